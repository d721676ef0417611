import { z } from 'zod';

// Paid remote reviews: the coach's offer, the student's request, its states, payments and history, the coach's queue
// and the admin's revenue table.

export const REVIEW_STATUSES = ['requested', 'awaiting_payment', 'paid', 'in_review', 'delivered', 'cancelled', 'refunded'] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];

/** The words a coach and a student read for each state. */
export const REVIEW_STATUS_LABELS: Record<ReviewStatus, string> = {
  requested: 'Requested',
  awaiting_payment: 'Waiting for payment',
  paid: 'Paid, not started',
  in_review: 'Coach is reviewing',
  delivered: 'Review sent',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

// ISO 4217 codes we price in (a short list; add one here when an academy needs it).
export const REVIEW_CURRENCIES = ['EUR', 'GBP', 'USD', 'CHF', 'SEK', 'NOK', 'DKK', 'CAD', 'AUD', 'NZD'] as const;

export const reviewOfferInputSchema = z.strictObject({
  priceCents: z.number({ error: 'Enter the price in cents, e.g. 4500 for 45.00.' }).int({ error: 'Whole cents only.' }).min(100, { error: 'At least 1.00.' }).max(100_000, { error: 'At most 1000.00.' }),
  currency: z.enum(REVIEW_CURRENCIES, { error: `Pick one of ${REVIEW_CURRENCIES.join(', ')}.` }),
  turnaroundDays: z.number({ error: 'Enter the days you need, 1 to 14.' }).int({ error: 'Whole days only.' }).min(1, { error: 'At least 1 day.' }).max(14, { error: 'At most 14 days.' }),
});
export type ReviewOfferInput = z.infer<typeof reviewOfferInputSchema>;

export const reviewOfferSchema = z.object({
  coachUserId: z.number().int(),
  coachName: z.string(),
  priceCents: z.number().int(),
  currency: z.string(),
  turnaroundDays: z.number().int(),
  /** when the coach stopped taking requests (ISO time), or null while the offer is open; only the coach sees it set */
  withdrawnAt: z.string().nullable(),
});
export type ReviewOffer = z.infer<typeof reviewOfferSchema>;
export const reviewOfferResponseSchema = z.object({ offer: reviewOfferSchema });
export const reviewOffersResponseSchema = z.object({ offers: z.array(reviewOfferSchema) });

export const eligibleRecordingSchema = z.object({
  id: z.number().int(),
  filename: z.string(),
  sessionId: z.number().int(),
  sessionDate: z.string(),
  swingCount: z.number().int(),
});
export type EligibleRecording = z.infer<typeof eligibleRecordingSchema>;
export const eligibleRecordingsResponseSchema = z.object({ recordings: z.array(eligibleRecordingSchema) });

export const createReviewSchema = z.strictObject({
  recordingId: z.number({ error: 'Pick a recording.' }).int().positive(),
  question: z.string({ error: 'Write what you would like your coach to look at.' }).trim().min(5, { error: 'Write at least a few words (5+ characters).' }).max(2000, { error: 'Use at most 2000 characters.' }),
});
export type CreateReviewInput = z.infer<typeof createReviewSchema>;
export const reviewCreatedSchema = z.object({ id: z.number().int(), checkoutUrl: z.string() });

export const deliverReviewSchema = z.strictObject({
  summary: z.string({ error: 'Write a summary for the student.' }).trim().min(10, { error: 'Write at least a sentence (10+ characters).' }).max(5000, { error: 'Use at most 5000 characters.' }),
  drillId: z.number().int().positive().optional(),
});
export type DeliverReviewInput = z.infer<typeof deliverReviewSchema>;

export const reviewPaymentSchema = z.object({
  id: z.number().int(),
  kind: z.enum(['payment', 'refund']),
  amountCents: z.number().int(),
  currency: z.string(),
  providerRef: z.string(),
  createdAt: z.string(),
});
export type ReviewPayment = z.infer<typeof reviewPaymentSchema>;

export const reviewHistoryEntrySchema = z.object({
  from: z.enum(REVIEW_STATUSES).nullable(),
  to: z.enum(REVIEW_STATUSES),
  /** 'payments' when the provider's webhook made the change */
  by: z.enum(['student', 'coach', 'admin', 'payments']),
  byName: z.string().nullable(),
  at: z.string(),
});
export type ReviewHistoryEntry = z.infer<typeof reviewHistoryEntrySchema>;

export const reviewSchema = z.object({
  id: z.number().int(),
  status: z.enum(REVIEW_STATUSES),
  checkoutSessionId: z.string().nullable(),
  payments: z.array(reviewPaymentSchema),
  history: z.array(reviewHistoryEntrySchema),
  athleteId: z.number().int(),
  studentName: z.string(),
  coachName: z.string(),
  recordingId: z.number().int(),
  recordingName: z.string(),
  sessionId: z.number().int(),
  question: z.string(),
  priceCents: z.number().int(),
  currency: z.string(),
  dueAt: z.string().nullable(),
  overdue: z.boolean(),
  summary: z.string().nullable(),
  drill: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  createdAt: z.string(),
});
export type Review = z.infer<typeof reviewSchema>;

export const reviewListItemSchema = reviewSchema.omit({ payments: true, history: true });
export type ReviewListItem = z.infer<typeof reviewListItemSchema>;
export const reviewListResponseSchema = z.object({ reviews: z.array(reviewListItemSchema) });

export const revenueRowSchema = z.object({
  coachUserId: z.number().int(),
  coachName: z.string(),
  month: z.string(),
  currency: z.string(),
  paidCents: z.number().int(),
  refundedCents: z.number().int(),
  netCents: z.number().int(),
  payments: z.number().int(),
});
export type RevenueRow = z.infer<typeof revenueRowSchema>;
export const revenueResponseSchema = z.object({ rows: z.array(revenueRowSchema) });

export const formatMoney = (cents: number, currency: string) => `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;
