import { composeMail, type MailContent } from '../compose';

export interface PasswordResetMail {
  academyName: string;
  url: string;
  expiresMinutes: number;
}

export function passwordResetMail(m: PasswordResetMail): MailContent {
  return composeMail({
    academyName: m.academyName,
    subject: 'Choose a new password',
    greeting: 'Hello,',
    paragraphs: ['A new password was requested for your account. If that was you, open the link below and choose one.'],
    action: { label: 'Choose a new password', url: m.url },
    afterAction: [
      `The link works once and for ${m.expiresMinutes} minutes. Choosing a new password signs you out everywhere else.`,
    ],
    reason: 'You received this because someone asked for a new password for this address. If it was not you, ignore this mail: your password stays as it is.',
  });
}
