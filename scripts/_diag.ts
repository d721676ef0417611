import { analyzeRecording, parseRecording } from '@/lib/signal';
import { FINDER_VARIANTS, generateSession, variantOptions, scoreFinder } from '@/lib/signal/synthetic';
for (const v of FINDER_VARIANTS.slice(0, 4)) for (const seed of [1, 2, 3]) {
  const s = generateSession(variantOptions(v, seed));
  const out = analyzeRecording(parseRecording(s.csv()), s.layout);
  const sc = scoreFinder(s.truth.swings, out.result.swings);
  for (const m of sc.matches) {
    if (Math.abs(m.error.address) > 0.1 || Math.abs(m.error.top) > 0.03) console.log(v.name, seed, m.truth.preShot, 'addr', m.error.address.toFixed(3), 'top', m.error.top.toFixed(3), 'at', m.truth.events.address.toFixed(2));
  }
}
