import { requireRole } from '@/lib/auth/roles';
import { createDrill, listDrills } from '@/lib/drills/store';
import { DRILL_CAUTION } from '@/lib/drills/types';
import { json, readJson, withErrors } from '@/lib/http';
import { drillInputSchema } from '@/lib/contracts/drills';

export const dynamic = 'force-dynamic';

// GET: coach: own library; student: the drills assigned to them. `caution` is the general caution shown with every drill.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach', 'student');
  return json({ drills: await listDrills(viewer), caution: DRILL_CAUTION });
});

// POST (coach) { name, steps, addressesChecks, cautions }: 201 { drill }.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = drillInputSchema.parse(await readJson(request));
  return json({ drill: await createDrill(viewer, input) }, 201);
});
