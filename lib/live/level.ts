// The weight split of the last chunk for the live bar: mean force per sensor over the chunk's rows, then
// lead % = lead-foot force / total x 100 and heel % = heel-region force / that foot's force x 100 (README formulas,
// the same definitions as lib/signal/derive.ts, on raw means: the bar shows where the weight is now, not an analysis).
import type { Handedness, SensorLayout } from '@/lib/signal/types';
import { detectDelimiter } from '@/lib/signal/read/cells';

export interface Level {
  t: number;
  leadPct: number | null;
  leadHeelPct: number | null;
  trailHeelPct: number | null;
}

const round1 = (v: number | null) => (v === null || !Number.isFinite(v) ? null : Math.round(v * 10) / 10);

export function chunkLevel(headerLine: string, body: string, layout: SensorLayout, handedness: Handedness, units: 'N' | 'kPa'): Level | null {
  const delimiter = detectDelimiter(headerLine);
  const header = headerLine.split(delimiter).map((h) => h.trim());
  const sensors = layout.sensors
    .map((s) => ({ s, col: header.indexOf(s.id) }))
    .filter((x) => x.col > 0)
    .map(({ s, col }) => ({
      col,
      foot: s.foot,
      heel: s.region ? s.region === 'heel' : s.y_mm < layout.foot_length_mm / 2,
      scale: units === 'kPa' ? s.area_mm2 * 0.001 : 1,
    }));
  const sum = new Float64Array(sensors.length);
  const count = new Float64Array(sensors.length);
  let t = NaN;
  for (const line of body.split('\n')) {
    if (line.trim() === '') continue;
    const cells = line.split(delimiter);
    const time = Number((delimiter === ';' ? cells[0].replace(',', '.') : cells[0]).trim());
    if (Number.isFinite(time)) t = time;
    sensors.forEach((x, k) => {
      const raw = cells[x.col]?.trim();
      const v = Number(delimiter === ';' ? raw?.replace(',', '.') : raw);
      if (raw && Number.isFinite(v)) {
        sum[k] += v * x.scale;
        count[k]++;
      }
    });
  }
  if (!Number.isFinite(t)) return null;
  const lead = handedness === 'right' ? 'left' : 'right';
  let leadN = 0, trailN = 0, leadHeel = 0, trailHeel = 0;
  sensors.forEach((x, k) => {
    if (count[k] === 0) return;
    const f = Math.max(0, sum[k] / count[k]);
    if (x.foot === lead) {
      leadN += f;
      if (x.heel) leadHeel += f;
    } else {
      trailN += f;
      if (x.heel) trailHeel += f;
    }
  });
  const total = leadN + trailN;
  return {
    t,
    leadPct: round1(total > 1 ? (100 * leadN) / total : null),
    leadHeelPct: round1(leadN > 1 ? (100 * leadHeel) / leadN : null),
    trailHeelPct: round1(trailN > 1 ? (100 * trailHeel) / trailN : null),
  };
}
