// Cell-level rules shared by the reader: numbers, delimiters, metadata lines.
import { SignalInputError } from '../errors';

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

/**
 * A cell as a number: NaN for an empty cell (a missing sample), null when it is not a number.
 * With the semicolon delimiter a decimal comma ("41,10") is accepted, as spreadsheets in many locales write it.
 */
export function cellNumber(raw: string, decimalComma: boolean): number | null {
  const cell = raw.trim();
  if (cell === '') return NaN;
  if (NUMBER.test(cell)) {
    const v = Number(cell);
    return Number.isFinite(v) ? v : null;
  }
  if (decimalComma && DECIMAL_COMMA.test(cell)) return Number(cell.replace(',', '.'));
  return null;
}

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
    new SignalInputError('bad-metadata', `metadata "${key}" ${what}, got "${value}"`, { line, column: 1 });
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
    case 'sample_rate_hz':
    case 'stance_width_mm': {
      const v = cellNumber(value, false);
      if (v === null || !(v > 0)) throw bad('must be a positive number');
      return value;
    }
    default:
      return value;
  }
}
