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

async function parseResponse<S extends z.ZodType>(response: Response, schema: S): Promise<z.infer<S>> {
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = errorResponseSchema.safeParse(body);
    if (parsed.success) {
      throw new ApiError(response.status, parsed.data.error.message, parsed.data.error.fieldErrors);
    }
    throw new ApiError(response.status, `Request failed with status ${response.status}.`);
  }
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

/** Send JSON (POST/PATCH) and validate the response. */
export async function sendJson<S extends z.ZodType>(
  url: string,
  method: 'POST' | 'PATCH',
  body: unknown,
  schema: S,
): Promise<z.infer<S>> {
  const response = await fetch(url, {
    method,
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    credentials: 'same-origin',
    body: JSON.stringify(body),
  });
  return parseResponse(response, schema);
}
