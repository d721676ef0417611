import { requireRecording } from '@/lib/auth/access';
import { requireRole } from '@/lib/auth/roles';
import { ConflictError, NotFoundError, parseId, withErrors } from '@/lib/http';
import { getStore } from '@/lib/storage';
import { videoRow } from '@/lib/videos/store';
import { Readable } from 'node:stream';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// The poster frame (JPEG); access exactly like the recording.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const row = await videoRow(parseId((await params).id));
  if (!row) throw new NotFoundError('No video with this id.');
  await requireRecording(viewer, row.recording_id, 'read');
  if (!row.poster_key) throw new ConflictError('The video has no poster frame yet.');
  // the poster is small: its size is read from the stream once
  const chunks: Buffer[] = [];
  for await (const chunk of (await getStore().read(row.poster_key)) as Readable) chunks.push(chunk as Buffer);
  const bytes = Buffer.concat(chunks);
  return new Response(bytes, { headers: { 'Content-Type': 'image/jpeg', 'Content-Length': String(bytes.length), 'Cache-Control': 'private, max-age=0, must-revalidate' } });
});
