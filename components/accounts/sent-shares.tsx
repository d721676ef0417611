'use client';
// The coach's list of what was sent to one player (GET /api/athletes/:id/shares), newest first: each share's date,
// kind and note, the note editable (PATCH /api/shares/:id), and a remove that asks first and can be undone (DELETE,
// then POST /api/shares/:id/restore from the UndoLine).
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { Field, inputClass } from '@/components/ui/field';
import { formatDate } from '@/components/ui/format';
import { ApiError, deleteJson, sendJson } from '@/lib/fetcher';
import { serverErrorText } from '@/lib/forms';
import { type Share, shareBinnedResponseSchema, shareResponseSchema } from '@/lib/contracts/shares';

const kindLabels = { lesson: 'Lesson summary', swing: 'Swing' } as const;

function NoteEditor({ share, athleteName, onSaved, onCancel }: { share: Share; athleteName: string; onSaved: () => void; onCancel: () => void }) {
  const id = useId();
  const [note, setNote] = useState(share.note ?? '');
  const [pending, setPending] = useState(false);
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [error, setError] = useState<string | null>(null);

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setPending(true);
    setFieldError(undefined);
    setError(null);
    try {
      await sendJson(`/api/shares/${share.id}`, 'PATCH', { note }, shareResponseSchema);
      onSaved();
    } catch (e) {
      const noteError = e instanceof ApiError ? e.fieldErrors.note?.[0] : undefined;
      if (noteError) setFieldError(noteError);
      else setError(serverErrorText(e, 'Could not save the note.'));
    } finally {
      setPending(false);
    }
  }

  return (
    <form className="space-y-2" onSubmit={(e) => void save(e)} noValidate>
      <Field id={id} label={`Note for ${athleteName}`} hint="Leave it empty to remove the note. The student is not mailed again." error={fieldError}>
        <textarea
          id={id}
          rows={3}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          className={inputClass}
          aria-invalid={fieldError ? true : undefined}
          aria-describedby={fieldError ? `${id}-error` : `${id}-hint`}
        />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Save note'}
        </Button>
        <Button type="button" variant="secondary" disabled={pending} onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {error && (
        <p role="alert" className="text-sm font-medium text-danger">
          {error}
        </p>
      )}
    </form>
  );
}

export function SentShares({
  shares,
  loadError,
  athleteName,
  onChanged,
}: {
  shares: Share[] | undefined;
  loadError: unknown;
  athleteName: string;
  onChanged: () => void;
}) {
  const [editing, setEditing] = useState<number | null>(null);
  const [removed, setRemoved] = useState<{ id: number; message: string } | null>(null);

  async function remove(share: Share) {
    await deleteJson(`/api/shares/${share.id}`, shareBinnedResponseSchema);
    setRemoved({ id: share.id, message: `${kindLabels[share.kind]} of ${formatDate(share.sessionDate)} removed from ${athleteName}’s list.` });
    if (editing === share.id) setEditing(null);
    onChanged();
  }

  async function undo(id: number) {
    await sendJson(`/api/shares/${id}/restore`, 'POST', undefined, shareResponseSchema);
    onChanged();
  }

  return (
    <section aria-labelledby="sent-shares-title" className="space-y-2 border-t border-surface-line pt-3" data-testid="sent-shares">
      <h3 id="sent-shares-title" className="text-sm font-medium text-ink">
        Sent to the student
      </h3>
      {removed && <UndoLine message={removed.message} onUndo={() => undo(removed.id)} onDismiss={() => setRemoved(null)} />}
      {loadError ? (
        <p role="alert" className="text-sm text-danger">
          Could not load what was sent: {serverErrorText(loadError, 'try again later.')}
        </p>
      ) : !shares ? (
        <p className="text-sm text-ink-muted">Loading…</p>
      ) : shares.length === 0 ? (
        <p className="text-sm text-ink-muted">Nothing sent to {athleteName} yet.</p>
      ) : (
        <ul className="divide-y divide-surface-line">
          {shares.map((share) => (
            <li key={share.id} className="space-y-2 py-2 text-sm" data-share-id={share.id}>
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <p className="text-ink">
                  <span className="font-medium">{formatDate(share.createdAt.slice(0, 10))}</span> · {kindLabels[share.kind]} of {formatDate(share.sessionDate)}
                </p>
                {editing !== share.id && (
                  <div className="flex flex-wrap gap-2">
                    <Button type="button" variant="secondary" aria-label={`Edit the note of the ${kindLabels[share.kind].toLowerCase()} sent ${formatDate(share.createdAt.slice(0, 10))}`} onClick={() => setEditing(share.id)}>
                      Edit note
                    </Button>
                    <ConfirmButton
                      label="Remove…"
                      accessibleLabel={`Remove the ${kindLabels[share.kind].toLowerCase()} sent ${formatDate(share.createdAt.slice(0, 10))}`}
                      question={`Remove this ${kindLabels[share.kind].toLowerCase()} from ${athleteName}’s home page? You can undo it for 30 days.`}
                      confirmLabel="Remove"
                      onConfirm={() => remove(share)}
                    />
                  </div>
                )}
              </div>
              {editing === share.id ? (
                <NoteEditor
                  share={share}
                  athleteName={athleteName}
                  onCancel={() => setEditing(null)}
                  onSaved={() => {
                    setEditing(null);
                    onChanged();
                  }}
                />
              ) : share.note ? (
                <p className="whitespace-pre-wrap text-ink-muted">{share.note}</p>
              ) : (
                <p className="text-ink-faint">No note.</p>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
