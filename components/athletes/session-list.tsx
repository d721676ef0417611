import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { contextLabels, formatDate } from '@/components/ui/format';
import type { PracticeSession } from '@/lib/contracts/athletes';

export function SessionList({ sessions }: { sessions: PracticeSession[] }) {
  if (sessions.length === 0) return <p className="text-sm text-ink-muted">No sessions recorded yet.</p>;
  return (
    <ol className="divide-y divide-surface-line" data-testid="session-list">
      {sessions.map((s) => (
        <li key={s.id} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 py-3">
          <Link href={`/sessions/${s.id}`} className="w-28 shrink-0 text-sm font-medium tabular-nums text-accent hover:underline">
            {formatDate(s.sessionDate)}
          </Link>
          <Badge>{contextLabels[s.context]}</Badge>
          {s.location && <span className="text-sm text-ink-muted">{s.location}</span>}
          {s.notes && <p className="w-full text-sm text-ink sm:pl-32">{s.notes}</p>}
        </li>
      ))}
    </ol>
  );
}
