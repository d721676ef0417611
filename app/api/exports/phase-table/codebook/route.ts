import { withErrors } from '@/lib/http';
import { codebookQuerySchema } from '@/lib/contracts/research';
import { codebookBody, exportFileName } from '@/lib/research/export';
import { requireExporter } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

// The codebook of the phase-table export: each column's meaning, unit and how it was computed (CSV or JSON).
export const GET = withErrors(async (request: Request) => {
  const viewer = await requireExporter(request);
  const query = codebookQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const identified = viewer.role === 'coach';
  const name = exportFileName(query, identified).replace('phase-table', 'phase-table-codebook');
  return new Response(codebookBody(query, identified), {
    status: 200,
    headers: {
      'Content-Type': query.format === 'csv' ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8',
      'Content-Disposition': `${query.format === 'csv' ? 'attachment' : 'inline'}; filename="${name}"`,
      'Cache-Control': 'no-store',
    },
  });
});
