// Paid remote reviews over HTTP against the running app, its payments fake (scripts/lib/fakes/payments.ts, reached
// by the app through the official `stripe` SDK) and its SMTP fake: request -> checkout -> signed webhook -> paid ->
// delivered -> the student's mail; bad signatures; replays and out-of-order events; refunds; the role matrix; the coach
// withdrawing the offer and offering it again.
//
// The webhook signatures this test makes follow the provider's published scheme (Stripe docs, "Verify webhook
// signatures manually": header `t=<timestamp>,v1=<hex HMAC-SHA256(secret, "<timestamp>.<raw body>")>`), computed here
// with node:crypto, independently of both the SDK and the fake.
import { createHmac } from 'node:crypto';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { mailsNow, waitForMail } from './support/mail';
import { serverDb, settled, upload } from './support/recordings-http';

const env = e2eEnv();
const WEBHOOK_SECRET = process.env.PAYMENTS_WEBHOOK_SECRET ?? '';
const FAKE = `${process.env.PAYMENTS_API_PROTOCOL ?? 'http'}://${process.env.PAYMENTS_API_HOST ?? '127.0.0.1'}:${process.env.PAYMENTS_API_PORT ?? '0'}`;
const json = (method: string, body: unknown): RequestInit => ({ method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

type ReviewBody = {
  id: number;
  status: string;
  checkoutSessionId: string | null;
  payments: { kind: string; amountCents: number; currency: string; providerRef: string }[];
  history: { from: string | null; to: string; by: string; byName: string | null; at: string }[];
  dueAt: string | null;
  overdue: boolean;
};
type FakeEvent = { id: string; type: string; body: string; status: number };

let coach: HttpSession;
let coach2: HttpSession;
let student: HttpSession;
let admin: HttpSession;
let researcher: HttpSession;
let db: Knex;
let recordingId: number;

function sign(body: string, secret = WEBHOOK_SECRET, t = Math.floor(Date.now() / 1000)): string {
  return `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${body}`).digest('hex')}`;
}

async function postWebhook(body: string, signature: string): Promise<{ status: number; body: any }> {
  const res = await fetch(`${env.E2E_BASE_URL}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body });
  return { status: res.status, body: await res.json() };
}

