'use client';
// Delete one recording (a failed one, a wrong file): asks first, then offers Undo. It goes to the bin and can be
// restored for 30 days (DELETE /api/recordings/:id, POST /api/recordings/:id/restore).
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ApiError, deleteJson, sendJson } from '@/lib/fetcher';
import { binnedRecordingSchema } from '@/lib/contracts/sessions';

export function RecordingDelete({ id, filename, onChanged }: { id: number; filename: string; onChanged: () => void }) {
  const [mode, setMode] = useState<'idle' | 'confirm'>('idle');
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    setError(null);
    try {
      await deleteJson(`/api/recordings/${id}`, binnedRecordingSchema);
      setMode('idle');
      onChanged();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not delete the recording.');
    }
  }
  if (mode === 'idle') {
    return (
      <Button type="button" variant="secondary" className="min-h-11" aria-label={`Delete ${filename}`} onClick={() => setMode('confirm')}>
        Delete…
      </Button>
    );
  }
  return (
    <span role="alertdialog" aria-label={`Delete ${filename}?`} className="inline-flex flex-wrap items-center gap-2 text-sm">
      <span>Delete {filename} and its swings? You can undo this for 30 days.</span>
      <Button type="button" variant="danger" className="min-h-11" onClick={() => void remove()}>
        Move to bin
      </Button>
      <Button type="button" variant="secondary" className="min-h-11" onClick={() => setMode('idle')}>
        Keep it
      </Button>
      {error && <span role="alert" className="font-medium text-danger">{error}</span>}
    </span>
  );
}

/** The undo line after a recording was deleted. */
export function RecordingUndo({ id, filename, onChanged, onDone }: { id: number; filename: string; onChanged: () => void; onDone: () => void }) {
  const [error, setError] = useState<string | null>(null);
  async function restore() {
    try {
      await sendJson(`/api/recordings/${id}/restore`, 'POST', undefined, binnedRecordingSchema);
      onDone();
      onChanged();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not restore the recording.');
    }
  }
  return (
    <li role="status" className="flex flex-wrap items-center gap-3 py-3 text-sm">
      <span>{filename} moved to the bin.</span>
      <Button type="button" variant="secondary" className="min-h-11" onClick={() => void restore()}>
        Undo
      </Button>
      {error && <span role="alert" className="font-medium text-danger">{error}</span>}
    </li>
  );
}
