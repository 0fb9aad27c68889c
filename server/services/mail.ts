import nodemailer from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { DataSource } from 'typeorm';
import type { Env } from '../env';
import { MailMessage } from '../db/entities/mail-message.entity';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface MailService {
  send(mail: OutgoingMail): Promise<void>;
  close(): Promise<void>;
}

/**
 * nodemailer over SMTP. Without SMTP_HOST (demo, development, test) it talks to an in-process fake SMTP server
 * (smtp-server) on a loopback port, which parses each message and stores it in the outbox table.
 */
export async function createMailService(env: Env, ds: DataSource): Promise<MailService> {
  if (env.smtp) {
    const transport = nodemailer.createTransport({
      host: env.smtp.host,
      port: env.smtp.port,
      secure: env.smtp.secure,
      auth: env.smtp.user ? { user: env.smtp.user, pass: env.smtp.pass ?? '' } : undefined,
    });
    return {
      send: async (m) => void (await transport.sendMail({ from: env.mailFrom, ...m })),
      close: async () => transport.close(),
    };
  }
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
          await ds.getRepository(MailMessage).save({
            to: (to || '').slice(0, 254),
            from: (parsed.from?.text ?? '').slice(0, 254),
            subject: (parsed.subject ?? '').slice(0, 300),
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          });
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  const port = await new Promise<number>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const addr = server.server.address();
      resolve(typeof addr === 'object' && addr ? addr.port : 0);
    });
  });
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  return {
    send: async (m) => void (await transport.sendMail({ from: env.mailFrom, ...m })),
    close: async () => {
      transport.close();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}

/** Escapes text for the HTML part of a message. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
