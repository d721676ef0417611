import { describe, expect, it } from 'vitest';
import { SignalInputError } from '@/lib/signal/errors';
import {
  createRecordingReader,
  MIN_SAMPLES,
  parseLayout,
  parseProfile,
  parseRecording,
} from '@/lib/signal/read';
import { cellNumber } from '@/lib/signal/read/cells';
import type { ImportProfile, RawRecording } from '@/lib/signal/types';

// Invented recording in format 1 (spec section 1): 12 rows at 100 Hz, 2 sensors per foot.
const rows = (n: number, d = ',', start = 0) =>
  Array.from({ length: n }, (_, i) => [((start + i) / 100).toFixed(2), 10 + i, 20, 30 + i, 40].join(d));
const header = 'time_s,L1,L2,R1,R2';
const meta = ['# format: stanceline-insole/1', '# sample_rate_hz: 100', '# units: N', '# handedness: right', '# Athlete: Student A'];
const file = [...meta, header, ...rows(12)].join('\n') + '\n';

function errorOf(fn: () => unknown): SignalInputError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(SignalInputError);
    return e as SignalInputError;
  }
  throw new Error('expected a SignalInputError');
}

const expectErr = (text: string, code: string, line: number | null, column: number | null, profile?: ImportProfile) => {
  const e = errorOf(() => parseRecording(text, { profile }));
  expect({ code: e.code, line: e.line, column: e.column }).toEqual({ code, line, column });
  return e;
};

describe('parseRecording: format 1', () => {
  it('reads metadata, sensors, time and line numbers', () => {
    const r = parseRecording(file);
    // spec section 1: metadata keys lower-cased, free keys kept
    expect(r.metadata).toEqual({ format: 'stanceline-insole/1', sample_rate_hz: '100', units: 'N', handedness: 'right', athlete: 'Student A' });
    expect(r.sensorIds).toEqual(['L1', 'L2', 'R1', 'R2']);
    expect(r.sensorColumns).toEqual([2, 3, 4, 5]);
    expect(r.headerLine).toBe(6);
    expect(r.units).toBe('N');
    expect(Array.from(r.time)).toEqual(Array.from({ length: 12 }, (_, i) => Number((i / 100).toFixed(2))));
    expect(r.channels[0][3]).toBe(13);
    expect(r.channels[2][11]).toBe(41);
    expect(r.lines[0]).toBe(7);
    expect(r.lines[11]).toBe(18);
    expect(r.impact).toBeNull();
  });

  it('tolerates a BOM and CRLF line endings', () => {
    const r = parseRecording('\uFEFF' + file.replace(/\n/g, '\r\n'));
    expect(r).toEqual(parseRecording(file));
  });

  it('detects tab and semicolon delimiters (semicolon files may use decimal commas)', () => {
    const tab = [header.replace(/,/g, '\t'), ...rows(12, '\t')].join('\n');
    expect(parseRecording(tab).channels).toEqual(parseRecording([header, ...rows(12)].join('\n')).channels);
    const semi = [header.replace(/,/g, ';'), ...rows(12, ';').map((r) => r.replace(/\./g, ','))].join('\n');
    const r = parseRecording(semi);
    expect(r.time[5]).toBeCloseTo(0.05, 12);
    expect(r.channels[1][0]).toBe(20);
  });

  it('reads an empty cell as missing (NaN) and the impact column as 0/1', () => {
    const lines = ['time_s,L1,R1,impact', ...Array.from({ length: 12 }, (_, i) => `${i / 100},${i === 4 ? '' : 5},6,${i === 7 ? 1 : 0}`)];
    const r = parseRecording(lines.join('\n'));
    expect(Number.isNaN(r.channels[0][4])).toBe(true);
    expect(r.channels[0][5]).toBe(5);
    expect(Array.from(r.impact!).indexOf(1)).toBe(7);
    expect(r.impact!.reduce((a, b) => a + b, 0)).toBe(1);
  });

  it('keeps kPa units from the metadata', () => {
    expect(parseRecording(file.replace('# units: N', '# units: kPa')).units).toBe('kPa');
  });

  it('skips blank lines but keeps counting them', () => {
    const r = parseRecording([header, '', ...rows(6), '', '', ...rows(6, ',', 6), ''].join('\n'));
    expect(r.time.length).toBe(12);
    expect(r.lines[5]).toBe(8); // header 1, blank 2, rows 3-8, blanks 9-10
    expect(r.lines[6]).toBe(11);
  });

  it('streams in tiny chunks to the same result as one string', () => {
    const text = '\uFEFF' + file.replace(/\n/g, '\r\n');
    const whole = parseRecording(text);
    for (const size of [1, 2, 3, 7, 64]) {
      const reader = createRecordingReader();
      for (let i = 0; i < text.length; i += size) reader.push(text.slice(i, i + size));
      expect(reader.end()).toEqual(whole);
    }
  });

  it('streams a headerless profile file in chunks with the right line numbers', () => {
    const profile = parseProfile({ header: false, time: { column: 1, unit: 's' }, units: 'N', sensors: { L1: 2, R1: 4 } });
    const text = ['# notes: x', ...rows(20)].join('\n');
    const whole = parseRecording(text, { profile });
    const reader = createRecordingReader({ profile });
    for (let i = 0; i < text.length; i += 5) reader.push(text.slice(i, i + 5));
    const streamed: RawRecording = reader.end();
    expect(streamed).toEqual(whole);
    expect(streamed.lines[0]).toBe(2);
    expect(streamed.channels[1][19]).toBe(49);
  });
});