async function review(session: HttpSession, id: number): Promise<ReviewBody> {
  const res = await session.json(`/api/reviews/${id}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as ReviewBody;
}

async function fakeEvents(sessionId: string): Promise<FakeEvent[]> {
  const res = await fetch(`${FAKE}/_fake/events`);
  const all = ((await res.json()) as { events: FakeEvent[] }).events;
  return all.filter((e) => (JSON.parse(e.body) as { data: { object: { id: string } } }).data.object.id === sessionId);
}

/** A request by the student; answers the review id and its checkout URL. */
async function request(question = 'Is my weight getting to the lead side early enough?'): Promise<{ id: number; checkoutUrl: string }> {
  const res = await student.json('/api/reviews', json('POST', { recordingId, question }));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: number; checkoutUrl: string };
}

/** Submits the fake's pay page the way the browser's form does; the fake sends the signed webhook, then redirects. */
async function pay(checkoutUrl: string): Promise<Response> {
  return fetch(checkoutUrl, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: '', redirect: 'manual' });
}

beforeAll(async () => {
  expect(WEBHOOK_SECRET, 'npm test starts the payments fake and passes PAYMENTS_WEBHOOK_SECRET').toMatch(/^whsec_/);
  [coach, coach2, student, admin, researcher] = await Promise.all([
    signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD),
    signedIn(env.E2E_BASE_URL, DEMO.coach2, DEMO_PASSWORD),
    signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD),
    signedIn(env.E2E_BASE_URL, DEMO.admin, DEMO_PASSWORD),
    signedIn(env.E2E_BASE_URL, DEMO.researcher, DEMO_PASSWORD),
  ]);
  db = serverDb();
  // a ready recording of the student's own player (athlete 1, Ada Fenwick, coached by coach@)
  const content = generateSession({ seed: 1818, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 2, withMarker: true }).csv();
  const res = await upload(coach, { athleteId: 1, sessionId: 1, handedness: 'right', stanceWidthMm: 380 }, [{ name: `review-${Date.now().toString(36)}.csv`, content }]);
  expect(res.status).toBe(202);
  recordingId = res.body.recordings[0].id;
  expect((await settled(coach, recordingId)).status).toBe('ready');
}, 120_000);

afterAll(async () => {
  await db?.destroy();
});

describe('the coach offer and the student request', () => {
  it('PUT /api/review-offer 200 for a coach, 403 for a student, 422 on a bad price; the student sees the offer', async () => {
    const put = await coach.json('/api/review-offer', json('PUT', { priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }));
    expect(put.status).toBe(200);
    expect((await student.json('/api/review-offer', json('PUT', { priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }))).status).toBe(403);
    const bad = await coach.json('/api/review-offer', json('PUT', { priceCents: 45.5, currency: 'EUR', turnaroundDays: 3 }));
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toContain('priceCents');
    const seen = await student.json('/api/review-offer');
    expect(seen.body).toMatchObject({ offers: [{ coachName: 'Maren Solberg', priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }] });
  });

  it('eligible recordings: the student’s ready ones only', async () => {
    const res = await student.json('/api/reviews/eligible-recordings');
    expect(res.status).toBe(200);
    const ids = (res.body as { recordings: { id: number }[] }).recordings.map((r) => r.id);
    expect(ids).toContain(recordingId);
    expect((await coach.json('/api/reviews/eligible-recordings')).status).toBe(403);
  });
});

describe('the full flow against the payments fake', () => {
  it('request -> checkout -> signed webhook -> paid -> delivered -> the student’s mail; replays and late events change nothing', async () => {
    const before = mailsNow();
    const { id, checkoutUrl } = await request();
    expect(checkoutUrl.startsWith(`${FAKE}/pay/`)).toBe(true);
    let r = await review(student, id);
    expect(r.status).toBe('awaiting_payment');
    expect(r.checkoutSessionId).toMatch(/^cs_/);
    expect(r.payments).toEqual([]);
    expect(r.history.map((h) => h.to)).toEqual(['requested', 'awaiting_payment']);
    expect(r.history[0]).toMatchObject({ by: 'student', byName: 'Ada Fenwick' });
    // the checkout session at the fake carries client_reference_id = the review id
    const cs = await (await fetch(`${FAKE}/v1/checkout/sessions/${r.checkoutSessionId}`, { headers: { authorization: `Bearer ${process.env.PAYMENTS_SECRET_KEY}` } })).json();
    expect(cs).toMatchObject({ client_reference_id: String(id), amount_total: 4500, currency: 'eur', status: 'open' });
    await waitForMail(DEMO.student, before);

    // bad signature: 400, nothing changes
    const forged = JSON.stringify({ id: `evt_forged_${id}`, object: 'event', type: 'checkout.session.completed', data: { object: { ...cs, status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' } } });
    expect((await postWebhook(forged, sign(forged, 'whsec_not_the_secret'))).status).toBe(400);
    expect((await postWebhook(forged, 'garbage')).status).toBe(400);
    expect((await postWebhook(forged + ' ', sign(forged))).status).toBe(400); // body changed after signing
    r = await review(student, id);
    expect(r.status).toBe('awaiting_payment');
    expect(r.payments).toEqual([]);
    expect(await db('payment_events').where({ event_id: `evt_forged_${id}` }).first()).toBeUndefined();

    // pay on the fake's page: it sends the signed checkout.session.completed, then redirects back to the app
    const paid = await pay(checkoutUrl);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${env.E2E_BASE_URL}/reviews/${id}?paid=1`);
    r = await review(student, id);
    expect(r.status).toBe('paid');
    expect(r.payments).toEqual([expect.objectContaining({ kind: 'payment', amountCents: 4500, currency: 'EUR', providerRef: r.checkoutSessionId })]);
    // due = payment time + 3 days (the offer's turnaround)
    const paidAt = Date.parse(r.history.at(-1)!.at);
    expect(Date.parse(r.dueAt!) - paidAt).toBe(3 * 24 * 3600 * 1000);
    expect(r.history.at(-1)).toMatchObject({ from: 'awaiting_payment', to: 'paid', by: 'payments', byName: null });

    // the same event 5 times: 200 each, no second payment
    const [completed] = await fakeEvents(r.checkoutSessionId!);
    expect(completed.type).toBe('checkout.session.completed');
    expect(completed.status).toBe(200);
    for (let i = 0; i < 5; i++) {
      const again = await postWebhook(completed.body, sign(completed.body));
      expect(again.status).toBe(200);
      expect(again.body).toMatchObject({ received: true, outcome: 'replay' });
    }
    // out of order: an expiry for the same session arriving after the payment (a new event id) cannot cancel it
    const event = JSON.parse(completed.body);
    const lateExpiry = JSON.stringify({ ...event, id: `${event.id}_late_expiry`, type: 'checkout.session.expired', data: { object: { ...event.data.object, status: 'expired', payment_status: 'unpaid' } } });
    expect((await postWebhook(lateExpiry, sign(lateExpiry))).body).toMatchObject({ outcome: 'ignored' });
    // and the provider's own resend of the completion under another event id records no second payment
    const resent = JSON.stringify({ ...event, id: `${event.id}_resent` });
    expect((await postWebhook(resent, sign(resent))).body).toMatchObject({ outcome: 'ignored' });
    r = await review(student, id);
    expect(r.status).toBe('paid');
    expect(r.payments).toHaveLength(1);
    expect(Number((await db('review_payments').where({ review_id: id }).count({ n: '*' }))[0].n)).toBe(1);

    // the coach's queue: this review, paid, not overdue
    const queue = (await coach.json('/api/reviews')).body as { reviews: { id: number; status: string; overdue: boolean }[] };
    expect(queue.reviews.find((q) => q.id === id)).toMatchObject({ status: 'paid', overdue: false });

    // deliver: 200, the student's mail links to the review
    const beforeDelivery = mailsNow();
    const delivered = await coach.json(`/api/reviews/${id}/deliver`, json('POST', { summary: 'Your pressure moves to the lead side nicely; start it a touch earlier from the top.' }));
    expect(delivered.status, JSON.stringify(delivered.body)).toBe(200);
    expect(delivered.body).toMatchObject({ status: 'delivered' });
    const mail = await waitForMail(DEMO.student, beforeDelivery);
    expect(mail.subject).toMatch(/^Your review is ready/);
    expect(mail.text).toContain(`${env.E2E_BASE_URL}/reviews/${id}`);
    expect(mail.text).toContain('physiotherapist');
    r = await review(student, id);
    expect(r.history.map((h) => h.to)).toEqual(['requested', 'awaiting_payment', 'paid', 'in_review', 'delivered']);
    expect(r.history.slice(3).every((h) => h.by === 'coach' && h.byName === 'Maren Solberg')).toBe(true);

    // a refund after delivery is refused with a clear message, and nothing changes
    const refused = await coach.json(`/api/reviews/${id}/refund`, { method: 'POST' });
    expect(refused.status).toBe(409);
    expect(refused.body).toMatchObject({ error: { code: 'refund_after_delivery' } });
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/already delivered/);
    r = await review(student, id);
    expect(r.status).toBe('delivered');
    expect(r.payments).toHaveLength(1);
  });

  it('a refund before delivery goes through the SDK; a late completion replay cannot undo it', async () => {
    const { id, checkoutUrl } = await request('Please look at my transition.');
    expect((await pay(checkoutUrl)).status).toBe(303);
    expect((await coach2.json(`/api/reviews/${id}/refund`, { method: 'POST' })).status).toBe(404);
    const refunded = await coach.json(`/api/reviews/${id}/refund`, { method: 'POST' });
    expect(refunded.status, JSON.stringify(refunded.body)).toBe(200);
    const r = refunded.body as ReviewBody;
    expect(r.status).toBe('refunded');
    expect(r.payments.map((p) => [p.kind, p.amountCents])).toEqual([
      ['payment', 4500],
      ['refund', 4500],
    ]);
    expect(r.payments[1].providerRef).toMatch(/^re_/);
    const [completed] = await fakeEvents(r.checkoutSessionId!);
    expect((await postWebhook(completed.body, sign(completed.body))).body).toMatchObject({ outcome: 'replay' });
    expect((await review(coach, id)).status).toBe('refunded');
    expect((await coach.json(`/api/reviews/${id}/deliver`, json('POST', { summary: 'Too late for this one, it was refunded.' }))).status).toBe(409);
  });

  it('the student cancels an unpaid request: the checkout expires at the fake and its webhook is a no-op', async () => {
    const { id, checkoutUrl } = await request('Cancel me please.');
    const cancelled = await student.json(`/api/reviews/${id}/cancel`, { method: 'POST' });
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(200);
    expect(cancelled.body).toMatchObject({ status: 'cancelled' });
    const r = await review(student, id);
    const [expired] = await fakeEvents(r.checkoutSessionId!);
    expect(expired).toMatchObject({ type: 'checkout.session.expired', status: 200 });
    expect(await db('payment_events').where({ event_id: expired.id }).first('outcome')).toEqual({ outcome: 'ignored' });
    // the pay page no longer takes a payment
    expect(await (await fetch(checkoutUrl)).text()).toContain('This checkout is expired');
    expect(r.history.map((h) => [h.to, h.by])).toEqual([
      ['requested', 'student'],
      ['awaiting_payment', 'payments'],
      ['cancelled', 'student'],
    ]);
  });

  it('an expired checkout cancels the request (webhook from the fake)', async () => {
    const { id } = await request('Let this one lapse.');
    const r = await review(student, id);
    const expire = await fetch(`${FAKE}/v1/checkout/sessions/${r.checkoutSessionId}/expire`, { method: 'POST', headers: { authorization: `Bearer ${process.env.PAYMENTS_SECRET_KEY}` } });
    expect(expire.status).toBe(200);
    const after = await review(student, id);
    expect(after.status).toBe('cancelled');
    expect(after.history.at(-1)).toMatchObject({ from: 'awaiting_payment', to: 'cancelled', by: 'payments' });
  });

  it('overdue: a paid review past its due date is marked and comes first in the queue', async () => {
    const { id, checkoutUrl } = await request('Is my finish balanced?');
    await pay(checkoutUrl);
    await db('reviews').where({ id }).update({ due_at: new Date(Date.now() - 3600_000) });
    const queue = ((await coach.json('/api/reviews')).body as { reviews: { id: number; status: string; overdue: boolean; dueAt: string | null }[] }).reviews;
    expect(queue[0]).toMatchObject({ id, overdue: true });
    const open = queue.filter((q) => q.status === 'paid' || q.status === 'in_review');
    const dues = open.map((q) => Date.parse(q.dueAt!));
    expect([...dues].sort((a, b) => a - b)).toEqual(dues);
    expect((await coach.json(`/api/reviews/${id}/start`, { method: 'POST' })).body).toMatchObject({ status: 'in_review' });
  });
});

