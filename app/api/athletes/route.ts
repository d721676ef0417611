import { requireRole } from '@/lib/auth/roles';
import { createAthleteForCoach, listAthletesPage, ROSTER_MAX } from '@/lib/db/athletes';
import { pageQueryOf } from '@/lib/pagination';
import { json, readJson, withErrors } from '@/lib/http';
import { athleteInputSchema, athleteListQuerySchema } from '@/lib/contracts/athletes';

export const dynamic = 'force-dynamic';

// Coaches see their roster; a student sees a list holding only their own profile. ?limit=&offset= page through it
// (limit at most ROSTER_MAX; `page` says which part; without limit the whole roster).
export const GET = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach', 'student');
  const url = new URL(request.url);
  const filters = athleteListQuerySchema.parse({
    q: url.searchParams.get('q') ?? undefined,
    context: url.searchParams.get('context') || undefined,
    handedness: url.searchParams.get('handedness') || undefined,
    archived: url.searchParams.get('archived') === 'true' ? true : undefined,
  });
  return json(await listAthletesPage(viewer, filters, pageQueryOf(url, ROSTER_MAX)));
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = athleteInputSchema.parse(await readJson(request));
  return json({ athlete: await createAthleteForCoach(viewer, input) }, 201);
});
