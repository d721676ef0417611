import { requireRole } from '@/lib/auth/roles';
import { shotProfileInputSchema } from '@/lib/contracts/shots';
import { json, readJson, withErrors } from '@/lib/http';
import { listShotProfilesOfCoach, saveShotProfileOfCoach } from '@/lib/shots/profiles';

export const dynamic = 'force-dynamic';

// A coach's saved shot profiles (how a launch monitor's log maps onto our columns and units), reused on imports.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach');
  return json({ profiles: await listShotProfilesOfCoach(viewer) });
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = shotProfileInputSchema.parse(await readJson(request));
  return json({ profile: { id: await saveShotProfileOfCoach(viewer, input.name, input.profile), name: input.name } }, 201);
});
