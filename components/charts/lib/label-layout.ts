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
