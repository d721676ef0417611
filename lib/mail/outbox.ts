// The demo Outbox: the .eml files the local SMTP fake kept in MAIL_DIR, newest first, parsed with mailparser.
import 'server-only';
import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { getEnv } from '@/lib/env';
import type { OutboxMessage } from '@/lib/contracts/outbox';

const MAX_LISTED = 200;

/** The links a message holds (its text part; every mail of ours carries its link there too). */
export function linksIn(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/[^\s<>"]+/g) ?? [])];
}

export async function listOutbox(dir = getEnv().MAIL_DIR): Promise<OutboxMessage[]> {
  let names: string[];
  try {
    names = (await readdir(dir)).filter((name) => name.endsWith('.eml'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  names.sort().reverse(); // file names start with the UTC arrival time
  const messages: OutboxMessage[] = [];
  for (const name of names.slice(0, MAX_LISTED)) {
    const path = join(dir, name);
    const parsed = await simpleParser(await readFile(path));
    const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
    const text = parsed.text ?? '';
    messages.push({
      id: name.replace(/\.eml$/, ''),
      // when the fake wrote it (the Date header is the sender's clock, to the second)
      receivedAt: (await stat(path)).mtime.toISOString(),
      from: parsed.from?.text ?? '',
      to,
      subject: parsed.subject ?? '',
      text,
      hasHtml: typeof parsed.html === 'string' && parsed.html.length > 0,
      links: linksIn(text),
    });
  }
  return messages;
}
