import type { RecordingError } from '@/lib/contracts/recordings';

/** Why a file could not be processed, and where in it: "line 12, column 4". */
export function RecordingErrorNote({ error }: { error: RecordingError }) {
  // The core's message may already start with "line 12, column 4: "; the position is shown once, above it.
  const message = error.message.replace(/^line \d+(, column \d+)?: /, '');
  const where = [error.line !== null ? `line ${error.line}` : null, error.column !== null ? `column ${error.column}` : null].filter(Boolean).join(', ');
  return (
    <div role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger" data-testid="recording-error">
      <p className="font-medium">
        This file could not be processed{where ? <span data-testid="recording-error-where"> at {where}</span> : null}.
      </p>
      <p className="mt-0.5 break-words">{message.charAt(0).toUpperCase() + message.slice(1)}</p>
    </div>
  );
}
