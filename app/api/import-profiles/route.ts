import { z } from 'zod';
import { requireRole } from '@/lib/auth/roles';
import { json, readJson, withErrors } from '@/lib/http';
import { listProfilesOfCoach, saveProfileOfCoach } from '@/lib/recordings/profiles';
import { importProfileSchema } from '@/lib/signal';

export const dynamic = 'force-dynamic';

const saveSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'Give the profile a name.' }).max(80, { error: 'Use at most 80 characters.' }),
  profile: importProfileSchema,
});

// A coach's saved import profiles (for files not in recording format 1), reusable on every upload.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach');
  return json({ profiles: await listProfilesOfCoach(viewer) });
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = saveSchema.parse(await readJson(request));
  return json({ profile: { id: await saveProfileOfCoach(viewer, input.name, input.profile), name: input.name } }, 201);
});
