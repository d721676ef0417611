// Reads a shot log (CSV or TSV) with a shot profile into shots in SI units. Pure: text in, rows out; bad input
// collects problems with 1-based line and column (at most MAX_PROBLEMS) and throws ShotFileError.
import type { ShotProfile } from '@/lib/contracts/shots';
import { distanceToM, speedToMps } from './units';

export const MAX_PROBLEMS = 10;
export const MAX_SHOTS = 5000;

export interface ParsedShot {
  /** 1-based line of the shot in the file */
  line: number;
  /** seconds on the device's clock: epoch seconds for a date-time, seconds since midnight of the session date (UTC) for a clock time, else the number as given */
  deviceTimeS: number;
  timeText: string;
  club: string | null;
  ballSpeed: number | null;
  carry: number | null;
  total: number | null;
  launchAngle: number | null;
  spin: number | null;
  offline: number | null;
}

export interface Problem {
  line: number;
  column: number | null;
  message: string;
}

export class ShotFileError extends Error {
  constructor(readonly problems: Problem[]) {
    super(problems.map(describeProblem).join('; '));
    this.name = 'ShotFileError';
  }
}

export const describeProblem = (p: Problem): string => `line ${p.line}${p.column !== null ? `, column ${p.column}` : ''}: ${p.message}`;

const quote = (s: string) => JSON.stringify(s.length > 40 ? `${s.slice(0, 40)}…` : s);

/** Splits one line on the delimiter; double quotes enclose a field and "" inside them is a quote. */
export function splitLine(line: string, delimiter: string): string[] {
  const out: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line[i];
    if (quoted) {
      if (c === '"' && line[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"' && field.trim() === '') {
      quoted = true;
      field = '';
    } else if (c === delimiter) {
      out.push(field.trim());
      field = '';
    } else field += c;
  }
  out.push(field.trim());
  return out;
}

/** The profile's delimiter, else the first of tab, semicolon, comma found in the header line. */
function delimiterOf(profile: ShotProfile, headerLine: string): string {
  if (profile.delimiter) return profile.delimiter;
  if (headerLine.includes('\t')) return '\t';
  if (headerLine.includes(';')) return ';';
  return ',';
}

/** A number in the profile's decimal mark (a decimal comma file may not use commas to group thousands). */
export function parseNumber(text: string, decimal: '.' | ','): number | null {
  const t = text.replace(/\s/g, '');
  const normalised = decimal === ',' ? t.replace(',', '.') : t;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(normalised)) return null;
  return Number(normalised);
}

const ISO_DATE_TIME = /^(\d{4}-\d{2}-\d{2})[T ](\d{2}):(\d{2}):(\d{2})([.,]\d+)?(Z|[+-]\d{2}:?\d{2})?$/;
const CLOCK_TIME = /^(\d{1,2}):(\d{2}):(\d{2})([.,]\d+)?$/;

/**
 * A shot time: an ISO 8601 date-time (no zone = UTC; the offset finder absorbs any zone difference), a clock time
 * hh:mm:ss(.fff) on the session date, or a plain number of seconds. Returns seconds or null.
 */
export function parseShotTime(text: string, decimal: '.' | ',', sessionDate: string): number | null {
  const iso = ISO_DATE_TIME.exec(text);
  if (iso) {
    const zone = iso[6] ? (iso[6] === 'Z' ? 'Z' : iso[6].length === 5 ? `${iso[6].slice(0, 3)}:${iso[6].slice(3)}` : iso[6]) : 'Z';
    const whole = Date.parse(`${iso[1]}T${iso[2]}:${iso[3]}:${iso[4]}${zone}`);
    if (!Number.isFinite(whole)) return null;
    return whole / 1000 + (iso[5] ? Number(`0.${iso[5].slice(1)}`) : 0);
  }
  const clock = CLOCK_TIME.exec(text);
  if (clock) {
    const [h, m, s] = [Number(clock[1]), Number(clock[2]), Number(clock[3])];
    if (h > 23 || m > 59 || s > 60) return null;
    const midnight = Date.parse(`${sessionDate}T00:00:00Z`) / 1000;
    if (!Number.isFinite(midnight)) return null;
    return midnight + h * 3600 + m * 60 + s + (clock[4] ? Number(`0.${clock[4].slice(1)}`) : 0);
  }
  return parseNumber(text, decimal);
}

type NumericField = 'ball_speed' | 'carry' | 'total' | 'launch_angle' | 'spin' | 'offline';
const NUMERIC_FIELDS: NumericField[] = ['ball_speed', 'carry', 'total', 'launch_angle', 'spin', 'offline'];

