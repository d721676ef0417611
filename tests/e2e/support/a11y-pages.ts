import type { Page } from 'playwright-core';

// Every page of every role, and the states a user reaches on it by acting, that the accessibility test checks
// with axe-core (tests/e2e/accessibility.test.ts). THE ONE LIST: a change that adds a page under app/ adds its
// entry here; the test fails for any app/**/page.tsx route that no entry covers.

export type A11yRole = 'coach' | 'student' | 'admin' | 'researcher' | 'signed-out';

/** Ids the checks open, made by the test's setup (an uploaded invented lesson, a band, a drill assignment). */
export interface A11yFixture {
  athleteId: number;
  sessionId: number;
  swingIds: number[];
  bandId: number;
  /** a paid remote review of the lesson, requested by the demo student */
  reviewId: number;
}

export interface A11yCheck {
  /** unique; the test title and the screenshot name */
  name: string;
  /** the app route it covers, as the folders under app/ spell it without route groups: '/swings/[id]' */
  route: string;
  as: A11yRole;
  path: (f: A11yFixture) => string;
  /** waits until the page shows what it is for (beyond network idle) */
  ready?: (page: Page) => Promise<unknown>;
  /** the action that reaches the checked state, then waits for it */
  act?: (page: Page, f: A11yFixture) => Promise<unknown>;
}

const viewer = (page: Page) => page.locator('[data-testid="swing-workbench"] [data-swing-viewer]').waitFor({ timeout: 30_000 });
const openFirstTable = async (page: Page) => {
  const toggle = page.getByRole('button', { name: 'Show table' }).first();
  await toggle.click();
  await page.getByRole('button', { name: 'Hide table' }).first().waitFor();
};
const fieldError = (page: Page) => page.locator('[role="alert"]').first().waitFor();

