'use client';
// Assign one drill to one of the coach's students with a due date (POST /api/athletes/:id/drill-assignments).
import { useState } from 'react';
import { mutate } from 'swr';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { serverErrorText } from '@/lib/forms';
import { assignmentInputSchema } from '@/lib/contracts/drills';
import { assignmentResponseSchema } from '@/lib/contracts/drills';
import { ASSIGNMENTS_URL } from './drill-api';

const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);

export function AssignForm({ drillId, drillName, athletes }: { drillId: number; drillName: string; athletes: { id: number; displayName: string }[] }) {
  const [athleteId, setAthleteId] = useState(athletes[0]?.id ?? 0);
  const [dueDate, setDueDate] = useState(inAWeek);
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function assign() {
    setMsg(null);
    const parsed = assignmentInputSchema.safeParse({ drillId, dueDate });
    if (!parsed.success) return setMsg({ ok: false, text: parsed.error.issues[0]?.message ?? 'Check the due date.' });
    setBusy(true);
    try {
      await sendJson(`/api/athletes/${athleteId}/drill-assignments`, 'POST', parsed.data, assignmentResponseSchema);
      setMsg({ ok: true, text: `Assigned to ${athletes.find((a) => a.id === athleteId)?.displayName ?? 'the player'}.` });
      await mutate(ASSIGNMENTS_URL);
    } catch (e) {
      setMsg({ ok: false, text: serverErrorText(e, 'Could not assign the drill.') });
    } finally {
      setBusy(false);
    }
  }

  if (athletes.length === 0) return null;
  return (
    <div className="mt-3 flex flex-wrap items-end gap-2 border-t border-surface-line pt-3 text-sm">
      <label className="space-y-1">
        <span className="block text-sm text-ink-muted">Assign to</span>
        <select aria-label={`Assign ${drillName} to`} className={`${inputClass} w-auto`} value={athleteId} onChange={(e) => setAthleteId(Number(e.target.value))}>
          {athletes.map((a) => <option key={a.id} value={a.id}>{a.displayName}</option>)}
        </select>
      </label>
      <label className="space-y-1">
        <span className="block text-sm text-ink-muted">Due</span>
        <input type="date" aria-label={`Due date for ${drillName}`} className={`${inputClass} w-auto`} value={dueDate} onChange={(e) => setDueDate(e.target.value)} />
      </label>
      <Button type="button" variant="secondary" onClick={() => void assign()} disabled={busy}>Assign</Button>
      {msg && <p role={msg.ok ? 'status' : 'alert'} className={`text-sm ${msg.ok ? 'text-ok' : 'text-danger'}`}>{msg.text}</p>}
    </div>
  );
}
