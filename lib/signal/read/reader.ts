// Streaming reader of recording CSV format 1 and of import-profile layouts. Papaparse tokenises the complete lines
// of each chunk, a piece of about PIECE characters at a time (fastMode: fields are never quoted in these files, so
// one row is one line and line numbers stay exact); the partial last line of a chunk is carried over to the next
// push. Values go straight into growing typed arrays: no row objects are kept.
import Papa from 'papaparse';
import { SignalInputError } from '../errors';
import type { ImportProfile, RawRecording, Units } from '../types';
import { cellNumber, checkedMetadataValue, clip, detectDelimiter, metadataEntry, POW10, quote } from './cells';
import { planFromHeader, planFromProfile, type ColumnPlan } from './columns';
import { Growable } from './growable';

/** Fewest data rows a recording may have: enough for the default zero-lag filter's edge padding (9 + 1). */
export const MIN_SAMPLES = 10;

/**
 * Characters of data handed to the tokeniser at once (rounded up to a whole line). Small enough that each piece's
 * row arrays die young (a cheap minor GC), large enough that the per-call cost is spread over ~150 rows.
 */
const PIECE = 16_384;

/**
 * Longest line accepted, in characters (64 Ki; a 16-sensor pair at full precision needs well under 1 Ki). A longer line
 * is refused with its number instead of being held, tokenised and quoted whole (a 30 MB line without a newline).
 */
export const MAX_LINE_CHARS = 65_536;

/**
 * Most negative sensor value accepted, in the file's units (N or kPa). A calibrated insole reads a little below zero
 * when a sensor is unloaded (offset drift; common practice to tolerate a few units); a clearly negative force or
 * pressure is a wrong sign, a wrong column or a broken sensor, and would pull the centre of pressure off the foot.
 */
export const MAX_NEGATIVE_READING = 10;

export interface RecordingReader {
  push(chunk: string): void;
  /**
   * The same as push() of these bytes decoded as UTF-8, for bytes that end on a whole character (a whole file, or a
   * piece that ends just after a newline). The common data line is read from the bytes themselves; only the other
   * lines (the preamble, anything the fast scanner leaves) are decoded into strings.
   */
  pushBytes(chunk: Uint8Array): void;
  end(): RawRecording;
}

export interface RecordingReaderOptions {
  profile?: ImportProfile;
  /** off: every line through papaparse (tests) */
  fastScan?: boolean;
  /**
   * The input's number of lines when known in advance (its newline characters, plus one when the last line has
   * none): the arrays are then sized once for the data rows instead of grown and copied. Only a hint: a wrong
   * count changes no result.
   */
  lines?: number;
  /**
   * The input's size in bytes, when known and `lines` is not: the arrays are sized once for the most rows of plain
   * cells that many bytes can hold (a character and a delimiter per field), and the results are views of them (the
   * part never written is never touched, so it costs address space only). More rows than that (empty cells) grow
   * the arrays as usual.
   */
  bytes?: number;
  /**
   * Arrays of the caller's own for the data rows (for example views of memory shared with another thread): called
   * once per array when the data starts, with the row count that the `lines` hint leaves room for (only then), and
   * must return an array of zeros of that length and the column's type (Float64Array for the time and the sensors,
   * Uint32Array for the line numbers, Uint8Array for the impact marker). Rows beyond it go to the reader's own arrays.
   */
  arrays?: (column: 'time' | 'lines' | 'impact' | { sensor: number }, rows: number) => Float64Array | Uint32Array | Uint8Array;
}

/** UTF-8 to text for the lines not read from bytes; a BOM stays a character, as in push() after the first chunk. */
const utf8 = new TextDecoder('utf-8', { ignoreBOM: true });

