import { expect } from 'vitest';
import type { HttpSession } from './http-session';

/**
 * One signed-in session per actor, and the two helpers the role-matrix tests share: `send` (JSON in and out as that
 * actor) and `matrix` (the same request as every actor, the owner last so a DELETE it makes does not turn the
 * others' answers into 404; every refusal must be JSON).
 */
export function roleRequests<A extends string>(sessions: Map<A, HttpSession>, actors: readonly A[], owner: A) {
  const send = (actor: A, method: string, path: string, body?: unknown) =>
    sessions.get(actor)!.json(path, { method, headers: body === undefined ? {} : { 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });

  async function matrix(method: string, path: string, body: unknown, expected: Record<A, number>): Promise<void> {
    const got = {} as Record<A, number>;
    for (const actor of [...actors.filter((a) => a !== owner), owner]) {
      const res = await send(actor, method, path, body);
      got[actor] = res.status;
      if (res.status >= 400) expect(res.contentType).toContain('application/json');
    }
    expect(got).toEqual(expected);
  }

  return { send, matrix };
}
