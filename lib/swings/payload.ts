import 'server-only';
import { createHash } from 'node:crypto';
import { db } from '@/lib/db/client';
import { SWING_PART_FORMAT, recordingOverviewText, recordingPartText, storeSwingPayload } from './payload-build';

// Serving the stored viewer payload (lib/swings/payload-build.ts builds it). The per-reader part (numbers, labels,
// notes, audit, neighbours, canEdit) is read per request after the role and access checks, and the ETag is taken
// over the whole body that reader gets, so a stored payload or a 304 never skips them.

/**
 * The stored payload parts of a swing as bytes, from the ones its view query read (`shared`, `swing`; null when
 * missing): a part missing (a swing processed before payloads were stored apart) or of an older form
 * (`swingFormat`, SWING_PART_FORMAT) is built and stored now.
 */
export async function payloadBytesOf(
  swingId: number,
  recordingId: number,
  shared: Buffer | null,
  swing: Buffer | null,
  swingFormat: number | null,
): Promise<{ shared: Buffer; swing: Buffer }> {
  const [sharedBytes, swingBytes] = await Promise.all([
    shared ?? recordingPartText(db, recordingId).then((t) => Buffer.from(t, 'utf8')),
    swing !== null && swingFormat === SWING_PART_FORMAT ? swing : storeSwingPayload(db, swingId).then((t) => Buffer.from(t, 'utf8')),
  ]);
  return { shared: sharedBytes, swing: swingBytes };
}

/** The GET /api/recordings/:id/overview body as JSON text (the stored overview, built when missing). */
export async function overviewBodyOf(recordingId: number): Promise<string> {
  return `{"overview":${await recordingOverviewText(db, recordingId)}}`;
}

/** A weak validator of one response body (weak, so it stays valid for the gzip and identity encodings). */
export function etagOf(body: string | Uint8Array): string {
  return `W/"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`;
}

/** True when an If-None-Match header names this ETag (weak comparison, RFC 9110 section 13.1.2). */
export function matchesEtag(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  if (ifNoneMatch.trim() === '*') return true;
  const opaque = (tag: string) => tag.trim().replace(/^W\//, '');
  return ifNoneMatch.split(',').some((tag) => opaque(tag) === opaque(etag));
}

/**
 * Answers a JSON body the caller built for this reader after requireRole and the access check: a weak ETag of the
 * exact text, and 304 with no body when If-None-Match names it. `Cache-Control: private, no-cache` sends every reuse
 * back here (through the checks) first. Compression (gzip when the client accepts it) is Next's own (`compress`,
 * on by default for `next start`), and only Next's: Next drops a route handler's own Content-Encoding header
 * (next/dist/server/send-response.js), so a body gzipped here would reach the client as undecodable bytes.
 */
export function sendCacheableJson(request: Request, body: string | Buffer): Response {
  const etag = etagOf(body);
  const headers: Record<string, string> = { ETag: etag, 'Cache-Control': 'private, no-cache', Vary: 'Cookie' };
  if (matchesEtag(request.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });
  return new Response(typeof body === 'string' ? body : new Uint8Array(body.buffer as ArrayBuffer, body.byteOffset, body.byteLength), { status: 200, headers: { ...headers, 'Content-Type': 'application/json; charset=utf-8' } });
}
