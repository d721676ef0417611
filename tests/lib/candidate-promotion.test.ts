import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Viewer } from '@/lib/auth/viewer';
import { closeDb, db } from '@/lib/db/client';
import { drainQueue } from '@/lib/jobs/worker';
import { uploadFieldsSchema } from '@/lib/recordings/fields';
import { promoteCandidate, withdrawPromotion } from '@/lib/recordings/promote';
import { requestReprocess } from '@/lib/recordings/reprocess';
import { optionsFor } from '@/lib/recordings/upload';
import { getRecordingView } from '@/lib/recordings/views';
import { analyzeRecording, builtinLayout, parseRecording, roundAnalysis } from '@/lib/signal';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { resetToDemo } from './db-fixture';
import { insertRecording, tempDir } from './support/recordings';

// Issue contracts on real MariaDB: a coach's promoted candidate is kept over a reprocess (it is detected again on
// every analysis), the promotion is audited, and the parameters follow the precedence form > file metadata >
// athlete profile > defaults. Expected values come from the generator's own construction (its truth) and from the
// signal core run directly on the same file (what `npm run analyze` prints).

const coach: Viewer = { id: 2, role: 'coach', academyId: 1, name: 'x', email: 'x@stanceline.test' };
const store = createLocalStore(tempDir('promotion-store'));
const worker = () => ({ db, store, workerId: 'promotion', pollMs: 50, lockTimeoutS: 30 });
// two swings with walking before each: the walking gives rejected candidates
const golf = generateSession({ seed: 17, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 2, withMarker: false, distractors: ['walk'] });

beforeAll(async () => {
  await resetToDemo();
});
beforeEach(async () => {
  await resetToDemo();
});
afterAll(async () => {
  await resetToDemo();
  await closeDb();
});

async function processed(content: string, options: Parameters<typeof insertRecording>[3]) {
  const { recordingId } = await insertRecording(db, store, content, options);
  await drainQueue(worker());
  const view = (await getRecordingView(recordingId))!;
  expect(view.status).toBe('ready');
  return { recordingId, view };
}

describe('promoting a rejected candidate', () => {
  it('lists rejected candidates with their reason, counts a promoted one as a swing, audits it and keeps it over a reprocess', async () => {
    const { recordingId, view } = await processed(golf.csv(), {});
    expect(view.swings.filter((s) => !s.stale)).toHaveLength(2); // the generator's two swings
    expect(view.candidates.length).toBeGreaterThan(0);
    for (const c of view.candidates) expect(c.reasonText.length).toBeGreaterThan(10);
    const candidate = view.candidates[0]; // walking, rejected with its reason

    const answer = await promoteCandidate(recordingId, coach.id, { timeS: candidate.timeS });
    expect(answer.recording.status).toBe('received');
    expect(answer.promotion).toMatchObject({ timeS: candidate.timeS, reason: candidate.reason, userId: 2 });
    await drainQueue(worker());
    let after = (await getRecordingView(recordingId))!;
    const promoted = after.swings.filter((s) => s.promoted !== null);
    expect(promoted).toHaveLength(1);
    expect(promoted[0].startS).toBeLessThanOrEqual(candidate.timeS);
    expect(promoted[0].endS).toBeGreaterThanOrEqual(candidate.timeS);
    expect(after.swings.filter((s) => !s.stale)).toHaveLength(3);
    expect(after.candidates.some((c) => Math.abs(c.timeS - candidate.timeS) < 0.005)).toBe(false);
    expect(after.promotions).toHaveLength(1);

    // a reprocess with changed parameters runs the promotion again
    await requestReprocess(recordingId, { cutoffHz: 18 });
    await drainQueue(worker());
    after = (await getRecordingView(recordingId))!;
    expect(after.status).toBe('ready');
    expect(after.swings.filter((s) => s.promoted !== null && !s.stale)).toHaveLength(1);
    expect(after.swings.filter((s) => !s.stale)).toHaveLength(3);

    // a second promotion of the same candidate is refused; an unknown time names the field
    await expect(promoteCandidate(recordingId, coach.id, { timeS: candidate.timeS })).rejects.toThrow(/already/);
    await expect(promoteCandidate(recordingId, coach.id, { timeS: 0.123 })).rejects.toThrow(/No rejected candidate/);

    // withdrawing it brings the finder's own result back
    await withdrawPromotion(recordingId, after.promotions[0].id);
    await drainQueue(worker());
    after = (await getRecordingView(recordingId))!;
    expect(after.swings.filter((s) => !s.stale)).toHaveLength(2);
    expect(after.promotions).toHaveLength(0);
  });
});

describe('parameter precedence: form > file metadata > athlete profile > defaults', () => {
  it("the file's own stance width and handedness win over the athlete's profile, and match the analyze command", async () => {
    await db('athletes').where({ id: 1 }).update({ stance_width_mm: 380, handedness: 'left' });
    const options = await optionsFor(coach, uploadFieldsSchema.parse({ athleteId: '1' }));
    const { view } = await processed(golf.csv(), options);
    expect(view.parameters).toMatchObject({ stance_width_mm: 400, handedness: 'right' }); // the file says 400 mm, right
    expect(view.parameterSources).toMatchObject({
      stanceWidthMm: { used: 400, source: 'file', file: 400, fallback: 380 },
      handedness: { used: 'right', source: 'file', file: 'right', fallback: 'left' },
    });
    expect(view.options).toMatchObject({ profileStanceWidthMm: 380, profileHandedness: 'left', stanceWidthMm: null, handedness: null });
    // the same file through the signal core with no options (npm run analyze FILE)
    const direct = roundAnalysis(analyzeRecording(parseRecording(golf.csv()), builtinLayout('pair-8')!).result);
    expect(view.swings.filter((s) => !s.stale).map((s) => s.events)).toEqual(direct.swings.map((s) => s.events));
  });

  it('the profile fills in what the file does not say, and an explicit form value wins over both', async () => {
    await db('athletes').where({ id: 1 }).update({ stance_width_mm: 380, handedness: 'right' });
    const bare = golf.csv().replace(/^# stance_width_mm: .*\n/m, '');
    const fromProfile = await processed(bare, await optionsFor(coach, uploadFieldsSchema.parse({ athleteId: '1' })));
    expect(fromProfile.view.parameterSources!.stanceWidthMm).toEqual({ used: 380, source: 'fallback', file: null, fallback: 380 });
    const fromForm = await processed(golf.csv(), await optionsFor(coach, uploadFieldsSchema.parse({ athleteId: '1', stanceWidthMm: '420' })));
    expect(fromForm.view.parameterSources!.stanceWidthMm).toEqual({ used: 420, source: 'option', file: 400, fallback: 380 });
  });
});
