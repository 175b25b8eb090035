import { startFakeSmtp, type ReceivedMail } from '../../apps/api/src/dev-mail/fake-smtp';
import { createSmtpMailer } from '../../apps/api/src/mail/mailer';

/**
 * A real SMTP round trip for tests: the app's nodemailer transport sends to a fake SMTP server
 * on a free loopback port, which keeps what it receives.
 */
export async function startMailCatcher() {
  const received: ReceivedMail[] = [];
  const waiters: { match: (m: ReceivedMail) => boolean; resolve: (m: ReceivedMail) => void }[] = [];
  const server = await startFakeSmtp({
    port: 0,
    onMessage: (mail) => {
      received.push(mail);
      for (const w of [...waiters]) {
        if (w.match(mail)) {
          waiters.splice(waiters.indexOf(w), 1);
          w.resolve(mail);
        }
      }
    },
  });
  const mailer = createSmtpMailer({
    host: '127.0.0.1',
    port: server.port,
    from: 'Batchproof <test@batchproof.example>',
  });
  return {
    mailer,
    received,
    /** Resolves with the first message to `to` (already received or arriving within 10 s). */
    waitFor(to: string, timeoutMs = 10_000): Promise<ReceivedMail> {
      const match = (m: ReceivedMail) => m.to.includes(to.toLowerCase());
      const found = received.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(
          () => reject(new Error(`No e-mail to ${to} within ${timeoutMs} ms`)),
          timeoutMs,
        );
        waiters.push({ match, resolve: (m) => (clearTimeout(timer), resolve(m)) });
      });
    },
    async close() {
      mailer.close();
      await server.close();
    },
  };
}

/** The first link in a message's text. */
export function firstLink(mail: ReceivedMail): string {
  const m = /https?:\/\/\S+/.exec(mail.text);
  if (!m) throw new Error(`No link in e-mail "${mail.subject}"`);
  return m[0];
}
