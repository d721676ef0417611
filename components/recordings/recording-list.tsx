'use client';

import { useState } from 'react';
import { formatBytes } from './format';
import { RecordingDelete, RecordingUndo } from './recording-delete';
import { NoSwingsNote } from './no-swings-note';
import { ParameterSources } from './parameter-sources';
import { RecordingErrorNote } from './recording-error-note';
import { StatusBadge } from './status-badge';
import type { SessionRecording } from '@/lib/contracts/recordings';

/** The recordings of a session with their processing state. */
export function RecordingList({ recordings, onChanged }: { recordings: SessionRecording[]; /** the coach's delete; absent: read-only */ onChanged?: () => void }) {
  const [binned, setBinned] = useState<{ id: number; filename: string }[]>([]);
  if (recordings.length === 0 && binned.length === 0) return <p className="text-sm text-ink-muted">No recordings in this session yet.</p>;
  return (
    <ul className="divide-y divide-surface-line" data-testid="recording-list">
      {onChanged &&
        binned.map((b) => <RecordingUndo key={`undo-${b.id}`} id={b.id} filename={b.filename} onChanged={onChanged} onDone={() => setBinned((list) => list.filter((x) => x.id !== b.id))} />)}
      {recordings.map((r) => (
        <li key={r.id} className="space-y-2 py-3" data-testid="recording-row" data-filename={r.filename} data-status={r.status}>
          <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
            <span className="font-medium text-ink">{r.filename}</span>
            <StatusBadge status={r.status} />
            <span className="text-sm tabular-nums text-ink-muted">{formatBytes(r.byteSize)}</span>
            {r.status === 'ready' && <span className="text-sm text-ink-muted">{r.swingCount === 1 ? '1 swing' : `${r.swingCount} swings`}</span>}
            {r.algorithmVersion && <span className="text-sm text-ink-faint">{r.algorithmVersion}</span>}
            {onChanged && (
              <span className="ml-auto">
                <RecordingDelete
                  id={r.id}
                  filename={r.filename}
                  onChanged={() => {
                    setBinned((list) => [...list, { id: r.id, filename: r.filename }]);
                    onChanged();
                  }}
                />
              </span>
            )}
          </div>
          {r.status === 'ready' && <ParameterSources sources={r.parameterSources} />}
          {r.status === 'failed' && r.error && <RecordingErrorNote error={r.error} />}
          {r.status === 'ready' && r.swingCount === 0 && <NoSwingsNote />}
        </li>
      ))}
    </ul>
  );
}
