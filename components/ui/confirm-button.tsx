'use client';
// A delete (or archive) that asks first: the button opens an inline confirmation saying what happens, with the
// action and "Keep it". The caller then shows an UndoLine where data would otherwise be lost.
import { useId, useState } from 'react';
import { Button } from './button';

export function ConfirmButton({
  label,
  question,
  confirmLabel,
  onConfirm,
  accessibleLabel,
}: {
  /** the button, e.g. "Delete…" */
  label: string;
  /** the full question, e.g. "Delete the drill “Feet together”? It goes to the bin for 30 days." */
  question: string;
  /** the confirming action, e.g. "Move to bin" */
  confirmLabel: string;
  onConfirm: () => Promise<void>;
  /** the button's accessible name when `label` alone is ambiguous in a list */
  accessibleLabel?: string;
}) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const titleId = useId();
  async function confirm() {
    setBusy(true);
    setError(null);
    try {
      await onConfirm();
      setOpen(false);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'That did not work; try again.');
    } finally {
      setBusy(false);
    }
  }
  if (!open) {
    return (
      <Button type="button" variant="secondary" aria-label={accessibleLabel} onClick={() => setOpen(true)}>
        {label}
      </Button>
    );
  }
  return (
    <div role="alertdialog" aria-labelledby={titleId} className="flex flex-wrap items-center gap-2 rounded-md border border-danger p-2 text-sm">
      <p id={titleId} className="basis-full text-ink">
        {question}
      </p>
      <Button type="button" variant="danger" disabled={busy} onClick={() => void confirm()}>
        {confirmLabel}
      </Button>
      <Button type="button" variant="secondary" disabled={busy} onClick={() => setOpen(false)}>
        Keep it
      </Button>
      {error && (
        <p role="alert" className="basis-full font-medium text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

/** "X moved to the bin. [Undo]" after a delete; Undo calls the restore route. */
export function UndoLine({ message, onUndo, onDismiss }: { message: string; onUndo: () => Promise<void>; onDismiss: () => void }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function undo() {
    setBusy(true);
    setError(null);
    try {
      await onUndo();
      onDismiss();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not undo.');
    } finally {
      setBusy(false);
    }
  }
  return (
    <div role="status" className="mb-3 flex flex-wrap items-center gap-3 rounded-md border border-surface-line bg-surface-sunken px-3 py-2 text-sm" data-testid="undo-line">
      <span>{message}</span>
      <Button type="button" variant="secondary" disabled={busy} onClick={() => void undo()}>
        Undo
      </Button>
      <Button type="button" variant="secondary" disabled={busy} onClick={onDismiss}>
        Dismiss
      </Button>
      {error && (
        <span role="alert" className="font-medium text-danger">
          {error}
        </span>
      )}
    </div>
  );
}
