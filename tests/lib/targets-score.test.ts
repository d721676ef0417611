import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_TARGETS } from '@/lib/targets/defaults';
import { scoreCheck, scoreSwing, type EventValues } from '@/lib/targets/score';
import { clubGroupOf, MEASURES, TARGET_EVENTS, type TargetCheck } from '@/lib/targets/types';

// Scoring properties (the definition: pass when |actual - expected| <= tolerance), fast-check with a fixed seed.
const checkArb = fc.record({
  event: fc.constantFrom(...TARGET_EVENTS),
  measure: fc.constantFrom(...MEASURES),
  expected: fc.double({ min: -100, max: 100, noNaN: true }),
  tolerance: fc.double({ min: 0.5, max: 40, noNaN: true }),
});
// one check per event and measure, so every check reads its own value
const targetArb = fc.uniqueArray(checkArb, { minLength: 1, maxLength: 20, selector: (c) => `${c.event}.${c.measure}` });

function valuesEqualTo(checks: TargetCheck[]): EventValues {
  const v: EventValues = {};
  for (const c of checks) (v[c.event] ??= {})[c.measure] = c.expected;
  return v;
}

describe('scoring a swing against a target', () => {
  it('a swing equal to the target passes every check (property)', () => {
    fc.assert(
      fc.property(targetArb, (checks) => {
        const s = scoreSwing({ checks, tempo: { min: 2.5, max: 3.5 } }, valuesEqualTo(checks), 3);
        expect(s.checks.every((c) => c.pass && c.by === 0)).toBe(true);
        expect(s.summary.passed).toBe(s.summary.total);
        expect(s.summary.total).toBe(checks.length + 1);
      }),
      { seed: 20261204, numRuns: 300 },
    );
  });

  it('moving one value past its tolerance fails exactly that check, by the excess (property)', () => {
    fc.assert(
      fc.property(targetArb, fc.nat(), fc.double({ min: 0.01, max: 50, noNaN: true }), fc.boolean(), (checks, pick, excess, up) => {
        const i = pick % checks.length;
        const values = valuesEqualTo(checks);
        const c = checks[i];
        const moved = c.expected + (up ? 1 : -1) * (c.tolerance + excess);
        values[c.event]![c.measure] = moved;
        const s = scoreSwing({ checks, tempo: null }, values, null);
        const failed = s.checks.map((r, j) => (r.pass ? -1 : j)).filter((j) => j >= 0);
        expect(failed).toEqual([i]);
        expect(Math.abs(s.checks[i].by!)).toBeCloseTo(excess, 6);
        expect(Math.sign(s.checks[i].by!)).toBe(up ? 1 : -1);
        expect(s.summary.passed).toBe(checks.length - 1);
      }),
      { seed: 20261205, numRuns: 300 },
    );
  });

  it('the tolerance edge passes and a missing value misses', () => {
    const c: TargetCheck = { event: 'impact', measure: 'leadPct', expected: 85, tolerance: 10 };
    expect(scoreCheck(c, 95).pass).toBe(true); // |95 - 85| = 10 <= 10
    expect(scoreCheck(c, 74).by).toBeCloseTo(-1, 12); // 1 below the band
    expect(scoreCheck(c, null)).toMatchObject({ pass: false, actual: null, by: null });
  });
});

describe('club groups and the common-practice defaults', () => {
  it('maps swing label clubs to groups; no label scores as irons', () => {
    expect(clubGroupOf('driver')).toBe('driver');
    expect(clubGroupOf('wood')).toBe('woods-hybrids');
    expect(clubGroupOf('hybrid')).toBe('woods-hybrids');
    expect(clubGroupOf('iron-7')).toBe('irons');
    expect(clubGroupOf('wedge')).toBe('wedges');
    expect(clubGroupOf(null)).toBe('irons');
  });

  it('says it is common practice, and the driver stays more behind the ball at impact than irons (common practice)', () => {
    expect(DEFAULT_TARGETS).toHaveLength(4);
    for (const t of DEFAULT_TARGETS) expect(`${t.name} ${t.description}`).toMatch(/common practice/i);
    const impactLead = (g: string) => DEFAULT_TARGETS.find((t) => t.clubGroup === g)!.checks.find((c) => c.event === 'impact' && c.measure === 'leadPct')!;
    expect(impactLead('driver').expected).toBeLessThan(impactLead('irons').expected);
    // irons: about 80-90 % lead at impact must pass (common practice)
    expect(scoreCheck(impactLead('irons'), 80).pass && scoreCheck(impactLead('irons'), 90).pass).toBe(true);
    const irons = DEFAULT_TARGETS.find((t) => t.clubGroup === 'irons')!;
    expect(irons.checks.find((c) => c.event === 'address' && c.measure === 'leadPct')!.expected).toBe(50); // near 50/50 at address
  });
});
