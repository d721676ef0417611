import { composeMail, type MailContent } from '../compose';

export interface InvitationMail {
  academyName: string;
  inviterName: string;
  /** 'coach', 'student', ... in words: "a coach", "a student" */
  roleWords: string;
  /** a student invited for a player on the roster */
  playerName: string | null;
  url: string;
  expiresHours: number;
}

export function invitationMail(m: InvitationMail): MailContent {
  const forPlayer = m.playerName ? ` Your account will show the sessions recorded for ${m.playerName}.` : '';
  return composeMail({
    academyName: m.academyName,
    subject: 'Your invitation',
    greeting: 'Hello,',
    paragraphs: [
      `${m.inviterName} invites you to join ${m.academyName} on Stanceline as ${m.roleWords}.${forPlayer}`,
      'Open the link below and choose a password to create your account.',
    ],
    action: { label: 'Accept the invitation', url: m.url },
    afterAction: [`The link works once and for ${m.expiresHours} hours. After that, ask ${m.inviterName} for a new one.`],
    reason: `You received this because ${m.inviterName} entered your address to invite you. If you did not expect it, ignore this mail: no account is made until the link is used.`,
  });
}
