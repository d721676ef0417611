import { describe, expect, it } from 'vitest';
import { defaultSets, setOptions } from '@/components/compare/compare-view';

// The compare page's sets: only sets with swings are offered; practice vs on-course is the default when both hold
// swings (the page's own subtitle), else the two newest months.
describe('compare sets', () => {
  it('offers only the contexts and months that hold swings', () => {
    expect(setOptions(['on-course'], ['2026-03']).map((o) => o.value)).toEqual(['context:on-course', 'month:2026-03']);
    expect(setOptions([], [])).toEqual([]);
  });

  it('opens on practice vs on-course when both exist, whatever the months', () => {
    expect(defaultSets(['lesson', 'on-course', 'practice'], ['2026-03', '2025-12'])).toEqual(['context:practice', 'context:on-course']);
  });

  it('falls back to the two newest months, then to the first two sets on offer', () => {
    expect(defaultSets(['practice'], ['2026-03', '2026-02', '2025-12'])).toEqual(['month:2026-03', 'month:2026-02']);
    expect(defaultSets(['practice', 'lesson'], ['2026-03'])).toEqual(['context:practice', 'context:lesson']);
  });
});
