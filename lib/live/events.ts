import 'server-only';
import { db } from '@/lib/db/client';
import { jsonColumn } from '@/lib/db/values';
import { kickLive } from './processor';

// GET /api/live/:id/events: Server-Sent Events read from MariaDB, so the instance that serves the coach need not be
// the one that holds the buffer. Every POLL_MS the handler reads live_events after its cursor (the SSE id; a
// reconnecting client's Last-Event-ID starts it where it left) and the session's level; every few seconds it
// checks the lease and takes over a session whose owner died.

const POLL_MS = 150;
const LEASE_CHECK_EVERY = 20;
const HEARTBEAT_MS = 15_000;

export function parseLastEventId(raw: string | null): number {
  const n = raw !== null && /^\d{1,18}$/.test(raw.trim()) ? Number(raw.trim()) : 0;
  return Number.isSafeInteger(n) ? n : 0;
}

export function liveEventStream(liveId: number, afterId: number, signal: AbortSignal): ReadableStream<Uint8Array> {
  const enc = new TextEncoder();
  let cursor = afterId;
  let lastLevel = '';
  let polls = 0;
  let lastWrite = Date.now();
  let endedAt: number | null = null;
  let timer: NodeJS.Timeout | null = null;
  let closed = false;
  return new ReadableStream<Uint8Array>({
    start(controller) {
      const send = (text: string) => {
        if (closed || signal.aborted) return;
        controller.enqueue(enc.encode(text));
        lastWrite = Date.now();
      };
      send('retry: 1000\n\n');
      const close = () => {
        closed = true;
        if (timer) clearTimeout(timer);
        timer = null;
        try {
          controller.close();
        } catch {
          /* already closed */
        }
      };
      signal.addEventListener('abort', close);
      const poll = async () => {
        timer = null;
        if (signal.aborted || closed) return;
        try {
          const rows = await db('live_events').where({ live_session_id: liveId }).andWhere('id', '>', cursor).orderBy('id').limit(200).select('id', 'kind', 'payload');
          for (const r of rows) {
            cursor = Number(r.id);
            const payload = jsonColumn<{ status?: string }>(r.payload);
            send(`id: ${cursor}\nevent: ${r.kind}\ndata: ${JSON.stringify(payload)}\n\n`);
            if (r.kind === 'status' && payload?.status === 'ended') endedAt ??= Date.now();
          }
          const s = await db('live_sessions as l').leftJoin('live_leases as k', 'k.live_session_id', 'l.id').where('l.id', liveId).first('k.level', 'l.status');
          const level = s?.level ? JSON.stringify(jsonColumn(s.level)) : '';
          if (level && level !== lastLevel) {
            lastLevel = level;
            send(`event: level\ndata: ${level}\n\n`);
          }
          if (++polls % LEASE_CHECK_EVERY === 0 && s?.status === 'active') {
            const lease = await db('live_leases').where({ live_session_id: liveId }).first(db.raw('expires_at < CURRENT_TIMESTAMP(3) as expired'));
            if (!lease || Number(lease.expired) === 1) kickLive(liveId);
          }
          if (Date.now() - lastWrite > HEARTBEAT_MS) send(': still here\n\n');
          if (endedAt !== null && Date.now() - endedAt > 2000) return close();
        } catch (error) {
          console.error(`[stanceline live] event stream ${liveId}:`, error);
        }
        if (!signal.aborted && !closed) timer = setTimeout(() => void poll(), POLL_MS);
      };
      void poll();
    },
    cancel() {
      closed = true;
      if (timer) clearTimeout(timer);
      timer = null;
    },
  });
}
