import { describe, expect, it } from 'vitest';
import { parseRange } from '@/lib/videos/stream';

// Byte ranges against RFC 9110 §14.1.2's own examples (a representation of 10000 bytes) and §14.4 (an unsatisfiable
// range answers 416 with "bytes */size"; a Range the server does not support may be ignored: 200 with everything).
describe('parseRange (RFC 9110 §14.1.2 examples, length 10000)', () => {
  it('the first 500 bytes: bytes=0-499', () => expect(parseRange('bytes=0-499', 10000)).toEqual({ start: 0, end: 499 }));
  it('the second 500 bytes: bytes=500-999', () => expect(parseRange('bytes=500-999', 10000)).toEqual({ start: 500, end: 999 }));
  it('the final 500 bytes: bytes=-500', () => expect(parseRange('bytes=-500', 10000)).toEqual({ start: 9500, end: 9999 }));
  it('the final 500 bytes: bytes=9500-', () => expect(parseRange('bytes=9500-', 10000)).toEqual({ start: 9500, end: 9999 }));
  it('a last position beyond the end is the end (§14.1.2)', () => expect(parseRange('bytes=9000-20000', 10000)).toEqual({ start: 9000, end: 9999 }));
  it('a first position at or past the end is unsatisfiable (§14.1.1)', () => expect(parseRange('bytes=10000-', 10000)).toBe('unsatisfiable'));
  it('several ranges or another unit: ignored (whole file)', () => {
    expect(parseRange('bytes=0-1,5-6', 10000)).toBeNull();
    expect(parseRange('items=0-1', 10000)).toBeNull();
    expect(parseRange(null, 10000)).toBeNull();
  });
});
