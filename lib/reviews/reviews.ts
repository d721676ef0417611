// Paid remote reviews: a student asks their coach to review one recording, pays through the provider's Checkout, the
// coach reviews it (the viewer's notes and corrections, plus a summary and an optional drill) and delivers it.
// States move forward only (states.ts); every move is a review_history row with who and when.
import 'server-only';
import type { Knex } from 'knex';
import type { Viewer } from '@/lib/auth/viewer';
import { academyName } from '@/lib/accounts/academy';
import { db } from '@/lib/db/client';
import { toIsoTime } from '@/lib/db/values';
import { ConflictError, HttpError, NotFoundError, ForbiddenError } from '@/lib/http';
import { appUrl, sendReviewUpdateMail } from '@/lib/mail';
import type { ReviewMailStep } from '@/lib/mail/kinds/review-update';
import {
  formatMoney,
  type CreateReviewInput,
  type DeliverReviewInput,
  type EligibleRecording,
  type Review,
  type ReviewHistoryEntry,
  type ReviewListItem,
  type ReviewOffer,
  type ReviewOfferInput,
  type ReviewPayment,
  type ReviewStatus,
  type RevenueRow,
} from '@/lib/contracts/reviews';
import { payments } from './provider';
import { canMove, OPEN_FOR_COACH } from './states';

export type Actor = { kind: 'student' | 'coach' | 'admin'; userId: number } | { kind: 'payments' };

const actorOf = (viewer: Viewer): Actor => ({ kind: viewer.role === 'student' ? 'student' : viewer.role === 'admin' ? 'admin' : 'coach', userId: viewer.id });

/**
 * Moves a review to `to` if that is a forward move from its current state (row locked FOR UPDATE inside `trx`).
 * Returns the state it came from, or null when the move is not allowed (nothing changed).
 */
export async function moveReview(trx: Knex.Transaction, reviewId: number, to: ReviewStatus, actor: Actor, now: Date, extra: Record<string, unknown> = {}): Promise<ReviewStatus | null> {
  const row = await trx('reviews').where({ id: reviewId }).forUpdate().first('status');
  if (!row || !canMove(row.status, to)) return null;
  await trx('reviews').where({ id: reviewId }).update({ status: to, updated_at: now, ...extra });
  await trx('review_history').insert({
    review_id: reviewId,
    from_status: row.status,
    to_status: to,
    actor_user_id: actor.kind === 'payments' ? null : actor.userId,
    actor_kind: actor.kind,
    at: now,
  });
  return row.status as ReviewStatus;
}

// ---- the coach's offer ------------------------------------------------------------------------------------------

/** Sets the coach's offer; offering again after a withdrawal clears withdrawn_at. */
export async function putOffer(viewer: Viewer, input: ReviewOfferInput, now = new Date()): Promise<ReviewOffer> {
  const row = { price_cents: input.priceCents, currency: input.currency, turnaround_days: input.turnaroundDays, withdrawn_at: null, updated_at: now };
  await db('review_offers').insert({ coach_user_id: viewer.id, ...row }).onConflict('coach_user_id').merge(row);
  return { coachUserId: viewer.id, coachName: viewer.name, ...input, withdrawnAt: null };
}

/**
 * The coach stops taking requests: withdrawn_at is set (kept from the first withdrawal if already set); the price,
 * currency and turnaround stay for offering again. Requests already made keep going at their own price.
 */
export async function withdrawOffer(viewer: Viewer, now = new Date()): Promise<ReviewOffer> {
  const existing = await db('review_offers').where({ coach_user_id: viewer.id }).first('withdrawn_at');
  if (!existing) throw new NotFoundError('You have no review offer to withdraw.');
  if (!existing.withdrawn_at) await db('review_offers').where({ coach_user_id: viewer.id }).whereNull('withdrawn_at').update({ withdrawn_at: now, updated_at: now });
  const [offer] = (await offerQuery().where('o.coach_user_id', viewer.id)).map(toOffer);
  if (!offer) throw new NotFoundError('You have no review offer to withdraw.');
  return offer;
}

function offerQuery() {
  return db('review_offers as o')
    .join('users as u', 'u.id', 'o.coach_user_id')
    .where('u.active', true)
    .select('o.coach_user_id', 'u.name', 'o.price_cents', 'o.currency', 'o.turnaround_days', 'o.withdrawn_at');
}

type OfferRow = { coach_user_id: number; name: string; price_cents: number; currency: string; turnaround_days: number; withdrawn_at: unknown };

