import { beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { athleteListResponseSchema, athleteResponseSchema, sessionListResponseSchema } from '@/lib/contracts/athletes';
import { bandCreatedSchema, bandDetailSchema, bandsResponseSchema } from '@/lib/contracts/bands';
import { compareResponseSchema, progressResponseSchema } from '@/lib/contracts/compare';
import { assignmentResponseSchema, assignmentsResponseSchema, drillReportResponseSchema, drillResponseSchema, drillsResponseSchema } from '@/lib/contracts/drills';
import { errorResponseSchema } from '@/lib/contracts/errors';
import { importProfileCreatedSchema, importProfilesResponseSchema } from '@/lib/contracts/import-profiles';
import { meResponseSchema } from '@/lib/contracts/me';
import { recordingViewSchema, sessionRecordingsSchema } from '@/lib/contracts/recordings';
import { overlayOptionsResponseSchema, recordingOverviewResponseSchema, swingViewResponseSchema } from '@/lib/contracts/swings';
import { scoreResponseSchema, targetResponseSchema, targetsResponseSchema } from '@/lib/contracts/targets';
import { outcomeSessionsResponseSchema, rankingResponseSchema, sessionShotsSchema, shotProfilesResponseSchema } from '@/lib/contracts/shots';
import { userListResponseSchema } from '@/lib/contracts/users';
import { acceptInvitationResponseSchema, invitationListResponseSchema, invitationResponseSchema } from '@/lib/contracts/invitations';
import { mailPreferencesResponseSchema } from '@/lib/contracts/mail-preferences';
import { outboxResponseSchema } from '@/lib/contracts/outbox';
import { passwordResetAcceptedSchema } from '@/lib/contracts/password-reset';
import { reviewOfferResponseSchema, reviewOffersResponseSchema } from '@/lib/contracts/reviews';
import { shareBinnedResponseSchema, shareListResponseSchema, shareResponseSchema } from '@/lib/contracts/shares';
import { linkIn, mailsNow, waitForMail } from './support/mail';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { type HttpSession, signedIn } from './support/http-session';
import { sampleRecording, type Sample } from './support/recordings-http';

// Every answer of the API against its contract (lib/contracts/<resource>.ts), on the running app: the schema the
// client parses with must accept the answer AND name every field of it (zod drops unknown keys, so parsing and
// comparing with the raw JSON finds a field the contract does not declare). A drift between server and client
// (a renamed field, a null where the contract says number) fails here instead of as "unexpected shape" in a page.

const env = e2eEnv();
let coach: HttpSession;
let admin: HttpSession;
let student: HttpSession;
let sample: Sample;

beforeAll(async () => {
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  admin = await signedIn(env.E2E_BASE_URL, DEMO.admin, DEMO_PASSWORD);
  student = await signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD);
  sample = await sampleRecording(coach);
});

async function conforms(session: HttpSession, path: string, schema: z.ZodType, init: RequestInit = {}, status = 200): Promise<unknown> {
  const res = await session.json(path, init);
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  const parsed = schema.safeParse(res.body);
  expect(parsed.success, parsed.success ? '' : `${path}: ${parsed.error.message}`).toBe(true);
  // every field the server sent is declared by the contract (nothing stripped by the parse)
  expect(parsed.data).toEqual(res.body);
  return res.body;
}

