import { hashPassword } from '@/lib/auth/password';
import { requireRole } from '@/lib/auth/roles';
import { createAcademyUser, listAcademyUsers } from '@/lib/db/users';
import { json, readJson, withErrors } from '@/lib/http';
import { createUserSchema } from '@/lib/contracts/users';

export const dynamic = 'force-dynamic';

// Academy admins only: the accounts of their own academy.
export const GET = withErrors(async () => {
  const admin = await requireRole('admin');
  return json({ users: await listAcademyUsers(admin.academyId) });
});

export const POST = withErrors(async (request: Request) => {
  const admin = await requireRole('admin');
  const input = createUserSchema.parse(await readJson(request));
  const user = await createAcademyUser(admin.academyId, {
    email: input.email,
    name: input.name,
    role: input.role,
    passwordHash: await hashPassword(input.password),
  });
  return json({ user }, 201);
});
