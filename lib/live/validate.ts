// Checks one chunk of a live stream with the recording reader itself (the same rules as an upload) and gives the
// place of a problem counted from the start of the stream: the reader sees the stream's preamble and then this
// chunk, so its line numbers are shifted by the lines of the chunks before.
import { createRecordingReader } from '@/lib/signal/read';
import { SignalInputError } from '@/lib/signal/errors';
import { detectDelimiter, metadataEntry } from '@/lib/signal/read/cells';
import { BadInputAtError } from '@/lib/http';

export interface CheckedChunk {
  /** the stream's metadata lines and header row (chunk 0 only) */
  preamble: string | null;
  preambleLines: number;
  /** the data rows, each ending with a line break */
  body: string;
  lineCount: number;
  firstS: number | null;
  lastS: number | null;
}

function linesOf(text: string): string[] {
  const lines = text.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  return lines;
}

function timeOf(line: string, delimiter: string): number {
  const cell = line.split(delimiter)[0].trim();
  return Number(delimiter === ';' ? cell.replace(',', '.') : cell);
}

function rethrow(error: unknown, lineShift: number): never {
  if (error instanceof SignalInputError) {
    const line = error.line === null ? null : error.line + lineShift;
    const at = line !== null ? `line ${line}${error.column !== null ? `, column ${error.column}` : ''}: ` : '';
    const reason = error.message.replace(/^line \d+(, column \d+)?: /, '');
    throw new BadInputAtError(`${at}${reason}`, line, error.column);
  }
  throw error;
}

/**
 * chunk 0: `text` starts with the metadata lines and the header row. Later chunks: `preamble` is the stream's and
 * `linesBefore` the number of stream lines before this chunk (preamble included); `prevLastS` the time of the
 * previous chunk's last row when it is stored.
 */
export function checkChunk(
  text: string,
  stream: { first: true } | { first: false; preamble: string; preambleLines: number; linesBefore: number; prevLastS: number | null },
): CheckedChunk {
  const normal = text.startsWith('\uFEFF') ? text.slice(1) : text;
  const withBreak = normal.endsWith('\n') ? normal : `${normal}\n`;
  const reader = createRecordingReader();
  let preamble: string | null = null;
  let preambleLines: number;
  let body: string;
  if (stream.first) {
    const lines = linesOf(withBreak);
    let h = 0;
    while (h < lines.length && (lines[h].trim() === '' || lines[h].startsWith('#'))) h++;
    if (h >= lines.length) throw new BadInputAtError(`line ${lines.length + 1}, column 1: chunk 0 must hold the metadata lines and the header row`, lines.length + 1, 1);
    preamble = lines.slice(0, h + 1).join('\n') + '\n';
    preambleLines = h + 1;
    body = lines.slice(h + 1).map((l) => `${l}\n`).join('');
    try {
      reader.push(withBreak);
    } catch (error) {
      rethrow(error, 0);
    }
  } else {
    preambleLines = stream.preambleLines;
    body = withBreak;
    try {
      reader.push(stream.preamble);
      reader.push(body);
    } catch (error) {
      rethrow(error, stream.linesBefore - stream.preambleLines);
    }
  }
  const header = (preamble ?? (stream.first ? '' : stream.preamble)).trimEnd().split('\n').pop() ?? '';
  const delimiter = detectDelimiter(header);
  const rows = linesOf(body);
  const dataRows = rows.filter((l) => l.trim() !== '');
  const firstS = dataRows.length ? timeOf(dataRows[0], delimiter) : null;
  const lastS = dataRows.length ? timeOf(dataRows[dataRows.length - 1], delimiter) : null;
  if (!stream.first && stream.prevLastS !== null && firstS !== null && !(firstS > stream.prevLastS)) {
    const line = stream.linesBefore + 1 + rows.findIndex((l) => l.trim() !== '');
    throw new BadInputAtError(`line ${line}, column 1: time ${firstS} is not after the previous chunk's last time ${stream.prevLastS}`, line, 1);
  }
  return { preamble, preambleLines, body, lineCount: rows.length, firstS, lastS };
}

/** The `# key: value` lines of a preamble (keys lower-cased, as the reader keeps them). */
export function metadataOf(preamble: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const line of preamble.split('\n')) {
    const e = line.startsWith('#') ? metadataEntry(line.replace(/\r$/, '')) : null;
    if (e) out[e[0]] = e[1];
  }
  return out;
}
