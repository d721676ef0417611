import 'server-only';
// GET /api/videos/:id/stream and /poster: the stored file with HTTP Range (RFC 9110 §14: one range, 206 with
// Content-Range; an unsatisfiable range 416 with "bytes */size"), a strong ETag from the stored key and size (a
// reprocess writes the same key with new bytes only after the row changes, so key + size + id is enough), and
// If-None-Match -> 304.
import { Readable } from 'node:stream';
import { getStore } from '@/lib/storage';

export interface ByteRange {
  start: number;
  end: number;
}

/** Parses a Range header against a size: null for none/ignored, 'unsatisfiable', or one range (inclusive ends). */
export function parseRange(header: string | null, size: number): ByteRange | null | 'unsatisfiable' {
  if (!header) return null;
  const m = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
  // Several ranges or another unit: RFC 9110 lets a server ignore Range and send the whole file.
  if (!m || (m[1] === '' && m[2] === '')) return null;
  let start: number;
  let end: number;
  if (m[1] === '') {
    const suffix = Number(m[2]);
    if (suffix === 0) return 'unsatisfiable';
    start = Math.max(0, size - suffix);
    end = size - 1;
  } else {
    start = Number(m[1]);
    end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
    if (m[2] !== '' && Number(m[2]) < start) return null;
  }
  if (start >= size) return 'unsatisfiable';
  return { start, end };
}

export async function serveStored(request: Request, key: string, size: number, contentType: string, etagSeed: string): Promise<Response> {
  const etag = `"${etagSeed}-${size}"`;
  const common = { 'Content-Type': contentType, ETag: etag, 'Accept-Ranges': 'bytes', 'Cache-Control': 'private, max-age=0, must-revalidate' };
  if (request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers: common });
  const range = parseRange(request.headers.get('range'), size);
  if (range === 'unsatisfiable') return new Response(null, { status: 416, headers: { ...common, 'Content-Range': `bytes */${size}` } });
  const body = await getStore().read(key, range ?? undefined);
  const web = Readable.toWeb(body) as ReadableStream<Uint8Array>;
  if (!range) return new Response(web, { status: 200, headers: { ...common, 'Content-Length': String(size) } });
  return new Response(web, {
    status: 206,
    headers: { ...common, 'Content-Length': String(range.end - range.start + 1), 'Content-Range': `bytes ${range.start}-${range.end}/${size}` },
  });
}