const toOffer = (r: OfferRow): ReviewOffer => ({
  coachUserId: Number(r.coach_user_id),
  coachName: r.name,
  priceCents: Number(r.price_cents),
  currency: r.currency,
  turnaroundDays: Number(r.turnaround_days),
  withdrawnAt: toIsoTime(r.withdrawn_at),
});

/** The offers of a student's coaches, open ones only unless `withWithdrawn`. */
async function studentOffers(viewer: Viewer, withWithdrawn: boolean): Promise<ReviewOffer[]> {
  const q = offerQuery()
    .join('coach_athletes as ca', 'ca.coach_user_id', 'o.coach_user_id')
    .join('athletes as a', 'a.id', 'ca.athlete_id')
    .where('a.user_id', viewer.id)
    .orderBy('o.coach_user_id');
  if (!withWithdrawn) q.whereNull('o.withdrawn_at');
  return ((await q) as OfferRow[]).map(toOffer);
}

/** A coach: their own offer, withdrawn or not (or none). A student: the open offers of their coaches. */
export async function offersFor(viewer: Viewer): Promise<ReviewOffer[]> {
  if (viewer.role === 'coach') return ((await offerQuery().where('o.coach_user_id', viewer.id)) as OfferRow[]).map(toOffer);
  if (viewer.role !== 'student') return [];
  return studentOffers(viewer, false);
}

// ---- the student's request --------------------------------------------------------------------------------------

async function studentAthlete(viewer: Viewer): Promise<{ id: number; academy_id: number }> {
  const athlete = await db('athletes').where({ user_id: viewer.id }).first('id', 'academy_id');
  if (!athlete) throw new ConflictError('Your account is not linked to a player yet: ask your coach to link it.');
  return { id: Number(athlete.id), academy_id: Number(athlete.academy_id) };
}

function eligibleQuery(athleteId: number) {
  return db('recordings as r')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .where('r.athlete_id', athleteId)
    .where('r.status', 'ready')
    .whereNull('r.binned_at')
    .whereNull('p.binned_at');
}

export async function eligibleRecordings(viewer: Viewer): Promise<EligibleRecording[]> {
  const athlete = await studentAthlete(viewer);
  const rows = await eligibleQuery(athlete.id)
    .select('r.id', 'r.filename', 'r.session_id', db.raw("DATE_FORMAT(p.session_date, '%Y-%m-%d') as session_date"))
    .select(db('swings as s').whereRaw('s.recording_id = r.id').count('*').as('swing_count'))
    .orderBy([{ column: 'p.session_date', order: 'desc' }, { column: 'r.id', order: 'desc' }]);
  return rows.map((r) => ({ id: Number(r.id), filename: r.filename, sessionId: Number(r.session_id), sessionDate: String(r.session_date), swingCount: Number(r.swing_count) }));
}

/** 201 { id, checkoutUrl }: the request row, then a Checkout Session carrying client_reference_id = the review id. */
export async function createReview(viewer: Viewer, input: CreateReviewInput, now = new Date()): Promise<{ id: number; checkoutUrl: string }> {
  const athlete = await studentAthlete(viewer);
  const recording = await eligibleQuery(athlete.id).where('r.id', input.recordingId).first('r.id', 'r.filename');
  if (!recording) {
    const exists = await db('recordings').where({ id: input.recordingId, athlete_id: athlete.id }).whereNull('binned_at').first('status');
    if (!exists) throw new NotFoundError('No such recording of yours.');
    throw new ConflictError(`This recording is not ready for a review yet (it is ${exists.status}); pick one marked ready.`);
  }
  const offer = (await offersFor(viewer))[0];
  if (!offer) {
    const withdrawn = (await studentOffers(viewer, true))[0];
    if (withdrawn) throw new ConflictError(`${withdrawn.coachName} is not taking review requests at the moment. Requests you already made go on as before.`);
    throw new ConflictError('Your coach does not offer remote reviews yet.');
  }
  const client = payments();
  const id = await db.transaction(async (trx) => {
    // the offer may have been withdrawn or changed since it was read: lock it and take the price from the locked row
    const current = await trx('review_offers').where({ coach_user_id: offer.coachUserId }).forUpdate().first('price_cents', 'currency', 'turnaround_days', 'withdrawn_at');
    if (!current || current.withdrawn_at) throw new ConflictError(`${offer.coachName} is not taking review requests at the moment. Requests you already made go on as before.`);
    offer.priceCents = Number(current.price_cents);
    offer.currency = current.currency;
    offer.turnaroundDays = Number(current.turnaround_days);
    const [reviewId] = await trx('reviews').insert({
      academy_id: athlete.academy_id,
      athlete_id: athlete.id,
      student_user_id: viewer.id,
      coach_user_id: offer.coachUserId,
      recording_id: input.recordingId,
      question: input.question,
      status: 'requested',
      price_cents: offer.priceCents,
      currency: offer.currency,
      turnaround_days: offer.turnaroundDays,
      created_at: now,
      updated_at: now,
    });
    await trx('review_history').insert({ review_id: reviewId, from_status: null, to_status: 'requested', actor_user_id: viewer.id, actor_kind: 'student', at: now });
    return Number(reviewId);
  });
  let session;
  try {
    session = await client.checkout.sessions.create(
      {
        mode: 'payment',
        client_reference_id: String(id),
        customer_email: viewer.email,
        line_items: [
          {
            quantity: 1,
            price_data: { currency: offer.currency.toLowerCase(), unit_amount: offer.priceCents, product_data: { name: `Remote review by ${offer.coachName}` } },
          },
        ],
        metadata: { review_id: String(id) },
        success_url: appUrl(`/reviews/${id}?paid=1`),
        cancel_url: appUrl(`/reviews/${id}`),
      },
      { idempotencyKey: `review-${id}-checkout` },
    );
  } catch (error) {
    await db.transaction((trx) => moveReview(trx, id, 'cancelled', { kind: 'payments' }, new Date()));
    throw new HttpError(502, 'payments_failed', `The payments provider did not accept the checkout (${error instanceof Error ? error.message : 'unknown error'}); nothing was charged. Try again later.`);
  }
  await db.transaction((trx) => moveReview(trx, id, 'awaiting_payment', { kind: 'payments' }, new Date(), { checkout_session_id: session.id }));
  await notifyStudent(id, 'awaiting_payment');
  return { id, checkoutUrl: session.url ?? appUrl(`/reviews/${id}`) };
}

