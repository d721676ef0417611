// The remembered session-token decode (lib/auth/token-memo.ts) against next-auth's own encode and decode: the memo
// may only save work, never accept a token that next-auth's decode would refuse or give a different payload.
import { encode, decode } from 'next-auth/jwt';
import { describe, expect, it } from 'vitest';
import { CLOCK_TOLERANCE_S, DecodedTokenMemo, decodeSessionToken, isExpired } from '@/lib/auth/token-memo';

const SECRET = 'token-memo-test-secret-'.repeat(3);
const claims = { uid: 7, sv: 2, role: 'coach' as const, academyId: 1, name: 'Mara Quill', email: 'mara@fernhollow.test' };

describe('decodeSessionToken', () => {
  it('gives what next-auth decode gives, and the second time from memory', async () => {
    const token = await encode({ token: claims, secret: SECRET, maxAge: 600 });
    const memo = new DecodedTokenMemo(10);
    const first = await decodeSessionToken(token, SECRET, Date.now() / 1000, memo);
    expect(first).toEqual(await decode({ token, secret: SECRET }));
    expect(memo.count).toBe(1);
    const second = await decodeSessionToken(token, SECRET, Date.now() / 1000, memo);
    expect(second).toBe(first); // the same object: no decode ran
  });

  it('refuses a tampered token, another secret and garbage, and remembers none of them', async () => {
    const token = await encode({ token: claims, secret: SECRET, maxAge: 600 });
    const memo = new DecodedTokenMemo(10);
    const flipped = token.slice(0, -3) + (token.at(-3) === 'A' ? 'B' : 'A') + token.slice(-2);
    expect(await decodeSessionToken(flipped, SECRET, Date.now() / 1000, memo)).toBeNull();
    expect(await decodeSessionToken(token, 'another-secret-'.repeat(4), Date.now() / 1000, memo)).toBeNull();
    expect(await decodeSessionToken('not.a.token', SECRET, Date.now() / 1000, memo)).toBeNull();
    expect(memo.count).toBe(0);
  });

  it('a remembered token is not accepted under another secret', async () => {
    const token = await encode({ token: claims, secret: SECRET, maxAge: 600 });
    const memo = new DecodedTokenMemo(10);
    await decodeSessionToken(token, SECRET, Date.now() / 1000, memo);
    expect(await decodeSessionToken(token, 'another-secret-'.repeat(4), Date.now() / 1000, memo)).toBeNull();
  });

  it('a remembered token expires when next-auth decode would refuse it', async () => {
    const token = await encode({ token: claims, secret: SECRET, maxAge: 600 });
    const memo = new DecodedTokenMemo(10);
    const payload = (await decodeSessionToken(token, SECRET, Date.now() / 1000, memo))!;
    const exp = payload.exp as number;
    // jose's jwtDecrypt (what next-auth decode runs, clockTolerance 15 s) refuses once exp <= now - tolerance
    expect(memo.get(token, SECRET, exp + CLOCK_TOLERANCE_S - 1)).toBe(payload);
    expect(memo.get(token, SECRET, exp + CLOCK_TOLERANCE_S)).toBeNull(); // (a decode at that time refuses it too)
    expect(memo.count).toBe(0); // and it is forgotten
  });

  it('agrees with next-auth decode on an expired token it never saw', async () => {
    const token = await encode({ token: claims, secret: SECRET, maxAge: -60 });
    await expect(decode({ token, secret: SECRET })).rejects.toThrow();
    expect(await decodeSessionToken(token, SECRET, Date.now() / 1000, new DecodedTokenMemo(10))).toBeNull();
    expect(isExpired({ ...claims, exp: 100 }, 100 + CLOCK_TOLERANCE_S)).toBe(true);
    expect(isExpired({ ...claims, exp: 100 }, 100 + CLOCK_TOLERANCE_S - 0.001)).toBe(false);
  });

  it('holds at most its size, dropping the least recently used', async () => {
    const memo = new DecodedTokenMemo(2);
    const now = Date.now() / 1000;
    const [a, b, c] = await Promise.all([1, 2, 3].map((uid) => encode({ token: { ...claims, uid }, secret: SECRET, maxAge: 600 })));
    await decodeSessionToken(a, SECRET, now, memo);
    await decodeSessionToken(b, SECRET, now, memo);
    memo.get(a, SECRET, now); // a is now the most recently used
    await decodeSessionToken(c, SECRET, now, memo);
    expect(memo.count).toBe(2);
    expect(memo.get(a, SECRET, now)?.uid).toBe(1);
    expect(memo.get(b, SECRET, now)).toBeNull();
    expect(memo.get(c, SECRET, now)?.uid).toBe(3);
  });
});
