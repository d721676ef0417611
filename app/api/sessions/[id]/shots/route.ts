import { requireRole } from '@/lib/auth/roles';
import { requireSession } from '@/lib/auth/access';
import { shotOffsetPatchSchema } from '@/lib/contracts/shots';
import { db } from '@/lib/db/client';
import { json, NotFoundError, parseId, readJson, withErrors } from '@/lib/http';
import { shotUnitsOf } from '@/lib/shots/units-preference';
import { binImport, sessionShotsView, setOffset } from '@/lib/shots/session-shots';
import { receiveShotLog } from '@/lib/shots/upload';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// A session's launch-monitor shots. POST (multipart `file` + `profile`): import a shot log, find the clock offset,
// pair shots with swings; 201 { imported, matched, unmatchedShots, unmatchedSwings, offsetS }. GET: the pairing
// view (the athlete's coach or the student). PATCH { offsetS } or { refind: true }: shift the offset by hand or find
// it again. DELETE: the import goes to the bin (POST .../shots/restore brings it back).
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  return json(await receiveShotLog(viewer, id, request), 201);
});

export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'read');
  return json(await sessionShotsView(db, id, await shotUnitsOf(viewer)));
});

export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  const change = shotOffsetPatchSchema.parse(await readJson(request));
  const result = await setOffset(db, id, change);
  if (!result) throw new NotFoundError('This session has no shot log.');
  return json(result);
});

export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  if (!(await binImport(db, id))) throw new NotFoundError('This session has no shot log.');
  return json(await sessionShotsView(db, id, await shotUnitsOf(viewer)));
});
