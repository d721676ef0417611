// Helpers of offset pagination (the contract is lib/contracts/pagination.ts).
import { pageQuerySchema, type Page, type PageQuery } from '@/lib/contracts/pagination';

export type { Page, PageQuery };

export const WHOLE_LIST: PageQuery = { limit: null, offset: 0 };

/** Reads limit and offset from a URL's query (422 through lib/http.ts, naming the field, when out of range). */
export function pageQueryOf(url: URL, max: number): PageQuery {
  return pageQuerySchema(max).parse({ limit: url.searchParams.get('limit') ?? undefined, offset: url.searchParams.get('offset') ?? undefined });
}

export function pageOf(query: PageQuery, total: number): Page {
  const next = query.limit === null ? total : query.offset + query.limit;
  return { offset: query.offset, limit: query.limit, total, nextOffset: next < total ? next : null };
}

/** Applies a page to a knex query (no LIMIT for the whole list). */
export function paged<Q extends { limit(n: number): Q; offset(n: number): Q }>(query: Q, page: PageQuery): Q {
  const limited = page.limit === null ? query : query.limit(page.limit);
  return page.offset > 0 ? limited.offset(page.offset) : limited;
}

/** The same page of a list already in memory. */
export function sliceOf<T>(items: T[], page: PageQuery): T[] {
  return items.slice(page.offset, page.limit === null ? undefined : page.offset + page.limit);
}
