// Number formats for the charts and panels. Missing values (NaN) show as an en dash, never as 0.
export const DASH = '–';

export function formatSeconds(s: number, digits = 2): string {
  if (!Number.isFinite(s)) return DASH;
  const r = Number(s.toFixed(digits));
  return (Object.is(r, -0) ? 0 : r).toFixed(digits);
}

export function formatNumber(v: number, digits = 0): string {
  if (!Number.isFinite(v)) return DASH;
  const r = Number(v.toFixed(digits));
  return (Object.is(r, -0) ? 0 : r).toFixed(digits);
}
