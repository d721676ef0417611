'use client';

import { formatBytes } from './format';
import { RecordingResult } from './recording-result';

export type QueuedFile = {
  key: string;
  file: File;
  /** pending: not sent yet; uploading: bytes on the way; stored: the server kept it (202); rejected: a 4xx/5xx or network error */
  state: 'pending' | 'uploading' | 'stored' | 'rejected';
  /** bytes of this file sent so far */
  sentBytes: number;
  recordingId?: number;
  duplicate?: boolean;
  message?: string;
};

/** One file of the upload: its byte progress, then its processing state and result. */
export function UploadItem({ item, onRemove }: { item: QueuedFile; onRemove?: () => void }) {
  const size = item.file.size;
  const percent = size === 0 ? (item.state === 'pending' ? 0 : 100) : Math.min(100, Math.round((item.sentBytes / size) * 100));
  return (
    <li className="space-y-2 py-3" data-testid="upload-item" data-filename={item.file.name} data-state={item.state}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="font-medium text-ink">{item.file.name}</span>
        <span className="flex items-center gap-3 text-sm tabular-nums text-ink-muted">
          <span data-testid="upload-bytes">
            {item.state === 'pending' ? formatBytes(size) : `${formatBytes(item.sentBytes)} of ${formatBytes(size)} sent`}
          </span>
          {item.state === 'pending' && onRemove && (
            <button type="button" onClick={onRemove} className="text-accent hover:underline">
              Remove
            </button>
          )}
        </span>
      </div>
      {item.state !== 'pending' && (
        <div
          role="progressbar"
          aria-label={`Upload of ${item.file.name}`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent}
          className="h-2 w-full overflow-hidden rounded-full bg-surface-sunken"
          data-testid="upload-progress"
        >
          <div
            className={`h-full rounded-full transition-[width] duration-150 ${item.state === 'rejected' ? 'bg-danger' : 'bg-accent'}`}
            style={{ width: `${percent}%` }}
          />
        </div>
      )}
      {item.state === 'rejected' && (
        <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger" data-testid="upload-rejected">
          {item.message}
        </p>
      )}
      {item.duplicate && (
        <p className="text-sm text-ink-muted" data-testid="upload-duplicate">
          This session already holds a file with exactly these bytes; showing the recording kept earlier instead of a copy.
        </p>
      )}
      {item.state === 'stored' && item.recordingId !== undefined && <RecordingResult recordingId={item.recordingId} />}
    </li>
  );
}
