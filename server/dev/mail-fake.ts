import express from 'express';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

/** One message the fake received, as the inbox endpoint returns it. */
export interface FakeMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export interface MailFake {
  smtpPort: number;
  inboxUrl: string;
  messages: FakeMail[];
  close(): Promise<void>;
}

/**
 * A real SMTP server on loopback that keeps what it receives, plus a small HTTP inbox
 * (GET /messages as JSON, GET / as a page) for people and browser tests to read the mail.
 * No STARTTLS: smtp-server's built-in certificate has expired.
 */
export async function startMailFake({ smtpPort, httpPort, host = '127.0.0.1' }: { smtpPort: number; httpPort: number; host?: string }): Promise<MailFake> {
  const messages: FakeMail[] = [];
  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            receivedAt: new Date().toISOString(),
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve) => smtp.listen(smtpPort, host, resolve));

  const inbox = express();
  // GET /messages: anyone on loopback (tests read it); every mail received so far as JSON; no errors.
  inbox.get('/messages', (_req, res) => {
    res.json({ messages });
  });
  // GET /: anyone on loopback; the received mail as a page, to read invitations in development; no errors.
  inbox.get('/', (_req, res) => {
    const rows = messages
      .map((m) => `<li><b>${escapeHtml(m.subject)}</b> to ${escapeHtml(m.to.join(', '))}<pre>${escapeHtml(m.text)}</pre></li>`)
      .join('');
    res.type('html').send(`<!doctype html><title>Trimsheet mail fake</title><h1>Mail fake (development only)</h1><ul>${rows || '<li>No mail yet</li>'}</ul>`);
  });
  const http = inbox.listen(httpPort, host);
  await new Promise<void>((resolve) => http.once('listening', () => resolve()));
  const address = http.address() as AddressInfo;

  return {
    smtpPort,
    inboxUrl: `http://${host}:${address.port}`,
    messages,
    close: async () => {
      await new Promise<void>((resolve) => http.close(() => resolve()));
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
    },
  };
}

function escapeHtml(text: string) {
  return text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c] ?? c);
}