describe('parseRecording: import profiles (spec section 3)', () => {
  it('reads header names and a time column in ms', () => {
    const profile = parseProfile({
      delimiter: ';',
      header: true,
      time: { column: 'Zeit ms', unit: 'ms' },
      units: 'kPa',
      sensors: { R1: 'right heel', L1: 'left heel' },
      impact: 'hit',
    });
    const text = ['Zeit ms;left heel;ignored;right heel;hit', ...Array.from({ length: 12 }, (_, i) => `${i * 10};${i};x;${2 * i};${i === 3 ? 1 : 0}`)].join('\n');
    const r = parseRecording(text, { profile });
    expect(r.sensorIds).toEqual(['L1', 'R1']);
    expect(r.units).toBe('kPa');
    expect(r.time[3]).toBeCloseTo(0.03, 12);
    expect(r.channels[1][5]).toBe(10);
    expect(r.impact![3]).toBe(1);
  });

  it('reads 1-based column indexes without a header', () => {
    const profile = parseProfile({ delimiter: '\t', header: false, time: { column: 3, unit: 's' }, units: 'N', sensors: { L1: 1 } });
    const r = parseRecording(Array.from({ length: 10 }, (_, i) => `${i}\tjunk\t${i / 10}`).join('\r\n'), { profile });
    expect(r.time[9]).toBeCloseTo(0.9, 12);
    expect(r.channels[0][9]).toBe(9);
  });

  it('names a header name the profile asks for but the file lacks', () => {
    const profile = parseProfile({ header: true, time: { column: 't', unit: 's' }, units: 'N', sensors: { L1: 'a' } });
    expectErr('t,b\n0,1\n', 'missing-column', 1, null, profile);
  });
});

