import { requireRole } from '@/lib/auth/roles';
import { updateAcademyUser } from '@/lib/db/users';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { updateUserSchema } from '@/lib/contracts/users';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const admin = await requireRole('admin');
  const id = parseId((await params).id);
  const patch = updateUserSchema.parse(await readJson(request));
  return json({ user: await updateAcademyUser(admin, id, patch) });
});
