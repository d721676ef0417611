import { requireRole } from '@/lib/auth/roles';
import { json, withErrors } from '@/lib/http';
import { listExportAudit } from '@/lib/research/export';
import { requireExporter } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

// The export audit: researchers and coaches see their own exports (a token works too), an admin the academy's.
export const GET = withErrors(async (request: Request) => {
  const viewer = request.headers.has('authorization') ? await requireExporter(request) : await requireRole('researcher', 'coach', 'admin');
  return json({ entries: await listExportAudit(viewer) });
});