// ---- reading ----------------------------------------------------------------------------------------------------

type ReviewRow = Record<string, unknown> & { id: number; status: ReviewStatus; academy_id: number; student_user_id: number; coach_user_id: number };

function reviewQuery() {
  return db('reviews as v')
    .join('users as su', 'su.id', 'v.student_user_id')
    .join('users as cu', 'cu.id', 'v.coach_user_id')
    .join('recordings as r', 'r.id', 'v.recording_id')
    .leftJoin('drills as d', 'd.id', 'v.drill_id')
    .select(
      'v.*',
      'su.name as student_name',
      'cu.name as coach_name',
      'r.filename as recording_name',
      'r.session_id',
      'd.name as drill_name',
    );
}

function toListItem(row: ReviewRow, now: Date): ReviewListItem {
  const due = row.due_at ? new Date(row.due_at as Date) : null;
  return {
    id: Number(row.id),
    status: row.status,
    checkoutSessionId: (row.checkout_session_id as string | null) ?? null,
    athleteId: Number(row.athlete_id),
    studentName: String(row.student_name),
    coachName: String(row.coach_name),
    recordingId: Number(row.recording_id),
    recordingName: String(row.recording_name),
    sessionId: Number(row.session_id),
    question: String(row.question),
    priceCents: Number(row.price_cents),
    currency: String(row.currency),
    dueAt: toIsoTime(row.due_at),
    overdue: due !== null && OPEN_FOR_COACH.includes(row.status) && due.getTime() < now.getTime(),
    summary: (row.summary as string | null) ?? null,
    drill: row.drill_id && row.drill_name ? { id: Number(row.drill_id), name: String(row.drill_name) } : null,
    createdAt: toIsoTime(row.created_at) ?? '',
  };
}

/** The student, the coach and the academy's admin see a review; anyone else gets the same 404 as an unknown id. */
export async function requireReview(viewer: Viewer, id: number): Promise<ReviewRow> {
  const row = (await reviewQuery().where('v.id', id).first()) as ReviewRow | undefined;
  const visible =
    row &&
    ((viewer.role === 'student' && Number(row.student_user_id) === viewer.id) ||
      (viewer.role === 'coach' && Number(row.coach_user_id) === viewer.id) ||
      (viewer.role === 'admin' && Number(row.academy_id) === viewer.academyId));
  if (!visible) throw new NotFoundError('No such review.');
  return row;
}

