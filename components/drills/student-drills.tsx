'use client';
// The student's assigned drills with their cautions; the student can only mark practice done and add a note
// (PATCH /api/drill-assignments/:id { practiceDone, studentNote }).
import { useState } from 'react';
import { mutate } from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { formatDate } from '@/components/ui/format';
import { sendJson } from '@/lib/fetcher';
import { serverErrorText } from '@/lib/forms';
import { assignmentPatchSchema, assignmentResponseSchema, type DrillAssignment as Assignment } from '@/lib/contracts/drills';
import { DrillCard } from './drill-card';
import { ASSIGNMENTS_URL, useAssignments } from './drill-api';

export function StudentDrills() {
  const { data, error } = useAssignments();
  if (error) return <p role="alert" className="text-sm text-danger">Could not load your drills: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  if (data.assignments.length === 0) return <p className="text-sm text-ink-muted">Your coach has not given you a drill yet.</p>;
  return (
    <div className="space-y-3" data-testid="student-drills">
      {data.assignments.map((a) => (
        <DrillCard key={a.id} drill={a.drill}>
          <PracticeDone assignment={a} />
        </DrillCard>
      ))}
    </div>
  );
}

/** Due before today and practice not done (dates compared as YYYY-MM-DD in the viewer's own calendar). */
export function isOverdue(a: { dueDate: string; practiceDone: boolean }, today = localToday()): boolean {
  return !a.practiceDone && a.dueDate < today;
}

function localToday(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

function PracticeDone({ assignment: a }: { assignment: Assignment }) {
  const [note, setNote] = useState(a.studentNote ?? '');
  const [err, setErr] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function save(done = true) {
    setErr(null);
    const parsed = assignmentPatchSchema.safeParse({ practiceDone: done, ...(done && note.trim() ? { studentNote: note } : {}) });
    if (!parsed.success) return setErr(parsed.error.issues[0]?.message ?? 'Check the note.');
    setBusy(true);
    try {
      await sendJson(`${ASSIGNMENTS_URL}/${a.id}`, 'PATCH', parsed.data, assignmentResponseSchema);
      await mutate(ASSIGNMENTS_URL);
    } catch (e) {
      setErr(serverErrorText(e, 'Could not save.'));
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="mt-3 space-y-2 border-t border-surface-line pt-3 text-sm" data-assignment={a.id} data-done={a.practiceDone ? 'true' : 'false'}>
      <p className="text-sm text-ink-muted">
        Due {formatDate(a.dueDate)} {isOverdue(a) && <Badge tone="notice">Overdue</Badge>}
      </p>
      {a.practiceDone ? (
        <>
          <p><Badge tone="ok">✓ Practice done</Badge>{a.studentNote ? <span className="ml-2 text-ink-muted">“{a.studentNote}”</span> : null}</p>
          <Button type="button" variant="secondary" className="min-h-11" onClick={() => void save(false)} disabled={busy}>
            Not done yet (take back)
          </Button>
          {err && <p role="alert" className="text-sm text-danger">{err}</p>}
        </>
      ) : (
        <>
          <label className="block">
            <span className="block text-sm text-ink-muted">Note for your coach (optional)</span>
            <textarea aria-label="Note for your coach" rows={2} className={inputClass} value={note} onChange={(e) => setNote(e.target.value)} />
          </label>
          <Button type="button" onClick={() => void save()} disabled={busy}>Mark practice done</Button>
          {err && <p role="alert" className="text-sm text-danger">{err}</p>}
        </>
      )}
    </div>
  );
}
