import { json, withErrors } from '@/lib/http';
import { cohortSummary } from '@/lib/research/export';
import { parseExportQuery } from '@/lib/research/query';
import { requireExporter } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

// How many players and swings the cohort filters select, with a preview of the first swings (wide shape).
export const GET = withErrors(async (request: Request) => {
  const viewer = await requireExporter(request);
  const { filter } = parseExportQuery(request.url, false);
  return json(await cohortSummary(viewer, filter));
});