const json = (method: string, body: unknown): RequestInit => ({ method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

describe('API answers match lib/contracts', () => {
  it('athletes and sessions', async () => {
    await conforms(coach, '/api/athletes', athleteListResponseSchema);
    await conforms(coach, '/api/athletes/1', athleteResponseSchema);
    await conforms(student, '/api/athletes/1/sessions', sessionListResponseSchema);
  });

  it('shots and pressure (tests/http/shots.test.ts checks the answers with shots in them)', async () => {
    await conforms(student, '/api/sessions/1/shots', sessionShotsSchema);
    await conforms(coach, '/api/shot-profiles', shotProfilesResponseSchema);
    await conforms(student, '/api/athletes/1/outcomes/ranking?outcome=carry', rankingResponseSchema);
    await conforms(coach, '/api/athletes/1/outcomes/sessions', outcomeSessionsResponseSchema);
  });

  it('the coach’s review offer: GET, DELETE (withdrawn), GET (still the coach’s), PUT (offered again)', async () => {
    const offer = { priceCents: 4500, currency: 'EUR', turnaroundDays: 3 };
    await conforms(coach, '/api/review-offer', reviewOfferResponseSchema, json('PUT', offer));
    await conforms(student, '/api/review-offer', reviewOffersResponseSchema);
    const withdrawn = (await conforms(coach, '/api/review-offer', reviewOfferResponseSchema, { method: 'DELETE' })) as { offer: { withdrawnAt: string | null } };
    expect(withdrawn.offer.withdrawnAt).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    const own = (await conforms(coach, '/api/review-offer', reviewOffersResponseSchema)) as { offers: { withdrawnAt: string | null }[] };
    expect(own.offers).toEqual([expect.objectContaining({ withdrawnAt: withdrawn.offer.withdrawnAt })]);
    const back = (await conforms(coach, '/api/review-offer', reviewOfferResponseSchema, json('PUT', offer))) as { offer: { withdrawnAt: string | null } };
    expect(back.offer.withdrawnAt).toBeNull();
  });

  it('users', async () => {
    await conforms(admin, '/api/users', userListResponseSchema);
  });

  it('me, for each role', async () => {
    const me = (await conforms(student, '/api/me', meResponseSchema)) as { athlete: unknown };
    expect(me.athlete).not.toBeNull();
    await conforms(coach, '/api/me', meResponseSchema);
    await conforms(admin, '/api/me', meResponseSchema);
  });

  it('import profiles', async () => {
    const profile = { header: true, time: { column: 't', unit: 's' }, units: 'N', sensors: { L1: 'left heel', R1: 'right heel' } };
    await conforms(coach, '/api/import-profiles', importProfileCreatedSchema, json('POST', { name: 'contract probe', profile }), 201);
    await conforms(coach, '/api/import-profiles', importProfilesResponseSchema);
  });

  it('recordings, sessions and swings', async () => {
    await conforms(coach, `/api/recordings/${sample.recordingId}`, recordingViewSchema);
    await conforms(coach, `/api/sessions/${sample.sessionId}/recordings`, sessionRecordingsSchema);
    await conforms(coach, `/api/swings/${sample.swingId}`, swingViewResponseSchema);
    await conforms(coach, `/api/swings/${sample.swingId}/score`, scoreResponseSchema);
    await conforms(coach, `/api/swings/${sample.swingId}/overlay-options`, overlayOptionsResponseSchema);
    await conforms(coach, `/api/recordings/${sample.recordingId}/overview`, recordingOverviewResponseSchema);
  });

  it('targets (list, create, edit)', async () => {
    await conforms(coach, '/api/targets', targetsResponseSchema);
    const created = (await conforms(
      coach,
      '/api/targets',
      targetResponseSchema,
      json('POST', { name: `Contract check ${Date.now()}`, clubGroup: 'irons', checks: [{ event: 'impact', measure: 'leadPct', expected: 85, tolerance: 10 }] }),
      201,
    )) as z.infer<typeof targetResponseSchema>;
    await conforms(coach, `/api/targets/${created.target.id}`, targetResponseSchema, json('PATCH', { description: 'checked' }));
    // leave the targets as the other tests expect them
    expect((await coach.json(`/api/targets/${created.target.id}`, { method: 'DELETE' })).status).toBe(200);
  });

  it('drills, assignments and the drill report', async () => {
    await conforms(coach, '/api/drills', drillsResponseSchema);
    const drill = (await conforms(
      coach,
      '/api/drills',
      drillResponseSchema,
      json('POST', { name: `Contract drill ${Date.now()}`, steps: ['Hold the finish for three seconds.'], addressesChecks: [{ event: 'finish', measure: 'leadPct' }], cautions: 'Stop on pain.' }),
      201,
    )) as z.infer<typeof drillResponseSchema>;
    await conforms(coach, `/api/athletes/${sample.athleteId}/drill-assignments`, assignmentResponseSchema, json('POST', { drillId: drill.drill.id, dueDate: '2026-12-31' }), 201);
    await conforms(coach, '/api/drill-assignments', assignmentsResponseSchema);
    await conforms(coach, `/api/athletes/${sample.athleteId}/drill-assignments`, assignmentsResponseSchema);
    await conforms(student, '/api/drill-assignments', assignmentsResponseSchema);
    await conforms(coach, `/api/sessions/${sample.sessionId}/drill-report`, drillReportResponseSchema);
    // the drill goes, and its assignment with it (ON DELETE CASCADE): the library stays as the other tests expect it
    expect((await coach.json(`/api/drills/${drill.drill.id}`, { method: 'DELETE' })).status).toBe(200);
  });

  it('bands, compare and progress', async () => {
    const { body } = await coach.json(`/api/sessions/${sample.sessionId}/recordings`);
    const ids = (body as z.infer<typeof sessionRecordingsSchema>).swings.filter((s) => !s.stale && !s.hidden).map((s) => s.id);
    expect(ids.length).toBeGreaterThanOrEqual(3);
    const made = (await conforms(coach, '/api/bands', bandCreatedSchema, json('POST', { name: `Contract band ${Date.now()}`, swingIds: ids.slice(0, 3) }), 201)) as z.infer<typeof bandCreatedSchema>;
    await conforms(coach, '/api/bands', bandsResponseSchema);
    await conforms(coach, `/api/bands/${made.id}`, bandDetailSchema);
    await conforms(coach, `/api/swings/${ids[0]}/score?band=${made.id}`, scoreResponseSchema);
    await conforms(coach, `/api/athletes/${sample.athleteId}/compare?a=context:practice&b=context:lesson&metrics=impact.leadPct,tempoRatio`, compareResponseSchema);
    await conforms(coach, `/api/athletes/${sample.athleteId}/progress?metrics=impact.leadPct`, progressResponseSchema);
    expect((await coach.json(`/api/bands/${made.id}`, { method: 'DELETE' })).status).toBe(200);
  });

  it('invitations, password reset, shares, mail preferences, outbox', async () => {
    const email = `contract-${Date.now().toString(36)}@stanceline.test`;
    const before = mailsNow();
    // a researcher's invitation (accepting one for a player would change the demo roster other tests read)
    await conforms(admin, '/api/invitations', invitationResponseSchema, json('POST', { email, role: 'researcher' }), 201);
    await conforms(coach, '/api/invitations', invitationResponseSchema, json('POST', { email: `coach-${email}`, role: 'student', athleteId: 3 }), 201);
    await conforms(coach, '/api/invitations', invitationListResponseSchema);
    await conforms(admin, '/api/invitations', invitationListResponseSchema);
    const { token } = linkIn(await waitForMail(email, before), '/invite');
    await conforms(coach, '/api/invitations/accept', acceptInvitationResponseSchema, json('POST', { token, password: 'a-long-enough-password' }));
    await conforms(coach, '/api/password-reset', passwordResetAcceptedSchema, json('POST', { email: `nobody-${email}` }), 202);
    const shared = (await conforms(coach, '/api/shares', shareResponseSchema, json('POST', { sessionId: 1, note: 'Contract check' }), 201)) as { share: { id: number } };
    await conforms(student, '/api/shares', shareListResponseSchema);
    await conforms(coach, '/api/athletes/1/shares', shareListResponseSchema);
    await conforms(coach, `/api/shares/${shared.share.id}`, shareResponseSchema, json('PATCH', { note: '' }));
    await conforms(coach, `/api/shares/${shared.share.id}`, shareBinnedResponseSchema, { method: 'DELETE' });
    await conforms(coach, `/api/shares/${shared.share.id}/restore`, shareResponseSchema, { method: 'POST' });
    await conforms(student, '/api/me/mail-preferences', mailPreferencesResponseSchema);
    await conforms(student, '/api/me/mail-preferences', mailPreferencesResponseSchema, json('PATCH', { drillReminders: true }));
    await conforms(admin, '/api/outbox', outboxResponseSchema);
  });

  it('errors', async () => {
    await conforms(coach, '/api/athletes/999999', errorResponseSchema, {}, 404);
    await conforms(coach, '/api/targets', errorResponseSchema, json('POST', { name: '' }), 422);
  });
});