describe('parseRecording errors carry line and column', () => {
  it('empty file', () => {
    expectErr('', 'empty-file', 1, 1);
    expectErr('\n\r\n  \n', 'empty-file', 1, 1);
  });
  it('missing header', () => {
    expectErr(['# units: N', ...rows(12)].join('\n'), 'missing-header', 2, 1);
    expectErr('# units: N\n', 'missing-header', 2, 1);
  });
  it('unknown sensor column', () => {
    const e = expectErr(['time_s,L1,X2,R1', ...rows(12)].join('\n'), 'unknown-column', 1, 3);
    expect(e.message).toContain('X2');
    expectErr('time_s,L1,L1\n', 'duplicate-column', 1, 3);
    expectErr('time_s,impact\n', 'no-sensors', 1, 1);
  });
  it('non-numeric cell', () => {
    const lines = [header, ...rows(12)];
    lines[5] = '0.04,10,abc,30,40';
    const e = expectErr(lines.join('\n'), 'non-numeric', 6, 3);
    expect(e.message).toBe('line 6, column 3: "abc" is not a number');
    lines[5] = '0.04,1.0.0,2,3,4';
    expectErr(lines.join('\n'), 'non-numeric', 6, 2);
    lines[5] = '0.04,"1",2,3,4';
    expectErr(lines.join('\n'), 'non-numeric', 6, 2);
  });
  it('time not strictly increasing, or missing', () => {
    const lines = [...meta, header, ...rows(12)];
    lines[10] = lines[9];
    expectErr(lines.join('\n'), 'time-not-increasing', 11, 1);
    lines[10] = ',1,2,3,4';
    expectErr(lines.join('\n'), 'missing-time', 11, 1);
  });
  it('wrong number of fields', () => {
    const lines = [header, ...rows(12)];
    lines[3] = '0.02,1,2,3';
    expectErr(lines.join('\n'), 'field-count', 4, 5);
    lines[3] = '0.02,1,2,3,4,5';
    expectErr(lines.join('\n'), 'field-count', 4, 6);
  });
  it('too few samples', () => {
    // MIN_SAMPLES = 10: the default zero-lag filter pads 9 samples at each end and needs 10
    expect(MIN_SAMPLES).toBe(10);
    expectErr([header, ...rows(9)].join('\n'), 'too-few-samples', 10, 1);
    expect(parseRecording([header, ...rows(10)].join('\n')).time.length).toBe(10);
  });
  it('bad metadata values', () => {
    expectErr(file.replace('# units: N', '# units: psi'), 'bad-metadata', 3, 1);
    expectErr(file.replace('# handedness: right', '# handedness: ambi'), 'bad-metadata', 4, 1);
    expectErr(file.replace('# sample_rate_hz: 100', '# sample_rate_hz: -5'), 'bad-metadata', 2, 1);
    expectErr(file.replace('stanceline-insole/1', 'other/2'), 'bad-metadata', 1, 1);
    expectErr([header, ...rows(5), '# late: 1', ...rows(7, ',', 5)].join('\n'), 'misplaced-metadata', 7, 1);
  });
  it('bad impact value', () => {
    const text = ['time_s,L1,impact', ...Array.from({ length: 12 }, (_, i) => `${i},1,${i === 2 ? 2 : 0}`)].join('\n');
    expectErr(text, 'bad-impact', 4, 3);
  });
});

describe('parseLayout / parseProfile', () => {
  const layout = {
    id: 'pair-2',
    name: 'two',
    foot_length_mm: 260,
    sensors: [
      { id: 'L1', foot: 'left', x_mm: -18, y_mm: 30, area_mm2: 700 },
      { id: 'R1', foot: 'right', x_mm: -18, y_mm: 30, area_mm2: 700, region: 'heel' },
    ],
  };
  it('accepts the spec example shape', () => {
    expect(parseLayout(layout).sensors[1].region).toBe('heel');
  });
  it('names the JSON path of a problem', () => {
    const bad = structuredClone(layout);
    (bad.sensors[1] as { area_mm2: unknown }).area_mm2 = -1;
    const e = errorOf(() => parseLayout(bad));
    expect(e.code).toBe('bad-layout');
    expect(e.message).toContain('sensors.1.area_mm2');
    const wrongFoot = structuredClone(layout);
    wrongFoot.sensors[0].foot = 'right';
    expect(errorOf(() => parseLayout(wrongFoot)).message).toContain('sensors.0.foot');
    expect(errorOf(() => parseLayout(null)).code).toBe('bad-layout');
  });
  it('rejects profiles with names but no header, or unknown units', () => {
    const p = { header: false, time: { column: 't', unit: 's' }, units: 'N', sensors: { L1: 2 } };
    expect(errorOf(() => parseProfile(p)).message).toContain('time.column');
    expect(errorOf(() => parseProfile({ ...p, time: { column: 1, unit: 'min' } })).message).toContain('time.unit');
    expect(errorOf(() => parseProfile({ ...p, time: { column: 1, unit: 's' }, sensors: { L1: 1 } })).message).toContain('already used');
  });
});

