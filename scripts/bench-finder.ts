// Benchmark of the swing finder (npm run bench:finder): generated sessions of every variant (lib/signal/synthetic/
// variants.ts) through parse -> analyze, scored against the generator's own truth. Prints one row per variant:
// swings found / true (full and partial), false swings, and the median and p95 absolute error of each event (ms),
// beside the targets. Asserts nothing. `--tuning` runs the tuning seeds instead of the held-out ones.
import { analyzeRecording, parseRecording, type EventName } from '@/lib/signal';
import {
  DISTRACTOR_ONLY,
  FINDER_VARIANTS,
  generateSession,
  HELD_OUT_SEEDS,
  quantile,
  scoreFinder,
  TUNING_SEEDS,
  variantOptions,
  type SwingMatch,
} from '@/lib/signal/synthetic';

const TARGET = { fullFoundPct: 100, partialFoundPct: 95, falseSwings: 0, addressMs: 100, topMs: 20, finishMs: 250, withinPct: 95 };
const EVENTS: EventName[] = ['address', 'top', 'transition', 'impact', 'finish'];
const tuning = process.argv.includes('--tuning');
const seeds = tuning ? TUNING_SEEDS : HELD_OUT_SEEDS;

function analyzeSession(opts: Parameters<typeof generateSession>[0]) {
  const s = generateSession(opts);
  const out = analyzeRecording(parseRecording(s.csv()), s.layout);
  const found = out.result.swings.map((w) => ({ events: w.events, partial: w.partial, forwardPress: w.forward_press ? { timeS: w.forward_press.time_s, sizeMm: w.forward_press.size_mm } : null }));
  return { s, out, found };
}

const pad = (v: string, n: number) => v.padStart(n);
const ms = (v: number) => (Number.isFinite(v) ? (v * 1000).toFixed(0) : '-');
console.log(`swing finder on generated sessions, ${tuning ? 'TUNING' : 'held-out'} seeds ${seeds.join(', ')}`);
console.log(
  `targets: ${TARGET.fullFoundPct} % of full swings, >= ${TARGET.partialFoundPct} % of partial, ${TARGET.falseSwings} false; ` +
    `address <= ${TARGET.addressMs} ms, top <= ${TARGET.topMs} ms, finish <= ${TARGET.finishMs} ms for >= ${TARGET.withinPct} % of swings`,
);
console.log(
  ['variant'.padEnd(30), 'full', 'partial', 'false', ...EVENTS.map((e) => pad(`${e} med/p95`, 18)), pad('top bias', 9), pad('press', 6), pad('partial ok', 11)].join(' '),
);
const all: SwingMatch[] = [];
let totals = { trueFull: 0, foundFull: 0, truePartial: 0, foundPartial: 0, falseSwings: 0 };
const t0 = performance.now();
for (const v of FINDER_VARIANTS) {
  const matches: SwingMatch[] = [];
  const sum = { trueFull: 0, foundFull: 0, truePartial: 0, foundPartial: 0, falseSwings: 0 };
  let pressFound = 0;
  let pressTrue = 0;
  let partialFlagOk = 0;
  for (const seed of seeds) {
    const { s, found } = analyzeSession(variantOptions(v, seed));
    const sc = scoreFinder(s.truth.swings, found);
    for (const k of Object.keys(sum) as (keyof typeof sum)[]) sum[k] += sc[k];
    matches.push(...sc.matches);
    for (const m of sc.matches) {
      if (m.truth.forwardPress) {
        pressTrue++;
        if (m.found.forwardPress && Math.abs(m.found.forwardPress.timeS - m.truth.forwardPress.timeS) <= 0.1) pressFound++;
      }
      if (Boolean(m.found.partial) === m.truth.partial) partialFlagOk++;
    }
  }
  all.push(...matches);
  for (const k of Object.keys(totals) as (keyof typeof totals)[]) totals[k] += sum[k];
  const cols = EVENTS.map((e) => {
    const a = matches.map((m) => Math.abs(m.error[e]));
    return pad(`${ms(quantile(a, 0.5))}/${ms(quantile(a, 0.95))}`, 18);
  });
  console.log(
    [
      v.name.padEnd(30),
      pad(`${sum.foundFull}/${sum.trueFull}`, 4),
      pad(`${sum.foundPartial}/${sum.truePartial}`, 7),
      pad(String(sum.falseSwings), 5),
      ...cols,
      pad(ms(quantile(matches.map((m) => m.error.top), 0.5)), 9),
      pad(pressTrue ? `${pressFound}/${pressTrue}` : '-', 6),
      pad(`${partialFlagOk}/${matches.length}`, 11),
    ].join(' '),
  );
}
let distractorFalse = 0;
for (const seed of seeds) distractorFalse += analyzeSession({ ...DISTRACTOR_ONLY, seed }).found.length;
console.log(`distractors alone (walk, step, waggle, re-tee, lift, twice each): ${distractorFalse} false swings (target 0)`);
const within = (e: EventName, tol: number) => (100 * all.filter((m) => Math.abs(m.error[e]) <= tol).length) / all.length;
console.log(
  `all variants: full ${totals.foundFull}/${totals.trueFull}, partial ${totals.foundPartial}/${totals.truePartial}, false ${totals.falseSwings + distractorFalse}; ` +
    `within tolerance: address ${within('address', 0.1).toFixed(1)} %, top ${within('top', 0.02).toFixed(1)} %, finish ${within('finish', 0.25).toFixed(1)} % ` +
    `(target >= ${TARGET.withinPct} %); top bias (median) ${ms(quantile(all.map((m) => m.error.top), 0.5))} ms (target within +/-10 ms)`,
);
console.log(`${((performance.now() - t0) / 1000).toFixed(1)} s`);
