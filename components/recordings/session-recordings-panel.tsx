'use client';

import useSWR from 'swr';
import { SwingTable } from '@/components/swings/swing-table';
import type { SwingRow } from '@/components/swings/swing-table-columns';
import { Card } from '@/components/ui/card';
import { fetchJson } from '@/lib/fetcher';
import { isSettled, sessionRecordingsSchema, type SessionRecordings } from '@/lib/contracts/recordings';
import { clubLabels, flightLabels, strikeLabels } from '@/components/swings/labels';
import { RecordingList } from './recording-list';

const fetchSession = fetchJson(sessionRecordingsSchema);

type Labels = SessionRecordings['swings'][number]['labels'];

/** Strike, flight, tags and rating as one line for the table's Label column; null when none is set. */
export function labelLine(labels: Labels): string | null {
  const parts = [
    labels.strike ? strikeLabels[labels.strike] : null,
    labels.flight ? flightLabels[labels.flight] : null,
    ...labels.tags,
    labels.rating !== null ? `rated ${labels.rating}/5` : null,
  ].filter((p): p is string => Boolean(p));
  return parts.length > 0 ? parts.join(' · ') : null;
}

function toRows(view: SessionRecordings): SwingRow[] {
  return view.swings
    .filter((s) => !s.hidden)
    .map((s) => ({
      id: s.id,
      number: s.number,
      index: s.index,
      recordingId: s.recordingId,
      filename: s.filename,
      club: s.labels.club ? clubLabels[s.labels.club] : null,
      label: labelLine(s.labels),
      impactS: s.events.impact,
      leadPctAtImpact: s.leadPctAtImpact,
      tempoRatio: s.tempoRatio,
      impactSource: s.eventSources.impact.source === 'manual' ? 'manual' : s.impactSource,
      stale: s.stale,
      partial: s.partial ?? false,
    }));
}

/** Recordings and swings of one session; polls every 1.5 s while any recording is still queued or processing. */
export function SessionRecordingsPanel({ sessionId, initial, canEdit = false }: { sessionId: number; initial: SessionRecordings; canEdit?: boolean }) {
  const { data, mutate } = useSWR(`/api/sessions/${sessionId}/recordings`, fetchSession, {
    fallbackData: initial,
    refreshInterval: (latest?: SessionRecordings) => (latest && latest.recordings.every((r) => isSettled(r.status)) ? 0 : 1500),
  });
  const view = data ?? initial;
  const rows = toRows(view);
  return (
    <>
      <Card title={`Recordings (${view.recordings.length})`}>
        <RecordingList recordings={view.recordings} onChanged={canEdit ? () => void mutate() : undefined} />
      </Card>
      <Card title={`Swings (${rows.length})`}>
        {rows.length === 0 ? (
          <p className="text-sm text-ink-muted">
            {view.recordings.length === 0 ? 'Upload recordings to find swings.' : 'No golf swings were found in this session’s recordings yet.'}
          </p>
        ) : (
          <SwingTable rows={rows} recordings={view.recordings.filter((r) => r.status === 'ready').map((r) => ({ id: r.id, filename: r.filename }))} />
        )}
      </Card>
    </>
  );
}
