// The payments provider's webhook: the signature checked by the SDK on the raw body, each event handled once (its id
// stored in payment_events in the same transaction as its effect), and moves that would go backwards ignored.
import 'server-only';
import type Stripe from 'stripe';
import { db } from '@/lib/db/client';
import { HttpError } from '@/lib/http';
import { moveReview, notifyStudent } from './reviews';
import { payments, webhookSecret } from './provider';
import type { ReviewMailStep } from '@/lib/mail/kinds/review-update';

export type WebhookOutcome = 'replay' | 'paid' | 'cancelled' | 'ignored';

/** Verifies the signature; a bad or missing one is a 400 and nothing else happens. */
export function verifyEvent(rawBody: string, signature: string | null): Stripe.Event {
  if (!signature) throw new HttpError(400, 'bad_signature', 'The Stripe-Signature header is missing.');
  try {
    return payments().webhooks.constructEvent(rawBody, signature, webhookSecret());
  } catch (error) {
    if (error instanceof HttpError) throw error;
    throw new HttpError(400, 'bad_signature', 'The webhook signature does not match this server’s signing secret.');
  }
}

const isDuplicate = (error: unknown) => (error as { code?: string })?.code === 'ER_DUP_ENTRY';

export async function handleEvent(event: Stripe.Event, now = new Date()): Promise<WebhookOutcome> {
  let mail: { id: number; step: ReviewMailStep } | null = null;
  let outcome: WebhookOutcome;
  try {
    outcome = await db.transaction(async (trx) => {
      // first: the event id; a replay fails here (primary key) and the transaction does nothing else
      await trx('payment_events').insert({ event_id: event.id, type: event.type, outcome: 'handling', received_at: now });
      let result: WebhookOutcome = 'ignored';
      if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.expired') {
        const session = event.data.object as Stripe.Checkout.Session;
        const reviewId = Number(session.client_reference_id);
        const review = Number.isInteger(reviewId) ? await trx('reviews').where({ id: reviewId }).forUpdate().first() : undefined;
        // the session must be the one this review created (a stale or foreign session is ignored)
        if (review && review.checkout_session_id === session.id) {
          if (event.type === 'checkout.session.completed' && session.payment_status === 'paid') {
            const due = new Date(now.getTime() + Number(review.turnaround_days) * 24 * 3600 * 1000);
            const from = await moveReview(trx, reviewId, 'paid', { kind: 'payments' }, now, {
              payment_intent_id: typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null),
              due_at: due,
            });
            if (from) {
              await trx('review_payments').insert({
                review_id: reviewId,
                coach_user_id: review.coach_user_id,
                academy_id: review.academy_id,
                kind: 'payment',
                amount_cents: session.amount_total ?? review.price_cents,
                currency: (session.currency ?? review.currency).toUpperCase(),
                provider_ref: session.id,
                created_at: now,
              });
              result = 'paid';
              mail = { id: reviewId, step: 'paid' };
            }
          } else if (event.type === 'checkout.session.expired') {
            const from = await moveReview(trx, reviewId, 'cancelled', { kind: 'payments' }, now);
            if (from) {
              result = 'cancelled';
              mail = { id: reviewId, step: 'cancelled' };
            }
          }
        }
      }
      await trx('payment_events').where({ event_id: event.id }).update({ outcome: result });
      return result;
    });
  } catch (error) {
    if (isDuplicate(error)) return 'replay';
    throw error;
  }
  const sent = mail as { id: number; step: ReviewMailStep } | null;
  if (sent) await notifyStudent(sent.id, sent.step);
  return outcome;
}
