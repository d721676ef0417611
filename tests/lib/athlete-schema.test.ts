import { describe, expect, it } from 'vitest';
import { ageOn, athleteInputSchema, athletePatchSchema, isMinor } from '@/lib/contracts/athletes';
import { zodFieldErrors } from '@/lib/http';

const valid = { displayName: 'Test Player', handedness: 'right', stanceWidthMm: 400, dateOfBirth: null, homeClub: null };

describe('athleteInputSchema (shared by the form and the API)', () => {
  it('accepts a complete athlete and trims text', () => {
    expect(athleteInputSchema.parse({ ...valid, displayName: '  Test Player  ', homeClub: ' Club ' })).toMatchObject({
      displayName: 'Test Player',
      homeClub: 'Club',
    });
  });

  it('keeps stance width within 150-900 mm, whole millimetres', () => {
    expect(athleteInputSchema.safeParse({ ...valid, stanceWidthMm: 150 }).success).toBe(true);
    expect(athleteInputSchema.safeParse({ ...valid, stanceWidthMm: 900 }).success).toBe(true);
    const low = athleteInputSchema.safeParse({ ...valid, stanceWidthMm: 149 });
    expect(low.success || zodFieldErrors(low.error)).toEqual({ stanceWidthMm: ['Stance width must be at least 150 mm.'] });
    const fraction = athleteInputSchema.safeParse({ ...valid, stanceWidthMm: 400.5 });
    expect(fraction.success || zodFieldErrors(fraction.error)).toEqual({ stanceWidthMm: ['Use whole millimetres.'] });
    // An empty number input reaches the schema as NaN (react-hook-form valueAsNumber).
    expect(athleteInputSchema.safeParse({ ...valid, stanceWidthMm: Number.NaN }).success).toBe(false);
  });

  it('names each bad field', () => {
    const result = athleteInputSchema.safeParse({ displayName: ' ', handedness: 'ambi', stanceWidthMm: 400, dateOfBirth: '12/03/1994', homeClub: null });
    expect(result.success).toBe(false);
    expect(Object.keys(zodFieldErrors(result.error!)).sort()).toEqual(['dateOfBirth', 'displayName', 'handedness']);
  });

  it('refuses a date of birth in the future', () => {
    const result = athleteInputSchema.safeParse({ ...valid, dateOfBirth: '2999-01-01' });
    expect(result.success || zodFieldErrors(result.error)).toEqual({ dateOfBirth: ['The date of birth cannot be in the future.'] });
  });

  it('a patch needs at least one field', () => {
    expect(athletePatchSchema.safeParse({}).success).toBe(false);
    expect(athletePatchSchema.parse({ stanceWidthMm: 410 })).toEqual({ stanceWidthMm: 410 });
  });
});

describe('ageOn(dateOfBirth, today) and isMinor', () => {
  // Age in completed years: the birthday itself counts (the usual legal reckoning of age).
  it('counts a year only once the birthday is reached', () => {
    expect(ageOn('2010-06-04', '2026-06-03')).toBe(15);
    expect(ageOn('2010-06-04', '2026-06-04')).toBe(16);
    expect(ageOn('2008-02-29', '2026-02-28')).toBe(17);
    expect(ageOn('2008-02-29', '2026-03-01')).toBe(18);
  });

  it('is a minor below 18 only', () => {
    expect(isMinor('2008-12-02', '2026-12-01')).toBe(true);
    expect(isMinor('2008-12-01', '2026-12-01')).toBe(false);
    expect(isMinor(null, '2026-12-01')).toBe(false);
  });
});
