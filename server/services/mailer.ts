import nodemailer from 'nodemailer';
import type { Config } from '../env';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Sends mail through the configured SMTP server (the mail fake in development and tests). */
export function createMailer(smtp: Config['smtp']): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    ignoreTLS: smtp.ignoreTls,
    ...(smtp.user ? { auth: { user: smtp.user, pass: smtp.pass ?? '' } } : {}),
  });
  return {
    send: async (mail) => {
      await transport.sendMail({ from: smtp.from, ...mail });
    },
    close: () => transport.close(),
  };
}
