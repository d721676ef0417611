import { requireRole } from '@/lib/auth/roles';
import { json, readJson, withErrors } from '@/lib/http';
import { tokenInputSchema } from '@/lib/contracts/research';
import { createToken, listTokens } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

// A researcher's personal API tokens: the token is in the 201 answer once; only its hash is kept.
export const GET = withErrors(async () => {
  const viewer = await requireRole('researcher');
  return json({ tokens: await listTokens(viewer) });
});

export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('researcher');
  const input = tokenInputSchema.parse(await readJson(request));
  return json(await createToken(viewer, input.name), 201);
});