describe('cellNumber: the fast path agrees with the strict rules', () => {
  it('reads plain decimals exactly as Number() does, bit for bit', () => {
    // reference: ECMA-262 StringToNumber (Number(string)), the conversion the strict path uses
    const cells = ['0', '7', '64.31', '-0.25', '+12.5', '.5', '5.', '-0', '-0.000', '0.1', '0.3', '1.005', '123456789012345',
      '12345678901234.5', '0.000000000000001', '999999999999999', '1234567890123456', '00000000000000000001', '1e5', '2.5E-3', ' 41.1 ', '\t3'];
    for (const c of cells) expect(Object.is(cellNumber(c, false), Number(c)), c).toBe(true);
    // many random decimals of 1-17 digits with the point anywhere (invented inputs; Number() is the reference)
    let seed = 7;
    const next = () => (seed = (seed * 48271) % 2147483647);
    for (let k = 0; k < 20000; k++) {
      const digits = String(next()) + String(next());
      const d = digits.slice(0, 1 + (next() % 17));
      const at = next() % (d.length + 1);
      const cell = (next() % 2 ? '-' : '') + d.slice(0, at) + '.' + d.slice(at);
      expect(Object.is(cellNumber(cell, false), Number(cell)), cell).toBe(true);
    }
  });
  it('keeps rejecting what format 1 does not accept', () => {
    for (const c of ['0x1A', 'Infinity', '-Infinity', 'NaN', '1e400', '.', '-', '+', '1.2.3', '1,5', '1 5', '"1"', '1_000', '١']) {
      expect(cellNumber(c, false), c).toBeNull();
    }
    expect(Number.isNaN(cellNumber('', false))).toBe(true);
    expect(Number.isNaN(cellNumber('  ', false))).toBe(true);
  });
  it('reads a decimal comma only in semicolon files, and only with digits on both sides', () => {
    expect(cellNumber('41,10', true)).toBe(41.1);
    expect(cellNumber('-0,5', true)).toBe(-0.5);
    expect(cellNumber(' 2,5 ', true)).toBe(2.5);
    for (const c of ['1,', ',5', '1,2,3', '1,2.3', '1,5e3']) expect(cellNumber(c, true), c).toBeNull();
    expect(cellNumber('1,5', false)).toBeNull();
  });
});

describe('parseRecording: long files (the tokeniser works through pieces of the text)', () => {
  // Invented file of 6000 rows (~150 kB, many tokeniser pieces), with a blank line every 997 rows and CRLF endings.
  const n = 6000;
  const body: string[] = [];
  const expectedLines: number[] = [];
  for (let i = 0; i < n; i++) {
    if (i > 0 && i % 997 === 0) body.push('');
    body.push([((i + 1) / 100).toFixed(2), (i % 50) + 0.25, 20, 30 + (i % 7), 40].join(','));
    expectedLines.push(body.length + 1); // the header is line 1
  }
  const text = [header, ...body].join('\r\n') + '\r\n';

  it('keeps every row, value and line number', () => {
    const r = parseRecording(text);
    expect(r.time.length).toBe(n);
    expect(Array.from(r.lines)).toEqual(expectedLines);
    expect(r.channels[0][4321]).toBe((4321 % 50) + 0.25);
    expect(r.time[n - 1]).toBe(Number((n / 100).toFixed(2)));
    // right-sized arrays: the buffers hold exactly the samples, nothing more
    expect(r.time.buffer.byteLength).toBe(n * 8);
    expect(r.lines.buffer.byteLength).toBe(n * 4);
  });

  it('gives the same result for any chunking, including chunks that split lines and CRLF pairs', () => {
    const whole = parseRecording(text);
    for (const size of [1, 4093, 16_384, 16_385, 65_536, 100_000]) {
      const reader = createRecordingReader();
      for (let i = 0; i < text.length; i += size) reader.push(text.slice(i, i + size));
      expect(reader.end(), `chunk size ${size}`).toEqual(whole);
    }
  });

  it('points at the right line and column deep into the file', () => {
    const lines = text.split('\r\n');
    const at = 5123; // 0-based index in `lines`, so file line 5124
    lines[at] = lines[at].replace(/,20,/, ',2O,');
    const e = expectErr(lines.join('\r\n'), 'non-numeric', at + 1, 3);
    expect(e.message).toBe(`line ${at + 1}, column 3: "2O" is not a number`);
    const reader = createRecordingReader();
    const broken = lines.join('\n');
    for (let i = 0; i < broken.length; i += 777) {
      try {
        reader.push(broken.slice(i, i + 777));
      } catch (err) {
        expect((err as SignalInputError).line).toBe(at + 1);
        return;
      }
    }
    throw new Error('expected the streamed read to fail');
  });
});

