import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseProfile } from '@/lib/signal';
import { SignalInputError } from '@/lib/signal/errors';
import { createRecordingReader, type RecordingReaderOptions } from '@/lib/signal/read/reader';
import { generateSession } from '@/lib/signal/synthetic';
import type { ImportProfile, RawRecording } from '@/lib/signal/types';
import { BASE } from './helpers';

// The reader's byte input (pushBytes, the analyze command's path) against its text input: the bytes decoded by
// Node's own UTF-8 decoder (Buffer#toString, the outside reference) and pushed as text must give the same arrays bit
// for bit (compared as bytes, so -0 and NaN count), or the same error, message, line and column. The `lines` hint
// and caller-given arrays change no result either.

type Outcome = { raw: RawRecording } | { error: { code: string; message: string; line: number | null; column: number | null } };

function run(feed: (r: ReturnType<typeof createRecordingReader>) => void, opts: RecordingReaderOptions = {}): Outcome {
  try {
    const reader = createRecordingReader(opts);
    feed(reader);
    return { raw: reader.end() };
  } catch (e) {
    if (!(e instanceof SignalInputError)) throw e;
    return { error: { code: e.code, message: e.message, line: e.line, column: e.column } };
  }
}

const hex = (a: ArrayBufferView | null) => (a ? Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('hex') : null);
function comparable(o: Outcome) {
  if ('error' in o) return o;
  const r = o.raw;
  return { ...r, time: hex(r.time), lines: hex(r.lines), impact: hex(r.impact), channels: r.channels.map(hex) };
}

/** Lines of a buffer as the analyze command counts them: newlines, plus one when the last byte is not one. */
const lineCount = (b: Buffer) => b.toString('latin1').split('\n').length - (b[b.length - 1] === 10 ? 1 : 0);

function same(bytes: Buffer, opts: { profile?: ImportProfile; piece?: number } = {}) {
  const text = run((r) => r.push(bytes.toString('utf8')), { profile: opts.profile });
  const whole = run((r) => r.pushBytes(bytes), { profile: opts.profile });
  expect(comparable(whole)).toEqual(comparable(text));
  const hinted = run((r) => r.pushBytes(bytes), { profile: opts.profile, lines: lineCount(bytes) });
  expect(comparable(hinted)).toEqual(comparable(text));
  if (opts.piece) {
    // pieces that end just after a newline, as scripts/analyze-read.ts hands them on
    const pieces = run((r) => {
      let at = 0;
      while (at < bytes.length) {
        const nl = bytes.indexOf(10, Math.min(bytes.length - 1, at + opts.piece!));
        const end = nl < 0 ? bytes.length : nl + 1;
        r.pushBytes(bytes.subarray(at, end));
        at = end;
      }
    }, { profile: opts.profile, lines: lineCount(bytes) });
    expect(comparable(pieces)).toEqual(comparable(text));
  }
  return text;
}

const gaitProfile = parseProfile(JSON.parse(readFileSync('tests/fixtures/profiles/gaitpdb.json', 'utf8')));

