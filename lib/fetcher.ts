import type { z } from 'zod';
import { errorResponseSchema } from '@/lib/contracts/errors';

/** An API error with the server's message and per-field errors (422). */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

function apiError(status: number, body: unknown): ApiError {
  const parsed = errorResponseSchema.safeParse(body);
  if (parsed.success) return new ApiError(status, parsed.data.error.message, parsed.data.error.fieldErrors);
  return new ApiError(status, `Request failed with status ${status}.`);
}

async function parseResponse<S extends z.ZodType>(response: Response, schema: S): Promise<z.infer<S>> {
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) throw apiError(response.status, body);
  const parsed = schema.safeParse(body);
  if (!parsed.success) {
    throw new ApiError(response.status, 'The server sent a response in an unexpected shape.');
  }
  return parsed.data;
}

/** GET a URL and validate the JSON against `schema`; used as the SWR fetcher. */
export function fetchJson<S extends z.ZodType>(schema: S) {
  return async (url: string): Promise<z.infer<S>> => {
    const response = await fetch(url, { headers: { Accept: 'application/json' }, credentials: 'same-origin' });
    return parseResponse(response, schema);
  };
}

/** Send JSON (POST/PATCH/DELETE) and validate the response. */
export async function sendJson<S extends z.ZodType>(
  url: string,
  method: 'POST' | 'PUT' | 'PATCH' | 'DELETE',
  body: unknown,
  schema: S,
): Promise<z.infer<S>> {
  const response = await fetch(url, {
    method,
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    credentials: 'same-origin',
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return parseResponse(response, schema);
}

/**
 * DELETE a URL. A 204 (no body) resolves to undefined; a JSON answer is validated against `schema` when one is
 * given; an error answer throws ApiError with the server's message and field errors, like every other call.
 */
export async function deleteJson<S extends z.ZodType>(url: string, schema?: S): Promise<z.infer<S> | undefined> {
  const response = await fetch(url, { method: 'DELETE', headers: { Accept: 'application/json' }, credentials: 'same-origin' });
  if (!response.ok) throw apiError(response.status, await response.json().catch(() => null));
  if (response.status === 204 || schema === undefined) return undefined;
  return parseResponse(response, schema);
}
