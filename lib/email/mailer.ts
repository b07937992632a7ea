import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { db } from '@/db';

// Every message goes through nodemailer to SMTP_HOST:SMTP_PORT: the local fake in the demo and
// tests, a real relay in production (SMTP_USER / SMTP_PASS / SMTP_SECURE). Each send is logged.
let transporter: Transporter | undefined;

function transport(): Transporter {
  if (transporter) return transporter;
  const secure = process.env.SMTP_SECURE === 'true';
  transporter = nodemailer.createTransport({
    host: process.env.SMTP_HOST ?? '127.0.0.1',
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure,
    ignoreTLS: !secure && !process.env.SMTP_USER,
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASS ?? '' } : undefined,
    connectionTimeout: 5000,
  });
  return transporter;
}

export type OutgoingEmail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  template: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
};

export function mailFrom(): string {
  return process.env.MAIL_FROM ?? 'Ampwright <no-reply@ampwright.test>';
}

export async function sendEmail(mail: OutgoingEmail): Promise<{ messageId: string | null; ok: boolean }> {
  let messageId: string;
  try {
    const info = await transport().sendMail({
      from: mailFrom(),
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      attachments: mail.attachments,
    });
    messageId = info.messageId;
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    console.error(`[mail] sending "${mail.subject}" to ${mail.to} failed: ${message}`);
    await logEmail(mail, { message_id: null, status: 'failed', error: message.slice(0, 500) });
    return { messageId: null, ok: false };
  }
  // Accepted by the relay: sent, even if the log row cannot be written (a caller told "failed"
  // would undo its claim and send the message again).
  await logEmail(mail, { message_id: messageId, status: 'sent' });
  return { messageId, ok: true };
}

async function logEmail(mail: OutgoingEmail, outcome: { message_id: string | null; status: 'sent' | 'failed'; error?: string }): Promise<void> {
  await db
    .insertInto('emails')
    .values({ to_address: mail.to, subject: mail.subject, template: mail.template, ...outcome })
    .execute()
    .catch((err: unknown) => console.error(`[mail] could not log "${mail.subject}" to ${mail.to}: ${err instanceof Error ? err.message : String(err)}`));
}

export function appUrl(path = '/'): string {
  const base = (process.env.APP_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
  return `${base}${path.startsWith('/') ? path : `/${path}`}`;
}
