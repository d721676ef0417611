// Sends a composed mail through SMTP (nodemailer). The relay comes from the environment (lib/env.ts): the local SMTP
// fake under npm start / npm test, any relay in production. Without SMTP_HOST nothing is sent and the skip is logged.
import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '@/lib/env';
import type { MailContent } from './compose';

const DEFAULT_FROM = 'Stanceline <no-reply@stanceline.invalid>';

// One transport per relay address (cached on globalThis like the db client; keyed so a changed relay gets its own).
const globalForMail = globalThis as typeof globalThis & { __stancelineMail?: Map<string, Transporter | null> };

function transport(): Transporter | null {
  const env = getEnv();
  const key = `${env.SMTP_HOST ?? ''}:${env.SMTP_PORT}:${env.SMTP_USER ?? ''}`;
  globalForMail.__stancelineMail ??= new Map();
  const known = globalForMail.__stancelineMail.get(key);
  if (known !== undefined) return known;
  const created = env.SMTP_HOST
    ? nodemailer.createTransport({
        host: env.SMTP_HOST,
        port: env.SMTP_PORT,
        secure: env.SMTP_SECURE === 'true',
        auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD } : undefined,
        // a relay that hangs must not hold a request for minutes
        connectionTimeout: 10_000,
        greetingTimeout: 10_000,
        socketTimeout: 20_000,
      })
    : null;
  globalForMail.__stancelineMail.set(key, created);
  return created;
}

export type SendResult = { sent: true; messageId: string } | { sent: false; reason: 'not-configured' };

export async function sendMail(to: string, content: MailContent): Promise<SendResult> {
  const smtp = transport();
  if (!smtp) {
    console.warn(`[stanceline mail] SMTP_HOST is not set: "${content.subject}" to ${to} was not sent`);
    return { sent: false, reason: 'not-configured' };
  }
  const info = await smtp.sendMail({ from: getEnv().MAIL_FROM ?? DEFAULT_FROM, to, subject: content.subject, text: content.text, html: content.html });
  return { sent: true, messageId: String(info.messageId) };
}

/** The app's own address for links in mails (NEXTAUTH_URL, else the loopback port). */
export function appUrl(path: string): string {
  const env = getEnv();
  const base = env.NEXTAUTH_URL ?? `http://127.0.0.1:${env.PORT}`;
  return new URL(path, base.endsWith('/') ? base : `${base}/`).toString();
}
