// Column values as MariaDB and mysql2 hand them over, turned into what the API sends: JSON columns, dates, numbers
// and the rounding the API shares with `npm run analyze`. One module, so every read model converts the same way.
// Pure: no database access, no server-only marker.

/**
 * A JSON column. MariaDB stores JSON as LONGTEXT with a CHECK, so mysql2 returns a string; a value that is already
 * parsed (a driver that maps JSON columns) passes through. null/undefined stay null.
 */
export function jsonColumn<T>(value: unknown): T | null {
  if (value === null || value === undefined) return null;
  return (typeof value === 'string' ? JSON.parse(value) : value) as T;
}

/** A JSON column that is NOT NULL in the schema (or whose absence is a bug): throws rather than returning null. */
export function jsonColumnOf<T>(value: unknown): T {
  const parsed = jsonColumn<T>(value);
  if (parsed === null) throw new TypeError('expected a JSON column value, got null');
  return parsed;
}

/**
 * A DATE column as YYYY-MM-DD. DATE columns arrive either as 'YYYY-MM-DD' strings (dateStrings) or as Date objects
 * at local midnight (mysql2's default), so the local parts are the date.
 */
export function toIsoDate(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  if (value instanceof Date) {
    const y = value.getFullYear();
    const m = String(value.getMonth() + 1).padStart(2, '0');
    const d = String(value.getDate()).padStart(2, '0');
    return `${y}-${m}-${d}`;
  }
  return String(value).slice(0, 10);
}

/** A DATETIME/TIMESTAMP column as an ISO 8601 instant; null stays null. */
export function toIsoTime(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  return new Date(value as string | number | Date).toISOString();
}

/** DECIMAL and BIGINT columns come back as strings from mysql2; null stays null. */
export function num(value: unknown): number | null {
  return value === null || value === undefined ? null : Number(value);
}

/** Rounds to `digits` decimals; null/undefined stay null; `|| 0` turns -0 into 0 so JSON never shows "-0". */
export const round =
  (digits: number) =>
  (value: unknown): number | null => {
    if (value === null || value === undefined) return null;
    const p = 10 ** digits;
    return Math.round(Number(value) * p) / p || 0;
  };

// The API's rounding, the same as `npm run analyze` prints (lib/signal roundAnalysis): times to 3 decimals, the
// tempo ratio to 2, percentages and millimetres to 1, mm/s to whole numbers.
export const r3 = round(3);
export const r2 = round(2);
export const r1 = round(1);
export const r0 = round(0);
