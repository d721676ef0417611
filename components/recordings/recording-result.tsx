'use client';

import Link from 'next/link';
import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';
import { isSettled, recordingViewSchema, type RecordingView } from '@/lib/contracts/recordings';
import { formatNumber, formatTempo } from './format';
import { NoSwingsNote } from './no-swings-note';
import { RecordingErrorNote } from './recording-error-note';
import { StatusBadge } from './status-badge';

const fetchRecording = fetchJson(recordingViewSchema);

/** Polls GET /api/recordings/:id once a second until processing ends (ready or failed), then stops. */
export function RecordingResult({ recordingId }: { recordingId: number }) {
  const { data, error } = useSWR(`/api/recordings/${recordingId}`, fetchRecording, {
    refreshInterval: (latest?: RecordingView) => (latest && isSettled(latest.status) ? 0 : 1000),
    revalidateOnFocus: false,
  });
  if (error) return <p className="text-sm text-danger">Could not read the processing state: {(error as Error).message}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Waiting for the processing state…</p>;
  return (
    <div className="space-y-2" data-testid="recording-result" data-recording-id={recordingId}>
      <div className="flex items-center gap-2 text-sm">
        <StatusBadge status={data.status} />
        {!isSettled(data.status) && <span className="text-ink-muted">Stored; the file is being read and analysed…</span>}
        {data.status === 'ready' && (
          <span className="text-ink" data-testid="swing-count">
            {data.swings.length === 1 ? '1 swing found' : `${data.swings.length} swings found`}
          </span>
        )}
      </div>
      {data.status === 'failed' && data.error && <RecordingErrorNote error={data.error} />}
      {data.status === 'ready' && data.swings.length === 0 && <NoSwingsNote />}
      {data.status === 'ready' && data.swings.length > 0 && (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm tabular-nums" data-testid="found-swings">
            <thead className="text-ink-muted">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">Swing</th>
                <th scope="col" className="py-1 pr-3 font-medium">Address (s)</th>
                <th scope="col" className="py-1 pr-3 font-medium">Top (s)</th>
                <th scope="col" className="py-1 pr-3 font-medium">Impact (s)</th>
                <th scope="col" className="py-1 pr-3 font-medium">Finish (s)</th>
                <th scope="col" className="py-1 pr-3 font-medium">Tempo</th>
                <th scope="col" className="py-1 pr-3 font-medium">Lead % at impact</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-surface-line">
              {data.swings.map((s) => (
                <tr key={s.id}>
                  <td className="py-1 pr-3">
                    <Link href={`/swings/${s.id}`} className="font-medium text-accent hover:underline">
                      Swing {s.index}
                    </Link>
                  </td>
                  <td className="py-1 pr-3">{formatNumber(s.events.address, 3)}</td>
                  <td className="py-1 pr-3">{formatNumber(s.events.top, 3)}</td>
                  <td className="py-1 pr-3">{formatNumber(s.events.impact, 3)}</td>
                  <td className="py-1 pr-3">{formatNumber(s.events.finish, 3)}</td>
                  <td className="py-1 pr-3">{formatTempo(s.tempoRatio)}</td>
                  <td className="py-1 pr-3">{formatNumber(s.leadPctAtImpact, 1, ' %')}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