export async function getReview(viewer: Viewer, id: number, now = new Date()): Promise<Review> {
  const row = await requireReview(viewer, id);
  const [paymentRows, historyRows] = await Promise.all([
    db('review_payments').where({ review_id: id }).orderBy('id'),
    db('review_history as h').leftJoin('users as u', 'u.id', 'h.actor_user_id').where('h.review_id', id).orderBy('h.id').select('h.*', 'u.name as actor_name'),
  ]);
  const paymentsOut: ReviewPayment[] = paymentRows.map((p) => ({
    id: Number(p.id),
    kind: p.kind,
    amountCents: Number(p.amount_cents),
    currency: p.currency,
    providerRef: p.provider_ref,
    createdAt: toIsoTime(p.created_at) ?? '',
  }));
  const history: ReviewHistoryEntry[] = historyRows.map((h) => ({ from: h.from_status, to: h.to_status, by: h.actor_kind, byName: h.actor_name ?? null, at: toIsoTime(h.at) ?? '' }));
  return { ...toListItem(row, now), payments: paymentsOut, history };
}

/**
 * A student: their own requests, newest first. A coach: their reviews, the open ones (paid, in review) first by due
 * date, then the rest newest first. An admin: the academy's, newest first.
 */
export async function listReviews(viewer: Viewer, now = new Date()): Promise<ReviewListItem[]> {
  const q = reviewQuery();
  if (viewer.role === 'student') q.where('v.student_user_id', viewer.id).orderBy('v.id', 'desc');
  else if (viewer.role === 'coach')
    q.where('v.coach_user_id', viewer.id)
      .orderByRaw(`CASE WHEN v.status IN (${OPEN_FOR_COACH.map(() => '?').join(',')}) THEN 0 ELSE 1 END`, [...OPEN_FOR_COACH])
      .orderBy('v.due_at', 'asc')
      .orderBy('v.id', 'desc');
  else if (viewer.role === 'admin') q.where('v.academy_id', viewer.academyId).orderBy('v.id', 'desc');
  else throw new ForbiddenError();
  return ((await q) as ReviewRow[]).map((row) => toListItem(row, now));
}

/** The student's way back to an unpaid checkout: the provider's page while the session is still open, else null. */
export async function openCheckoutUrl(viewer: Viewer, id: number): Promise<string | null> {
  const row = await requireReview(viewer, id);
  if (viewer.role !== 'student' || row.status !== 'awaiting_payment' || !row.checkout_session_id) return null;
  const session = await payments().checkout.sessions.retrieve(String(row.checkout_session_id));
  return session.status === 'open' ? session.url : null;
}

// ---- the coach's work -------------------------------------------------------------------------------------------

async function requireOwnReview(viewer: Viewer, id: number): Promise<ReviewRow> {
  const row = await requireReview(viewer, id);
  if (viewer.role !== 'coach' || Number(row.coach_user_id) !== viewer.id) throw new ForbiddenError('Only the coach of this review can do that.');
  return row;
}

export async function startReview(viewer: Viewer, id: number, now = new Date()): Promise<Review> {
  const row = await requireOwnReview(viewer, id);
  const moved = await db.transaction((trx) => moveReview(trx, id, 'in_review', actorOf(viewer), now));
  if (!moved) throw new ConflictError(`This review is ${row.status.replace('_', ' ')}: it can be started only once it is paid.`);
  await notifyStudent(id, 'in_review');
  return getReview(viewer, id, now);
}

export async function deliverReview(viewer: Viewer, id: number, input: DeliverReviewInput, now = new Date()): Promise<Review> {
  await requireOwnReview(viewer, id);
  if (input.drillId !== undefined) {
    const drill = await db('drills').where({ id: input.drillId, academy_id: viewer.academyId }).whereNull('binned_at').first('id');
    if (!drill) throw new NotFoundError('No such drill in your academy’s library.');
  }
  await db.transaction(async (trx) => {
    const current = await trx('reviews').where({ id }).forUpdate().first('status');
    if (current.status === 'paid') await moveReview(trx, id, 'in_review', actorOf(viewer), now);
    const from = await moveReview(trx, id, 'delivered', actorOf(viewer), now, { summary: input.summary, drill_id: input.drillId ?? null });
    if (!from) throw new ConflictError(`This review is ${String(current.status).replace('_', ' ')}: only a paid review can be delivered.`);
  });
  await notifyStudent(id, 'delivered');
  return getReview(viewer, id, now);
}

