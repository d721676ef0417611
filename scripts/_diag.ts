import { analyzeRecording, parseRecording } from '@/lib/signal';
import { FINDER_VARIANTS, generateSession, variantOptions, scoreFinder } from '@/lib/signal/synthetic';
for (const v of FINDER_VARIANTS.filter((v) => /noise x3, 550/.test(v.name))) for (const seed of [1, 2, 3, 4, 5, 6]) {
  const s = generateSession(variantOptions(v, seed));
  const out = analyzeRecording(parseRecording(s.csv()), s.layout);
  const sc = scoreFinder(s.truth.swings, out.result.swings);
  for (const t of s.truth.swings) {
    const m = sc.matches.find((m) => m.truth === t);
    if (!m) console.log(v.name, seed, 'missed', t.preShot, t.partial, t.events.top.toFixed(2), out.candidates.filter((c) => Math.abs(out.series.time[c.peak] - t.events.top) < 0.6).map((c) => c.reason));
    else if (Math.abs(m.error.finish) > 0.25 || Math.abs(m.error.top) > 0.02) console.log(v.name, seed, t.preShot, t.partial, 'finish', m.error.finish.toFixed(3), 'top', m.error.top.toFixed(3), 'addr', m.error.address.toFixed(3));
  }
}
