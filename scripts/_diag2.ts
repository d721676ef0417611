import { analyzeRecording, parseRecording, stillnessThresholds, detectionParams, findTop, findTransition } from '@/lib/signal';
import { FINDER_VARIANTS, generateSession, variantOptions } from '@/lib/signal/synthetic';
const v = FINDER_VARIANTS.find((x) => x.name.startsWith('noise x3, 550'))!;
const s = generateSession(variantOptions(v, 5));
const out = analyzeRecording(parseRecording(s.csv()), s.layout);
const t = s.truth.swings.find((t) => Math.abs(t.events.top - 72.62) < 0.1)!;
console.log(t.events, stillnessThresholds(out.series.copSpeed, 100, detectionParams(340)));
const c = out.candidates.find((c) => Math.abs(out.series.time[c.peak] - t.events.top) < 0.6)!;
const p = detectionParams(340);
const tr = findTransition(out.series.copVx, c.peak, c.peak - 60, p);
console.log('peak', out.series.time[c.peak], 'transition', out.series.time[tr], 'top', out.series.time[findTop(out.series, tr, c.peak - 60, p)]);
const fs = 100;
for (let i = Math.round((t.events.address - 0.2) * fs); i <= Math.round((t.events.top + 0.1) * fs); i += 2)
  console.log((i / fs).toFixed(2), out.series.copX[i].toFixed(1), out.series.copVx[i].toFixed(0), out.series.copSpeed[i].toFixed(0));
