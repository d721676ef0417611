import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { scoreSwingForViewer } from '@/lib/targets/swing-score';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?band=BAND_ID (optional): the swing against its target and, when asked, a band. Same role rules as the swing.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const raw = new URL(request.url).searchParams.get('band');
  const bandId = raw === null || raw === '' ? null : parseId(raw);
  return json(await scoreSwingForViewer(viewer, id, bandId));
});
