// Reading the mails the app sent, from the SMTP fake's folder (MAIL_DIR, one .eml per message), with mailparser.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';
import { e2eEnv } from './env';

export function mailDir(): string {
  const dir = e2eEnv().MAIL_DIR;
  if (!dir) throw new Error('MAIL_DIR is not set: run through npm test, which starts the SMTP fake');
  return dir;
}

const toText = (to: ParsedMail['to']) => (Array.isArray(to) ? to.map((a) => a.text).join(', ') : (to?.text ?? ''));

/** Waits for the newest mail to `address` that arrived after `since` (file names start with the arrival time). */
export async function waitForMail(address: string, since: Set<string>, timeoutMs = 15_000): Promise<ParsedMail> {
  const dir = mailDir();
  const until = Date.now() + timeoutMs;
  for (;;) {
    const fresh = readdirSync(dir).filter((n) => n.endsWith('.eml') && !since.has(n)).sort().reverse();
    for (const name of fresh) {
      const mail = await simpleParser(readFileSync(join(dir, name)));
      if (toText(mail.to).toLowerCase().includes(address.toLowerCase())) return mail;
    }
    if (Date.now() > until) throw new Error(`no mail to ${address} within ${timeoutMs} ms in ${dir}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The names of the mails there now (pass to waitForMail to wait for a newer one). */
export function mailsNow(): Set<string> {
  return new Set(readdirSync(mailDir()));
}

export function linkIn(mail: ParsedMail, path: string): { url: string; token: string } {
  const match = (mail.text ?? '').match(new RegExp(`https?://[^\\s]+${path}/([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in:\n${mail.text}`);
  return { url: match[0], token: match[1]! };
}

export const alterOne = (token: string) => token.slice(0, 10) + (token[10] === 'A' ? 'B' : 'A') + token.slice(11);