export function createRecordingReader(opts: RecordingReaderOptions = {}): RecordingReader {
  const profile = opts.profile;
  const fastEnabled = opts.fastScan !== false;
  const metadata: Record<string, string> = {};
  let pending = '';
  let started = false;
  let ended = false;
  let line = 0; // lines consumed so far (1-based number of the last one)
  let headerLine: number | null = null;
  let lastContentLine = 0;

  let plan: ColumnPlan | null = null;
  let delimiter = '';
  let decimalComma = false;
  let time: Growable<Float64Array> | null = null;
  let lines: Growable<Uint32Array> | null = null;
  let impact: Growable<Uint8Array> | null = null;
  let channels: Growable<Float64Array>[] = [];
  let prevTime = -Infinity;

  const startData = (p: ColumnPlan) => {
    plan = p;
    // at most one data row per line still to come (the header line, if any, is `line`)
    const bound = opts.lines === undefined && opts.bytes !== undefined && opts.bytes > 0;
    const rows =
      opts.lines !== undefined && opts.lines > line
        ? opts.lines - (headerLine === line ? line : line - 1)
        : bound
          ? Math.floor(opts.bytes! / (2 * (p.fieldCount ?? p.minFields))) + 1
          : undefined;
    const given = rows !== undefined ? opts.arrays : undefined;
    time = new Growable(Float64Array, rows, given?.('time', rows!) as Float64Array | undefined, bound);
    lines = new Growable(Uint32Array, rows, given?.('lines', rows!) as Uint32Array | undefined, bound);
    impact = p.impact >= 0 ? new Growable(Uint8Array, rows, given?.('impact', rows!) as Uint8Array | undefined, bound) : null;
    channels = p.sensors.map((_, c) => new Growable(Float64Array, rows, given?.({ sensor: c }, rows!) as Float64Array | undefined, bound));
    if (rows !== undefined) {
      direct = {
        row: 0,
        limit: rows,
        time: time.current,
        lines: lines.current,
        impact: impact ? impact.current : null,
        channels: channels.map((g) => g.current),
      };
    }
  };

  /**
   * Rows written by the fast scanners (takeCells) straight into the arrays sized from the `lines` or `bytes` hint
   * (no call per value: a double handed to a method is boxed, and 16 of them per line kept the young generation
   * busy). Every other way of adding a row first hands the count back to the Growables (endDirect) and then pushes
   * as usual.
   */
  let direct: {
    row: number;
    limit: number;
    time: Float64Array;
    lines: Uint32Array;
    impact: Uint8Array | null;
    channels: Float64Array[];
  } | null = null;
  const endDirect = () => {
    if (!direct) return;
    const rows = direct.row;
    direct = null;
    time!.grow(rows);
    lines!.grow(rows);
    impact?.grow(rows);
    for (const c of channels) c.grow(rows);
  };

  const setDelimiter = (firstLine: string) => {
    delimiter = profile?.delimiter ?? detectDelimiter(firstLine);
    decimalComma = delimiter === ';';
    // the hot path needs a one-character delimiter that cannot be part of a number
    fastCode = delimiter.length === 1 ? delimiter.charCodeAt(0) : -1;
    fast = fastEnabled && fastCode >= 0 && !/[0-9.+\-]/.test(delimiter) && !(decimalComma && fastCode === 44);
  };

  // papaparse's tokeniser, the Parser that Papa.parse wraps, called directly with the same settings. Measured on a
  // 38 MB file, tokenising alone: through Papa.parse most row arrays lived long enough to be copied into the old
  // generation (~250 MB promoted, ~0.3 s of minor GC); through the Parser they die young (~40 MB, ~15 ms).
  // Papa.parse also strips a leading U+FEFF from its input; that changes nothing here because every cell is
  // trimmed (trim removes U+FEFF) before it is read, and push() strips the file's own BOM.
  const tokenise = (text: string): string[][] =>
    new Papa.Parser({ delimiter, newline: '\n', fastMode: true }).parse(text, 0, false).data as string[][];

  /** Lines before the data: metadata, blank lines, then the header row (or, for a headerless profile, data). */
  const preambleLine = (text: string): boolean => {
    line++;
    checkLine(text, line);
    const trimmed = text.trim();
    if (trimmed === '') return false;
    lastContentLine = line;
    if (trimmed.startsWith('#')) {
      const entry = metadataEntry(trimmed);
      if (entry) metadata[entry[0]] = checkedMetadataValue(entry[0], entry[1], line);
      return false;
    }
    setDelimiter(text);
    if (!profile) {
      headerLine = line;
      startData(planFromHeader(stripCr(tokenise(text)[0]), line));
      return false;
    }
    if (profile.header) {
      headerLine = line;
      startData(planFromProfile(profile, stripCr(tokenise(text)[0]), line));
      return false;
    }
    startData(planFromProfile(profile, null, null));
    line--; // the caller hands this line to the data path
    return true;
  };

  const dataRow = (fields: string[], p: ColumnPlan) => {
    endDirect();
    line++;
    const count = fields.length;
    stripCr(fields);
    const first = fields[0];
    if (count === 1 && first.trim() === '') return;
    lastContentLine = line;
    // only a cell that may start with whitespace needs the trim before the '#' test
    const c0 = first.charCodeAt(0);
    if (c0 === 35 || ((c0 <= 32 || c0 >= 0xa0) && first.trim().startsWith('#'))) {
      throw new SignalInputError('misplaced-metadata', 'a "#" metadata line must come before the header and data', {
        line,
        column: 1,
      });
    }
    if (p.fieldCount === null) p.fieldCount = count;
    if (count !== p.fieldCount || count < p.minFields) {
      const want = Math.max(p.fieldCount, p.minFields);
      throw new SignalInputError('field-count', `expected ${want} fields, found ${count}`, {
        line,
        column: Math.min(count, want) + 1,
      });
    }
    const t = cellNumber(fields[p.time], decimalComma);
    if (t === null) throw nonNumeric(fields[p.time], line, p.time);
    if (t !== t) throw new SignalInputError('missing-time', 'the time cell is empty', { line, column: p.time + 1 });
    const ts = t * p.timeScale;
    if (!(ts > prevTime)) {
      throw new SignalInputError('time-not-increasing', `time ${clip(fields[p.time])} is not after the previous row's`, {
        line,
        column: p.time + 1,
      });
    }
    prevTime = ts;
    const sensors = p.sensors;
    for (let c = 0; c < sensors.length; c++) {
      const v = cellNumber(fields[sensors[c]], decimalComma);
      if (v === null) throw nonNumeric(fields[sensors[c]], line, sensors[c]);
      if (v < -MAX_NEGATIVE_READING) throw negativeReading(fields[sensors[c]], line, sensors[c]);
      channels[c].push(v);
    }
    if (impact) {
      const v = cellNumber(fields[p.impact], decimalComma);
      if (v === null || (v !== 0 && v !== 1 && v === v)) {
        throw new SignalInputError('bad-impact', `impact must be 0, 1 or empty, got ${quote(fields[p.impact])}`, {
          line,
          column: p.impact + 1,
        });
      }
      impact.push(v === 1 ? 1 : 0);
    }
    time!.push(ts);
    lines!.push(line);
  };

  /** One block of whole lines (the text between two newlines counts as one line, even when empty). */
  const block = (text: string) => {
    let rest = text;
    while (!plan) {
      const nl = rest.indexOf('\n');
      const head = nl < 0 ? rest : rest.slice(0, nl);
      if (preambleLine(head)) break;
      if (nl < 0) return;
      rest = rest.slice(nl + 1);
    }
    dataText(rest);
  };

  /**
   * The hot path for the common line: every cell a plain decimal (sign, at most 15 digits, one point; the cells
   * plainDecimal in cells.ts reads), as many cells as the header, time increasing, readings in range, impact 0/1.
   * Such a line is read straight from the text's character codes, with the same arithmetic as plainDecimal (so the
   * same doubles, bit for bit) and no cell strings. Any other line (empty, '#', spaces, an exponent, a missing
   * value, a wrong count, anything an error message would quote) goes through papaparse and dataRow unchanged, so
   * its result or its error is exactly what it was. Checked against the papaparse path on every fixture and on
   * generated damage (tests/signal/read-fast-scan.test.ts).
   */
  let fast = false;
  let fastCode = 0; // the delimiter's character code
  let cells = new Float64Array(0);
  const scanPiece = (text: string, p: ColumnPlan) => {
    let from = 0;
    const n = text.length;
    for (;;) {
      let nl = text.indexOf('\n', from);
      if (nl < 0) nl = n;
      if (!fastLine(text, from, nl, p)) {
        // papaparse splits a piece at every '\n'; one line of it alone gives the same row
        const one = text.slice(from, nl);
        if (one === '') line++;
        else {
          const rows = tokenise(one);
          for (let r = 0; r < rows.length; r++) dataRow(rows[r], p);
        }
      }
      if (nl >= n) return;
      from = nl + 1;
    }
  };

  /**
   * The checks and effects of a line the fast scanners (fastLine, fastLineBytes) read into cells[0..k): the same as
   * dataRow's for that line. The row goes straight into the arrays sized from a hint while they have room (see
   * `direct`), else to the Growables. False leaves the line to the slow path, with nothing changed.
   */
  const takeCells = (p: ColumnPlan, k: number): boolean => {
    if (k !== p.fieldCount) return false;
    const ts = cells[p.time] * p.timeScale;
    if (!(ts > prevTime)) return false;
    const sensors = p.sensors;
    for (let c = 0; c < sensors.length; c++) if (cells[sensors[c]] < -MAX_NEGATIVE_READING) return false;
    if (impact) {
      const v = cells[p.impact];
      if (v !== 0 && v !== 1) return false;
    }
    line++;
    lastContentLine = line;
    prevTime = ts;
    const d = direct;
    if (d !== null && d.row < d.limit) {
      const r = d.row++;
      const out = d.channels;
      for (let c = 0; c < sensors.length; c++) out[c][r] = cells[sensors[c]];
      if (d.impact) d.impact[r] = cells[p.impact] === 1 ? 1 : 0;
      d.time[r] = ts;
      d.lines[r] = line;
      return true;
    }
    endDirect();
    for (let c = 0; c < sensors.length; c++) channels[c].push(cells[sensors[c]]);
    if (impact) impact.push(cells[p.impact] === 1 ? 1 : 0);
    time!.push(ts);
    lines!.push(line);
    return true;
  };

  /** Reads one line [from, end) when it is a common one (see scanPiece); false leaves it to the papaparse path. */
  const fastLine = (text: string, from: number, end: number, p: ColumnPlan): boolean => {
    const want = p.fieldCount;
    if (want === null || want < p.minFields) return false;
    if (end > from && text.charCodeAt(end - 1) === 13) end--; // CRLF: stripCr's job
    if (end <= from) return false;
    if (cells.length !== want) cells = new Float64Array(want);
    let k = 0;
    let i = from;
    const comma = decimalComma;
    for (;;) {
      // one cell: exactly plainDecimal's grammar and arithmetic
      if (k === want) return false; // more cells than the header
      let c = text.charCodeAt(i);
      const neg = c === 45;
      if (neg || c === 43) i++;
      let m = 0;
      let digits = 0;
      let point = -1;
      let isComma = false;
      for (; i < end; i++) {
        c = text.charCodeAt(i);
        const d = c - 48;
        if (d >= 0 && d <= 9) {
          m = m * 10 + d;
          digits++;
        } else if (c === fastCode) break;
        else if (point < 0 && (c === 46 || (c === 44 && comma))) {
          point = digits;
          isComma = c === 44;
        } else return false;
      }
      if (digits === 0 || digits > 15) return false;
      if (isComma && (point === 0 || point === digits)) return false;
      const v = point < 0 ? m : m / POW10[digits - point];
      cells[k++] = neg ? -v : v;
      if (i >= end) break;
      i++; // past the delimiter
      if (i >= end) return false; // an empty last cell
    }
    return takeCells(p, k);
  };

  /**
   * fastLine over UTF-8 bytes [from, end) of one line: the same grammar, arithmetic, checks and effects (a line it
   * reads is all ASCII, where a byte is the character). False leaves the line to the text path.
   */
  const fastLineBytes = (bytes: Uint8Array, from: number, end: number, p: ColumnPlan): boolean => {
    const want = p.fieldCount;
    if (want === null || want < p.minFields) return false;
    if (end > from && bytes[end - 1] === 13) end--;
    if (end <= from) return false;
    if (cells.length !== want) cells = new Float64Array(want);
    let k = 0;
    let i = from;
    const comma = decimalComma;
    const delim = fastCode;
    for (;;) {
      if (k === want) return false;
      let c = bytes[i];
      const neg = c === 45;
      if (neg || c === 43) i++;
      let m = 0;
      let digits = 0;
      let point = -1;
      let isComma = false;
      for (; i < end; i++) {
        c = bytes[i];
        const d = c - 48;
        if (d >= 0 && d <= 9) {
          m = m * 10 + d;
          digits++;
        } else if (c === delim) break;
        else if (point < 0 && (c === 46 || (c === 44 && comma))) {
          point = digits;
          isComma = c === 44;
        } else return false;
      }
      if (digits === 0 || digits > 15) return false;
      if (isComma && (point === 0 || point === digits)) return false;
      const v = point < 0 ? m : m / POW10[digits - point];
      cells[k++] = neg ? -v : v;
      if (i >= end) break;
      i++;
      if (i >= end) return false;
    }
    return takeCells(p, k);
  };

  /**
   * Whole lines of bytes: [from, to) where bytes[to] is the newline that ends the last of them. Line by line as
   * block() takes them: the preamble as text, then each data line from the bytes when fastLineBytes reads it, else
   * as text through dataText (which sees one line, as scanPiece hands on one line). Without the fast scanner
   * (a delimiter it cannot use) the data lines go to block() as one text.
   */
  const byteLines = (bytes: Uint8Array, from: number, to: number) => {
    let s = from;
    while (s <= to && !plan) {
      const e = bytes.indexOf(10, s);
      block(utf8.decode(bytes.subarray(s, e)));
      s = e + 1;
    }
    if (s > to) return;
    const p = plan as unknown as ColumnPlan;
    if (!fast) {
      block(utf8.decode(bytes.subarray(s, to)));
      return;
    }
    while (s <= to) {
      const e = bytes.indexOf(10, s);
      if (e - s > MAX_LINE_CHARS || !fastLineBytes(bytes, s, e, p)) dataText(utf8.decode(bytes.subarray(s, e)));
      s = e + 1;
    }
  };

  /** Whole data lines, tokenised a piece of about PIECE characters at a time (see PIECE). */
  const dataText = (text: string) => {
    const p = plan as ColumnPlan;
    let from = 0;
    for (;;) {
      const to = text.length - from > PIECE ? text.indexOf('\n', from + PIECE) : -1;
      const piece = to < 0 ? (from === 0 ? text : text.slice(from)) : text.slice(from, to);
      if (piece === '') line++; // the empty line after a final newline; papaparse returns no row for ''
      else {
        if (piece.length > MAX_LINE_CHARS) checkLines(piece, line);
        if (fast) scanPiece(piece, p);
        else {
          const rows = tokenise(piece);
          for (let r = 0; r < rows.length; r++) dataRow(rows[r], p);
        }
      }
      if (to < 0) return;
      from = to + 1;
    }
  };

  const push = (chunk: string) => {
    if (ended) throw new RangeError('push() after end()');
    if (!started && chunk.length > 0) {
      started = true;
      if (chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1);
    }
    const nl = chunk.lastIndexOf('\n');
    if (nl < 0) {
      pending += chunk;
      if (pending.length > MAX_LINE_CHARS) checkLine(pending, line + 1);
      return;
    }
    if (pending.length + chunk.indexOf('\n') > MAX_LINE_CHARS) checkLine(pending + chunk.slice(0, chunk.indexOf('\n')), line + 1);
    // The carried-over partial line ends at the chunk's first newline; the lines after it are handed on as a
    // slice of the chunk, so the chunk's text is never copied.
    const first = chunk.indexOf('\n');
    block(pending + chunk.slice(0, first));
    if (first < nl) block(chunk.slice(first + 1, nl));
    pending = chunk.slice(nl + 1);
  };

  const pushBytes = (input: Uint8Array) => {
    if (ended) throw new RangeError('push() after end()');
    // a plain Uint8Array view: a subclass's own indexOf (Node's Buffer) is slower per call and allocates
    const chunk = Object.getPrototypeOf(input) === Uint8Array.prototype ? input : new Uint8Array(input.buffer, input.byteOffset, input.byteLength);
    let from = 0;
    if (!started && chunk.length > 0) {
      started = true;
      if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) from = 3; // the BOM, as push() drops U+FEFF
    }
    const nl = chunk.lastIndexOf(10);
    if (nl < from) {
      push(utf8.decode(chunk.subarray(from)));
      return;
    }
    const first = chunk.indexOf(10, from);
    if (pending !== '') {
      // the carried-over partial line ends at the first newline: push() joins and checks it
      push(utf8.decode(chunk.subarray(from, first + 1)));
      from = first + 1;
    }
    if (from <= nl) byteLines(chunk, from, nl);
    pending = utf8.decode(chunk.subarray(nl + 1));
  };

  return {
    push,
    pushBytes,
    end(): RawRecording {
      if (ended) throw new RangeError('end() called twice');
      ended = true;
      endDirect();
      if (pending !== '') {
        checkLine(pending, line + 1);
        block(pending);
      }
      pending = '';
      if (lastContentLine === 0) throw new SignalInputError('empty-file', 'the file is empty', { line: 1, column: 1 });
      if (!plan) {
        throw new SignalInputError('missing-header', 'no header row (time_s, L1, ...) and no data after the metadata', {
          line: line + 1,
          column: 1,
        });
      }
      const n = time!.length;
      if (n < MIN_SAMPLES) {
        throw new SignalInputError('too-few-samples', `${n} data rows; at least ${MIN_SAMPLES} are needed`, {
          line: lastContentLine,
          column: 1,
        });
      }
      const p = plan as ColumnPlan;
      // The profile describes the file, so its units win; then the metadata; newtons when neither says.
      const units: Units = profile?.units ?? (metadata.units as Units | undefined) ?? 'N';
      return {
        metadata,
        sensorIds: p.sensorIds.slice(),
        sensorColumns: p.sensors.map((i) => i + 1),
        headerLine,
        units,
        time: time!.take(),
        channels: channels.map((c) => c.take()),
        impact: impact ? impact.take() : null,
        lines: lines!.take(),
      };
    },
  };
}

