'use client';
// The coach's drill library with an assign control per drill, then what is assigned and whether it was practised.
// Every drill and assignment can be edited and deleted: a delete asks first, goes to the bin (30 days) and offers Undo.
import { useState } from 'react';
import { mutate } from 'swr';
import { formatDate } from '@/components/ui/format';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { BIN_DAYS } from '@/lib/contracts/sessions';
import { assignmentBinnedResponseSchema, assignmentResponseSchema, drillBinnedResponseSchema, drillResponseSchema, type DrillAssignment } from '@/lib/contracts/drills';
import { AssignForm } from './assign-form';
import { DrillCard } from './drill-card';
import { DrillForm } from './drill-form';
import { ASSIGNMENTS_URL, DRILLS_URL, useAssignments, useDrills } from './drill-api';
import { isOverdue } from './student-drills';

type AthleteOption = { id: number; displayName: string };
type Undo = { message: string; restore: () => Promise<void> };

const refresh = () => Promise.all([mutate(DRILLS_URL), mutate(ASSIGNMENTS_URL)]);

export function DrillLibrary({ athletes }: { athletes: AthleteOption[] }) {
  const { data, error } = useDrills();
  const [editing, setEditing] = useState<number | null>(null);
  const [undo, setUndo] = useState<Undo | null>(null);
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the drills: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  async function remove(id: number) {
    const { drill } = await sendJson(`${DRILLS_URL}/${id}`, 'DELETE', undefined, drillBinnedResponseSchema);
    await refresh();
    setUndo({
      message: `“${drill.name}” moved to the bin with its assignments.`,
      restore: async () => {
        await sendJson(`${DRILLS_URL}/${id}/restore`, 'POST', undefined, drillResponseSchema);
        await refresh();
      },
    });
  }
  return (
    <>
      {undo && <UndoLine message={undo.message} onUndo={undo.restore} onDismiss={() => setUndo(null)} />}
      {data.drills.length === 0 && <p className="text-sm text-ink-muted">No drills yet. Add one below.</p>}
      <div className="grid gap-3 md:grid-cols-2" data-testid="drill-library">
        {data.drills.map((d) =>
          editing === d.id ? (
            <article key={d.id} className="rounded-md border border-accent p-4" aria-label={`Edit ${d.name}`}>
              <h3 className="mb-2 font-semibold text-ink">Edit “{d.name}”</h3>
              <DrillForm drill={d} onDone={() => setEditing(null)} />
            </article>
          ) : (
            <DrillCard key={d.id} drill={d}>
              <AssignForm drillId={d.id} drillName={d.name} athletes={athletes} />
              <div className="mt-3 flex flex-wrap gap-2 border-t border-surface-line pt-3">
                <Button type="button" variant="secondary" aria-label={`Edit ${d.name}`} onClick={() => setEditing(d.id)}>
                  Edit
                </Button>
                <ConfirmButton
                  label="Delete…"
                  accessibleLabel={`Delete ${d.name}`}
                  question={`Delete “${d.name}” and take it off every player’s list? It goes to the bin: you can undo for ${BIN_DAYS} days.`}
                  confirmLabel="Move to bin"
                  onConfirm={() => remove(d.id)}
                />
              </div>
            </DrillCard>
          ),
        )}
      </div>
    </>
  );
}

function DueDateEdit({ a, onCancel }: { a: DrillAssignment; onCancel: () => void }) {
  const [value, setValue] = useState(a.dueDate);
  const [error, setError] = useState<string | null>(null);
  const fieldId = `due-${a.id}`;
  async function save() {
    setError(null);
    try {
      await sendJson(`${ASSIGNMENTS_URL}/${a.id}`, 'PATCH', { dueDate: value }, assignmentResponseSchema);
      await mutate(ASSIGNMENTS_URL);
      onCancel();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not save the due date.');
    }
  }
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={fieldId} className="sr-only">
        Due date of {a.drill.name} for {a.athleteName}
      </label>
      <input id={fieldId} type="date" value={value} onChange={(e) => setValue(e.target.value)} className={`${inputClass} w-auto`} aria-invalid={error ? true : undefined} />
      <Button type="button" onClick={() => void save()}>
        Save
      </Button>
      <Button type="button" variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
      {error && (
        <p role="alert" className="basis-full text-sm text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

export function CoachAssignments({ athletes }: { athletes: AthleteOption[] }) {
  const { data, error } = useAssignments();
  const [undo, setUndo] = useState<Undo | null>(null);
  const [editing, setEditing] = useState<number | null>(null);
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the assignments.</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  const nameOf = (id: number | undefined, fallback?: string | null) => fallback ?? athletes.find((a) => a.id === id)?.displayName ?? '—';
  async function remove(a: DrillAssignment) {
    await sendJson(`${ASSIGNMENTS_URL}/${a.id}`, 'DELETE', undefined, assignmentBinnedResponseSchema);
    await mutate(ASSIGNMENTS_URL);
    setUndo({
      message: `“${a.drill.name}” taken off ${nameOf(a.athleteId, a.athleteName)}’s list.`,
      restore: async () => {
        await sendJson(`${ASSIGNMENTS_URL}/${a.id}/restore`, 'POST', undefined, assignmentResponseSchema);
        await mutate(ASSIGNMENTS_URL);
      },
    });
  }
  return (
    <>
      {undo && <UndoLine message={undo.message} onUndo={undo.restore} onDismiss={() => setUndo(null)} />}
      {data.assignments.length === 0 ? (
        <p className="text-sm text-ink-muted">Nothing assigned yet.</p>
      ) : (
        <table className="w-full text-left text-sm" data-testid="coach-assignments">
          <thead className="text-ink-muted">
            <tr><th className="py-1 font-medium">Player</th><th className="py-1 font-medium">Drill</th><th className="py-1 font-medium">Due</th><th className="py-1 font-medium">Practice</th><th className="py-1 font-medium">Player’s note</th><th className="py-1 font-medium"><span className="sr-only">Change</span></th></tr>
          </thead>
          <tbody>
            {data.assignments.map((a) => (
              <tr key={a.id} className="border-t border-surface-line align-top" data-assignment={a.id}>
                <td className="py-1.5">{nameOf(a.athleteId, a.athleteName)}</td>
                <td className="py-1.5">{a.drill.name}</td>
                <td className="py-1.5">{editing === a.id ? <DueDateEdit a={a} onCancel={() => setEditing(null)} /> : formatDate(a.dueDate)}</td>
                <td className="py-1.5">{a.practiceDone ? <Badge tone="ok">✓ done</Badge> : isOverdue(a) ? <Badge tone="notice">overdue</Badge> : <Badge>open</Badge>}</td>
                <td className="py-1.5 text-ink-muted">{a.studentNote || '—'}</td>
                <td className="py-1.5">
                  <div className="flex flex-wrap justify-end gap-2">
                    {editing !== a.id && (
                      <Button type="button" variant="secondary" aria-label={`Change the due date of ${a.drill.name} for ${nameOf(a.athleteId, a.athleteName)}`} onClick={() => setEditing(a.id)}>
                        Due date
                      </Button>
                    )}
                    <ConfirmButton
                      label="Remove…"
                      accessibleLabel={`Remove ${a.drill.name} from ${nameOf(a.athleteId, a.athleteName)}`}
                      question={`Take “${a.drill.name}” off ${nameOf(a.athleteId, a.athleteName)}’s list? The practice mark and note are kept in the bin for ${BIN_DAYS} days.`}
                      confirmLabel="Remove"
                      onConfirm={() => remove(a)}
                    />
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
