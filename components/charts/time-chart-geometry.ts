// Sizes shared by the time chart's static layers and its interactive shell.
import { innerHeight, innerWidth, timeScale, valueScale, type ChartBox } from './lib/scales';

export const MARGIN = { top: 8, right: 14, bottom: 8, left: 40 };
export const LABEL_ROW_PX = 16;
/** rows of event labels above a chart: top, transition and impact can fall within a few pixels of each other */
export const LABEL_ROWS = 3;
// 14 px: no text on screen below 14 px, chart labels included
export const FONT_PX = 14;
export const UNIT_ROW_PX = 20;

export interface GeometryInput {
  width: number;
  height: number;
  domain: [number, number];
  yDomain: [number, number];
  showEventLabels?: boolean;
  showTimeAxis?: boolean;
}

/** The chart box (three label rows on top when event labels are shown, a tick row below with the time axis) and scales. */
export function chartGeometry(p: GeometryInput) {
  const labelRowsPx = p.showEventLabels ? LABEL_ROW_PX * LABEL_ROWS + 4 : 0;
  const box: ChartBox = {
    width: p.width,
    height: p.height,
    // without event labels, room above the plot for the value axis's unit (14 px text)
    margin: { ...MARGIN, top: p.showEventLabels ? MARGIN.top + labelRowsPx : UNIT_ROW_PX, bottom: p.showTimeAxis ? 24 : MARGIN.bottom },
  };
  return { box, w: innerWidth(box), h: innerHeight(box), x: timeScale(p.domain, box), y: valueScale(p.yDomain, box) };
}
