import type { Metadata } from 'next';
import Link from 'next/link';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { OfferForm } from '@/components/reviews/offer-form';
import { RequestForm } from '@/components/reviews/request-form';
import { RevenueChart } from '@/components/reviews/revenue-chart';
import { ReviewTable } from '@/components/reviews/review-table';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { formatMoney } from '@/lib/contracts/reviews';
import { eligibleRecordings, listReviews, offersFor, revenueByCoachMonth } from '@/lib/reviews/reviews';

export const metadata: Metadata = { title: 'Remote reviews' };

// Coach: the offer and the queue (paid reviews by due date, overdue marked). Student: the offer, the request form and
// their requests. Admin: revenue per coach per month and the academy's reviews.
export default async function ReviewsPage() {
  const viewer = await requirePageRole('coach', 'student', 'admin');
  const reviews = await listReviews(viewer);

  if (viewer.role === 'coach') {
    const [offer] = await offersFor(viewer);
    const open = reviews.filter((r) => r.status === 'paid' || r.status === 'in_review');
    const rest = reviews.filter((r) => !open.includes(r));
    return (
      <>
        <PageHeader title="Remote reviews" subtitle="Students send a recording and a question, pay, and you send back your notes, a summary and a drill." />
        <div className="space-y-6">
          <Card title="Your offer">
            <OfferForm initial={offer ?? null} />
          </Card>
          <Card title={`To review (${open.length})`}>
            <ReviewTable reviews={open} show="student" emptyText="Nothing to review: paid requests appear here, the earliest due date first." />
          </Card>
          <Card title="Other requests">
            <ReviewTable reviews={rest} show="student" emptyText="No other requests yet." />
          </Card>
        </div>
      </>
    );
  }

  if (viewer.role === 'student') {
    const [[offer], recordings] = await Promise.all([offersFor(viewer), eligibleRecordings(viewer).catch(() => [])]);
    return (
      <>
        <PageHeader title="Remote reviews" subtitle="Send your coach a recording and a question; they send back notes on your swings and a summary." />
        <div className="space-y-6">
          <Card title="Ask for a review">
            {offer ? (
              <div className="space-y-4">
                <p className="text-sm text-ink">
                  {offer.coachName} reviews a recording for <strong>{formatMoney(offer.priceCents, offer.currency)}</strong> and sends it back within{' '}
                  <strong>{offer.turnaroundDays} days</strong> of payment.
                </p>
                <RequestForm offer={offer} recordings={recordings} />
              </div>
            ) : (
              <p className="text-sm text-ink-muted">Your coach does not offer remote reviews yet.</p>
            )}
          </Card>
          <Card title="My requests">
            <ReviewTable reviews={reviews} show="coach" emptyText="No requests yet." />
          </Card>
          <CoachingCaution />
        </div>
      </>
    );
  }

  const revenue = await revenueByCoachMonth(viewer);
  return (
    <>
      <PageHeader title="Remote reviews" subtitle="Review revenue per coach and month, from the recorded payments and refunds." />
      <div className="space-y-6">
        <Card title="Revenue per coach per month">
          {revenue.length === 0 ? (
            <p className="text-sm text-ink-muted">No payments yet.</p>
          ) : (
            <div className="space-y-6">
              <div className="overflow-x-auto">
                <table className="w-full text-left text-sm" data-testid="revenue-table">
                  <thead>
                    <tr className="border-b border-surface-line">
                      <th scope="col" className="py-2 pr-4">Month</th>
                      <th scope="col" className="py-2 pr-4">Coach</th>
                      <th scope="col" className="py-2 pr-4 text-right">Paid reviews</th>
                      <th scope="col" className="py-2 pr-4 text-right">Paid</th>
                      <th scope="col" className="py-2 pr-4 text-right">Refunded</th>
                      <th scope="col" className="py-2 text-right">Net</th>
                    </tr>
                  </thead>
                  <tbody>
                    {revenue.map((r) => (
                      <tr key={`${r.coachUserId}-${r.month}-${r.currency}`} className="border-b border-surface-line">
                        <td className="py-2 pr-4">{r.month}</td>
                        <td className="py-2 pr-4">{r.coachName}</td>
                        <td className="py-2 pr-4 text-right">{r.payments}</td>
                        <td className="py-2 pr-4 text-right">{formatMoney(r.paidCents, r.currency)}</td>
                        <td className="py-2 pr-4 text-right">{formatMoney(r.refundedCents, r.currency)}</td>
                        <td className="py-2 text-right font-medium">{formatMoney(r.netCents, r.currency)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              <RevenueChart rows={revenue} />
            </div>
          )}
        </Card>
        <Card title="The academy’s reviews">
          <ReviewTable reviews={reviews} show="both" emptyText="No requests yet." />
        </Card>
        <p className="text-sm text-ink-muted">
          Open a review from the list to see its payments and history. <Link href="/users" className="underline">Accounts</Link>
        </p>
      </div>
    </>
  );
}
