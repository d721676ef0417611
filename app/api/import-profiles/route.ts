import { requireRole } from '@/lib/auth/roles';
import { importProfileInputSchema } from '@/lib/contracts/import-profiles';
import { json, readJson, withErrors } from '@/lib/http';
import { listProfilesOfCoach, saveProfileOfCoach } from '@/lib/recordings/profiles';

export const dynamic = 'force-dynamic';

// A coach's saved import profiles (for files not in recording format 1), reusable on every upload.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach');
  return json({ profiles: await listProfilesOfCoach(viewer) });
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = importProfileInputSchema.parse(await readJson(request));
  return json({ profile: { id: await saveProfileOfCoach(viewer, input.name, input.profile), name: input.name } }, 201);
});
