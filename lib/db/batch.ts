// Multi-row INSERTs cut into statements of at most 500 rows and about 1 MB of text, so a result with large JSON
// columns (swing windows, viewer payloads) goes over in few round trips and no statement nears MariaDB's
// max_allowed_packet. Takes the caller's connection or transaction (no app client: the worker runs outside Next).
import type { Knex } from 'knex';

const MAX_ROWS = 500;
const MAX_BYTES = 1_000_000;

/** A row's size as sent, roughly: the length of its string values plus a little per other value. */
function roughSize(row: Record<string, unknown>): number {
  let n = 0;
  for (const v of Object.values(row)) n += typeof v === 'string' ? v.length : 16;
  return n;
}

export async function insertInBatches(conn: Knex, table: string, rows: Record<string, unknown>[]): Promise<void> {
  let batch: Record<string, unknown>[] = [];
  let size = 0;
  for (const row of rows) {
    const rowSize = roughSize(row);
    if (batch.length > 0 && (batch.length >= MAX_ROWS || size + rowSize > MAX_BYTES)) {
      await conn(table).insert(batch);
      batch = [];
      size = 0;
    }
    batch.push(row);
    size += rowSize;
  }
  if (batch.length > 0) await conn(table).insert(batch);
}