describe('pushBytes reads what push reads from the decoded text', () => {
  // PhysioNet gaitpdb open walking recordings (tests/fixtures/gaitpdb/README.md): tab-delimited, read via a profile
  it.each(['GaCo01_01.txt', 'GaPt03_01.txt', 'JuCo01_01.txt'])('open data %s', (name) => {
    const out = same(readFileSync(`tests/fixtures/gaitpdb/${name}`), { profile: gaitProfile, piece: 4099 });
    expect('raw' in out && out.raw.time.length).toBeGreaterThan(1000);
  });

  it('generated sessions: an impact column, CRLF, a BOM, kPa at 200 Hz, no final newline, a semicolon file', () => {
    const golf = generateSession({ ...BASE, seed: 21, swings: 2, withMarker: true }).csv();
    expect('raw' in same(Buffer.from(golf), { piece: 777 })).toBe(true);
    same(Buffer.from(golf.replace(/\n/g, '\r\n')), { piece: 1000 });
    same(Buffer.from(`\ufeff${golf}`), { piece: 1000 });
    same(Buffer.from(golf.trimEnd()));
    same(Buffer.from(generateSession({ ...BASE, seed: 22, swings: 1, units: 'kPa', sampleRateHz: 200, sensorsPerFoot: 16 }).csv()));
    const semicolon = golf.split('\n').map((l) => (l.startsWith('#') ? l : l.replace(/,/g, ';').replace(/(\d)\.(\d)/g, '$1,$2')));
    same(Buffer.from(semicolon.join('\n')));
  });

  it('bytes that are not UTF-8, in a metadata value and in a cell: decoded as Node decodes them', () => {
    const golf = generateSession({ ...BASE, seed: 25, swings: 1 }).csv();
    const meta = Buffer.concat([Buffer.from('# notes: caf'), Buffer.from([0xe9, 0xff, 0xc3]), Buffer.from('\n'), Buffer.from(golf)]);
    const out = same(meta);
    expect('raw' in out && out.raw.metadata.notes).toBe('caf\ufffd\ufffd\ufffd');
    const lines = golf.split('\n');
    const first = lines.findIndex((l) => /^\d/.test(l));
    const cells = lines[first + 3].split(',');
    const bad = Buffer.concat([
      Buffer.from(`${lines.slice(0, first + 3).join('\n')}\n${cells[0]},`),
      Buffer.from([0xc3, 0x31]),
      Buffer.from(`,${cells.slice(2).join(',')}\n${lines.slice(first + 4).join('\n')}`),
    ]);
    expect('error' in same(bad)).toBe(true);
  });

  const damages: [string, (cells: string[]) => string[] | string][] = [
    ['spaces around a cell', (c) => [c[0], ` ${c[1]} `, ...c.slice(2)]],
    ['an exponent', (c) => [c[0], '1.5e2', ...c.slice(2)]],
    ['an empty sensor cell (a missing sample)', (c) => [c[0], '', ...c.slice(2)]],
    ['an empty last cell', (c) => [...c.slice(0, -1), '']],
    ['16 significant digits', (c) => [c[0], '1234567890.123456', ...c.slice(2)]],
    ['negative zero', (c) => [c[0], '-0', '-0.0', ...c.slice(3)]],
    ['a clearly negative reading', (c) => [c[0], '-10.5', ...c.slice(2)]],
    ['two points', (c) => [c[0], '1.2.3', ...c.slice(2)]],
    ['a field too many', (c) => [...c, '1']],
    ['a misplaced # line', () => '# late: metadata'],
    ['a blank line', () => ''],
    ['a lone CR', () => '\r'],
    ['a CR inside a line', (c) => [c[0], `${c[1]}\r`, ...c.slice(2)]],
    ['time repeated', () => 'REPEAT'],
    ['impact 2', (c) => [...c.slice(0, -1), '2']],
    ['a non-ASCII digit', (c) => [c[0], '١٢', ...c.slice(2)]],
  ];

  it.each(damages)('%s: the same values or the same error', (_name, damage) => {
    const golf = generateSession({ ...BASE, seed: 24, swings: 1, withMarker: true }).csv();
    const lines = golf.split('\n');
    const first = lines.findIndex((l) => /^\d/.test(l));
    for (const at of [first, first + 50, lines.length - 2]) {
      const copy = lines.slice();
      const d = damage(copy[at].split(','));
      copy[at] = d === 'REPEAT' ? copy[at - 1] : Array.isArray(d) ? d.join(',') : d;
      same(Buffer.from(copy.join('\n')), { piece: 513 });
    }
  });

  it('a wrong lines hint and arrays given by the caller change nothing', () => {
    const bytes = Buffer.from(generateSession({ ...BASE, seed: 26, swings: 1, withMarker: true }).csv());
    const reference = comparable(run((r) => r.pushBytes(bytes)));
    for (const lines of [1, 10, lineCount(bytes) - 3, lineCount(bytes) + 7, 10 * lineCount(bytes)]) {
      expect(comparable(run((r) => r.pushBytes(bytes), { lines }))).toEqual(reference);
    }
    // a size in bytes instead (an upper bound on the rows): the same values, and so for rows of empty cells, which
    // can be more than the bound (then the arrays grow as without a hint)
    for (const size of [bytes.length, 100, 1]) expect(comparable(run((r) => r.pushBytes(bytes), { bytes: size }))).toEqual(reference);
    const sparse = Buffer.from(`time_s,L1,R1\n${Array.from({ length: 200 }, (_, i) => `${i / 100},${i % 7 ? '' : i},${i}`).join('\n')}\n`);
    expect(comparable(run((r) => r.pushBytes(sparse), { bytes: sparse.length / 4 }))).toEqual(comparable(run((r) => r.push(sparse.toString()))));
    // caller's arrays of exactly the hinted size: the result is those very arrays
    const given: ArrayBufferView[] = [];
    const out = run((r) => r.pushBytes(bytes), {
      lines: lineCount(bytes),
      arrays: (column, rows) => {
        const a = column === 'lines' ? new Uint32Array(rows) : column === 'impact' ? new Uint8Array(rows) : new Float64Array(rows);
        given.push(a);
        return a;
      },
    });
    expect(comparable(out)).toEqual(reference);
    const raw = (out as { raw: RawRecording }).raw;
    expect(given).toContain(raw.time);
    expect(given).toContain(raw.channels[3]);
    expect(given).toContain(raw.lines);
  });
});