describe('role matrix', () => {
  it('GET /api/reviews/:id: the student, the coach and the academy admin; others 404/403/401', async () => {
    const { id } = await request('Role matrix request.');
    const none = new HttpSession(env.E2E_BASE_URL);
    const expected: [HttpSession, number][] = [
      [student, 200],
      [coach, 200],
      [admin, 200],
      [coach2, 404],
      [researcher, 403],
      [none, 401],
    ];
    for (const [who, status] of expected) expect((await who.json(`/api/reviews/${id}`)).status).toBe(status);
    expect((await coach.json('/api/reviews/999999')).status).toBe(404);
    // lists: the student's own, the coach's own, the admin's academy
    const ids = async (who: HttpSession) => ((await who.json('/api/reviews')).body as { reviews: { id: number }[] }).reviews.map((r) => r.id);
    expect(await ids(student)).toContain(id);
    expect(await ids(coach)).toContain(id);
    expect(await ids(admin)).toContain(id);
    expect(await ids(coach2)).not.toContain(id);
    expect((await researcher.json('/api/reviews')).status).toBe(403);
    // who may do what
    expect((await coach.json('/api/reviews', json('POST', { recordingId, question: 'A coach cannot ask.' }))).status).toBe(403);
    expect((await coach2.json(`/api/reviews/${id}/deliver`, json('POST', { summary: 'Not my review to deliver.' }))).status).toBe(404);
    expect((await student.json(`/api/reviews/${id}/deliver`, json('POST', { summary: 'I cannot deliver my own.' }))).status).toBe(403);
    expect((await admin.json('/api/reviews/revenue')).status).toBe(200);
    expect((await coach.json('/api/reviews/revenue')).status).toBe(403);
    // a recording that is not the student's: 404
    expect((await student.json('/api/reviews', json('POST', { recordingId: 999999, question: 'Not mine at all.' }))).status).toBe(404);
  });

  it('revenue per coach per month equals the sum of the stored payment records', async () => {
    const rows = ((await admin.json('/api/reviews/revenue')).body as { rows: { coachName: string; month: string; currency: string; paidCents: number; refundedCents: number; netCents: number }[] }).rows;
    const month = new Date().toISOString().slice(0, 7);
    const mine = rows.find((r) => r.coachName === 'Maren Solberg' && r.month === month && r.currency === 'EUR');
    const sums: { kind: string; s: unknown }[] = await db('review_payments').where({ coach_user_id: 2, currency: 'EUR' }).whereRaw("DATE_FORMAT(created_at, '%Y-%m') = ?", [month]).select('kind').sum({ s: 'amount_cents' }).groupBy('kind');
    const paid = Number(sums.find((s) => s.kind === 'payment')?.s ?? 0);
    const refunded = Number(sums.find((s) => s.kind === 'refund')?.s ?? 0);
    expect(paid).toBeGreaterThanOrEqual(3 * 4500); // this file paid three reviews
    expect(mine).toMatchObject({ paidCents: paid, refundedCents: refunded, netCents: paid - refunded });
  });
});