describe('hardening: huge cells and lines, CR-only files, implausible values (issue 11)', () => {
  // File: 5 metadata lines (1-5), header (6), data rows from line 7.
  const withRow = (k: number, row: string) => {
    const lines = [...meta, header, ...rows(12)];
    lines[6 + k] = row;
    return lines.join('\n') + '\n';
  };

  it('a 50,000-character cell: the message quotes at most 80 characters and keeps line and column', () => {
    const big = 'x'.repeat(50_000);
    const e = expectErr(withRow(3, `0.03,${big},20,33,40`), 'non-numeric', 10, 2);
    expect(e.message.length).toBeLessThan(200);
    expect(e.message).toMatch(/^line 10, column 2: "x{80}…" \(50000 characters\) is not a number$/);
    // a 100,000-character cell makes its line longer than the line limit: refused by line number, just as short
    const e2 = expectErr(withRow(3, `0.03,${'x'.repeat(100_000)},20,33,40`), 'line-too-long', 10, 65_537);
    expect(e2.message.length).toBeLessThan(200);
  });

  it('a line over 64 KiB is refused with its number, in one piece or pushed in chunks', () => {
    const long = `0.03,${'1'.repeat(70_000)},20,33,40`;
    expectErr(withRow(3, long), 'line-too-long', 10, 65_537);
    // 30 MB without any newline, pushed in 1 MB chunks: refused as soon as the pending line passes the limit
    const reader = createRecordingReader();
    reader.push([...meta, header].join('\n') + '\n');
    const chunk = '1,'.repeat(512 * 1024);
    const e = errorOf(() => {
      for (let i = 0; i < 30; i++) reader.push(chunk);
    });
    expect({ code: e.code, line: e.line }).toEqual({ code: 'line-too-long', line: 7 });
  });

  it('a file with CR-only line ends says so, with line 1 and the column of the first CR (was "no header row")', () => {
    const crOnly = [...meta, header, ...rows(12)].join('\r') + '\r';
    const e = expectErr(crOnly, 'cr-line-ends', 1, meta[0].length + 1);
    expect(e.message).toMatch(/carriage return \(CR\) only/);
    // CRLF stays fine
    expect(parseRecording([...meta, header, ...rows(12)].join('\r\n') + '\r\n').time.length).toBe(12);
  });

  it('a clearly negative force (-500 N) is refused with line and column; small offsets below zero are kept', () => {
    const e = expectErr(withRow(2, '0.02,10,-500,32,40'), 'negative-reading', 9, 3);
    expect(e.message).toMatch(/"-500" is below -10/);
    expect(parseRecording(withRow(2, '0.02,10,-0.4,32,40')).channels[1][2]).toBe(-0.4);
  });

  it('sample_rate_hz 1e12 is refused on its metadata line', () => {
    const text = [meta[0], '# sample_rate_hz: 1e12', ...meta.slice(2), header, ...rows(12)].join('\n');
    const e = expectErr(text, 'bad-metadata', 2, 1);
    expect(e.message).toMatch(/at most 10000 Hz/);
    expect(parseRecording([meta[0], '# sample_rate_hz: 500', header, ...rows(12)].join('\n')).metadata.sample_rate_hz).toBe('500');
  });
});
