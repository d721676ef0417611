'use client';
// "passed / total" target checks for one swing in the session's swings table (GET /api/swings/:id/score).
import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';
import { scoreResponseSchema } from '@/lib/contracts/targets';
import { scoreUrl } from './score-panel';

const fetchScore = fetchJson(scoreResponseSchema);

export function ScoreCell({ swingId }: { swingId: number }) {
  const { data, error } = useSWR(scoreUrl(swingId, null), fetchScore, { revalidateOnFocus: false });
  if (error) return <span className="text-ink-faint" title="score unavailable">—</span>;
  if (!data) return <span className="text-ink-faint">…</span>;
  const t = data.target;
  if (!t) return <span className="text-ink-faint" title="no target applies">—</span>;
  const passed = t.summary?.passed ?? t.checks.filter((c) => c.pass).length + (t.tempo?.pass ? 1 : 0);
  const total = t.summary?.total ?? t.checks.filter((c) => c.pass != null).length + (t.tempo?.pass != null ? 1 : 0);
  return (
    <span data-testid="swing-score" title={`${passed} of ${total} target checks within tolerance${t.name ? ` (${t.name})` : ''}`}>
      {passed}/{total}
    </span>
  );
}
