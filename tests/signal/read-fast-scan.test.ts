import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createRecordingReader } from '@/lib/signal/read/reader';
import { SignalInputError } from '@/lib/signal/errors';
import { parseProfile } from '@/lib/signal';
import type { ImportProfile, RawRecording } from '@/lib/signal/types';
import { generateSession } from '@/lib/signal/synthetic';
import { BASE } from './helpers';

// The reader's hot path (a number scanner over the text for the common line) against the papaparse path it
// replaces on that line (fastScan: false sends every line through papaparse, as before). The outside reference is
// papaparse 5.7.1's own tokeniser plus Number(); the result must be the same bit for bit (typed arrays compared as
// bytes, so -0 and NaN count) or the same error, message, line and column.

type Outcome = { raw: RawRecording } | { error: { code: string; message: string; line: number | null; column: number | null } };

function read(text: string, fastScan: boolean, opts: { profile?: ImportProfile; piece?: number } = {}): Outcome {
  try {
    const reader = createRecordingReader({ profile: opts.profile, fastScan });
    const piece = opts.piece ?? text.length;
    for (let at = 0; at < text.length; at += piece) reader.push(text.slice(at, at + piece));
    return { raw: reader.end() };
  } catch (e) {
    if (!(e instanceof SignalInputError)) throw e;
    return { error: { code: e.code, message: e.message, line: e.line, column: e.column } };
  }
}

const bytes = (a: ArrayBufferView | null) => (a ? Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('hex') : null);
function comparable(o: Outcome) {
  if ('error' in o) return o;
  const r = o.raw;
  return { ...r, time: bytes(r.time), lines: bytes(r.lines), impact: bytes(r.impact), channels: r.channels.map(bytes) };
}

function same(text: string, opts: { profile?: ImportProfile; piece?: number } = {}) {
  const slow = read(text, false, opts);
  const fast = read(text, true, opts);
  expect(comparable(fast)).toEqual(comparable(slow));
  return slow;
}

const gaitProfile = parseProfile(JSON.parse(readFileSync('tests/fixtures/profiles/gaitpdb.json', 'utf8')));

describe('the reader’s number scanner gives what papaparse + Number() gave', () => {
  // PhysioNet gaitpdb open walking recordings (tests/fixtures/gaitpdb/README.md): tab-delimited, read via a profile
  it.each(['GaCo01_01.txt', 'GaPt03_01.txt', 'JuCo01_01.txt'])('open data %s: identical arrays', (name) => {
    const text = readFileSync(`tests/fixtures/gaitpdb/${name}`, 'utf8');
    const out = same(text, { profile: gaitProfile });
    expect('raw' in out && out.raw.time.length).toBeGreaterThan(1000);
    same(text, { profile: gaitProfile, piece: 4099 }); // lines cut across pushes
  });

  it('generated sessions: comma, CRLF, an impact column, kPa, 200 Hz; pushed whole and in odd pieces', () => {
    const golf = generateSession({ ...BASE, seed: 21, swings: 2, withMarker: true }).csv();
    same(golf);
    same(golf, { piece: 777 });
    same(golf.replace(/\n/g, '\r\n'), { piece: 1000 });
    same(generateSession({ ...BASE, seed: 22, swings: 1, units: 'kPa', sampleRateHz: 200, sensorsPerFoot: 16 }).csv());
  });

  it('a semicolon file with decimal commas', () => {
    const golf = generateSession({ ...BASE, seed: 23, swings: 1 }).csv();
    const lines = golf.split('\n').map((l) => (l.startsWith('#') ? l : l.replace(/,/g, ';').replace(/(\d)\.(\d)/g, '$1,$2')));
    const out = same(lines.join('\n'));
    expect('raw' in out).toBe(true);
  });

  // Each damage goes into one data line; the scanner must leave that line to papaparse, which reads or refuses it
  // exactly as before (same values, or the same message, line and column).
  const damages: [string, (cells: string[]) => string[] | string][] = [
    ['spaces around a cell', (c) => [c[0], ` ${c[1]} `, ...c.slice(2)]],
    ['an exponent', (c) => [c[0], '1.5e2', ...c.slice(2)]],
    ['a leading plus and a bare point', (c) => [c[0], '+12.', '.5', ...c.slice(3)]],
    ['an empty sensor cell (a missing sample)', (c) => [c[0], '', ...c.slice(2)]],
    ['an empty last cell', (c) => [...c.slice(0, -1), '']],
    ['16 significant digits', (c) => [c[0], '1234567890.123456', ...c.slice(2)]],
    ['negative zero', (c) => [c[0], '-0', '-0.0', ...c.slice(3)]],
    ['a clearly negative reading', (c) => [c[0], '-10.5', ...c.slice(2)]],
    ['a slightly negative reading', (c) => [c[0], '-9.99', ...c.slice(2)]],
    ['text', (c) => [c[0], 'abc', ...c.slice(2)]],
    ['two points', (c) => [c[0], '1.2.3', ...c.slice(2)]],
    ['a field too many', (c) => [...c, '1']],
    ['a field too few', (c) => c.slice(0, -1)],
    ['a misplaced # line', () => '# late: metadata'],
    ['a blank line', () => ''],
    ['a line of spaces', () => '   '],
    ['a lone CR', () => '\r'],
    ['time going back', (c) => ['0.001', ...c.slice(1)]],
    ['time repeated', () => 'REPEAT'],
    ['an empty time cell', (c) => ['', ...c.slice(1)]],
    ['impact 2', (c) => [...c.slice(0, -1), '2']],
    ['a non-ASCII digit', (c) => [c[0], '١٢', ...c.slice(2)]],
    ['a quoted cell', (c) => [c[0], '"12.5"', ...c.slice(2)]],
  ];

  it.each(damages)('%s: the same values or the same error', (_name, damage) => {
    const golf = generateSession({ ...BASE, seed: 24, swings: 1, withMarker: true }).csv();
    const lines = golf.split('\n');
    const first = lines.findIndex((l) => /^\d/.test(l));
    for (const at of [first + 1, first + 50, lines.length - 3]) {
      const copy = lines.slice();
      const d = damage(copy[at].split(','));
      copy[at] = d === 'REPEAT' ? copy[at - 1] : Array.isArray(d) ? d.join(',') : d;
      const text = copy.join('\n');
      same(text);
      same(text, { piece: 513 });
    }
  });
});