function toSi(field: NumericField, value: number, profile: ShotProfile): number {
  const u = profile.units;
  if (field === 'ball_speed') return speedToMps(value, u.ball_speed ?? 'm/s');
  if (field === 'carry' || field === 'total' || field === 'offline') return distanceToM(value, u[field] ?? 'm');
  return value; // launch angle in degrees, spin in rpm
}

/**
 * Reads the whole file. Lines starting with '#' before the header and blank lines are skipped. With `allColumns`
 * every column the profile names must be in the header (a coach's own profile); without it (our plain layout)
 * only the time column is required and the others are read when present.
 */
export function parseShotLog(text: string, profile: ShotProfile, sessionDate: string, allColumns = true): ParsedShot[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const problems: Problem[] = [];
  const fail = (p: Problem) => {
    problems.push(p);
    if (problems.length >= MAX_PROBLEMS) throw new ShotFileError(problems);
  };
  let headerAt = lines.findIndex((l) => l.trim() !== '' && !l.trimStart().startsWith('#'));
  if (headerAt < 0) throw new ShotFileError([{ line: 1, column: null, message: 'the file has no header row and no shots' }]);
  const delimiter = delimiterOf(profile, lines[headerAt]);
  const decimal = profile.decimal ?? '.';
  if (decimal === ',' && delimiter === ',') {
    throw new ShotFileError([{ line: headerAt + 1, column: null, message: 'a decimal comma needs another delimiter (semicolon or tab) in the profile' }]);
  }
  const header = splitLine(lines[headerAt], delimiter);
  const col = new Map<string, number>();
  const columns = profile.columns as Record<string, string | undefined>;
  for (const [ours, theirs] of Object.entries(columns)) {
    if (!theirs) continue;
    const at = header.findIndex((h) => h === theirs);
    if (at < 0 && (allColumns || ours === 'time')) fail({ line: headerAt + 1, column: null, message: `the header has no column ${quote(theirs)} (profile column "${ours}"); it has ${header.map(quote).join(', ')}` });
    else if (at >= 0) col.set(ours, at);
  }
  if (problems.length > 0) throw new ShotFileError(problems);

  const shots: ParsedShot[] = [];
  for (let i = headerAt + 1; i < lines.length; i++) {
    if (lines[i].trim() === '') continue;
    const lineNo = i + 1;
    const cells = splitLine(lines[i], delimiter);
    const cell = (ours: string): { text: string; column: number } | null => {
      const at = col.get(ours);
      if (at === undefined) return null;
      return { text: cells[at] ?? '', column: at + 1 };
    };
    const t = cell('time')!;
    const time = t.text === '' ? null : parseShotTime(t.text, decimal, sessionDate);
    if (time === null) {
      fail({ line: lineNo, column: t.column, message: t.text === '' ? 'the shot time is empty' : `${quote(t.text)} is not a time (use an ISO 8601 date-time, hh:mm:ss or seconds)` });
      continue;
    }
    const shot: ParsedShot = { line: lineNo, deviceTimeS: time, timeText: t.text, club: null, ballSpeed: null, carry: null, total: null, launchAngle: null, spin: null, offline: null };
    const c = cell('club');
    if (c && c.text !== '') shot.club = c.text.slice(0, 40);
    let bad = false;
    for (const field of NUMERIC_FIELDS) {
      const v = cell(field);
      if (!v || v.text === '') continue;
      const n = parseNumber(v.text, decimal);
      if (n === null) {
        bad = true;
        fail({ line: lineNo, column: v.column, message: `${quote(v.text)} is not a number (${field}, decimal mark ${quote(decimal)})` });
        continue;
      }
      const si = toSi(field, n, profile);
      if (field === 'ball_speed') shot.ballSpeed = si;
      else if (field === 'launch_angle') shot.launchAngle = si;
      else shot[field] = si;
    }
    if (!bad) shots.push(shot);
    if (shots.length > MAX_SHOTS) throw new ShotFileError([{ line: lineNo, column: null, message: `more than ${MAX_SHOTS} shots in one file` }]);
  }
  if (problems.length > 0) throw new ShotFileError(problems);
  if (shots.length === 0) throw new ShotFileError([{ line: headerAt + 1, column: null, message: 'the file has a header but no shots' }]);
  for (let k = 1; k < shots.length; k++) {
    if (shots[k].deviceTimeS < shots[k - 1].deviceTimeS) {
      const at = col.get('time')! + 1;
      throw new ShotFileError([{ line: shots[k].line, column: at, message: `the shot time goes backwards (${quote(shots[k].timeText)} after ${quote(shots[k - 1].timeText)}); shots must be in time order` }]);
    }
  }
  return shots;
}
