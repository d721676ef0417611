import { requireRole } from '@/lib/auth/roles';
import { parseId, withErrors } from '@/lib/http';
import { liveEventStream, parseLastEventId } from '@/lib/live/events';
import { requireLive } from '@/lib/live/session';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// Server-Sent Events for the coach's screen: level (~10/s), swing, gap, status. Last-Event-ID resumes after it.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await requireLive(viewer, parseId((await params).id), 'read');
  const after = parseLastEventId(request.headers.get('last-event-id') ?? new URL(request.url).searchParams.get('after'));
  return new Response(liveEventStream(Number(row.id), after, request.signal), {
    headers: { 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-store, no-transform', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' },
  });
});
