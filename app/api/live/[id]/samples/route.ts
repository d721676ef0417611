import { json, parseId, withErrors } from '@/lib/http';
import { acceptChunk, parseSeq, readChunkText } from '@/lib/live/ingest';
import { requireIngestToken } from '@/lib/live/session';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// The bridge: Authorization: Bearer <token>, Content-Type: text/csv, X-Chunk-Seq: n. 202 once the chunk is stored;
// a repeated n is ignored (202, duplicate: true); a malformed chunk is 400 with its line and column from the start
// of the stream. No session cookie is needed or used here: the ingest token is the only credential.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const id = parseId((await params).id);
  const row = await requireIngestToken(id, request.headers.get('authorization'));
  const seq = parseSeq(request.headers.get('x-chunk-seq'));
  const text = await readChunkText(request);
  return json(await acceptChunk(row, seq, text), 202);
});
