import { ZodError, z } from 'zod';

// HTTP-facing errors thrown by lib code and mapped to responses in one place (toErrorResponse).
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = 'HttpError';
  }

  /** Headers the answer carries besides the JSON error body (Retry-After on a 429, say). */
  responseHeaders(): Record<string, string> {
    return {};
  }
}

export class UnauthenticatedError extends HttpError {
  constructor(message = 'Sign in to continue.') {
    super(401, 'unauthenticated', message);
  }
}

export class ForbiddenError extends HttpError {
  constructor(message = 'Your role does not allow this.') {
    super(403, 'forbidden', message);
  }
}

export class NotFoundError extends HttpError {
  constructor(message = 'Not found.') {
    super(404, 'not_found', message);
  }
}

export class ConflictError extends HttpError {
  constructor(message: string) {
    super(409, 'conflict', message);
  }
}

export class PayloadTooLargeError extends HttpError {
  constructor(message: string) {
    super(413, 'payload_too_large', message);
  }
}

/** Bad input with a place in a stream or file: the body carries the 1-based line and column besides the message. */
export class BadInputAtError extends HttpError {
  constructor(
    message: string,
    readonly line: number | null,
    readonly column: number | null,
  ) {
    super(400, 'bad_input', message);
  }
}

export type ErrorBody = {
  error: { code: string; message: string; fieldErrors?: Record<string, string[]>; line?: number | null; column?: number | null };
};

/** Field path "a.b" -> messages, for showing server-side validation errors on form fields. */
export function zodFieldErrors(error: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join('.') : '_form';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function json<T>(body: T, status = 200): Response {
  return Response.json(body, { status, headers: { 'Cache-Control': 'no-store' } });
}

/** The one error mapper: ZodError 422, HttpError its own status, anything else 500 without internals. */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof ZodError) {
    return json<ErrorBody>(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields are not valid.',
          fieldErrors: zodFieldErrors(error),
        },
      },
      422,
    );
  }
  if (error instanceof BadInputAtError) {
    return json<ErrorBody>({ error: { code: error.code, message: error.message, line: error.line, column: error.column } }, error.status);
  }
  if (error instanceof HttpError) {
    const response = json<ErrorBody>({ error: { code: error.code, message: error.message } }, error.status);
    for (const [name, value] of Object.entries(error.responseHeaders())) response.headers.set(name, value);
    return response;
  }
  console.error('[stanceline] unhandled error in route handler', error);
  return json<ErrorBody>({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, 500);
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * A second guard against cross-site requests besides the SameSite=Lax session cookie: a browser sends Origin
 * with every cross-origin POST/PATCH, so a changing request whose Origin is another host is refused.
 */
export function assertSameOrigin(request: Request): void {
  if (!UNSAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get('origin');
  if (!origin) return; // non-browser clients (curl, tests) send none
  const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host');
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw new ForbiddenError('Cross-site request refused.');
  }
  if (!host || originHost !== host) throw new ForbiddenError('Cross-site request refused.');
}

/** Wraps a route handler so every thrown error goes through toErrorResponse. */
export function withErrors<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      assertSameOrigin(request);
      return await handler(request, context);
    } catch (error) {
      return toErrorResponse(error);
    }
  };
}

/** Largest JSON body a route reads: forms and edits are a few KB. */
export const MAX_JSON_BODY_BYTES = 1024 * 1024;

function jsonTooLarge(request: Request): PayloadTooLargeError {
  // The rest of the body is not wanted; cancelling stops the server from buffering it.
  request.body?.cancel().catch(() => undefined);
  return new PayloadTooLargeError(`The request body is larger than ${MAX_JSON_BODY_BYTES / (1024 * 1024)} MB; JSON requests are limited to 1 MB.`);
}

/**
 * Reads a JSON body of at most MAX_JSON_BODY_BYTES: a larger declared Content-Length is a 413 before anything is
 * read, and a body without one is counted while it streams and refused as soon as it passes the limit. A malformed
 * body is a 422 on the pseudo-field "_body".
 */
export async function readJson(request: Request, maxBytes = MAX_JSON_BODY_BYTES): Promise<unknown> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) throw jsonTooLarge(request);
  let text = '';
  if (request.body) {
    const reader = request.body.getReader();
    const decoder = new TextDecoder();
    let seen = 0;
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      seen += value.byteLength;
      if (seen > maxBytes) {
        await reader.cancel().catch(() => undefined);
        throw jsonTooLarge(request);
      }
      text += decoder.decode(value, { stream: true });
    }
    text += decoder.decode();
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new ZodError([
      { code: 'custom', path: ['_body'], message: 'The request body must be valid JSON.', input: undefined },
    ]);
  }
}

/** Route ids are positive integers; anything else is "not found" rather than a server error. */
export const idParamSchema = z.coerce.number().int().positive();

export function parseId(raw: string): number {
  const parsed = idParamSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError();
  return parsed.data;
}
