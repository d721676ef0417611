'use client';
// The coach's notes on a swing, pinned to a time (default: the viewer's cursor) or to a phase, either kept for the
// coach or shared with the student; listed in the swing's time order (a phase note sits at the phase's start).
import { useState, type FormEvent } from 'react';
import type { SwingEvents } from '@/components/charts';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { inputClass } from '@/components/ui/field';
import { PHASES } from '@/lib/signal/types';
import { phaseLabels } from './labels';
import { createAnnotation, deleteAnnotation, errorText, restoreAnnotation, updateAnnotation } from './swing-api';
import { phaseNames, type Annotation } from '@/lib/contracts/swings';

/** Where a note sits on the swing's time axis: its time, or the start event of its phase. */
export function annotationTime(a: Annotation, events: SwingEvents | null): number {
  if (a.timeS !== null) return a.timeS;
  const phase = PHASES.find((p) => p.name === a.phase);
  return phase && events ? events[phase.from] : Infinity;
}

export function sortAnnotations(list: Annotation[], events: SwingEvents | null): Annotation[] {
  return [...list].sort((a, b) => annotationTime(a, events) - annotationTime(b, events) || a.id - b.id);
}

export interface AnnotationsPanelProps {
  swingId: number;
  annotations: Annotation[];
  events: SwingEvents | null;
  /** ticks are seconds from this time, as in the viewer */
  timeZero: number;
  cursorTime: number | null;
  canEdit: boolean;
  onChanged: () => void;
}

function where(a: Annotation, timeZero: number): string {
  if (a.timeS !== null) return `at ${(a.timeS - timeZero).toFixed(2)} s`;
  return a.phase ? phaseLabels[a.phase].name.toLowerCase() : 'whole swing';
}

