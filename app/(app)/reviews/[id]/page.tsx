import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { ReviewActions } from '@/components/reviews/review-actions';
import { Badge } from '@/components/ui/badge';
import { Card, PageHeader } from '@/components/ui/card';
import { formatDate } from '@/components/ui/format';
import { requirePageRole } from '@/lib/auth/roles';
import { formatMoney, REVIEW_STATUS_LABELS } from '@/lib/contracts/reviews';
import { listDrills } from '@/lib/drills/store';
import { idParamSchema, NotFoundError } from '@/lib/http';
import { getReview, openCheckoutUrl } from '@/lib/reviews/reviews';

export const metadata: Metadata = { title: 'Remote review' };

const BY = { student: 'the student', coach: 'the coach', admin: 'the admin', payments: 'the payment service' } as const;
const at = (iso: string) => `${formatDate(iso.slice(0, 10))} ${iso.slice(11, 16)} UTC`;

export default async function ReviewPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ paid?: string }> }) {
  const viewer = await requirePageRole('coach', 'student', 'admin');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const review = await getReview(viewer, id.data).catch((e: unknown) => {
    if (e instanceof NotFoundError) notFound();
    throw e;
  });
  const justPaid = (await searchParams).paid === '1';
  const payUrl = viewer.role === 'student' && review.status === 'awaiting_payment' ? await openCheckoutUrl(viewer, review.id).catch(() => null) : null;
  const drills = viewer.role === 'coach' ? (await listDrills(viewer)).map((d) => ({ id: d.id, name: d.name })) : [];
  return (
    <>
      <PageHeader title={`Remote review #${review.id}`} subtitle={`${review.studentName} asked ${review.coachName} · ${formatMoney(review.priceCents, review.currency)}`} />
      <div className="space-y-6">
        {justPaid && viewer.role === 'student' && (
          <p role="status" className="rounded-md border border-surface-line bg-surface px-3 py-2 text-sm text-ink" data-testid="paid-banner">
            {review.status === 'awaiting_payment' ? 'Your payment is being confirmed; reload in a moment.' : 'Thank you: your payment went through and your coach has your request.'}
          </p>
        )}
        <Card title="Request">
          <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]">
            <dt className="font-medium">State</dt>
            <dd data-testid="review-status">
              <Badge tone={review.status === 'delivered' ? 'ok' : 'neutral'}>{REVIEW_STATUS_LABELS[review.status]}</Badge>
              {review.overdue && (
                <span className="ml-2">
                  <Badge tone="danger">Overdue</Badge>
                </span>
              )}
            </dd>
            <dt className="font-medium">Question</dt>
            <dd className="whitespace-pre-wrap">{review.question}</dd>
            <dt className="font-medium">Recording</dt>
            <dd>
              <Link href={`/sessions/${review.sessionId}`} className="inline-flex min-h-11 items-center underline">
                {review.recordingName} (open the session and its swings)
              </Link>
            </dd>
            <dt className="font-medium">Due</dt>
            <dd>{review.dueAt ? at(review.dueAt) : 'Counts from payment'}</dd>
          </dl>
        </Card>
        {review.status === 'delivered' && (
          <Card title="The review">
            <div className="space-y-3 text-sm">
              <p className="whitespace-pre-wrap" data-testid="review-summary">{review.summary}</p>
              {review.drill && (
                <p>
                  Drill: <strong>{review.drill.name}</strong> (steps on the{' '}
                  <Link href="/drills" className="underline">
                    drills page
                  </Link>
                  )
                </p>
              )}
              <p>The coach&apos;s notes and corrections are on the swings of the recording above.</p>
              <p className="text-ink-muted">
                Try any change or drill gently and warm up first. Players under 18 practise with a parent&apos;s or guardian&apos;s consent, as local rules require.
              </p>
            </div>
          </Card>
        )}
        {(viewer.role === 'coach' || (viewer.role === 'student' && (review.status === 'requested' || review.status === 'awaiting_payment'))) && (
          <Card title={viewer.role === 'coach' ? 'Your review' : 'Your request'}>
            {viewer.role === 'coach' && review.status !== 'delivered' && (review.status === 'paid' || review.status === 'in_review') && (
              <p className="mb-4 text-sm text-ink-muted">
                Add notes and move events on the swings in the viewer first; then write the summary here. A refund is possible until you send the review.
              </p>
            )}
            {viewer.role === 'coach' && review.status === 'delivered' && <p className="text-sm text-ink-muted">Sent. A delivered review cannot be refunded here.</p>}
            {payUrl && (
              <p className="mb-4 text-sm">
                <a href={payUrl} className="inline-flex min-h-11 items-center rounded-md bg-accent px-3.5 py-2 font-medium text-white">
                  Pay {formatMoney(review.priceCents, review.currency)}
                </a>
              </p>
            )}
            <ReviewActions review={review} role={viewer.role} drills={drills} />
          </Card>
        )}
        <Card title="History">
          <ol className="space-y-1 text-sm" data-testid="review-history">
            {review.history.map((h, i) => (
              <li key={i}>
                {at(h.at)}: {REVIEW_STATUS_LABELS[h.to]}, by {h.byName ?? BY[h.by]}
              </li>
            ))}
          </ol>
        </Card>
        <Card title="Payments">
          {review.payments.length === 0 ? (
            <p className="text-sm text-ink-muted">No payment yet.</p>
          ) : (
            <ul className="space-y-1 text-sm">
              {review.payments.map((p) => (
                <li key={p.id}>
                  {at(p.createdAt)}: {p.kind === 'payment' ? 'Paid' : 'Refunded'} {formatMoney(p.amountCents, p.currency)}
                </li>
              ))}
            </ul>
          )}
        </Card>
        <CoachingCaution />
      </div>
    </>
  );
}
