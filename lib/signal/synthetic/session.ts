// Seeded, deterministic generator of golf practice sessions in recording CSV format 1 (for tests, the benchmark
// and demo data). Everything it produces is invented.
//
// The body weight is split between the feet by a lead-foot share f(t) and, inside each foot, between heel and toe
// by a heel share; each control moves between key frames along a cosine ease (track.ts). The movements are in
// moves.ts. The truth is the generator's own construction, never the detector's thresholds: address = the start of
// the takeaway move, top = the key frame where every control turns (the most trail-ward COP), transition / impact =
// top + D/6 and top + 5D/6 (the half-peak points of the eased lead-ward move of duration D, during which only the
// lead share moves, so COP X is linear in it), finish = the end of the follow-through move (the COP at rest).
import { builtinLayout } from '../layouts';
import type { EventName, Handedness, SensorLayout, Units } from '../types';
import { cleanCopX, geometry } from './geometry';
import { DISTRACTORS, idle, lift, PRE_SHOTS, relax, retee, setUp, swing, walk, type Distractor, type PreShot, type SwingDesign, type SwingKind } from './moves';
import { gaussian, prng } from './prng';
import { newTracks, syncTo } from './track';

export interface SessionOptions {
  seed: number;
  sampleRateHz: number;
  sensorsPerFoot: 8 | 16;
  units: Units;
  handedness: Handedness;
  stanceWidthMm: number;
  swings: number;
  withMarker: boolean;
  /** inserted before swing k: distractors[k % length] ('waggle' goes into that swing's address); with swings = 0
   *  every distractor is played once */
  distractors?: readonly Distractor[];
  /** pads the session with idle standing (slow weight shifts) up to this length, s */
  durationS?: number;
  bodyMassKg?: number;
  /** SD of the white noise added to every sensor, N */
  noiseN?: number;
  /** replaces the built-in pair-8 / pair-16 layout */
  layout?: SensorLayout;
  /** extra `# key: value` lines (free metadata) */
  metadata?: Record<string, string>;
  /** rows per chunk from chunks() */
  rowsPerChunk?: number;
  /** swing k's pre-shot routine: preShots[k % length] (default 'still'; the 'waggle' distractor keeps its own) */
  preShots?: readonly PreShot[];
  /** swing k is full or partial: kinds[k % length] (default 'full') */
  kinds?: readonly SwingKind[];
}

export interface TruthSwing {
  /** seconds on the recording's time axis */
  events: Record<EventName, number>;
  /** sample indexes of the same events */
  samples: Record<EventName, number>;
  /** design values: takeaway -> top and top -> impact durations, s */
  backswingS: number;
  downswingS: number;
  partial: boolean;
  /** the forward press's start (s) and its COP X travel toward the lead foot (mm, noise-free), or null */
  forwardPress: { timeS: number; sizeMm: number } | null;
  preShot: PreShot;
}

export interface Session {
  layout: SensorLayout;
  sampleRateHz: number;
  samples: number;
  durationS: number;
  /** the whole file as one string */
  csv(): string;
  /** the file in pieces of rowsPerChunk rows (the first piece holds metadata and header) */
  chunks(): Generator<string>;
  truth: { swings: TruthSwing[] };
}

function checkOptions(o: SessionOptions): void {
  if (!Number.isInteger(o.seed)) throw new RangeError(`seed must be an integer, got ${o.seed}`);
  if (!(o.sampleRateHz >= 20 && o.sampleRateHz <= 2000)) throw new RangeError(`sampleRateHz must be 20..2000, got ${o.sampleRateHz}`);
  if (o.sensorsPerFoot !== 8 && o.sensorsPerFoot !== 16 && !o.layout) throw new RangeError('sensorsPerFoot must be 8 or 16');
  if (o.units !== 'N' && o.units !== 'kPa') throw new RangeError(`units must be N or kPa, got ${o.units}`);
  if (o.handedness !== 'right' && o.handedness !== 'left') throw new RangeError(`handedness must be right or left`);
  if (!(o.stanceWidthMm >= 150 && o.stanceWidthMm <= 900)) throw new RangeError(`stanceWidthMm must be 150..900, got ${o.stanceWidthMm}`);
  if (!(Number.isInteger(o.swings) && o.swings >= 0)) throw new RangeError(`swings must be an integer >= 0, got ${o.swings}`);
  for (const d of o.distractors ?? []) if (!DISTRACTORS.includes(d)) throw new RangeError(`unknown distractor ${d}`);
  for (const p of o.preShots ?? []) if (!PRE_SHOTS.includes(p)) throw new RangeError(`unknown pre-shot routine ${p}`);
  for (const k of o.kinds ?? []) if (k !== 'full' && k !== 'partial') throw new RangeError(`unknown swing kind ${k}`);
  if (o.bodyMassKg !== undefined && !(o.bodyMassKg >= 20 && o.bodyMassKg <= 250)) throw new RangeError(`bodyMassKg must be 20..250, got ${o.bodyMassKg}`);
  if (o.noiseN !== undefined && !(o.noiseN >= 0 && o.noiseN <= 50)) throw new RangeError(`noiseN must be 0..50, got ${o.noiseN}`);
}

