import { describe, expect, it } from 'vitest';
import { safeCallbackPath } from '@/lib/auth/callback-url';

// The destination after sign-in must stay on this site. Each refused value is one a browser resolves to another
// host (WHATWG URL standard: "\" counts as "/" in special schemes, tab and newline are removed before parsing).
describe('safeCallbackPath', () => {
  it.each([
    ['/%5Cevil.example/x'],
    ['/\\evil.example/x'],
    ['/\\/evil.example/x'],
    ['/\t/evil.example/x'],
    ['/%09/evil.example/x'],
    ['//evil.example/x'],
    ['/\n/evil.example'],
    ['https://evil.example/x'],
    ['javascript:alert(1)'],
    ['evil.example'],
    [' //evil.example'],
    [''],
  ])('refuses %j', (value) => {
    const out = safeCallbackPath(value);
    expect(new URL(out, 'http://127.0.0.1:3000').origin).toBe('http://127.0.0.1:3000');
    // still encoded (%5C, %09), the text is only a path segment on this site
    if (!/%5C|%09/i.test(value)) expect(out).toBe('/');
  });

  it.each([
    ['/roster', '/roster'],
    ['/athletes/3?tab=swings#top', '/athletes/3?tab=swings#top'],
    ['/swings/12', '/swings/12'],
  ])('keeps the same-site path %j', (value, expected) => {
    expect(safeCallbackPath(value)).toBe(expected);
  });

  it('takes the first of repeated parameters and falls back to / for none', () => {
    expect(safeCallbackPath(['/roster', '//evil.example'])).toBe('/roster');
    expect(safeCallbackPath(undefined)).toBe('/');
  });
});
