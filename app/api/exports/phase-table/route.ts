import { withErrors } from '@/lib/http';
import { exportFileName, startExport } from '@/lib/research/export';
import { parseExportQuery } from '@/lib/research/query';
import { requireExporter } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

// The phase table of a cohort, streamed: a researcher (session or personal token) gets consented players under codes;
// a coach gets their own athletes, identified. ?format=csv|json&shape=long|wide plus cohort filters.
export const GET = withErrors(async (request: Request) => {
  const viewer = await requireExporter(request);
  const { filter, query } = parseExportQuery(request.url);
  const stream = await startExport(viewer, filter, query);
  const identified = viewer.role === 'coach';
  const codebook = `/api/exports/phase-table/codebook?format=${query.format}&shape=${query.shape}`;
  return new Response(stream, {
    status: 200,
    headers: {
      'Content-Type': query.format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8',
      'Content-Disposition': `attachment; filename="${exportFileName(query, identified)}"`,
      'Cache-Control': 'no-store',
      Link: `<${codebook}>; rel="describedby"`,
    },
  });
});