/** A refund through the provider, before delivery only. */
export async function refundReview(viewer: Viewer, id: number, now = new Date()): Promise<Review> {
  const row = await requireOwnReview(viewer, id);
  if (row.status === 'delivered') {
    throw new HttpError(409, 'refund_after_delivery', 'This review was already delivered, so it cannot be refunded here. Talk to your academy’s admin if the student should get money back.');
  }
  if (row.status !== 'paid' && row.status !== 'in_review') {
    throw new ConflictError(`This review is ${row.status.replace('_', ' ')}: only a paid review that is not yet delivered can be refunded.`);
  }
  const refund = await payments().refunds.create(
    { payment_intent: String(row.payment_intent_id), metadata: { review_id: String(id) } },
    { idempotencyKey: `review-${id}-refund` },
  );
  await db.transaction(async (trx) => {
    const from = await moveReview(trx, id, 'refunded', actorOf(viewer), now);
    if (!from) throw new ConflictError('This review changed while refunding; reload and check it.');
    await trx('review_payments')
      .insert({ review_id: id, coach_user_id: row.coach_user_id, academy_id: row.academy_id, kind: 'refund', amount_cents: refund.amount, currency: refund.currency.toUpperCase(), provider_ref: refund.id, created_at: now })
      .onConflict('provider_ref')
      .ignore();
  });
  await notifyStudent(id, 'refunded');
  return getReview(viewer, id, now);
}

/** The student (or coach) withdraws a request that is not paid yet: the checkout is expired at the provider first. */
export async function cancelReview(viewer: Viewer, id: number, now = new Date()): Promise<Review> {
  const row = await requireReview(viewer, id);
  if (viewer.role === 'admin') throw new ForbiddenError('Only the student or the coach can cancel a request.');
  if (row.status !== 'requested' && row.status !== 'awaiting_payment') throw new ConflictError(`This review is ${row.status.replace('_', ' ')}: only an unpaid request can be cancelled.`);
  const session = row.checkout_session_id ? await payments().checkout.sessions.retrieve(String(row.checkout_session_id)) : null;
  if (session?.status === 'complete') throw new ConflictError('The payment has just gone through; this request can no longer be cancelled.');
  // the move first (recorded as this user's), then the expiry: the provider's checkout.session.expired event that
  // follows finds the review cancelled already and is ignored
  const moved = await db.transaction((trx) => moveReview(trx, id, 'cancelled', actorOf(viewer), now));
  if (!moved) throw new ConflictError('This request changed meanwhile (it may have been paid); reload and check it.');
  if (session?.status === 'open') {
    await payments()
      .checkout.sessions.expire(session.id)
      .catch((error: unknown) => console.error(`review ${id}: cancelled, but its checkout could not be expired:`, error instanceof Error ? error.message : error));
  }
  await notifyStudent(id, 'cancelled');
  return getReview(viewer, id, now);
}

// ---- the admin's revenue ----------------------------------------------------------------------------------------

/** Per coach, month (UTC, YYYY-MM) and currency: payments, refunds and net, from the stored payment records. */
export async function revenueByCoachMonth(viewer: Viewer): Promise<RevenueRow[]> {
  const rows = await db('review_payments as p')
    .join('users as u', 'u.id', 'p.coach_user_id')
    .where('p.academy_id', viewer.academyId)
    .groupBy('p.coach_user_id', 'u.name', 'month', 'p.currency')
    .select(
      'p.coach_user_id',
      'u.name',
      db.raw("DATE_FORMAT(p.created_at, '%Y-%m') as month"),
      'p.currency',
      db.raw("SUM(CASE WHEN p.kind = 'payment' THEN p.amount_cents ELSE 0 END) as paid"),
      db.raw("SUM(CASE WHEN p.kind = 'refund' THEN p.amount_cents ELSE 0 END) as refunded"),
      db.raw("SUM(p.kind = 'payment') as payments"),
    )
    .orderBy([{ column: 'month', order: 'desc' }, { column: 'u.name' }]);
  return rows.map((r) => ({
    coachUserId: Number(r.coach_user_id),
    coachName: r.name,
    month: String(r.month),
    currency: r.currency,
    paidCents: Number(r.paid),
    refundedCents: Number(r.refunded),
    netCents: Number(r.paid) - Number(r.refunded),
    payments: Number(r.payments),
  }));
}

// ---- mail -------------------------------------------------------------------------------------------------------

/** The student's mail for a step; a failed send is logged, never undoes the step. */
export async function notifyStudent(id: number, step: ReviewMailStep): Promise<void> {
  try {
    const row = await reviewQuery().where('v.id', id).select('su.email as student_email').first();
    if (!row) return;
    await sendReviewUpdateMail(row.student_email, {
      academyName: await academyName(Number(row.academy_id)),
      coachName: row.coach_name,
      step,
      amount: formatMoney(Number(row.price_cents), row.currency),
      dueDate: row.due_at ? (toIsoTime(row.due_at) ?? '').slice(0, 10) : null,
      withDrill: row.drill_id !== null,
      url: appUrl(`/reviews/${id}`),
    });
  } catch (error) {
    console.error(`review ${id}: the ${step} mail was not sent:`, error instanceof Error ? error.message : error);
  }
}
