import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dragHandle } from '@/components/charts/time-chart-layers';

// Drag targets of event markers: 44 px wide where there is room (WCAG 2.5.5 target size, 44 × 44 CSS px), cut at the
// midpoint between two close markers so neither covers the other's line.
describe('dragHandle(markers, k)', () => {
  it('is 44 px centred on a marker with room around it', () => {
    expect(dragHandle([{ px: 10 }, { px: 200 }, { px: 400 }], 1)).toEqual({ left: 178, width: 44 });
  });

  it('splits the gap between two close markers at their midpoint', () => {
    const markers = [{ px: 100 }, { px: 110 }];
    expect(dragHandle(markers, 0)).toEqual({ left: 78, width: 27 });
    expect(dragHandle(markers, 1)).toEqual({ left: 105, width: 27 });
  });

  it('never overlaps a neighbour and always covers its own line (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 50, noNaN: true }), { minLength: 1, maxLength: 5 }), (gaps) => {
        const markers = gaps.reduce<{ px: number }[]>((acc, g) => [...acc, { px: (acc.at(-1)?.px ?? 0) + g }], []);
        markers.forEach((m, k) => {
          const h = dragHandle(markers, k);
          expect(h.left).toBeLessThanOrEqual(m.px);
          expect(h.left + h.width).toBeGreaterThanOrEqual(m.px);
          expect(h.width).toBeLessThanOrEqual(44 + 1e-9);
          if (k > 0 && markers[k - 1].px < m.px - 2) expect(h.left).toBeGreaterThanOrEqual((markers[k - 1].px + m.px) / 2 - 1);
        });
      }),
    );
  });
});
