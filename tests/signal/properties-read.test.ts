// Property tests of the reader (fast-check): whatever the bytes, the only error is SignalInputError.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SignalInputError } from '@/lib/signal/errors';
import { createRecordingReader, parseProfile, parseRecording } from '@/lib/signal/read';
import type { ImportProfile } from '@/lib/signal/types';

// Invented valid file in format 1.
const valid = [
  '# format: stanceline-insole/1',
  '# sample_rate_hz: 100',
  '# units: N',
  '# handedness: right',
  'time_s,L1,L2,R1,R2,impact',
  ...Array.from({ length: 14 }, (_, i) => `${(i / 100).toFixed(2)},${10 + i},20.5,${30 - i},40,${i === 6 ? 1 : 0}`),
].join('\n');
const profile = parseProfile({ header: false, time: { column: 1, unit: 'ms' }, units: 'kPa', sensors: { L1: 2, R1: 3 } });

function onlyInputErrors(text: string, p?: ImportProfile): void {
  try {
    parseRecording(text, { profile: p });
  } catch (e) {
    if (!(e instanceof SignalInputError)) throw e;
    expect(e.message.length).toBeGreaterThan(0);
  }
}

const mutation = fc.record({
  at: fc.nat(),
  kind: fc.constantFrom('insert', 'delete', 'replace'),
  text: fc.string({ maxLength: 4, unit: fc.constantFrom(',', ';', '\t', '\n', '\r', '#', ':', '-', '.', 'e', '1', '', ' ', '"', 'x', '\uFEFF') }),
});
function mutate(text: string, ms: { at: number; kind: string; text: string }[]): string {
  let s = text;
  for (const m of ms) {
    const at = m.at % (s.length + 1);
    if (m.kind === 'insert') s = s.slice(0, at) + m.text + s.slice(at);
    else if (m.kind === 'delete') s = s.slice(0, at) + s.slice(at + 1 + (m.text.length % 3));
    else s = s.slice(0, at) + m.text + s.slice(at + m.text.length);
  }
  return s;
}

describe('properties of parseRecording', () => {
  it('throws nothing but SignalInputError for any string', () => {
    fc.assert(fc.property(fc.string({ maxLength: 300 }), (s) => onlyInputErrors(s)), { numRuns: 300 });
    fc.assert(fc.property(fc.string({ maxLength: 300, unit: 'binary' }), (s) => onlyInputErrors(s, profile)), { numRuns: 200 });
  });

  it('throws nothing but SignalInputError for any bytes decoded as UTF-8', () => {
    const decoder = new TextDecoder();
    fc.assert(fc.property(fc.uint8Array({ maxLength: 400 }), (b) => {
      onlyInputErrors(decoder.decode(b));
      onlyInputErrors(decoder.decode(b), profile);
    }), { numRuns: 300 });
  });

  it('throws nothing but SignalInputError for mutated valid files', () => {
    fc.assert(
      fc.property(fc.array(mutation, { minLength: 1, maxLength: 6 }), (ms) => {
        const text = mutate(valid, ms);
        onlyInputErrors(text);
        onlyInputErrors(text, profile);
      }),
      { numRuns: 500 },
    );
  });

  it('streaming in any chunking gives the same result (or the same error) as one string', () => {
    fc.assert(
      fc.property(fc.array(mutation, { maxLength: 2 }), fc.array(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 30 }), (ms, sizes) => {
        const text = mutate(valid, ms);
        const outcome = (run: () => unknown) => {
          try {
            return { ok: run() };
          } catch (e) {
            return { err: (e as Error).message };
          }
        };
        const whole = outcome(() => parseRecording(text));
        const streamed = outcome(() => {
          const reader = createRecordingReader();
          let i = 0;
          let k = 0;
          while (i < text.length) {
            const size = sizes[k++ % sizes.length];
            reader.push(text.slice(i, i + size));
            i += size;
          }
          return reader.end();
        });
        expect(streamed).toEqual(whole);
      }),
      { numRuns: 300 },
    );
  });
});