describe('the coach withdraws the offer, then offers it again', () => {
  type OfferBody = { coachUserId: number; coachName: string; priceCents: number; currency: string; turnaroundDays: number; withdrawnAt: string | null };

  it('DELETE /api/review-offer: coach 200, student and admin 403, no session 401, a coach without an offer 404', async () => {
    expect((await coach.json('/api/review-offer', json('PUT', { priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }))).status).toBe(200);
    expect((await student.json('/api/review-offer', { method: 'DELETE' })).status).toBe(403);
    expect((await admin.json('/api/review-offer', { method: 'DELETE' })).status).toBe(403);
    expect((await researcher.json('/api/review-offer', { method: 'DELETE' })).status).toBe(403);
    expect((await new HttpSession(env.E2E_BASE_URL).json('/api/review-offer', { method: 'DELETE' })).status).toBe(401);
    const coach2Id = Number((await db('users').where({ email: DEMO.coach2 }).first('id')).id);
    await db('review_offers').where({ coach_user_id: coach2Id }).del();
    const none = await coach2.json('/api/review-offer', { method: 'DELETE' });
    expect(none.status).toBe(404);
    expect(none.body).toMatchObject({ error: { code: expect.any(String), message: expect.stringMatching(/no review offer/) } });
    // nothing above withdrew coach@'s offer
    expect((await student.json('/api/review-offer')).body).toMatchObject({ offers: [{ coachName: 'Maren Solberg', withdrawnAt: null }] });
  });

  it('after the withdrawal: invisible to the student, a new request 409; open requests go on at their own price; PUT offers again', async () => {
    // made before the withdrawal: one paid, one still waiting for payment
    const paidOne = await request('Paid before the coach stopped taking requests.');
    expect((await pay(paidOne.checkoutUrl)).status).toBe(303);
    expect((await review(student, paidOne.id)).status).toBe('paid');
    const unpaidOne = await request('Made before the coach stopped, paid after.');

    const before = Date.now();
    const withdrawn = await coach.json('/api/review-offer', { method: 'DELETE' });
    expect(withdrawn.status, JSON.stringify(withdrawn.body)).toBe(200);
    const offer = (withdrawn.body as { offer: OfferBody }).offer;
    expect(offer).toMatchObject({ coachName: 'Maren Solberg', priceCents: 4500, currency: 'EUR', turnaroundDays: 3 });
    expect(Date.parse(offer.withdrawnAt!)).toBeGreaterThanOrEqual(before - 1000);
    // the row and its values are kept
    expect(await db('review_offers').where({ coach_user_id: offer.coachUserId }).first('price_cents', 'currency', 'turnaround_days')).toEqual({ price_cents: 4500, currency: 'EUR', turnaround_days: 3 });
    // a second DELETE changes nothing: the first withdrawal time stays
    const again = await coach.json('/api/review-offer', { method: 'DELETE' });
    expect(again.status).toBe(200);
    expect((again.body as { offer: OfferBody }).offer.withdrawnAt).toBe(offer.withdrawnAt);

    // the coach still sees it (the form shows it and offers it again); the student does not
    expect((await coach.json('/api/review-offer')).body).toEqual({ offers: [offer] });
    expect((await student.json('/api/review-offer')).body).toEqual({ offers: [] });

    // a new request: 409 with a clear message, and no review row
    const rowsBefore = Number((await db('reviews').count({ n: '*' }))[0].n);
    const refused = await student.json('/api/reviews', json('POST', { recordingId, question: 'Can I still ask for a review?' }));
    expect(refused.status).toBe(409);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/Maren Solberg is not taking review requests/);
    expect(Number((await db('reviews').count({ n: '*' }))[0].n)).toBe(rowsBefore);

    // the request made before is paid after the withdrawal, at its own price
    expect((await pay(unpaidOne.checkoutUrl)).status).toBe(303);
    const lateBody = await review(student, unpaidOne.id);
    expect(lateBody.status).toBe('paid');
    expect(lateBody.payments).toEqual([expect.objectContaining({ kind: 'payment', amountCents: 4500, currency: 'EUR' })]);

    // the paid one is started and delivered as before
    expect((await coach.json(`/api/reviews/${paidOne.id}/start`, { method: 'POST' })).body).toMatchObject({ status: 'in_review' });
    const delivered = await coach.json(`/api/reviews/${paidOne.id}/deliver`, json('POST', { summary: 'Delivered after you stopped taking requests: the open ones still count.' }));
    expect(delivered.status, JSON.stringify(delivered.body)).toBe(200);
    expect(delivered.body).toMatchObject({ status: 'delivered', priceCents: 4500, currency: 'EUR' });
    const late = await coach.json(`/api/reviews/${unpaidOne.id}/deliver`, json('POST', { summary: 'Also delivered after the withdrawal, paid at its own price.' }));
    expect(late.status, JSON.stringify(late.body)).toBe(200);

    // PUT offers again: withdrawnAt back to null, the student sees it, a request goes through (then cancelled)
    const put = await coach.json('/api/review-offer', json('PUT', { priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }));
    expect(put.status).toBe(200);
    expect((put.body as { offer: OfferBody }).offer.withdrawnAt).toBeNull();
    expect((await coach.json('/api/review-offer')).body).toMatchObject({ offers: [{ withdrawnAt: null }] });
    expect((await student.json('/api/review-offer')).body).toMatchObject({ offers: [{ coachName: 'Maren Solberg', priceCents: 4500, withdrawnAt: null }] });
    const { id } = await request('Asking again now that the offer is back.');
    expect((await student.json(`/api/reviews/${id}/cancel`, { method: 'POST' })).status).toBe(200);
  });
});
