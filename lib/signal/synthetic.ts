// Seeded, deterministic generator of golf practice sessions in recording CSV format 1 (for tests, the benchmark
// and demo data). Everything it produces is invented.
//
// The body weight is split between the feet by a lead-foot share f(t) and, inside each foot, between heel and toe
// by a heel share; each control moves between key frames along a cosine ease s(u) = (1 - cos(pi u)) / 2
// (zero velocity at both ends, velocity ~ sin(pi u): peak at u = 1/2, half-peak at u = 1/6 and 5/6).
// A swing (common practice, domain.md): a quiet address near 50/50; backswing 0.7-0.95 s toward the trail foot
// (66-78 % trail, into the trail heel); a fast downswing of duration D to 80-88 % lead with impact at 5/6 D,
// i.e. 0.24-0.30 s after the top (tempo ~3:1, Grober & Cholewicki); a follow-through to 93-97 % lead onto the lead
// heel while the trail foot rolls onto its toes; a held finish; then back to a relaxed stance.
// Truth events are the detector's definitions (events.ts) applied to the noise-free COP computed from the layout:
// top = the most trail-ward COP X; transition / impact = the rising / falling half-peak of the lead-ward COP X
// velocity (impact is the marker sample, placed at the design time t_top + 5/6 D); address = last still sample
// before the backswing; finish = first sample of a settled hold after impact.
import { DETECTION_DEFAULTS } from './events';
import { builtinLayout } from './layouts';
import type { EventName, Handedness, SensorLayout, Units } from './types';

export type Distractor = 'walk' | 'step' | 'waggle' | 'retee' | 'lift';
export const DISTRACTORS: readonly Distractor[] = ['walk', 'step', 'waggle', 'retee', 'lift'];

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
}

