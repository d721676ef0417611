'use client';

import useSWR from 'swr';
import { SwingTable } from '@/components/swings/swing-table';
import type { SwingRow } from '@/components/swings/swing-table-columns';
import { Card } from '@/components/ui/card';
import { fetchJson } from '@/lib/fetcher';
import { isSettled, sessionRecordingsSchema, type SessionRecordings } from '@/lib/contracts/recordings';
import { RecordingList } from './recording-list';

const fetchSession = fetchJson(sessionRecordingsSchema);

function toRows(view: SessionRecordings): SwingRow[] {
  const names = new Map(view.recordings.map((r) => [r.id, r.filename]));
  return view.swings
    .filter((s) => !s.hidden)
    .map((s) => ({
      id: s.id,
      index: s.index,
      recordingId: s.recordingId,
      filename: names.get(s.recordingId) ?? `#${s.recordingId}`,
      club: null,
      label: null,
      impactS: s.events.impact,
      leadPctAtImpact: s.leadPctAtImpact,
      tempoRatio: s.tempoRatio,
      impactSource: s.impactSource,
      stale: s.stale,
      partial: s.partial ?? false,
    }));
}

/** Recordings and swings of one session; polls every 1.5 s while any recording is still queued or processing. */
export function SessionRecordingsPanel({ sessionId, initial }: { sessionId: number; initial: SessionRecordings }) {
  const { data } = useSWR(`/api/sessions/${sessionId}/recordings`, fetchSession, {
    fallbackData: initial,
    refreshInterval: (latest?: SessionRecordings) => (latest && latest.recordings.every((r) => isSettled(r.status)) ? 0 : 1500),
  });
  const view = data ?? initial;
  const rows = toRows(view);
  return (
    <>
      <Card title={`Recordings (${view.recordings.length})`}>
        <RecordingList recordings={view.recordings} />
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