function NoteEdit({ swingId, note, onDone, onChanged }: { swingId: number; note: Annotation; onDone: () => void; onChanged: () => void }) {
  const [body, setBody] = useState(note.body);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const fieldId = `note-edit-${note.id}`;
  const save = async (e: FormEvent) => {
    e.preventDefault();
    const text = body.trim();
    if (text.length === 0) return setError('Note: write something, or delete the note instead.');
    if (text.length > 2000) return setError(`Note: at most 2000 characters (now ${text.length}).`);
    setBusy(true);
    setError(null);
    try {
      await updateAnnotation(swingId, note.id, { body: text });
      onChanged();
      onDone();
    } catch (err) {
      setError(errorText(err));
    } finally {
      setBusy(false);
    }
  };
  return (
    <form onSubmit={save} className="mt-2 space-y-2" noValidate data-testid="annotation-edit">
      <label htmlFor={fieldId} className="sr-only">
        Note text
      </label>
      <textarea id={fieldId} rows={3} maxLength={2000} value={body} onChange={(e) => setBody(e.target.value)} className={inputClass} aria-invalid={error ? true : undefined} />
      {error && (
        <p role="alert" className="text-sm text-danger">
          {error}
        </p>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={busy}>
          Save note
        </Button>
        <Button type="button" variant="secondary" disabled={busy} onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function AnnotationList({ annotations, events, timeZero, canEdit, swingId, onChanged }: Omit<AnnotationsPanelProps, 'cursorTime'>) {
  const [error, setError] = useState<string | null>(null);
  const [editing, setEditing] = useState<number | null>(null);
  // a deleted note (in the bin on the server): Undo restores it, the same note with its id
  const [deleted, setDeleted] = useState<Annotation | null>(null);
  const sorted = sortAnnotations(annotations, events);
  const act = async (f: () => Promise<unknown>) => {
    setError(null);
    try {
      await f();
      onChanged();
    } catch (e) {
      setError(errorText(e));
    }
  };
  const undo = deleted && (
    <UndoLine
      message={`Note deleted: “${deleted.body.length > 60 ? `${deleted.body.slice(0, 60)}…` : deleted.body}”`}
      onUndo={async () => {
        await restoreAnnotation(swingId, deleted.id);
        onChanged();
      }}
      onDismiss={() => setDeleted(null)}
    />
  );
  if (sorted.length === 0) return <>{undo}<p className="text-sm text-ink-muted">No notes on this swing yet.</p></>;
  return (
    <>
      {undo}
      <ol className="space-y-2" data-testid="annotation-list">
        {sorted.map((a) => (
          <li key={a.id} className="rounded-md border border-surface-line p-3" data-testid="annotation" data-visibility={a.visibility}>
            <div className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
              <span className="font-semibold tabular-nums text-ink">{where(a, timeZero)}</span>
              <span>· {a.authorName}</span>
              {canEdit && <Badge tone={a.visibility === 'shared' ? 'ok' : 'neutral'}>{a.visibility === 'shared' ? 'Shared with the student' : 'Coach only'}</Badge>}
            </div>
            {editing === a.id ? (
              <NoteEdit swingId={swingId} note={a} onDone={() => setEditing(null)} onChanged={onChanged} />
            ) : (
              <p className="mt-1 whitespace-pre-wrap text-sm text-ink" data-testid="annotation-body">
                {a.body}
              </p>
            )}
            {canEdit && editing !== a.id && (
              <div className="mt-2 flex flex-wrap gap-2">
                <Button type="button" variant="secondary" aria-label={`Edit the note ${where(a, timeZero)}`} onClick={() => setEditing(a.id)}>
                  Edit
                </Button>
                <Button type="button" variant="secondary" onClick={() => act(() => updateAnnotation(swingId, a.id, { visibility: a.visibility === 'shared' ? 'coach' : 'shared' }))}>
                  {a.visibility === 'shared' ? 'Make coach-only' : 'Share'}
                </Button>
                <ConfirmButton
                  label="Delete…"
                  accessibleLabel={`Delete the note ${where(a, timeZero)}`}
                  question="Delete this note? You can undo it right after."
                  confirmLabel="Delete note"
                  onConfirm={async () => {
                    await deleteAnnotation(swingId, a.id);
                    setDeleted(a);
                    onChanged();
                  }}
                />
              </div>
            )}
          </li>
        ))}
      </ol>
      {error && <p role="alert" className="mt-2 text-sm text-danger">{error}</p>}
    </>
  );
}

export function AnnotationForm({ swingId, cursorTime, timeZero, onChanged }: Pick<AnnotationsPanelProps, 'swingId' | 'cursorTime' | 'timeZero' | 'onChanged'>) {
  const [body, setBody] = useState('');
  const [pin, setPin] = useState<'time' | 'phase'>('time');
  const [phase, setPhase] = useState<(typeof phaseNames)[number]>('backswing');
  const [visibility, setVisibility] = useState<'coach' | 'shared'>('shared');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const text = body.trim();
    if (text.length === 0) return setError('Note: write something first.');
    if (text.length > 2000) return setError(`Note: at most 2000 characters (now ${text.length}).`);
    if (pin === 'time' && cursorTime === null) return setError('Pin: the cursor has no time yet; pin the note to a phase.');
    setBusy(true);
    setError(null);
    try {
      await createAnnotation(swingId, { body: text, visibility, ...(pin === 'time' ? { timeS: Math.round(cursorTime! * 1000) / 1000 } : { phase }) });
      setBody('');
      onChanged();
    } catch (err) {
      setError(errorText(err));
    } finally {
      setBusy(false);
    }
  };

  return (
    <form onSubmit={submit} className="space-y-2" data-testid="annotation-form" noValidate>
      <label htmlFor="annotation-body" className="block text-sm font-medium text-ink">
        New note
      </label>
      <textarea
        id="annotation-body"
        rows={3}
        maxLength={2000}
        value={body}
        onChange={(e) => setBody(e.target.value)}
        className={inputClass}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? 'annotation-error' : undefined}
      />
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        <label className="inline-flex items-center gap-1.5">
          <input type="radio" name="annotation-pin" checked={pin === 'time'} onChange={() => setPin('time')} />
          At the cursor ({cursorTime === null ? '—' : `${(cursorTime - timeZero).toFixed(2)} s`})
        </label>
        <label className="inline-flex items-center gap-1.5">
          <input type="radio" name="annotation-pin" checked={pin === 'phase'} onChange={() => setPin('phase')} />
          To the phase
        </label>
        <select aria-label="Phase" value={phase} disabled={pin !== 'phase'} onChange={(e) => setPhase(e.target.value as typeof phase)} className="rounded-md border border-surface-line bg-surface px-2 py-1 text-sm">
          {phaseNames.map((p) => (
            <option key={p} value={p}>
              {phaseLabels[p].name}
            </option>
          ))}
        </select>
        <label className="inline-flex items-center gap-1.5">
          Visible to
          <select aria-label="Visible to" value={visibility} onChange={(e) => setVisibility(e.target.value as typeof visibility)} className="rounded-md border border-surface-line bg-surface px-2 py-1 text-sm">
            <option value="shared">the student and the coach</option>
            <option value="coach">the coach only</option>
          </select>
        </label>
      </div>
      {error && (
        <p id="annotation-error" role="alert" className="text-sm text-danger" data-testid="annotation-error">
          {error}
        </p>
      )}
      <Button type="submit" disabled={busy}>
        {busy ? 'Adding…' : 'Add note'}
      </Button>
    </form>
  );
}
