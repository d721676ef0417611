import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { formatDate } from '@/components/ui/format';
import { formatMoney, REVIEW_STATUS_LABELS, type ReviewListItem } from '@/lib/contracts/reviews';

/** A list of reviews; overdue ones say so in words, not colour alone. */
export function ReviewTable({ reviews, show, emptyText }: { reviews: ReviewListItem[]; show: 'student' | 'coach' | 'both'; emptyText: string }) {
  if (reviews.length === 0) return <p className="text-sm text-ink-muted">{emptyText}</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" data-testid="review-table">
        <thead>
          <tr className="border-b border-surface-line">
            <th scope="col" className="py-2 pr-4">Request</th>
            {show !== 'coach' && <th scope="col" className="py-2 pr-4">Student</th>}
            {show !== 'student' && <th scope="col" className="py-2 pr-4">Coach</th>}
            <th scope="col" className="py-2 pr-4">State</th>
            <th scope="col" className="py-2 pr-4">Due</th>
            <th scope="col" className="py-2 text-right">Price</th>
          </tr>
        </thead>
        <tbody>
          {reviews.map((r) => (
            <tr key={r.id} className="border-b border-surface-line" data-testid={`review-row-${r.id}`}>
              <td className="py-2 pr-4">
                <Link href={`/reviews/${r.id}`} className="inline-flex min-h-11 items-center underline">
                  #{r.id} · {r.question.length > 48 ? `${r.question.slice(0, 47)}…` : r.question}
                </Link>
              </td>
              {show !== 'coach' && <td className="py-2 pr-4">{r.studentName}</td>}
              {show !== 'student' && <td className="py-2 pr-4">{r.coachName}</td>}
              <td className="py-2 pr-4">
                <Badge tone={r.status === 'delivered' ? 'ok' : r.status === 'paid' || r.status === 'in_review' ? 'notice' : 'neutral'}>{REVIEW_STATUS_LABELS[r.status]}</Badge>
              </td>
              <td className="py-2 pr-4">
                {r.dueAt ? formatDate(r.dueAt.slice(0, 10)) : '—'}
                {r.overdue && (
                  <span className="ml-2">
                    <Badge tone="danger">Overdue</Badge>
                  </span>
                )}
              </td>
              <td className="py-2 text-right">{formatMoney(r.priceCents, r.currency)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
