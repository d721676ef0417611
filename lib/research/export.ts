import 'server-only';
import Papa from 'papaparse';
import { db } from '@/lib/db/client';
import { toIsoTime } from '@/lib/db/values';
import type { CohortFilter, CohortSummary, ExportAuditEntry, ExportQuery } from '@/lib/contracts/research';
import { SMALL_COHORT_PLAYERS } from '@/lib/contracts/research';
import { cohortBatches, type CohortScope } from './cohort';
import { codebook, columnsOf, ROWS_PER_SWING_LONG, rowsOf, wideRow, type Row } from './phase-table';
import type { Exporter } from './tokens';

// The phase-table export as a stream: one batch of swings at a time is read, turned into rows and written (CSV through
// papaparse's unparse, or JSON), and the next batch is read only when the reader wants more (ReadableStream pull), so
// memory stays bounded whatever the size. Every export writes an audit row when it starts and completes it with the
// counts (players, swings, rows) when the stream ends; a stream that breaks off is marked 'failed' with what was sent.

export function scopeOf(viewer: Exporter): CohortScope {
  return { kind: viewer.role === 'coach' ? 'coach' : 'researcher', academyId: viewer.academyId, userId: viewer.id };
}

/** The filters as the audit keeps them: only the ones set (partial swings 'include' is the default, left out). */
export function filterRecord(filter: CohortFilter): Record<string, string | number> {
  const out: Record<string, string | number> = {};
  for (const [k, v] of Object.entries(filter)) if (v !== undefined && v !== null && v !== '' && !(k === 'partial' && v === 'include')) out[k] = v as string | number;
  return out;
}

function csvChunk(rows: Row[], columns: string[], header: boolean): string {
  // papaparse quotes cells that hold the delimiter, quotes or line breaks; null becomes an empty cell (NA in R/pandas)
  return Papa.unparse(rows, { columns, header, newline: '\r\n' }) + '\r\n';
}

export function exportFileName(query: ExportQuery, identified: boolean, ext = query.format): string {
  return `phase-table-${query.shape}${identified ? '-identified' : ''}.${ext}`;
}

export async function startExport(viewer: Exporter, filter: CohortFilter, query: ExportQuery): Promise<ReadableStream<Uint8Array>> {
  const scope = scopeOf(viewer);
  const identified = scope.kind === 'coach';
  const columns = columnsOf(query.shape, identified);
  const [auditId] = await db('export_audit').insert({
    academy_id: viewer.academyId,
    user_id: viewer.id,
    role: viewer.role,
    token_id: viewer.tokenId,
    export: 'phase-table',
    format: query.format,
    shape: query.shape,
    identified,
    filters: JSON.stringify(filterRecord(filter)),
    players: 0,
    swings: 0,
  });
  const batches = cohortBatches(scope, filter);
  const players = new Set<string>();
  let swings = 0;
  let rows = 0;
  let first = true;
  const encoder = new TextEncoder();
  const finish = (status: 'completed' | 'failed') =>
    db('export_audit').where({ id: auditId }).update({ players: players.size, swings, rows, status, completed_at: db.raw('NOW(3)') });

  const opening = () =>
    query.format === 'json'
      ? `{"export":${JSON.stringify({ name: 'phase-table', shape: query.shape, identified, filters: filterRecord(filter), columns })},"codebook":${JSON.stringify(codebook(query.shape, identified))},"rows":[`
      : '';

  return new ReadableStream<Uint8Array>(
    {
      async pull(controller) {
        try {
          const next = await batches.next();
          if (next.done) {
            let tail = '';
            if (first) tail += opening() + (query.format === 'csv' ? csvChunk([], columns, true) : '');
            if (query.format === 'json') tail += `],"rowCount":${rows}}\n`;
            if (tail) controller.enqueue(encoder.encode(tail));
            await finish('completed');
            controller.close();
            return;
          }
          const out: Row[] = [];
          for (const s of next.value) {
            players.add(s.playerCode);
            swings += 1;
            out.push(...rowsOf(s, query.shape, identified));
          }
          let text = first ? opening() : '';
          if (query.format === 'csv') text += csvChunk(out, columns, first);
          else text += (first ? '' : ',') + out.map((r) => JSON.stringify(Object.fromEntries(columns.map((c) => [c, r[c] ?? null])))).join(',');
          first = false;
          rows += out.length;
          controller.enqueue(encoder.encode(text));
        } catch (error) {
          await finish('failed').catch(() => undefined);
          controller.error(error);
        }
      },
      async cancel() {
        await batches.return(undefined);
        await finish('failed').catch(() => undefined);
      },
    },
    { highWaterMark: 1 },
  );
}

/** What the researcher's page shows before a download: counts and the first swings in the wide shape. No audit. */
export async function cohortSummary(viewer: Exporter, filter: CohortFilter, previewSwings = 25): Promise<CohortSummary> {
  const scope = scopeOf(viewer);
  const identified = scope.kind === 'coach';
  const players = new Set<string>();
  const versions = new Set<string>();
  let swings = 0;
  const preview: Row[] = [];
  for await (const batch of cohortBatches(scope, filter)) {
    for (const s of batch) {
      players.add(s.playerCode);
      if (s.algorithmVersion) versions.add(s.algorithmVersion);
      swings += 1;
      if (preview.length < previewSwings) preview.push(wideRow(s, identified));
    }
  }
  const columns = columnsOf('wide', identified);
  return {
    players: players.size,
    swings,
    rowsLong: swings * ROWS_PER_SWING_LONG,
    smallCohort: players.size < SMALL_COHORT_PLAYERS,
    identified,
    algorithmVersions: [...versions].sort(),
    preview: { columns, rows: preview.map((r) => Object.fromEntries(columns.map((c) => [c, r[c] ?? null]))) },
  };
}

export function codebookBody(query: ExportQuery, identified: boolean): string {
  const entries = codebook(query.shape, identified);
  if (query.format === 'json') return JSON.stringify({ shape: query.shape, identified, columns: entries });
  return csvChunk(entries as unknown as Row[], ['column', 'type', 'unit', 'meaning', 'computed'], true);
}

/** The export audit: a researcher or coach sees their own exports, an admin the academy's. Newest first. */
export async function listExportAudit(viewer: { id: number; role: string; academyId: number }, limit = 100): Promise<ExportAuditEntry[]> {
  const q = db('export_audit as e')
    .leftJoin('users as u', 'u.id', 'e.user_id')
    .leftJoin('api_tokens as t', 't.id', 'e.token_id')
    .where('e.academy_id', viewer.academyId)
    .orderBy('e.id', 'desc')
    .limit(limit)
    .select('e.*', 'u.name as who', 't.name as token_name');
  if (viewer.role !== 'admin') q.where('e.user_id', viewer.id);
  const rows = await q;
  return rows.map((r) => ({
    id: Number(r.id),
    createdAt: toIsoTime(r.created_at)!,
    completedAt: toIsoTime(r.completed_at),
    who: r.who ?? null,
    role: r.role,
    token: r.token_name ?? null,
    format: r.format,
    shape: r.shape,
    identified: Boolean(r.identified),
    filters: typeof r.filters === 'string' ? JSON.parse(r.filters) : r.filters,
    players: Number(r.players),
    swings: Number(r.swings),
    rows: r.rows === null ? null : Number(r.rows),
    status: r.status,
  }));
}
