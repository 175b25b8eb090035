import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** A message the fake mail server received, parsed. */
export interface ReceivedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

/**
 * A local SMTP server that accepts every message and hands it, parsed, to `onMessage`.
 * It stands in for the hosted mail service in development and tests; it never relays.
 */
export async function startFakeSmtp(options: {
  port: number;
  host?: string;
  onMessage: (mail: ReceivedMail) => void | Promise<void>;
}) {
  let seq = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Batchproof development mail server',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          await options.onMessage({
            id: `${Date.now()}-${++seq}`,
            receivedAt: new Date().toISOString(),
            from:
              parsed.from?.text ??
              String(session.envelope.mailFrom && session.envelope.mailFrom.address),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : undefined,
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
