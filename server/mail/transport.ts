import nodemailer, { type Transporter } from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';
import type { Env } from '@server/config/env.ts';

/** What the outbox needs from a transport: nodemailer's `sendMail`. */
export type MailSender = Pick<Transporter<SMTPTransport.SentMessageInfo>, 'sendMail'>;

/**
 * Plain SMTP to SMTP_HOST:SMTP_PORT, without authentication or STARTTLS: the local fake SMTP
 * server in development and tests, or a relay on the same network. Every message comes from
 * MAIL_FROM. The timeouts are short so a sender never outlives its claim on a batch (outbox.ts).
 */
export function createMailTransport(
  env: Pick<Env, 'SMTP_HOST' | 'SMTP_PORT' | 'MAIL_FROM'>,
): Transporter<SMTPTransport.SentMessageInfo> {
  return nodemailer.createTransport(
    {
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: false,
      ignoreTLS: true,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    },
    { from: env.MAIL_FROM },
  );
}
