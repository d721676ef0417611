// Labels for points on the COP path: each label tries a few spots around its point (further out at each ring) and
// takes the first that overlaps no label already placed; a label with no free spot is left out (the values panel
// still lists that event).
import { textWidth } from './label-layout';

export interface PointLabel {
  x: number;
  y: number;
  anchor: 'start' | 'end' | 'middle';
  /** where the leader line from the point ends */
  anchorX: number;
  anchorY: number;
}

interface Box {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

export function placeLabels(points: { x: number; y: number; text: string }[], fontPx = 9.5): (PointLabel | null)[] {
  const placed: Box[] = points.map((p) => ({ x0: p.x - 4, x1: p.x + 4, y0: p.y - 4, y1: p.y + 4 })); // the markers themselves
  const h = fontPx + 2;
  return points.map((p) => {
    const w = textWidth(p.text, fontPx);
    for (const ring of [12, 24, 36]) {
      const spots: { dx: number; dy: number; anchor: PointLabel['anchor'] }[] = [
        { dx: 0, dy: -ring, anchor: 'middle' },
        { dx: 0, dy: ring, anchor: 'middle' },
        { dx: ring * 0.7, dy: -ring * 0.7, anchor: 'start' },
        { dx: -ring * 0.7, dy: -ring * 0.7, anchor: 'end' },
        { dx: ring * 0.7, dy: ring * 0.7, anchor: 'start' },
        { dx: -ring * 0.7, dy: ring * 0.7, anchor: 'end' },
      ];
      for (const s of spots) {
        const lx = p.x + s.dx;
        const ly = p.y + s.dy;
        const x0 = s.anchor === 'start' ? lx : s.anchor === 'end' ? lx - w : lx - w / 2;
        const box = { x0: x0 - 1, x1: x0 + w + 1, y0: ly - h / 2, y1: ly + h / 2 };
        if (placed.some((b) => overlaps(b, box))) continue;
        placed.push(box);
        return { x: lx, y: ly + fontPx * 0.35, anchor: s.anchor, anchorX: lx, anchorY: s.dy < 0 ? ly + h / 2 : ly - h / 2 };
      }
    }
    return null;
  });
}
