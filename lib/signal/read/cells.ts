// Cell-level rules shared by the reader: numbers, delimiters, metadata lines.
import { SignalInputError } from '../errors';

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

// 10^0 .. 10^15, all exact in a double.
export const POW10 = Array.from({ length: 16 }, (_, k) => 10 ** k);

/**
 * A cell as a number: NaN for an empty cell (a missing sample), null when it is not a number.
 * With the semicolon delimiter a decimal comma ("41,10") is accepted, as spreadsheets in many locales write it.
 */
export function cellNumber(raw: string, decimalComma: boolean): number | null {
  const fast = plainDecimal(raw, decimalComma);
  return fast === fast ? fast : strictCellNumber(raw, decimalComma);
}

/**
 * Fast path for the common cell: optional sign, at most 15 digits, at most one decimal point and nothing else
 * (no spaces, no exponent). Then the value is m / 10^k with m < 10^15 and 10^k both exact doubles, and one IEEE
 * division rounds the exact quotient correctly, so it equals Number(cell) bit for bit (the classic exact case
 * of decimal-to-binary conversion). Returns NaN for every other cell, which then takes the strict path.
 */
function plainDecimal(s: string, decimalComma: boolean): number {
  const n = s.length;
  let i = 0;
  let c = s.charCodeAt(0);
  const neg = c === 45; // '-'
  if (neg || c === 43) i = 1; // '+'
  let m = 0;
  let digits = 0;
  let point = -1; // digits before the decimal point, once one is seen
  let comma = false;
  for (; i < n; i++) {
    c = s.charCodeAt(i);
    const d = c - 48;
    if (d >= 0 && d <= 9) {
      m = m * 10 + d;
      digits++;
    } else if (point < 0 && (c === 46 || (c === 44 && decimalComma))) {
      point = digits;
      comma = c === 44;
    } else return NaN;
  }
  if (digits === 0 || digits > 15) return NaN;
  // a decimal comma needs digits on both sides (DECIMAL_COMMA); a point needs a digit on either side (NUMBER)
  if (comma && (point === 0 || point === digits)) return NaN;
  const v = point < 0 ? m : m / POW10[digits - point];
  return neg ? -v : v;
}

/** The rules themselves: trim, then the format-1 number grammar, then (semicolon files) a decimal comma. */
function strictCellNumber(raw: string, decimalComma: boolean): number | null {
  const cell = raw.trim();
  if (cell === '') return NaN;
  if (NUMBER.test(cell)) {
    const v = Number(cell);
    return Number.isFinite(v) ? v : null;
  }
  if (decimalComma && DECIMAL_COMMA.test(cell)) return Number(cell.replace(',', '.'));
  return null;
}

/** Longest piece of the file quoted in a message: a 100,000-character cell must not travel into logs and rows. */
export const QUOTE_MAX_CHARS = 80;

/** A cell or name for a message: trimmed and cut to QUOTE_MAX_CHARS, saying how long it was when cut. */
export function quote(text: string): string {
  const t = text.trim();
  if (t.length <= QUOTE_MAX_CHARS) return `"${t}"`;
  return `"${t.slice(0, QUOTE_MAX_CHARS)}…" (${t.length} characters)`;
}

/** Like quote, without the quotation marks (for a number shown as a number). */
export function clip(text: string): string {
  const t = text.trim();
  return t.length <= QUOTE_MAX_CHARS ? t : `${t.slice(0, QUOTE_MAX_CHARS)}… (${t.length} characters)`;
}

/**
 * Highest nominal rate accepted in `sample_rate_hz`. Pressure insoles record at 50-500 Hz (the format's scope); 10 kHz
 * leaves room for any lab system (common practice) while refusing typos such as 1e12.
 */
export const MAX_SAMPLE_RATE_HZ = 10_000;

/** Delimiter of a header or first data line: tab if present, else semicolon if present, else comma. */
export function detectDelimiter(line: string): string {
  if (line.includes('\t')) return '\t';
  if (line.includes(';')) return ';';
  return ',';
}

/** `# key: value` -> [key lower-cased, value trimmed]; null for a `#` comment without a colon. */
export function metadataEntry(line: string): [string, string] | null {
  const m = /^#\s*([^:]+?)\s*:\s*(.*?)\s*$/.exec(line);
  return m ? [m[1].toLowerCase(), m[2]] : null;
}

/**
 * Checks and normalises the known metadata keys (spec section 1); other keys are kept as free text.
 * Errors point at column 1: a metadata line is one field.
 */
export function checkedMetadataValue(key: string, value: string, line: number): string {
  const bad = (what: string) =>
    new SignalInputError('bad-metadata', `metadata ${quote(key)} ${what}, got ${quote(value)}`, { line, column: 1 });
  switch (key) {
    case 'format':
      if (value !== 'stanceline-insole/1') throw bad('must be stanceline-insole/1');
      return value;
    case 'units': {
      const v = value.toLowerCase();
      if (v === 'n') return 'N';
      if (v === 'kpa') return 'kPa';
      throw bad('must be N or kPa');
    }
    case 'handedness': {
      const v = value.toLowerCase();
      if (v !== 'right' && v !== 'left') throw bad('must be right or left');
      return v;
    }
    case 'sample_rate_hz': {
      const v = cellNumber(value, false);
      if (v === null || !(v > 0)) throw bad('must be a positive number');
      if (v > MAX_SAMPLE_RATE_HZ) throw bad(`must be at most ${MAX_SAMPLE_RATE_HZ} Hz (insoles record at 50-500 Hz)`);
      return value;
    }
    case 'stance_width_mm': {
      const v = cellNumber(value, false);
      if (v === null || !(v > 0)) throw bad('must be a positive number');
      return value;
    }
    default:
      return value;
  }
}
