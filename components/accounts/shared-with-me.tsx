import Link from 'next/link';
import { formatDate } from '@/components/ui/format';
import type { Share } from '@/lib/contracts/shares';

/** What the coach sent the student, newest first (the order listSharesForStudent gives). */
export function SharedWithMe({ shares }: { shares: Share[] }) {
  if (shares.length === 0) return <p className="text-sm text-ink-muted">Nothing shared with you yet. When your coach sends you a lesson or a swing, it appears here.</p>;
  return (
    <ul className="divide-y divide-surface-line text-sm" data-testid="shared-with-me">
      {shares.map((s) => (
        <li key={s.id} className="py-2.5">
          <Link href={s.href} className="inline-flex min-h-11 items-center font-medium text-accent underline">
            {s.kind === 'lesson' ? `Lesson summary, ${formatDate(s.sessionDate)}` : `A swing from ${formatDate(s.sessionDate)}`}
          </Link>
          <span className="block text-ink-muted">
            Sent {formatDate(s.createdAt.slice(0, 10))}
            {s.sharedBy ? ` by ${s.sharedBy}` : ''}
          </span>
          {s.note && <span className="block whitespace-pre-wrap">“{s.note}”</span>}
        </li>
      ))}
    </ul>
  );
}
