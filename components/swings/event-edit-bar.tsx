'use client';
// Saving moved event markers: "Save corrections" sends the moved times, "Discard" drops unsaved moves, "Reset to
// automatic" restores the detector's times. Shows which events are corrected by hand and the server's 422 messages.
import { Badge } from '@/components/ui/badge';
import type { EventName } from '@/lib/signal/types';
import { eventLabels } from './labels';
import type { SwingView } from '@/lib/contracts/swings';

export interface EventEditBarProps {
  swing: SwingView;
  /** unsaved moves, event -> new time (s) */
  moved: Partial<Record<EventName, number>>;
  timeZero: number;
  busy: boolean;
  error: string | null;
  onSave: () => void;
  onDiscard: () => void;
  onReset: () => void;
}

// 44 px high: a finger-sized target on a tablet in the bay (WCAG 2.5.5)
const small = 'min-h-11 rounded-md px-3 py-1 text-sm font-medium disabled:cursor-not-allowed';
const primary = `${small} bg-accent text-white hover:bg-accent-strong disabled:bg-surface-sunken disabled:text-ink-faint`;
const secondary = `${small} border border-surface-line bg-surface text-ink hover:bg-surface-sunken disabled:text-ink-faint`;

export function EventEditBar({ swing, moved, timeZero, busy, error, onSave, onDiscard, onReset }: EventEditBarProps) {
  const manual = swing.events.filter((e) => e.source === 'manual');
  const movedNames = Object.keys(moved) as EventName[];
  const rel = (t: number) => `${(t - timeZero).toFixed(2)} s`;
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-lg border border-surface-line bg-surface px-3 py-1.5 text-sm" data-testid="event-edit-bar">
      {manual.length > 0 ? (
        <span data-testid="corrected-mark" className="inline-flex flex-wrap items-center gap-1.5">
          <Badge tone="band">Corrected by hand</Badge>
          {manual.map((e) => (
            <span key={e.name} className="text-sm text-ink-muted" data-corrected-event={e.name}>
              {eventLabels[e.name]} {e.autoTimeS !== null ? `${rel(e.autoTimeS)} → ` : ''}
              {rel(e.timeS)}
            </span>
          ))}
        </span>
      ) : (
        <span className="text-sm text-ink-muted">Events as detected</span>
      )}
      {movedNames.length > 0 && (
        <span className="text-sm text-ink" data-testid="unsaved-moves">
          Unsaved: {movedNames.map((n) => `${eventLabels[n]} → ${rel(moved[n]!)}`).join(', ')}
        </span>
      )}
      <span className="ml-auto flex gap-2">
        <button type="button" className={secondary} onClick={onDiscard} disabled={busy || movedNames.length === 0}>
          Discard
        </button>
        <button type="button" className={primary} onClick={onSave} disabled={busy || movedNames.length === 0}>
          Save corrections
        </button>
        <button type="button" className={secondary} onClick={onReset} disabled={busy || manual.length === 0}>
          Reset to automatic
        </button>
      </span>
      {error && (
        <p role="alert" className="w-full text-sm text-danger" data-testid="event-edit-error">
          {error}
        </p>
      )}
    </div>
  );
}
