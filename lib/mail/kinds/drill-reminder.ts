import { composeMail, type MailContent } from '../compose';

export interface DrillReminderMail {
  academyName: string;
  /** drills assigned since the last reminder */
  assigned: string[];
  /** drills due tomorrow and not yet marked practised */
  dueTomorrow: string[];
  url: string;
}

const list = (names: string[]) => names.map((n) => `“${n}”`).join(', ');

export function drillReminderMail(m: DrillReminderMail): MailContent {
  const paragraphs: string[] = [];
  if (m.assigned.length) paragraphs.push(`Your coach gave you ${m.assigned.length === 1 ? 'a new drill' : `${m.assigned.length} new drills`}: ${list(m.assigned)}.`);
  if (m.dueTomorrow.length) paragraphs.push(`Due tomorrow: ${list(m.dueTomorrow)}.`);
  paragraphs.push('The steps, and where to mark a drill as practised, are on your drills page.');
  return composeMail({
    academyName: m.academyName,
    subject: m.assigned.length ? 'New drills from your coach' : 'Drills due tomorrow',
    greeting: 'Hello,',
    paragraphs,
    action: { label: 'Open my drills', url: m.url },
    afterAction: [
      'Warm up first and keep the effort easy. Stop if you feel pain in your back, neck or anywhere else, and see a physician or physiotherapist before you go on. Players under 18 practise with a parent’s or guardian’s consent.',
    ],
    reason: `You received this because your coach at ${m.academyName} assigned drills to you. At most one of these mails comes a day; to stop them, switch off drill reminders on your home page.`,
  });
}
