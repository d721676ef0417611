// The mail module: one send function per message kind. Each kind is a pure builder in kinds/ (its own wording, text
// and HTML through compose.ts); this file pairs the builder with the transport. DEVELOPERS.md "Mail" says how to add one.
import 'server-only';
import { drillReminderMail, type DrillReminderMail } from './kinds/drill-reminder';
import { invitationMail, type InvitationMail } from './kinds/invitation';
import { passwordResetMail, type PasswordResetMail } from './kinds/password-reset';
import { reviewUpdateMail, type ReviewUpdateMail } from './kinds/review-update';
import { shareMail, type ShareMail } from './kinds/share';
import { sendMail, type SendResult } from './transport';

export { appUrl } from './transport';
export type { SendResult } from './transport';

export const sendInvitationMail = (to: string, m: InvitationMail): Promise<SendResult> => sendMail(to, invitationMail(m));
export const sendPasswordResetMail = (to: string, m: PasswordResetMail): Promise<SendResult> => sendMail(to, passwordResetMail(m));
export const sendShareMail = (to: string, m: ShareMail): Promise<SendResult> => sendMail(to, shareMail(m));
export const sendDrillReminderMail = (to: string, m: DrillReminderMail): Promise<SendResult> => sendMail(to, drillReminderMail(m));
export const sendReviewUpdateMail = (to: string, m: ReviewUpdateMail): Promise<SendResult> => sendMail(to, reviewUpdateMail(m));
