import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';

// Pages: no session -> redirect to /sign-in (proxy.ts); a role without access -> redirect to its own home (/);
// an athlete outside the viewer's scope -> 404. Statuses are real HTTP statuses because the checks run in layouts
// outside any loading.tsx boundary.
type Actor = 'none' | 'admin' | 'coach' | 'coach2' | 'student' | 'researcher';
type Expect = number | `-> ${string}`;

const pages: { path: string; expected: Record<Actor, Expect> }[] = [
  { path: '/', expected: { none: '-> /sign-in', admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { path: '/roster', expected: { none: '-> /sign-in?callbackUrl=%2Froster', admin: '-> /', coach: 200, coach2: 200, student: '-> /', researcher: '-> /' } },
  { path: '/athletes/new', expected: { none: '-> /sign-in?callbackUrl=%2Fathletes%2Fnew', admin: '-> /', coach: 200, coach2: 200, student: '-> /', researcher: '-> /' } },
  { path: '/athletes/1', expected: { none: '-> /sign-in?callbackUrl=%2Fathletes%2F1', admin: '-> /', coach: 200, coach2: 404, student: 200, researcher: '-> /' } },
  { path: '/athletes/1/edit', expected: { none: '-> /sign-in?callbackUrl=%2Fathletes%2F1%2Fedit', admin: '-> /', coach: 200, coach2: 404, student: '-> /', researcher: '-> /' } },
  { path: '/athletes/5', expected: { none: '-> /sign-in?callbackUrl=%2Fathletes%2F5', admin: '-> /', coach: 404, coach2: 200, student: 404, researcher: '-> /' } },
  { path: '/users', expected: { none: '-> /sign-in?callbackUrl=%2Fusers', admin: 200, coach: '-> /', coach2: '-> /', student: '-> /', researcher: '-> /' } },
  { path: '/sign-in', expected: { none: 200, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { path: '/invitations', expected: { none: '-> /sign-in?callbackUrl=%2Finvitations', admin: 200, coach: 200, coach2: 200, student: '-> /', researcher: '-> /' } },
  // demo mode (npm test runs the SMTP fake)
  { path: '/outbox', expected: { none: '-> /sign-in?callbackUrl=%2Foutbox', admin: 200, coach: '-> /', coach2: '-> /', student: '-> /', researcher: '-> /' } },
  // reached from a mail before anyone can sign in: public
  { path: '/reset-password', expected: { none: 200, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { path: `/reset-password/${'A'.repeat(43)}`, expected: { none: 200, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
  { path: `/invite/${'A'.repeat(43)}`, expected: { none: 200, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200 } },
];

const sessions = new Map<Actor, HttpSession>();

beforeAll(async () => {
  const { E2E_BASE_URL } = e2eEnv();
  sessions.set('none', new HttpSession(E2E_BASE_URL));
  for (const actor of ['admin', 'coach', 'coach2', 'student', 'researcher'] as const) {
    sessions.set(actor, await signedIn(E2E_BASE_URL, DEMO[actor], DEMO_PASSWORD));
  }
});

describe('page access by role', () => {
  for (const page of pages) {
    for (const [actor, expected] of Object.entries(page.expected) as [Actor, Expect][]) {
      it(`${page.path} as ${actor} -> ${expected}`, async () => {
        const res = await sessions.get(actor)!.fetch(page.path);
        if (typeof expected === 'number') {
          expect(res.status).toBe(expected);
        } else {
          expect([307, 308]).toContain(res.status);
          expect(res.headers.get('location')).toBe(expected.slice(3));
        }
        await res.arrayBuffer();
      });
    }
  }

  it('pages carry the security headers', async () => {
    const res = await sessions.get('none')!.fetch('/sign-in');
    expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
    expect(res.headers.get('x-frame-options')).toBe('DENY');
    expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('permissions-policy')).toContain('camera=()');
    expect(res.headers.get('x-powered-by')).toBeNull();
  });

  it('the student home shows the health caution', async () => {
    const html = await (await sessions.get('student')!.fetch('/')).text();
    expect(html).toContain('Coaching information, not a medical assessment');
  });

  it('an under-18 athlete page shows the consent note (demo athlete 5, born 2010-06-04)', async () => {
    const html = await (await sessions.get('coach2')!.fetch('/athletes/5')).text();
    expect(html).toContain('consent of a parent or guardian');
  });

  it('the researcher page promises consented, de-identified data only', async () => {
    const html = await (await sessions.get('researcher')!.fetch('/')).text();
    expect(html).toContain('de-identified');
  });
});
