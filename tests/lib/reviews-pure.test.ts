// The review's state rule and its mails, without I/O. The order of states is the issue's own (requested -> awaiting
// payment -> paid -> in review -> delivered, or cancelled / refunded); the signature scheme is the provider's
// published one (header `t=<unix s>,v1=<hex HMAC-SHA256(secret, "<t>.<body>")>`), checked here with the provider's
// SDK (`stripe` webhooks.constructEvent) on a header our payments fake made.
import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { REVIEW_STATUSES } from '@/lib/contracts/reviews';
import { reviewUpdateMail } from '@/lib/mail/kinds/review-update';
import { canMove } from '@/lib/reviews/states';
import { signatureHeader } from '@/scripts/lib/fakes/payments';

const FORWARD = ['requested', 'awaiting_payment', 'paid', 'in_review', 'delivered'] as const;

describe('review states', () => {
  it('moves only forward along the issue’s chain; final states stay final', () => {
    for (let i = 0; i + 1 < FORWARD.length; i++) expect(canMove(FORWARD[i], FORWARD[i + 1])).toBe(true);
    for (let i = 0; i < FORWARD.length; i++) for (let j = 0; j <= i; j++) expect(canMove(FORWARD[i], FORWARD[j])).toBe(false);
    for (const final of ['delivered', 'cancelled', 'refunded'] as const) for (const to of REVIEW_STATUSES) expect(canMove(final, to)).toBe(false);
    // cancel before payment only; refund after payment and before delivery only
    expect(REVIEW_STATUSES.filter((s) => canMove(s, 'cancelled'))).toEqual(['requested', 'awaiting_payment']);
    expect(REVIEW_STATUSES.filter((s) => canMove(s, 'refunded'))).toEqual(['paid', 'in_review']);
  });
});

describe('the payments fake signs as the provider documents', () => {
  it('the SDK’s constructEvent accepts the fake’s header and refuses a changed body or another secret', () => {
    const sdk = new Stripe('sk_test_unused');
    const body = JSON.stringify({ id: 'evt_1', object: 'event', type: 'checkout.session.completed', data: { object: { id: 'cs_1' } } });
    const secret = 'whsec_0123456789abcdef0123456789abcdef';
    const header = signatureHeader(body, secret);
    expect(sdk.webhooks.constructEvent(body, header, secret).id).toBe('evt_1');
    // and the SDK's own test header for the same timestamp is byte-identical to ours
    const t = Number(/t=(\d+)/.exec(header)![1]);
    expect(sdk.webhooks.generateTestHeaderString({ payload: body, secret, timestamp: t })).toBe(header);
    expect(() => sdk.webhooks.constructEvent(`${body} `, header, secret)).toThrow();
    expect(() => sdk.webhooks.constructEvent(body, header, 'whsec_another_secret_0000000000000000')).toThrow();
  });
});

describe('review mails', () => {
  const base = { academyName: 'Harrow Vale Golf Academy', coachName: 'Maren Solberg', amount: '45.00 EUR', dueDate: '2026-12-05', withDrill: true, url: 'http://127.0.0.1:3999/reviews/7' };
  it('every step has its subject, the one link in both parts, and the reason', () => {
    const subjects = new Set<string>();
    for (const step of ['awaiting_payment', 'paid', 'in_review', 'delivered', 'cancelled', 'refunded'] as const) {
      const mail = reviewUpdateMail({ ...base, step });
      subjects.add(mail.subject);
      expect(mail.text).toContain(base.url);
      expect(mail.html).toContain(base.url);
      expect(mail.text).toContain('Harrow Vale Golf Academy');
      expect(mail.text).toContain('You received this because you asked for a remote review');
    }
    expect(subjects.size).toBe(6);
  });
  it('the delivered mail carries the health caution; the others do not', () => {
    expect(reviewUpdateMail({ ...base, step: 'delivered' }).text).toMatch(/physician or physiotherapist/);
    expect(reviewUpdateMail({ ...base, step: 'paid' }).text).not.toMatch(/physiotherapist/);
    expect(reviewUpdateMail({ ...base, step: 'paid' }).text).toContain('by 2026-12-05');
  });
});
