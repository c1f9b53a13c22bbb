import nodemailer from 'nodemailer';
import type { AppConfig } from '../config';

/** Names the company a message was sent for, so the development outbox shows a company only its own mail. */
export const COMPANY_MAIL_HEADER = 'X-Lifeplate-Company';

/** A file sent with a message; `content` is base64, so the whole message stays plain JSON in the sealed queue row. */
export type MailAttachment = { filename: string; contentType: string; content: string };

export type Mail = { to: string; subject: string; text: string; html: string; headers?: Record<string, string>; attachments?: MailAttachment[] };

/** Mail over real SMTP; in development and tests the host is the local fake, which offers no TLS. */
export const isLoopbackHost = (host: string) => ['127.0.0.1', 'localhost', '::1'].includes(host);

export function createMailer(config: Pick<AppConfig, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_USER' | 'SMTP_PASS' | 'SMTP_SECURE' | 'MAIL_FROM'>) {
  const loopback = isLoopbackHost(config.SMTP_HOST);
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    // The loopback fake's certificate has expired, so no STARTTLS there; real servers negotiate TLS as usual.
    ignoreTLS: loopback,
    // A mail server that accepts the connection but never answers must not hold a request (or a queue run) for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
    auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASS ?? '' } : undefined,
  });
  return {
    async send(mail: Mail) {
      const { attachments, ...rest } = mail;
      const info = await transport.sendMail({
        from: config.MAIL_FROM,
        ...rest,
        ...(attachments?.length ? { attachments: attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content, encoding: 'base64' })) } : {}),
      });
      return { messageId: info.messageId as string, accepted: info.accepted.map(String) };
    },
    close: () => transport.close(),
  };
}

export type Mailer = ReturnType<typeof createMailer>;
