import { requireRole } from '@/lib/auth/roles';
import { requireSession } from '@/lib/auth/access';
import { shotPairPatchSchema } from '@/lib/contracts/shots';
import { db } from '@/lib/db/client';
import { json, NotFoundError, parseId, readJson, withErrors } from '@/lib/http';
import { shotUnitsOf } from '@/lib/shots/units-preference';
import { pairShot, PairingError, sessionOfShot, sessionShotsView } from '@/lib/shots/session-shots';
import { ZodError } from 'zod';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// PATCH { swingId }: the coach pairs a shot with a swing of its session by hand; { swingId: null } unpairs it.
// Answers the session's pairing view.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const sessionId = await sessionOfShot(db, id);
  if (sessionId === null) throw new NotFoundError('No shot with this id.');
  await requireSession(viewer, sessionId, 'write');
  const { swingId } = shotPairPatchSchema.parse(await readJson(request));
  try {
    await pairShot(db, id, swingId);
  } catch (error) {
    if (error instanceof PairingError) throw new ZodError([{ code: 'custom', path: ['swingId'], message: error.message, input: swingId }]);
    throw error;
  }
  return json(await sessionShotsView(db, sessionId, await shotUnitsOf(viewer)));
});
