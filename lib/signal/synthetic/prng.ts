// Seeded randomness of the generator: mulberry32 (uniform in [0, 1)) and Box-Muller normals.

/** mulberry32: a small, fast, seeded PRNG in [0, 1) */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal draws from a uniform source (Box-Muller, two normals per pair of uniforms). */
export function gaussian(rnd: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const r = Math.sqrt(-2 * Math.log(1 - rnd()));
    const a = 2 * Math.PI * rnd();
    spare = r * Math.sin(a);
    return r * Math.cos(a);
  };
}
