import nodemailer from 'nodemailer';

/** A message the app sends; `text` is always present so every mail reads without HTML. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends e-mail. The app depends on this interface, so tests can use a real SMTP peer or a fake. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** An SMTP mailer through nodemailer (locally, the fake mail server started by the scripts). */
export function createSmtpMailer(options: { host: string; port: number; from: string }): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    ignoreTLS: true,
    pool: false,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
    close: () => transport.close(),
  };
}
