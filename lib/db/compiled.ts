import type { Knex } from 'knex';

// A query built with knex once and then run as its SQL text: for the few queries on every request's path (the user
// lookup, a swing's view), where knex compiling the same builder again cost more than MariaDB answering it
// (scripts/bench-api.ts). The builder is made once with a marker value for each parameter; the SQL text and where
// each parameter goes in its bindings are kept, and each run sends that text with the values in their places.

type Param = number | string | null;

export type CompiledQuery<P extends Param[]> = {
  /** The rows, as knex's builder would give them (mysql2 rows through the connection's typeCast). */
  rows(conn: Knex, ...params: P): Promise<Record<string, unknown>[]>;
  /** The SQL text (tests compare it with the builder's). */
  sql(conn: Knex): string;
};

const MARK = '\u0001stanceline-param-';

/**
 * `build(conn, ...markers)` must treat its parameters as values only (bindings), never as parts of the SQL text or
 * of the query's shape: the text is made once, from markers.
 */
export function compileOnce<P extends Param[]>(arity: P['length'], build: (conn: Knex, ...params: P) => Knex.QueryBuilder): CompiledQuery<P> {
  const cache = new WeakMap<Knex, { sql: string; slots: { param: number; value: unknown }[] }>();
  const compiled = (conn: Knex) => {
    let c = cache.get(conn);
    if (!c) {
      const markers = Array.from({ length: arity }, (_, k) => `${MARK}${k}`) as unknown as P;
      const { sql, bindings } = build(conn, ...markers).toSQL().toNative();
      if (sql.includes(MARK)) throw new Error('compileOnce: a parameter became part of the SQL text');
      const slots = bindings.map((value) => {
        const param = typeof value === 'string' && value.startsWith(MARK) ? Number(value.slice(MARK.length)) : -1;
        return { param, value };
      });
      const used = new Set(slots.map((s) => s.param));
      for (let k = 0; k < arity; k++) if (!used.has(k)) throw new Error(`compileOnce: parameter ${k} is not a binding of the query`);
      c = { sql, slots };
      cache.set(conn, c);
    }
    return c;
  };
  return {
    async rows(conn, ...params) {
      const { sql, slots } = compiled(conn);
      const values = slots.map((s) => (s.param >= 0 ? params[s.param] : s.value));
      const [rows] = (await conn.raw(sql, values as Knex.RawBinding[])) as unknown as [Record<string, unknown>[]];
      return rows;
    },
    sql: (conn) => compiled(conn).sql,
  };
}