export const A11Y_CHECKS: A11yCheck[] = [
  // signed out
  { name: 'sign-in', route: '/sign-in', as: 'signed-out', path: () => '/sign-in' },
  {
    name: 'sign-in, wrong password',
    route: '/sign-in',
    as: 'signed-out',
    path: () => '/sign-in',
    act: async (page) => {
      await page.getByLabel('Email').fill('nobody@stanceline.test');
      await page.getByLabel('Password').fill('not-the-password');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByTestId('sign-in-error').waitFor();
    },
  },

  // links from a mail, signed out (a token that matches nothing shows the page's "does not work" state; the forms
  // behind a real token are checked by tests/e2e/invitations.test.ts)
  { name: 'reset password request', route: '/reset-password', as: 'signed-out', path: () => '/reset-password' },
  {
    name: 'reset password request, form with errors',
    route: '/reset-password',
    as: 'signed-out',
    path: () => '/reset-password',
    act: async (page) => {
      await page.getByRole('button', { name: 'Send me a link' }).click();
      await fieldError(page);
    },
  },
  { name: 'reset password, unusable link', route: '/reset-password/[token]', as: 'signed-out', path: () => `/reset-password/${'A'.repeat(43)}` },
  { name: 'invitation, unusable link', route: '/invite/[token]', as: 'signed-out', path: () => `/invite/${'A'.repeat(43)}` },

  // coach
  { name: 'coach home', route: '/', as: 'coach', path: () => '/' },
  { name: 'coach invitations', route: '/invitations', as: 'coach', path: () => '/invitations' },
  {
    name: 'coach invitations, form with errors',
    route: '/invitations',
    as: 'coach',
    path: () => '/invitations',
    act: async (page) => {
      await page.getByRole('button', { name: 'Send invitation' }).click();
      await fieldError(page);
    },
  },
  {
    name: 'coach lesson summary, send to student open',
    route: '/sessions/[id]/summary',
    as: 'coach',
    path: (f) => `/sessions/${f.sessionId}/summary?swings=${f.swingIds[0]}`,
    act: async (page) => {
      await page.getByTestId('share-with-student').locator('summary').click();
      await page.getByLabel(/A note for/).waitFor();
    },
  },
  { name: 'coach roster', route: '/roster', as: 'coach', path: () => '/roster' },
  { name: 'coach add athlete', route: '/athletes/new', as: 'coach', path: () => '/athletes/new' },
  {
    name: 'coach add athlete, form with errors',
    route: '/athletes/new',
    as: 'coach',
    path: () => '/athletes/new',
    act: async (page) => {
      await page.getByTestId('athlete-form').locator('button[type="submit"]').click();
      await fieldError(page);
    },
  },
  { name: 'coach athlete', route: '/athletes/[id]', as: 'coach', path: (f) => `/athletes/${f.athleteId}` },
  { name: 'coach athlete edit', route: '/athletes/[id]/edit', as: 'coach', path: (f) => `/athletes/${f.athleteId}/edit` },
  { name: 'coach athlete compare', route: '/athletes/[id]/compare', as: 'coach', path: (f) => `/athletes/${f.athleteId}/compare` },
  { name: 'coach athlete progress', route: '/athletes/[id]/progress', as: 'coach', path: (f) => `/athletes/${f.athleteId}/progress` },
  {
    name: 'coach athlete shots and pressure',
    route: '/athletes/[id]/outcomes',
    as: 'coach',
    path: (f) => `/athletes/${f.athleteId}/outcomes`,
    ready: (page) => page.getByTestId('correlation-note').waitFor(),
  },
  { name: 'coach upload', route: '/upload', as: 'coach', path: () => '/upload' },
  {
    name: 'coach upload, a file chosen and an option refused on its field',
    route: '/upload',
    as: 'coach',
    path: () => '/upload',
    act: async (page) => {
      // nothing is sent: the form refuses the option first (tests/e2e/upload.test.ts checks the message)
      await page.getByTestId('file-input').setInputFiles({ name: 'a11y-choice.csv', mimeType: 'text/csv', buffer: Buffer.from('time_s,L1\n0,1\n') });
      await page.getByLabel('Filter cutoff (Hz)').fill('80');
      await page.getByRole('button', { name: 'Upload 1 file' }).click();
      await page.locator('[data-field-error="cutoffHz"]').waitFor();
    },
  },
  { name: 'coach targets', route: '/targets', as: 'coach', path: () => '/targets', ready: (page) => page.getByTestId('target-list').waitFor() },
  {
    name: 'coach targets, form with errors',
    route: '/targets',
    as: 'coach',
    path: () => '/targets',
    ready: (page) => page.getByTestId('target-list').waitFor(),
    act: async (page) => {
      await page.locator('[data-target]').first().getByRole('button', { name: 'Copy and edit' }).click();
      const form = page.getByTestId('target-form');
      await form.getByLabel('Check 1 tolerance').fill('0');
      await form.getByRole('button', { name: 'Save as my target' }).click();
      await form.getByRole('alert').first().waitFor();
    },
  },
  { name: 'coach bands', route: '/bands', as: 'coach', path: () => '/bands', ready: (page) => page.getByTestId('band-list').waitFor() },
  {
    name: 'coach bands, form with errors',
    route: '/bands',
    as: 'coach',
    path: () => '/bands',
    ready: (page) => page.getByTestId('band-list').waitFor(),
    act: async (page) => {
      await page.getByRole('button', { name: 'Build band' }).click();
      await fieldError(page);
    },
  },
  { name: 'coach drills', route: '/drills', as: 'coach', path: () => '/drills', ready: (page) => page.getByTestId('drill-library').waitFor() },
  {
    name: 'coach drills, form with errors',
    route: '/drills',
    as: 'coach',
    path: () => '/drills',
    ready: (page) => page.getByTestId('drill-library').waitFor(),
    act: async (page) => {
      await page.getByTestId('drill-form').getByRole('button', { name: 'Add drill' }).click();
      await page.getByTestId('drill-form').getByRole('alert').first().waitFor();
    },
  },
  // the session holds a processed recording and a failed one (with its error note)
  { name: 'coach session', route: '/sessions/[id]', as: 'coach', path: (f) => `/sessions/${f.sessionId}` },
  { name: 'coach lesson summary', route: '/sessions/[id]/summary', as: 'coach', path: (f) => `/sessions/${f.sessionId}/summary?swings=${f.swingIds.slice(0, 2).join(',')}` },
  { name: 'coach swing viewer', route: '/swings/[id]', as: 'coach', path: (f) => `/swings/${f.swingIds[3]}`, ready: viewer },
  {
    name: 'coach swing viewer, table open',
    route: '/swings/[id]',
    as: 'coach',
    path: (f) => `/swings/${f.swingIds[3]}`,
    ready: viewer,
    act: openFirstTable,
  },
  {
    name: 'coach swing viewer, second swing and band overlaid',
    route: '/swings/[id]',
    as: 'coach',
    path: (f) => `/swings/${f.swingIds[3]}`,
    ready: viewer,
    act: async (page, f) => {
      await page.getByTestId('overlay-picker').selectOption(String(f.swingIds[0]));
      await page.locator('[data-chart="swing-lead-share"] [data-line="overlay-lead-pct"]').waitFor();
      await page.getByLabel('Reference band').selectOption(String(f.bandId));
      await page.locator('[data-chart="swing-lead-share"] [data-layer="band"]').waitFor();
      await page.getByTestId('band-score').waitFor();
    },
  },
  {
    name: 'coach swing viewer, note form with errors',
    route: '/swings/[id]',
    as: 'coach',
    path: (f) => `/swings/${f.swingIds[3]}`,
    ready: viewer,
    act: async (page) => {
      await page.getByRole('button', { name: 'Add note' }).click();
      await page.getByTestId('annotation-error').or(page.getByTestId('annotation-form').getByRole('alert')).first().waitFor();
    },
  },
  { name: 'coach live lesson start', route: '/live', as: 'coach', path: () => '/live' },
  {
    // a new live session for the first student on the roster; the screen waits for the insoles
    name: 'coach live lesson screen',
    route: '/live/[id]',
    as: 'coach',
    path: () => '/live',
    act: async (page) => {
      await page.getByRole('button', { name: 'Start live lesson' }).click();
      await page.getByTestId('live-screen').waitFor({ timeout: 30_000 });
    },
  },
  { name: 'coach sign-out', route: '/sign-out', as: 'coach', path: () => '/sign-out' },
  { name: 'coach page not found', route: '(not found)', as: 'coach', path: () => '/no-such-page' },

  // student
  { name: 'student home', route: '/', as: 'student', path: () => '/' },
  { name: 'student drills', route: '/drills', as: 'student', path: () => '/drills' },
  { name: 'student targets', route: '/targets', as: 'student', path: () => '/targets' },
  { name: 'student athlete', route: '/athletes/[id]', as: 'student', path: (f) => `/athletes/${f.athleteId}` },
  { name: 'student compare', route: '/athletes/[id]/compare', as: 'student', path: (f) => `/athletes/${f.athleteId}/compare` },
  { name: 'student progress', route: '/athletes/[id]/progress', as: 'student', path: (f) => `/athletes/${f.athleteId}/progress` },
  { name: 'student shots and pressure', route: '/athletes/[id]/outcomes', as: 'student', path: (f) => `/athletes/${f.athleteId}/outcomes`, ready: (page) => page.getByTestId('correlation-note').waitFor() },
  { name: 'student session', route: '/sessions/[id]', as: 'student', path: (f) => `/sessions/${f.sessionId}` },
  { name: 'student lesson summary', route: '/sessions/[id]/summary', as: 'student', path: (f) => `/sessions/${f.sessionId}/summary?swings=${f.swingIds[0]}` },
  { name: 'student swing viewer', route: '/swings/[id]', as: 'student', path: (f) => `/swings/${f.swingIds[3]}`, ready: viewer },
  {
    name: 'student swing viewer, second swing overlaid',
    route: '/swings/[id]',
    as: 'student',
    path: (f) => `/swings/${f.swingIds[3]}`,
    ready: viewer,
    act: async (page, f) => {
      await page.getByTestId('overlay-picker').selectOption(String(f.swingIds[0]));
      await page.locator('[data-chart="swing-lead-share"] [data-line="overlay-lead-pct"]').waitFor();
    },
  },

  // admin
  { name: 'admin home', route: '/', as: 'admin', path: () => '/' },
  { name: 'admin accounts', route: '/users', as: 'admin', path: () => '/users' },
  {
    name: 'admin accounts, form with errors',
    route: '/users',
    as: 'admin',
    path: () => '/users',
    act: async (page) => {
      await page.locator('main form button[type="submit"]').first().click();
      await fieldError(page);
    },
  },

  { name: 'admin invitations', route: '/invitations', as: 'admin', path: () => '/invitations' },
  // paid remote reviews: the coach's offer and queue, the student's request page, the admin's revenue, one review
  { name: 'coach reviews queue', route: '/reviews', as: 'coach', path: () => '/reviews' },
  { name: 'coach review, deliver form', route: '/reviews/[id]', as: 'coach', path: (f) => `/reviews/${f.reviewId}`, ready: (page) => page.getByTestId('deliver-form').waitFor() },
  { name: 'student reviews', route: '/reviews', as: 'student', path: () => '/reviews' },
  { name: 'student review', route: '/reviews/[id]', as: 'student', path: (f) => `/reviews/${f.reviewId}?paid=1` },
  { name: 'admin reviews and revenue', route: '/reviews', as: 'admin', path: () => '/reviews', ready: (page) => page.getByTestId('revenue-table').waitFor() },
  {
    name: 'admin outbox, a message open',
    route: '/outbox',
    as: 'admin',
    path: () => '/outbox',
    act: async (page) => {
      const first = page.getByTestId('outbox').locator('summary').first();
      if ((await first.count()) > 0) await first.click();
    },
  },

  // researcher
  { name: 'researcher home', route: '/', as: 'researcher', path: () => '/', ready: (page) => page.getByTestId('cohort-count').filter({ hasText: /swing/ }).waitFor() },
  {
    name: 'researcher home, a narrow cohort and a new token',
    route: '/',
    as: 'researcher',
    path: () => '/',
    act: async (page) => {
      await page.getByLabel('Club group').selectOption('driver');
      await page.getByTestId('small-cohort-note').waitFor();
      await page.getByLabel('Token name').fill('a11y check');
      await page.getByRole('button', { name: 'Make a token' }).click();
      await page.getByTestId('new-token').waitFor();
    },
  },
];
