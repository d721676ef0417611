import { ALL_ROLES, requireRole } from '@/lib/auth/roles';
import { shotUnitsInputSchema } from '@/lib/contracts/shots';
import { json, readJson, withErrors } from '@/lib/http';
import { setShotUnits, shotUnitsOf } from '@/lib/shots/units-preference';

export const dynamic = 'force-dynamic';

// The units the signed-in user reads shot values in (metric: km/h and m; imperial: mph and yd). Any role.
export const GET = withErrors(async () => {
  const viewer = await requireRole(...ALL_ROLES);
  return json({ units: await shotUnitsOf(viewer) });
});

export const PATCH = withErrors(async (request: Request) => {
  const viewer = await requireRole(...ALL_ROLES);
  const { units } = shotUnitsInputSchema.parse(await readJson(request));
  await setShotUnits(viewer, units);
  return json({ units });
});
