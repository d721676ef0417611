// Event labels that would overlap go to a second (or third) row: greedy, left to right, each label in the first row
// whose last label ends at least `gap` px before it starts.
export interface LabelSlot {
  x: number;
  width: number;
}

export function labelRows(slots: LabelSlot[], gap = 4, maxRows = 3): number[] {
  const rowEnds: number[] = [];
  const order = slots.map((s, i) => i).sort((a, b) => slots[a].x - slots[b].x);
  const rows = new Array<number>(slots.length).fill(0);
  for (const i of order) {
    const left = slots[i].x - slots[i].width / 2;
    let r = rowEnds.findIndex((end) => left >= end + gap);
    if (r < 0) r = rowEnds.length < maxRows ? rowEnds.length : rowEnds.indexOf(Math.min(...rowEnds));
    rowEnds[r] = slots[i].x + slots[i].width / 2;
    rows[i] = r;
  }
  return rows;
}

/** Width estimate of a label in the chart's 10-11 px sans font (average glyph ~0.56 em; common practice). */
export const textWidth = (text: string, fontPx = 10.5) => text.length * fontPx * 0.56;

/**
 * Rows and x positions for event labels that never overlap and never leave [0, maxX]: each label goes in the first
 * row (of `maxRows`) with room at its marker; when none has room, it is staggered to the right of the row that ends
 * first (a label may then sit a little beside its marker; the marker line still runs up to its row). Labels are
 * kept inside the chart by sliding them in from the edges.
 */
export function placeLabels(slots: LabelSlot[], maxX: number, gap = 4, maxRows = 3): { row: number; x: number }[] {
  const rowEnds: number[] = [];
  const order = slots.map((_, i) => i).sort((a, b) => slots[a].x - slots[b].x);
  const out = slots.map(() => ({ row: 0, x: 0 }));
  for (const i of order) {
    const half = slots[i].width / 2;
    const x = Math.min(Math.max(slots[i].x, half), Math.max(half, maxX - half));
    let r = rowEnds.findIndex((end) => x - half >= end + gap);
    let placed = x;
    if (r < 0 && rowEnds.length < maxRows) r = rowEnds.length;
    else if (r < 0) {
      r = rowEnds.indexOf(Math.min(...rowEnds));
      placed = rowEnds[r] + gap + half;
    }
    rowEnds[r] = placed + half;
    out[i] = { row: r, x: placed };
  }
  return out;
}
