// Session dates coarsened to the ISO 8601 week (ISO 8601-1:2019, 5.2.4.3 "week date"): weeks start on Monday and
// week 1 is the week holding the year's first Thursday, so the week's year can differ from the calendar year at
// either end. Written 'YYYY-Www' (e.g. 2026-W07).

const DAY_MS = 86_400_000;

export function isoWeek(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  const t = Date.UTC(y, m - 1, d);
  if (!Number.isFinite(t) || !/^\d{4}-\d{2}-\d{2}$/.test(day)) throw new RangeError(`not a date: ${day}`);
  const weekday = (new Date(t).getUTCDay() + 6) % 7; // Monday 0 .. Sunday 6
  const thursday = t + (3 - weekday) * DAY_MS; // the Thursday of this week decides the week's year
  const year = new Date(thursday).getUTCFullYear();
  const week = 1 + Math.floor((thursday - Date.UTC(year, 0, 1)) / (7 * DAY_MS));
  return `${year}-W${String(week).padStart(2, '0')}`;
}

/** The Monday of an ISO week 'YYYY-Www', as 'YYYY-MM-DD'. */
export function isoWeekMonday(week: string): string {
  const match = /^(\d{4})-W(\d{2})$/.exec(week);
  if (!match) throw new RangeError(`not an ISO week: ${week}`);
  const year = Number(match[1]);
  const jan4 = Date.UTC(year, 0, 4); // 4 January is always in week 1
  const monday1 = jan4 - ((new Date(jan4).getUTCDay() + 6) % 7) * DAY_MS;
  return new Date(monday1 + (Number(match[2]) - 1) * 7 * DAY_MS).toISOString().slice(0, 10);
}
