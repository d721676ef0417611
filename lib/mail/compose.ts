// The one frame every mail is built in: a text part and an HTML part with the same words, the academy's name, one
// link (never measurements), and a line saying why the person received it. Pure: no I/O, no clock.

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export interface MailParts {
  academyName: string;
  subject: string;
  greeting: string;
  /** plain sentences; each becomes a paragraph */
  paragraphs: string[];
  action: { label: string; url: string };
  /** after the link, e.g. "The link works once and for 72 hours." */
  afterAction?: string[];
  /** why this person received this mail */
  reason: string;
}

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);
}

/** Only http(s) links go into a mail (a stored javascript: or data: URL would be a trap). */
function safeUrl(url: string): string {
  const parsed = new URL(url);
  if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') throw new RangeError(`mail links must be http(s), got ${parsed.protocol}`);
  return parsed.toString();
}

export function composeMail(parts: MailParts): MailContent {
  const url = safeUrl(parts.action.url);
  const after = parts.afterAction ?? [];
  const text = [
    parts.greeting,
    '',
    ...parts.paragraphs.flatMap((p) => [p, '']),
    `${parts.action.label}: ${url}`,
    '',
    ...after.flatMap((p) => [p, '']),
    '--',
    parts.academyName,
    parts.reason,
    '',
  ].join('\n');

  const p = (s: string) => `<p style="margin:0 0 14px;font-size:15px;line-height:1.5">${escapeHtml(s)}</p>`;
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(parts.subject)}</title></head>
<body style="margin:0;padding:24px;background:#f6f7f5;font-family:Arial,Helvetica,sans-serif;color:#1d2521">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #d9ddd8;border-radius:8px;padding:24px">
<p style="margin:0 0 18px;font-size:13px;font-weight:bold;letter-spacing:0.04em;text-transform:uppercase;color:#4a5550">${escapeHtml(parts.academyName)}</p>
${p(parts.greeting)}
${parts.paragraphs.map(p).join('\n')}
<p style="margin:22px 0"><a href="${escapeHtml(url)}" style="display:inline-block;padding:12px 18px;background:#1f5f4a;color:#ffffff;text-decoration:none;border-radius:6px;font-size:15px">${escapeHtml(parts.action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#4a5550">If the button does not open, copy this address into your browser: ${escapeHtml(url)}</p>
${after.map(p).join('\n')}
<hr style="border:none;border-top:1px solid #d9ddd8;margin:20px 0">
<p style="margin:0;font-size:13px;color:#4a5550">${escapeHtml(parts.academyName)} · ${escapeHtml(parts.reason)}</p>
</div>
</body></html>
`;
  return { subject: `${parts.subject} · ${parts.academyName}`, text, html };
}
