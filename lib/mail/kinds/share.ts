import { composeMail, type MailContent } from '../compose';

export interface ShareMail {
  academyName: string;
  coachName: string;
  /** 'lesson' (a session's summary) or 'swing' (one swing of a session) */
  what: 'lesson' | 'swing';
  /** the session's date, YYYY-MM-DD */
  sessionDate: string;
  /** the coach's own words, if any */
  note: string | null;
  url: string;
}

export function shareMail(m: ShareMail): MailContent {
  const thing = m.what === 'lesson' ? `the summary of your lesson on ${m.sessionDate}` : `a swing from your session on ${m.sessionDate}`;
  const paragraphs = [`${m.coachName} sent you ${thing}. Sign in to see it.`];
  if (m.note) paragraphs.push(`${m.coachName} wrote: “${m.note}”`);
  return composeMail({
    academyName: m.academyName,
    subject: m.what === 'lesson' ? 'Your lesson summary' : 'A swing from your session',
    greeting: 'Hello,',
    paragraphs,
    action: { label: m.what === 'lesson' ? 'Open the lesson summary' : 'Open the swing', url: m.url },
    afterAction: [
      'Work on changes at an easy effort. Stop if anything hurts, and see a physician or physiotherapist before you go on.',
    ],
    reason: `You received this because your coach at ${m.academyName} shared it with your student account.`,
  });
}
