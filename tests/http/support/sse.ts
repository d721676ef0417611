import type { HttpSession } from './http-session';

export interface SseEvent {
  id: string | null;
  event: string;
  data: string;
}

/** Reads a Server-Sent Events stream until `stop` says so or the time runs out; returns every event read. */
export async function readSse(
  session: HttpSession,
  path: string,
  opts: { lastEventId?: string; timeoutMs: number; stop: (events: SseEvent[]) => boolean; onEvent?: (e: SseEvent, at: number) => void },
): Promise<SseEvent[]> {
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), opts.timeoutMs);
  const events: SseEvent[] = [];
  try {
    const res = await session.fetch(path, { headers: opts.lastEventId ? { 'last-event-id': opts.lastEventId } : {}, signal: controller.signal });
    if (res.status !== 200 || !res.body) throw new Error(`${path}: ${res.status} ${await res.text()}`);
    const reader = res.body.getReader();
    const decoder = new TextDecoder();
    let buf = '';
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      buf += decoder.decode(value, { stream: true });
      let cut: number;
      while ((cut = buf.indexOf('\n\n')) >= 0) {
        const block = buf.slice(0, cut);
        buf = buf.slice(cut + 2);
        const e: SseEvent = { id: null, event: 'message', data: '' };
        let hasData = false;
        for (const line of block.split('\n')) {
          if (line.startsWith('id: ')) e.id = line.slice(4);
          else if (line.startsWith('event: ')) e.event = line.slice(7);
          else if (line.startsWith('data: ')) {
            e.data += line.slice(6);
            hasData = true;
          }
        }
        if (!hasData) continue;
        events.push(e);
        opts.onEvent?.(e, Date.now());
        if (opts.stop(events)) {
          controller.abort();
          return events;
        }
      }
    }
  } catch (error) {
    if (!controller.signal.aborted) throw error;
  } finally {
    clearTimeout(timer);
  }
  return events;
}
