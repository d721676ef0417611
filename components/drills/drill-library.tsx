'use client';
// The coach's drill library with an assign control per drill, then what is assigned and whether it was practised.
import { formatDate } from '@/components/ui/format';
import { Badge } from '@/components/ui/badge';
import { AssignForm } from './assign-form';
import { DrillCard } from './drill-card';
import { useAssignments, useDrills } from './drill-api';
import { isOverdue } from './student-drills';

type AthleteOption = { id: number; displayName: string };

export function DrillLibrary({ athletes }: { athletes: AthleteOption[] }) {
  const { data, error } = useDrills();
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the drills: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  if (data.drills.length === 0) return <p className="text-sm text-ink-muted">No drills yet. Add one below.</p>;
  return (
    <div className="grid gap-3 md:grid-cols-2" data-testid="drill-library">
      {data.drills.map((d) => (
        <DrillCard key={d.id} drill={d}>
          <AssignForm drillId={d.id} drillName={d.name} athletes={athletes} />
        </DrillCard>
      ))}
    </div>
  );
}

export function CoachAssignments({ athletes }: { athletes: AthleteOption[] }) {
  const { data, error } = useAssignments();
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the assignments.</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  if (data.assignments.length === 0) return <p className="text-sm text-ink-muted">Nothing assigned yet.</p>;
  const nameOf = (id: number | undefined, fallback?: string | null) => fallback ?? athletes.find((a) => a.id === id)?.displayName ?? '—';
  return (
    <table className="w-full text-left text-sm" data-testid="coach-assignments">
      <thead className="text-xs text-ink-muted">
        <tr><th className="py-1 font-medium">Player</th><th className="py-1 font-medium">Drill</th><th className="py-1 font-medium">Due</th><th className="py-1 font-medium">Practice</th><th className="py-1 font-medium">Player’s note</th></tr>
      </thead>
      <tbody>
        {data.assignments.map((a) => (
          <tr key={a.id} className="border-t border-surface-line" data-assignment={a.id}>
            <td className="py-1.5">{nameOf(a.athleteId, a.athleteName)}</td>
            <td className="py-1.5">{a.drill.name}</td>
            <td className="py-1.5">{formatDate(a.dueDate)}</td>
            <td className="py-1.5">{a.practiceDone ? <Badge tone="ok">✓ done</Badge> : isOverdue(a) ? <Badge tone="notice">overdue</Badge> : <Badge>open</Badge>}</td>
            <td className="py-1.5 text-ink-muted">{a.studentNote || '—'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
