// A constructed launch-monitor session: impacts on one clock, shots on another (known offset, known dropouts and extras).

/** Park-Miller minimal standard generator (deterministic; no shared random state). */
export function lcg(seed: number) {
  let s = seed % 2147483647;
  if (s <= 0) s += 2147483646;
  return () => {
    s = (s * 16807) % 2147483647;
    return (s - 1) / 2147483646;
  };
}

export interface ClockCase {
  impacts: number[];
  shots: number[];
  offsetS: number;
  /** index in shots -> index in impacts, for the shots that belong to a swing */
  truth: Map<number, number>;
}

/** A session of `n` swings 20-90 s apart; 10 % of swings lose their shot, 10 % extra shots without a swing. */
export function clockCase(seed: number, n = 40, offsetS?: number): ClockCase {
  const rnd = lcg(seed);
  const offset = offsetS ?? -120 + 240 * rnd();
  const impacts: number[] = [];
  let t = 5 + 30 * rnd();
  for (let i = 0; i < n; i++) {
    impacts.push(t);
    t += 20 + 70 * rnd();
  }
  const drop = new Set<number>();
  while (drop.size < Math.round(n * 0.1)) drop.add(Math.floor(rnd() * n));
  const rows: { time: number; impact: number | null }[] = [];
  impacts.forEach((imp, i) => {
    if (!drop.has(i)) rows.push({ time: imp + offset + (rnd() - 0.5) * 0.03, impact: i }); // ±15 ms jitter
  });
  for (let k = 0; k < Math.round(n * 0.1); k++) rows.push({ time: offset + impacts[0] + rnd() * (t - impacts[0]), impact: null });
  rows.sort((a, b) => a.time - b.time);
  const truth = new Map<number, number>();
  rows.forEach((r, i) => {
    if (r.impact !== null) truth.set(i, r.impact);
  });
  return { impacts, shots: rows.map((r) => r.time), offsetS: offset, truth };
}