/**
 * One line's own checks, before it is tokenised: a carriage return inside it means the file ends its lines in CR
 * only (old Mac style), which would otherwise read as one endless line; then the length limit.
 */
function checkLine(text: string, lineNo: number): void {
  const cr = text.indexOf('\r');
  if (cr >= 0 && cr < text.length - 1) {
    throw new SignalInputError('cr-line-ends', 'lines end in a carriage return (CR) only; save the file with LF or CRLF line ends', {
      line: lineNo,
      column: cr + 1,
    });
  }
  if (text.length > MAX_LINE_CHARS) {
    throw new SignalInputError('line-too-long', `the line is longer than ${MAX_LINE_CHARS} characters (a missing line break?)`, {
      line: lineNo,
      column: MAX_LINE_CHARS + 1,
    });
  }
}

/** checkLine for every line of a block of whole lines, the first of which is line `lineBefore` + 1. */
function checkLines(text: string, lineBefore: number): void {
  let from = 0;
  let n = lineBefore;
  for (;;) {
    const nl = text.indexOf('\n', from);
    const end = nl < 0 ? text.length : nl;
    n++;
    if (end - from > MAX_LINE_CHARS) checkLine(text.slice(from, end), n);
    if (nl < 0) return;
    from = nl + 1;
  }
}

function negativeReading(cell: string, line: number, index: number): SignalInputError {
  return new SignalInputError(
    'negative-reading',
    `${quote(cell)} is below -${MAX_NEGATIVE_READING}: a sensor reads force or pressure, which cannot be clearly negative (wrong sign or column?)`,
    { line, column: index + 1 },
  );
}

function stripCr(fields: string[]): string[] {
  const last = fields.length - 1;
  if (last >= 0 && fields[last].charCodeAt(fields[last].length - 1) === 13) fields[last] = fields[last].slice(0, -1);
  return fields;
}

function nonNumeric(cell: string, line: number, index: number): SignalInputError {
  return new SignalInputError('non-numeric', `${quote(cell)} is not a number`, { line, column: index + 1 });
}