export function generateSession(opts: SessionOptions): Session {
  checkOptions(opts);
  const fs = opts.sampleRateHz;
  const layout = opts.layout ?? builtinLayout(opts.sensorsPerFoot === 16 ? 'pair-16' : 'pair-8');
  if (!layout) throw new RangeError('no built-in layout for that sensor count');
  const g = geometry(layout, opts.handedness);
  const rnd = prng(opts.seed);
  const distractors = opts.distractors ?? [];
  const preShots = opts.preShots ?? [];
  const kinds = opts.kinds ?? [];
  const tr = newTracks();
  syncTo(tr, 1.5);

  const slot = opts.durationS !== undefined && opts.swings > 0 ? opts.durationS / opts.swings : 0;
  const designs: (SwingDesign & { preShot: PreShot })[] = [];
  const play = (d: Distractor | null) => {
    if (d === 'walk') walk(tr, rnd, 4 + Math.floor(rnd() * 4));
    else if (d === 'step') lift(tr, rnd, 0.4 + rnd() * 0.2);
    else if (d === 'lift') lift(tr, rnd, 1.2 + rnd());
    else if (d === 'retee') retee(tr, rnd);
  };
  if (opts.swings === 0) {
    // no swing: every distractor once (a waggle is a set-up with waggles that ends without a swing)
    for (const d of distractors) {
      if (d === 'waggle') relax(tr, setUp(tr, rnd, 'still', true).t + 0.8);
      else play(d);
    }
    if (opts.durationS !== undefined && tr.lead.end < opts.durationS) idle(tr, rnd, opts.durationS);
  }
  for (let k = 0; k < opts.swings; k++) {
    const d = distractors.length ? distractors[k % distractors.length] : null;
    play(d);
    const preShot: PreShot = d === 'waggle' ? 'waggle' : preShots.length ? preShots[k % preShots.length] : 'still';
    const kind: SwingKind = kinds.length ? kinds[k % kinds.length] : 'full';
    designs.push({ ...swing(tr, rnd, preShot, kind, d === 'waggle'), preShot });
    if (slot > 0) {
      const until = (k + 1) * slot;
      if (tr.lead.end < until) idle(tr, rnd, until);
    }
  }
  if (opts.durationS !== undefined && tr.lead.end > opts.durationS + 1e-9) {
    throw new RangeError(`durationS ${opts.durationS} is too short for ${opts.swings} swings and the distractors (${tr.lead.end.toFixed(1)} s needed)`);
  }
  const endS = opts.durationS ?? tr.lead.end + 1.5;
  syncTo(tr, endS);
  const n = Math.floor(endS * fs) + 1;

  const lead = tr.lead.render(n, fs);
  const leadHeel = tr.leadHeel.render(n, fs);
  const trailHeel = tr.trailHeel.render(n, fs);
  const load = tr.load.render(n, fs);
  const bw = (opts.bodyMassKg ?? 75) * 9.81;
  const w = opts.stanceWidthMm;
  // slow postural sway: two sines on the lead share and on the heel shares (~1-2 mm, a few mm/s)
  const ph = [rnd(), rnd(), rnd(), rnd()].map((p) => p * 2 * Math.PI);
  const C = g.ids.length;
  const clean: Float64Array[] = g.ids.map(() => new Float64Array(n));
  for (let i = 0; i < n; i++) {
    const t = i / fs;
    const sway = 0.003 * Math.sin(2 * Math.PI * 0.23 * t + ph[0]) + 0.002 * Math.sin(2 * Math.PI * 0.61 * t + ph[1]);
    const fl = Math.min(1, Math.max(0, lead[i] + (lead[i] > 0.02 && lead[i] < 0.98 ? sway : 0)));
    const hs = 0.01 * Math.sin(2 * Math.PI * 0.31 * t + ph[2]);
    const hl = Math.min(1, Math.max(0, leadHeel[i] + hs));
    const ht = Math.min(1, Math.max(0, trailHeel[i] + 0.01 * Math.sin(2 * Math.PI * 0.37 * t + ph[3])));
    const total = bw * load[i];
    for (let c = 0; c < C; c++) {
      const foot = g.isLead[c] ? total * fl : total * (1 - fl);
      const h = g.isLead[c] ? hl : ht;
      clean[c][i] = foot * (g.isHeel[c] ? h : 1 - h) * g.weight[c];
    }
  }

  // the truth: the design times of each swing (moves.ts), with the impact marker on the design impact
  const idx = (t: number) => Math.min(n - 1, Math.max(0, Math.round(t * fs)));
  const xAt = (t: number) => cleanCopX(g, clean.map((c) => c[idx(t)]), w);
  const marker = new Uint8Array(n);
  const truth: TruthSwing[] = designs.map((d) => {
    const events: Record<EventName, number> = {
      address: d.takeaway,
      top: d.top,
      transition: d.top + d.downD / 6,
      impact: d.top + d.impactS,
      finish: d.finish,
    };
    marker[idx(events.impact)] = 1;
    const samples = {} as Record<EventName, number>;
    for (const [k, v] of Object.entries(events)) samples[k as EventName] = idx(v);
    events.impact = samples.impact / fs; // the marker sample is the impact a file can state
    const forwardPress = d.press ? { timeS: d.press.start, sizeMm: xAt(d.press.end) - xAt(d.press.start) } : null;
    return { events, samples, backswingS: d.top - d.takeaway, downswingS: d.impactS, partial: d.partial, forwardPress, preShot: d.preShot };
  });

  const noiseN = opts.noiseN ?? 0.6;
  const kpa = opts.units === 'kPa';
  const metaLines = [
    '# format: stanceline-insole/1',
    `# sample_rate_hz: ${fs}`,
    `# units: ${opts.units}`,
    `# handedness: ${opts.handedness}`,
    `# stance_width_mm: ${w}`,
    `# layout: ${layout.id}`,
    ...Object.entries(opts.metadata ?? {}).map(([k, v]) => `# ${k}: ${v}`),
  ];
  // columns in layout order: left sensors then right (geometry sorted them), as the header lists them
  const header = ['time_s', ...g.ids, ...(opts.withMarker ? ['impact'] : [])].join(',');
  const rowsPerChunk = opts.rowsPerChunk ?? 2000;
  const decimals = fs > 1000 ? 4 : 3;
  const noiseSeed = Math.floor(rnd() * 2 ** 31);

  function* chunks(): Generator<string> {
    const gauss = gaussian(prng(noiseSeed));
    yield `${metaLines.join('\n')}\n${header}\n`;
    const parts: string[] = [];
    const cells = new Array<string>(C + 2);
    for (let i = 0; i < n; i++) {
      cells[0] = (i / fs).toFixed(decimals);
      for (let c = 0; c < C; c++) {
        let v = clean[c][i] + noiseN * gauss();
        if (v < 0) v = 0;
        if (kpa) v = v / (g.area[c] * 0.001);
        cells[c + 1] = v.toFixed(2);
      }
      if (opts.withMarker) cells[C + 1] = marker[i] ? '1' : '0';
      parts.push(opts.withMarker ? cells.join(',') : cells.slice(0, C + 1).join(','));
      if (parts.length === rowsPerChunk) {
        yield `${parts.join('\n')}\n`;
        parts.length = 0;
      }
    }
    if (parts.length) yield `${parts.join('\n')}\n`;
  }

  return {
    layout,
    sampleRateHz: fs,
    samples: n,
    durationS: (n - 1) / fs,
    csv: () => Array.from(chunks()).join(''),
    chunks,
    truth: { swings: truth },
  };
}
