'use client';

import { useRef, useState, type DragEvent } from 'react';

/** Drop several files at once, or pick them with the file dialog. */
export function DropZone({ onFiles, disabled }: { onFiles: (files: File[]) => void; disabled?: boolean }) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setOver(false);
    if (disabled) return;
    const files = Array.from(event.dataTransfer.files);
    if (files.length > 0) onFiles(files);
  };

  return (
    <div
      data-testid="drop-zone"
      onDragOver={(event) => {
        event.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      className={`flex flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed px-6 py-10 text-center text-sm ${
        over ? 'border-accent bg-band-soft' : 'border-surface-line bg-surface-sunken'
      } ${disabled ? 'opacity-60' : ''}`}
    >
      <p className="font-medium text-ink">Drop insole recordings here</p>
      <p className="text-ink-muted">Several files at once; CSV in recording format 1, or any text file an import profile describes.</p>
      <button type="button" disabled={disabled} onClick={() => input.current?.click()} className="text-sm font-medium text-accent hover:underline disabled:text-ink-faint">
        or choose files
      </button>
      <input
        ref={input}
        type="file"
        multiple
        className="sr-only"
        data-testid="file-input"
        aria-label="Recording files"
        onChange={(event) => {
          const files = Array.from(event.target.files ?? []);
          if (files.length > 0) onFiles(files);
          event.target.value = '';
        }}
      />
    </div>
  );
}
