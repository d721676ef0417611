import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { contextLabels, formatDate, handednessLabels } from '@/components/ui/format';
import { isMinor } from '@/lib/contracts/athletes';
import type { AthleteSummary } from '@/lib/contracts/athletes';

export function AthleteTable({ athletes }: { athletes: AthleteSummary[] }) {
  if (athletes.length === 0) {
    return <p className="rounded-md border border-dashed border-surface-line p-6 text-center text-sm text-ink-muted">No athletes match.</p>;
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" data-testid="athlete-table">
        <thead className="border-b border-surface-line text-sm uppercase tracking-wide text-ink-muted">
          <tr>
            <th scope="col" className="py-2 pr-4 font-medium">Athlete</th>
            <th scope="col" className="py-2 pr-4 font-medium">Plays</th>
            <th scope="col" className="py-2 pr-4 font-medium">Stance width</th>
            <th scope="col" className="py-2 pr-4 font-medium">Home club</th>
            <th scope="col" className="py-2 pr-4 font-medium">Last session</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-surface-line">
          {athletes.map((a) => (
            <tr key={a.id} className="hover:bg-surface-sunken/60">
              <td className="py-2.5 pr-4">
                <Link href={`/athletes/${a.id}`} className="font-medium text-ink hover:text-accent hover:underline">
                  {a.displayName}
                </Link>
                {isMinor(a.dateOfBirth) && (
                  <span className="ml-2">
                    <Badge tone="band">Under 18</Badge>
                  </span>
                )}
              </td>
              <td className="py-2.5 pr-4 text-ink-muted">{handednessLabels[a.handedness]}</td>
              <td className="py-2.5 pr-4 tabular-nums">{a.stanceWidthMm} mm</td>
              <td className="py-2.5 pr-4 text-ink-muted">{a.homeClub ?? '—'}</td>
              <td className="py-2.5 pr-4">
                {a.lastSession ? (
                  <span className="inline-flex items-center gap-2">
                    <span className="tabular-nums">{formatDate(a.lastSession.date)}</span>
                    <Badge>{contextLabels[a.lastSession.context]}</Badge>
                  </span>
                ) : (
                  <span className="text-ink-faint">No sessions yet</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
