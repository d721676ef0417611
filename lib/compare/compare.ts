// Compare two sets of one athlete's swings (pure): the values per metric, the mean difference (B - A) with Welch's t
// 95 % interval, and an honest note when a set has fewer than 3 swings with the metric.
import type { MetricDifference } from '@/lib/contracts/compare';
import type { SwingFacts } from '@/lib/targets/swing-facts';
import { metricValues } from './metrics';
import { inSet, setLabel } from './sets';
import { mean, smallSetNote, welchInterval } from './stats';

export type { MetricDifference };

export function compareSets(swings: SwingFacts[], a: string, b: string, metrics: string[], opts: { includePartial?: boolean } = {}) {
  // partial swings (pitches, half swings) are left out unless asked for: they would mix two kinds of motion
  const visible = swings.filter((s) => !s.hidden && (opts.includePartial || !s.partial));
  const setA = visible.filter((s) => inSet(s, a));
  const setB = visible.filter((s) => inSet(s, b));
  const side = (set: string, list: SwingFacts[]) => ({
    label: setLabel(set),
    n: list.length,
    sessionIds: [...new Set(list.map((s) => s.sessionId))],
    values: Object.fromEntries(metrics.map((m) => [m, metricValues(list, m)])) as Record<string, number[]>,
  });
  const sa = side(a, setA);
  const sb = side(b, setB);
  const differences: MetricDifference[] = metrics.map((metric) => {
    const va = sa.values[metric];
    const vb = sb.values[metric];
    const w = welchInterval(va, vb, 0.95);
    const meanA = va.length ? mean(va) : null;
    const meanB = vb.length ? mean(vb) : null;
    let note = smallSetNote(va.length, vb.length);
    if (!note && !w) note = 'No spread in either set, so no interval can be given.';
    return {
      metric,
      meanA,
      meanB,
      diff: meanA !== null && meanB !== null ? meanB - meanA : null,
      // Too few swings: no interval is shown at all rather than a meaningless one.
      ci95: note === null && w ? w.ci : null,
      df: w ? w.df : null,
      method: 'welch',
      note,
    };
  });
  return { a: sa, b: sb, differences };
}
