// A control signal of the generator: key frames joined by eased moves. The cosine ease s(u) = (1 - cos(pi u)) / 2
// has zero velocity at both ends and a velocity ~ sin(pi u): peak at u = 1/2, half-peak at u = 1/6 and 5/6.

export const ease = (u: number) => (1 - Math.cos(Math.PI * u)) / 2;

/** Key frames joined by eased moves (hold = two frames with one value). */
export class Track {
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

export interface Tracks {
  /** lead-foot share of the total, 0..1 */
  lead: Track;
  leadHeel: Track;
  trailHeel: Track;
  /** multiplies the body weight (bending, walking bumps) */
  load: Track;
}

export function newTracks(): Tracks {
  return { lead: new Track(0, 0.5), leadHeel: new Track(0, 0.5), trailHeel: new Track(0, 0.5), load: new Track(0, 1) };
}

export function syncTo(tr: Tracks, t: number): void {
  for (const k of Object.keys(tr) as (keyof Tracks)[]) tr[k].holdUntil(t);
}