export interface TruthSwing {
  /** seconds on the recording's time axis */
  events: Record<EventName, number>;
  /** sample indexes of the same events */
  samples: Record<EventName, number>;
  /** design values: backswing and top -> impact durations, s */
  backswingS: number;
  downswingS: number;
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

/** mulberry32: a small, fast, seeded PRNG in [0, 1) */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// cosine ease: zero velocity at both ends with a finite acceleration, velocity ~ sin(pi u) peaking at u = 1/2
const ease = (u: number) => (1 - Math.cos(Math.PI * u)) / 2;

/** A control signal made of key frames joined by eased moves (hold = two frames with one value). */
class Track {
  readonly t: number[] = [];
  readonly v: number[] = [];
  constructor(t0: number, v0: number) {
    this.t.push(t0);
    this.v.push(v0);
  }
  get last(): number {
    return this.v[this.v.length - 1];
  }
  get end(): number {
    return this.t[this.t.length - 1];
  }
  /** move to v, arriving at time t */
  to(t: number, v: number): this {
    if (t < this.end) throw new RangeError(`track key frame at ${t} s before ${this.end} s`);
    if (t > this.end) {
      this.t.push(t);
      this.v.push(v);
    } else this.v[this.v.length - 1] = v;
    return this;
  }
  holdUntil(t: number): this {
    return this.to(t, this.last);
  }
  render(n: number, fs: number): Float64Array {
    const out = new Float64Array(n);
    const T = this.t.length;
    let k = 0;
    for (let i = 0; i < n; i++) {
      const time = i / fs;
      while (k < T - 1 && this.t[k + 1] <= time) k++;
      out[i] = k >= T - 1 || time <= this.t[k] ? this.v[k] : this.v[k] + (this.v[k + 1] - this.v[k]) * ease((time - this.t[k]) / (this.t[k + 1] - this.t[k]));
    }
    return out;
  }
}

interface Tracks {
  /** lead-foot share of the total, 0..1 */
  lead: Track;
  leadHeel: Track;
  trailHeel: Track;
  /** multiplies the body weight (bending, walking bumps) */
  load: Track;
}

interface SwingDesign {
  address: number; // design start of the backswing, s
  top: number;
  downD: number;
  impactS: number;
  backswingS: number;
}

function syncTo(tr: Tracks, t: number): void {
  for (const k of Object.keys(tr) as (keyof Tracks)[]) tr[k].holdUntil(t);
}

/** Relaxed stance: both feet, slow small weight shifts (too slow to look like a swing), until `until`. */
function idle(tr: Tracks, rnd: () => number, until: number): void {
  let t = tr.lead.end;
  while (until - t > 5) {
    // at most 4.5 s per shift, so the loop ends before `until`
    t += 1.5 + rnd();
    tr.lead.to(t, 0.5 + (rnd() - 0.5) * 0.16);
    t += 1 + rnd();
    tr.lead.holdUntil(t);
  }
  if (until - t >= 1) tr.lead.to(until - 0.5, 0.5);
  syncTo(tr, until);
}

/** Walking: single support with the other foot in the air, heel-to-toe roll, brief double support. */
function walk(tr: Tracks, rnd: () => number, steps: number): void {
  let t = tr.lead.end;
  let onLead = rnd() < 0.5;
  t += 0.35;
  tr.lead.to(t, onLead ? 1 : 0);
  syncTo(tr, t);
  for (let s = 0; s < steps; s++) {
    const stance = 0.38 + rnd() * 0.08;
    const heel = onLead ? tr.leadHeel : tr.trailHeel;
    heel.to(tr.lead.end, 0.85);
    heel.to(t + stance, 0.1);
    t += stance;
    tr.lead.holdUntil(t);
    t += 0.1 + rnd() * 0.04; // double support: the weight passes to the other foot
    onLead = !onLead;
    tr.lead.to(t, onLead ? 1 : 0);
    tr.load.to(t - 0.05, 1.12).to(t, 1);
    syncTo(tr, t);
  }
  t += 0.4;
  tr.lead.to(t, 0.5);
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  syncTo(tr, t + 1.2);
}

/** A foot lifted off the ground for a while, then put down again. */
function lift(tr: Tracks, rnd: () => number, hold: number): void {
  let t = tr.lead.end + 0.5;
  tr.lead.to(t, rnd() < 0.5 ? 1 : 0);
  t += hold;
  tr.lead.holdUntil(t);
  t += 0.5;
  tr.lead.to(t, 0.5);
  syncTo(tr, t + 1.2);
}

/** Re-teeing: walk to the ball, bend over it on mostly one foot, walk back. */
function retee(tr: Tracks, rnd: () => number): void {
  walk(tr, rnd, 2);
  let t = tr.lead.end + 0.6;
  const onLead = rnd() < 0.5;
  tr.lead.to(t, onLead ? 0.85 : 0.15);
  tr.leadHeel.to(t, 0.2);
  tr.trailHeel.to(t, 0.2);
  tr.load.to(t, 1.05);
  t += 1.2 + rnd() * 0.6;
  syncTo(tr, t);
  t += 0.6;
  tr.lead.to(t, onLead ? 1 : 0); // the other foot comes off the ground as the golfer stands up
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  tr.load.to(t, 1);
  syncTo(tr, t + 0.3);
  walk(tr, rnd, 2);
}

/** Setting up at address (optionally with waggles), still before the takeaway; returns the takeaway time. */
function setUp(tr: Tracks, rnd: () => number, waggle: boolean): { t: number; f0: number } {
  let t = tr.lead.end;
  const f0 = 0.5 + (rnd() - 0.5) * 0.06;
  t += 0.6;
  tr.lead.to(t, f0);
  tr.leadHeel.to(t, 0.5 + (rnd() - 0.5) * 0.1);
  tr.trailHeel.to(t, 0.5 + (rnd() - 0.5) * 0.1);
  t += 0.6 + rnd() * 0.6;
  syncTo(tr, t);
  if (waggle) {
    // small quick back-and-forth of the weight at address, then still again before the takeaway
    const cycles = 2 + Math.floor(rnd() * 2);
    for (let c = 0; c < cycles; c++) {
      tr.lead.to((t += 0.2), f0 + 0.03).to((t += 0.2), f0 - 0.03);
    }
    tr.lead.to((t += 0.2), f0);
    t += 0.9 + rnd() * 0.4;
    syncTo(tr, t);
  } else {
    t += 0.6 + rnd() * 0.6;
    syncTo(tr, t);
  }
  return { t, f0 };
}

/** Back from wherever the weight is to a relaxed, even stance. */
function relax(tr: Tracks, t: number): void {
  tr.lead.to(t, 0.5);
  tr.leadHeel.to(t, 0.5);
  tr.trailHeel.to(t, 0.5);
  syncTo(tr, t + 1);
}

/** One swing from the relaxed stance; returns its design times. */
function swing(tr: Tracks, rnd: () => number, waggle: boolean): SwingDesign {
  const { t: address } = setUp(tr, rnd, waggle);
  // the COP passes the quiet threshold ~0.08 s into the move, so the move starts that much before the
  // 0.7-0.95 s backswing that address -> top measures
  const backswingS = 0.7 + rnd() * 0.25;
  const top = address + backswingS + 0.08;
  tr.lead.to(top, 0.22 + rnd() * 0.12);
  tr.trailHeel.to(top, 0.6 + rnd() * 0.1);
  tr.leadHeel.to(top, 0.45);
  syncTo(tr, top);
  const impactS = 0.24 + rnd() * 0.06;
  const downD = (impactS * 6) / 5;
  const downEnd = top + downD;
  tr.lead.to(downEnd, 0.8 + rnd() * 0.08);
  syncTo(tr, downEnd);
  const ftEnd = downEnd + 0.45 + rnd() * 0.15;
  tr.lead.to(ftEnd, 0.93 + rnd() * 0.04);
  tr.leadHeel.to(ftEnd, 0.7 + rnd() * 0.1);
  tr.trailHeel.to(ftEnd, 0.1);
  syncTo(tr, ftEnd);
  const t = ftEnd + 1.5 + rnd();
  syncTo(tr, t);
  relax(tr, t + 0.9);
  return { address, top, downD, impactS, backswingS };
}

interface Geometry {
  ids: string[];
  /** per column: lead foot?, heel?, weight within its foot region, area */
  isLead: boolean[];
  isHeel: boolean[];
  weight: number[];
  area: number[];
  x: number[];
  y: number[];
}

function geometry(layout: SensorLayout, handedness: Handedness): Geometry {
  const leadFoot = handedness === 'right' ? 'left' : 'right';
  const sensors = [...layout.sensors].sort((a, b) => (a.foot === b.foot ? 0 : a.foot === 'left' ? -1 : 1));
  const heelOf = (s: SensorLayout['sensors'][number]) => (s.region ?? (s.y_mm < layout.foot_length_mm / 2 ? 'heel' : 'toe')) === 'heel';
  // inside a region the load is shared in proportion to sensor area
  const regionArea = new Map<string, number>();
  for (const s of sensors) {
    const key = `${s.foot}:${heelOf(s)}`;
    regionArea.set(key, (regionArea.get(key) ?? 0) + s.area_mm2);
  }
  for (const foot of ['left', 'right']) {
    for (const heel of [true, false]) {
      if (!regionArea.get(`${foot}:${heel}`)) throw new RangeError(`layout "${layout.id}" has no ${heel ? 'heel' : 'toe'} sensor on the ${foot} foot`);
    }
  }
  return {
    ids: sensors.map((s) => s.id),
    isLead: sensors.map((s) => s.foot === leadFoot),
    isHeel: sensors.map(heelOf),
    weight: sensors.map((s) => s.area_mm2 / regionArea.get(`${s.foot}:${heelOf(s)}`)!),
    area: sensors.map((s) => s.area_mm2),
    x: sensors.map((s) => s.x_mm),
    y: sensors.map((s) => s.y_mm),
  };
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
}

/** Noise-free stance-frame COP of one sample, the README formulas; also used for the truth. */
function cleanCop(g: Geometry, f: number[], w: number, footLength: number): { x: number; y: number } {
  let total = 0;
  let mx = 0;
  let my = 0;
  for (let c = 0; c < f.length; c++) {
    total += f[c];
    mx += f[c] * (g.isLead[c] ? w / 2 - g.x[c] : -w / 2 + g.x[c]);
    my += f[c] * g.y[c];
  }
  return { x: mx / total, y: my / total - footLength / 2 };
}

export function generateSession(opts: SessionOptions): Session {
  checkOptions(opts);
  const fs = opts.sampleRateHz;
  const layout = opts.layout ?? builtinLayout(opts.sensorsPerFoot === 16 ? 'pair-16' : 'pair-8');
  if (!layout) throw new RangeError('no built-in layout for that sensor count');
  const g = geometry(layout, opts.handedness);
  const rnd = prng(opts.seed);
  const distractors = opts.distractors ?? [];
  const tr: Tracks = { lead: new Track(0, 0.5), leadHeel: new Track(0, 0.5), trailHeel: new Track(0, 0.5), load: new Track(0, 1) };
  syncTo(tr, 1.5);

  const slot = opts.durationS !== undefined && opts.swings > 0 ? opts.durationS / opts.swings : 0;
  const designs: SwingDesign[] = [];
  const play = (d: Distractor | null) => {
    if (d === 'walk') walk(tr, rnd, 4 + Math.floor(rnd() * 4));
    else if (d === 'step') lift(tr, rnd, 0.4 + rnd() * 0.2);
    else if (d === 'lift') lift(tr, rnd, 1.2 + rnd());
    else if (d === 'retee') retee(tr, rnd);
  };
  if (opts.swings === 0) {
    // no swing: every distractor once (a waggle is a set-up with waggles that ends without a swing)
    for (const d of distractors) {
      if (d === 'waggle') relax(tr, setUp(tr, rnd, true).t + 0.8);
      else play(d);
    }
    if (opts.durationS !== undefined && tr.lead.end < opts.durationS) idle(tr, rnd, opts.durationS);
  }
  for (let k = 0; k < opts.swings; k++) {
    const d = distractors.length ? distractors[k % distractors.length] : null;
    play(d);
    designs.push(swing(tr, rnd, d === 'waggle'));
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

  // truth from the noise-free COP (central differences), the detector's definitions
  const copX = new Float64Array(n);
  const copY = new Float64Array(n);
  const f = new Array<number>(C);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < C; c++) f[c] = clean[c][i];
    const p = cleanCop(g, f, w, layout.foot_length_mm);
    copX[i] = p.x;
    copY[i] = p.y;
  }
  const vx = new Float64Array(n);
  const speed = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    vx[i] = ((copX[i + 1] - copX[i - 1]) * fs) / 2;
    const vy = ((copY[i + 1] - copY[i - 1]) * fs) / 2;
    speed[i] = Math.hypot(vx[i], vy);
  }
  const D = DETECTION_DEFAULTS;
  const idx = (t: number) => Math.round(t * fs);
  const marker = new Uint8Array(n);
  const truth: TruthSwing[] = designs.map((d) => {
    let top = idx(d.top);
    for (let i = idx(d.top - 0.1); i <= idx(d.top + 0.1); i++) if (copX[i] < copX[top]) top = i;
    let peak = top;
    for (let i = top; i <= idx(d.top + d.downD); i++) if (vx[i] > vx[peak]) peak = i;
    let transition = top + 1;
    while (vx[transition] < vx[peak] * D.halfPeakFraction) transition++;
    let bPeak = idx(d.address);
    for (let i = idx(d.address); i <= top; i++) if (vx[i] < vx[bPeak]) bPeak = i;
    let address = bPeak;
    while (speed[address] >= D.quietSpeedMmS) address--; // the clean speed rises monotonically from the address
    const impact = idx(d.top + d.impactS);
    marker[impact] = 1;
    const hold = Math.round(D.settleHoldS * fs);
    let finish = impact + 1;
    let run = 0;
    for (let i = impact + 1; i < n; i++) {
      run = speed[i] < D.settleSpeedMmS ? run + 1 : 0;
      if (run === hold) {
        finish = i - hold + 1;
        break;
      }
    }
    const samples = { address, top, transition, impact, finish };
    const events = {} as Record<EventName, number>;
    for (const [k, v] of Object.entries(samples)) events[k as EventName] = v / fs;
    return { events, samples, backswingS: d.backswingS, downswingS: d.impactS };
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
    const nr = prng(noiseSeed);
    let spare: number | null = null;
    const gauss = () => {
      // Box-Muller, two normals per pair of uniforms
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      const r = Math.sqrt(-2 * Math.log(1 - nr()));
      const a = 2 * Math.PI * nr();
      spare = r * Math.sin(a);
      return r * Math.cos(a);
    };
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
