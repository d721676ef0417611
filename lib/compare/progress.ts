// Progress (pure): per session, in date order, the mean, SD and n of each chosen metric and the target score summed
// over the session's swings (checks passed / checks scored).
import type { SwingFacts } from '@/lib/targets/swing-facts';
import { metricValues } from './metrics';
import { mean, sd } from './stats';

export interface SessionInfo {
  id: number;
  date: string;
  context: string;
}

export function progressBySession(
  sessions: SessionInfo[],
  swings: SwingFacts[],
  metrics: string[],
  scoreOf: (s: SwingFacts) => { passed: number; total: number } | null,
  opts: { includePartial?: boolean } = {},
) {
  // partial swings (pitches, half swings) are left out unless asked for
  const visible = swings.filter((s) => !s.hidden && (opts.includePartial || !s.partial));
  return [...sessions]
    .sort((x, y) => (x.date < y.date ? -1 : x.date > y.date ? 1 : x.id - y.id))
    .map((session) => {
      const list = visible.filter((s) => s.sessionId === session.id);
      const m: Record<string, { mean: number | null; sd: number | null; n: number }> = {};
      for (const metric of metrics) {
        const v = metricValues(list, metric);
        m[metric] = { mean: v.length ? mean(v) : null, sd: v.length > 1 ? sd(v) : null, n: v.length };
      }
      let passed = 0;
      let total = 0;
      for (const s of list) {
        const r = scoreOf(s);
        if (r) {
          passed += r.passed;
          total += r.total;
        }
      }
      return { ...session, n: list.length, metrics: m, targetScore: total > 0 ? { passed, total } : null };
    });
}
