import { requireRole } from '@/lib/auth/roles';
import { listSharesForStudent, shareWithStudent } from '@/lib/accounts/shares';
import { json, readJson, withErrors } from '@/lib/http';
import { createShareSchema } from '@/lib/contracts/shares';

export const dynamic = 'force-dynamic';

// GET (student): what their coach sent them, newest first.
export const GET = withErrors(async () => {
  const viewer = await requireRole('student');
  return json({ shares: await listSharesForStudent(viewer) });
});

// POST (the player's coach) { sessionId } or { swingId }, note?: 201 { share }; the student gets a mail with a link.
// 409 when the player has no student account.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = createShareSchema.parse(await readJson(request));
  return json({ share: await shareWithStudent(viewer, input) }, 201);
});
