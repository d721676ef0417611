'use client';
// The researcher's page: cohort filters with the count of players and swings they select, a preview of the first
// swings (TanStack Table), downloads of the phase table (long or wide, CSV or JSON) and its codebook, personal API
// tokens, and the log of past exports. Everything here is de-identified: codes, age bands and ISO weeks.
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { Button, buttonClass } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { inputClass } from '@/components/ui/field';
import { ApiError, deleteJson, fetchJson, sendJson } from '@/lib/fetcher';
import {
  cohortSummarySchema,
  exportAuditSchema,
  SMALL_COHORT_PLAYERS,
  tokenCreatedSchema,
  tokenListSchema,
  tokenRevokedSchema,
  type TokenCreated,
} from '@/lib/contracts/research';
import { CLUB_GROUPS, clubGroupLabels } from '@/lib/contracts/targets';

type Filters = {
  clubGroup: string;
  context: string;
  from: string;
  to: string;
  handedness: string;
  partial: string;
  algorithmVersion: string;
  scoreMin: string;
  scoreMax: string;
};
const EMPTY: Filters = { clubGroup: '', context: '', from: '', to: '', handedness: '', partial: 'include', algorithmVersion: '', scoreMin: '', scoreMax: '' };

const queryOf = (f: Filters) => {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== '' && !(k === 'partial' && v === 'include')) p.set(k, v);
  return p.toString();
};

const PREVIEW_COLUMNS: { id: string; header: string }[] = [
  { id: 'player_code', header: 'Player code' },
  { id: 'age_band', header: 'Age band' },
  { id: 'session_week', header: 'Week' },
  { id: 'context', header: 'Context' },
  { id: 'club', header: 'Club' },
  { id: 'swing_id', header: 'Swing' },
  { id: 'top_lead_pct', header: 'Lead % at top' },
  { id: 'impact_lead_pct', header: 'Lead % at impact' },
  { id: 'downswing_duration_s', header: 'Downswing (s)' },
  { id: 'tempo_ratio', header: 'Tempo' },
  { id: 'target_score_pct', header: 'Target score %' },
];

const small = inputClass.replace('py-2', 'py-2.5');
const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' }) + ' UTC';

function Select({ id, label, value, onChange, options }: { id: string; label: string; value: string; onChange: (v: string) => void; options: [string, string][] }) {
  return (
    <label htmlFor={id} className="space-y-1 text-sm">
      <span className="block font-medium text-ink">{label}</span>
      <select id={id} className={`${small} min-h-11`} value={value} onChange={(e) => onChange(e.target.value)}>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}

function Input({ id, label, value, onChange, type = 'text', hint }: { id: string; label: string; value: string; onChange: (v: string) => void; type?: string; hint?: string }) {
  return (
    <label htmlFor={id} className="space-y-1 text-sm">
      <span className="block font-medium text-ink">{label}</span>
      <input id={id} type={type} className={`${small} min-h-11`} value={value} onChange={(e) => onChange(e.target.value)} inputMode={type === 'number' ? 'decimal' : undefined} aria-describedby={hint ? `${id}-hint` : undefined} />
      {hint && (
        <span id={`${id}-hint`} className="block text-sm text-ink-muted">
          {hint}
        </span>
      )}
    </label>
  );
}

export function ResearchWorkbench() {
  const [filters, setFilters] = useState<Filters>(EMPTY);
  const set = (k: keyof Filters) => (v: string) => setFilters((f) => ({ ...f, [k]: v }));
  const query = queryOf(filters);
  const { data: cohort, error: cohortError, isLoading } = useSWR(`/api/exports/cohort${query ? `?${query}` : ''}`, fetchJson(cohortSummarySchema), { keepPreviousData: true });

  const columns = useMemo<ColumnDef<Record<string, string | number | null>>[]>(
    () => PREVIEW_COLUMNS.map((c) => ({ id: c.id, header: c.header, accessorFn: (row) => row[c.id], cell: (info) => (info.getValue() === null ? '—' : String(info.getValue())) })),
    [],
  );
  const table = useReactTable({ data: cohort?.preview.rows ?? [], columns, getCoreRowModel: getCoreRowModel() });
  const link = (path: string, extra: Record<string, string>) => `${path}?${new URLSearchParams({ ...Object.fromEntries(new URLSearchParams(query)), ...extra }).toString()}`;

  return (
    <div className="space-y-6">
      <Card title="Choose a cohort">
        <form className="grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-3" onSubmit={(e) => e.preventDefault()} aria-describedby="cohort-count">
          <Select id="f-club" label="Club group" value={filters.clubGroup} onChange={set('clubGroup')} options={[['', 'All clubs'], ...CLUB_GROUPS.map((g) => [g, clubGroupLabels[g]] as [string, string])]} />
          <Select id="f-context" label="Session context" value={filters.context} onChange={set('context')} options={[['', 'All contexts'], ['lesson', 'Lesson'], ['practice', 'Practice'], ['on-course', 'On the course']]} />
          <Select id="f-hand" label="Handedness" value={filters.handedness} onChange={set('handedness')} options={[['', 'Both'], ['right', 'Right-handed'], ['left', 'Left-handed']]} />
          <Input id="f-from" label="Sessions from" type="date" value={filters.from} onChange={set('from')} />
          <Input id="f-to" label="Sessions to" type="date" value={filters.to} onChange={set('to')} />
          <Select id="f-partial" label="Partial swings (pitches, half swings)" value={filters.partial} onChange={set('partial')} options={[['include', 'Include'], ['exclude', 'Leave out'], ['only', 'Only partial swings']]} />
          <Select
            id="f-version"
            label="Analysis version"
            value={filters.algorithmVersion}
            onChange={set('algorithmVersion')}
            options={[['', 'Any version'], ...(cohort?.algorithmVersions ?? []).map((v) => [v, v] as [string, string]), ...(filters.algorithmVersion && !cohort?.algorithmVersions.includes(filters.algorithmVersion) ? [[filters.algorithmVersion, filters.algorithmVersion] as [string, string]] : [])]}
          />
          <Input id="f-score-min" label="Target score at least (%)" type="number" value={filters.scoreMin} onChange={set('scoreMin')} hint="Share of the target’s checks within tolerance." />
          <Input id="f-score-max" label="Target score at most (%)" type="number" value={filters.scoreMax} onChange={set('scoreMax')} />
        </form>
        <div className="mt-4 flex flex-wrap items-center gap-4">
          <p id="cohort-count" aria-live="polite" className="text-base font-semibold text-ink" data-testid="cohort-count">
            {cohortError ? `The filters could not be applied: ${cohortError instanceof ApiError ? Object.values(cohortError.fieldErrors).flat().join(' ') || cohortError.message : 'error'}` : cohort ? `${cohort.players} ${cohort.players === 1 ? 'player' : 'players'}, ${cohort.swings} ${cohort.swings === 1 ? 'swing' : 'swings'} (${cohort.rowsLong} rows in the long table)` : isLoading ? 'Counting…' : ''}
          </p>
          <Button variant="secondary" className="min-h-11" onClick={() => setFilters(EMPTY)}>
            Clear filters
          </Button>
        </div>
        {cohort?.smallCohort && (
          <p role="note" className="mt-3 rounded-md border border-band/40 bg-band-soft px-3 py-2 text-sm text-ink" data-testid="small-cohort-note">
            Fewer than {SMALL_COHORT_PLAYERS} players are in this cohort. With so few people, someone who knows the academy may recognise a player from
            the codes, weeks and age bands, and summary numbers say little about golfers in general. Widen the filters, or keep the
            table to yourself and report only pooled results.
          </p>
        )}
      </Card>

      <Card title="Preview">
        <p className="mb-3 text-sm text-ink-muted">The first {cohort?.preview.rows.length ?? 0} swings, a few columns of the wide table; the downloads hold every column.</p>
        {/* focusable so a keyboard can scroll the table sideways (WCAG 2.1.1) */}
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Preview table, scrolls sideways">
          <table className="min-w-full text-left text-sm" data-testid="preview-table">
            <caption className="sr-only">Preview of the cohort’s phase table, one row per swing</caption>
            <thead>
              {table.getHeaderGroups().map((g) => (
                <tr key={g.id} className="border-b border-surface-line">
                  {g.headers.map((h) => (
                    <th key={h.id} scope="col" className="whitespace-nowrap px-2 py-2 font-semibold text-ink">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-b border-surface-line/60">
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id} className="whitespace-nowrap px-2 py-2 tabular-nums text-ink">
                      {flexRender(c.column.columnDef.cell, c.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
              {table.getRowModel().rows.length === 0 && (
                <tr>
                  <td colSpan={PREVIEW_COLUMNS.length} className="px-2 py-4 text-ink-muted">
                    No swings match these filters.
                  </td>
                </tr>
              )}
            </tbody>
          </table>
        </div>
      </Card>

      <Card title="Downloads">
        <p className="mb-3 text-sm text-ink">
          Long table: one row per swing, event or phase and measure (tidy data). Wide table: one row per swing. Both carry the processing
          parameters of every number. Each download is written to the export log.
        </p>
        <div className="flex flex-wrap gap-2">
          <a className={`${buttonClass('primary')} min-h-11`} href={link('/api/exports/phase-table', { format: 'csv', shape: 'long' })} download data-testid="download-long-csv">
            Long table (CSV)
          </a>
          <a className={`${buttonClass('secondary')} min-h-11`} href={link('/api/exports/phase-table', { format: 'csv', shape: 'wide' })} download>
            Wide table (CSV)
          </a>
          <a className={`${buttonClass('secondary')} min-h-11`} href={link('/api/exports/phase-table', { format: 'json', shape: 'long' })} download>
            Long table (JSON)
          </a>
          <a className={`${buttonClass('secondary')} min-h-11`} href={link('/api/exports/phase-table', { format: 'json', shape: 'wide' })} download>
            Wide table (JSON)
          </a>
          <a className={`${buttonClass('secondary')} min-h-11`} href="/api/exports/phase-table/codebook?format=csv&shape=long" download>
            Codebook, long (CSV)
          </a>
          <a className={`${buttonClass('secondary')} min-h-11`} href="/api/exports/phase-table/codebook?format=csv&shape=wide" download>
            Codebook, wide (CSV)
          </a>
        </div>
      </Card>

      <TokenPanel />
      <ExportLog />
    </div>
  );
}

function TokenPanel() {
  const { data, mutate } = useSWR('/api/tokens', fetchJson(tokenListSchema));
  const [name, setName] = useState('');
  const [fresh, setFresh] = useState<(TokenCreated & { name: string }) | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  async function create(e: React.FormEvent) {
    e.preventDefault();
    setFailure(null);
    try {
      const created = await sendJson('/api/tokens', 'POST', { name }, tokenCreatedSchema);
      setFresh({ ...created, name });
      setName('');
      await mutate();
    } catch (err) {
      setFailure(err instanceof ApiError ? (err.fieldErrors.name?.[0] ?? err.message) : 'Could not make the token.');
    }
  }

  async function revoke(id: number) {
    setFailure(null);
    try {
      await deleteJson(`/api/tokens/${id}`, tokenRevokedSchema);
      if (fresh?.id === id) setFresh(null);
      await mutate();
    } catch (err) {
      setFailure(err instanceof ApiError ? err.message : 'Could not revoke the token.');
    }
  }

  return (
    <Card title="Access tokens">
      <p className="mb-3 text-sm text-ink">
        A personal token lets a script download exports as you: send it as <code>Authorization: Bearer …</code>. It works on the export
        addresses only. It is shown once; we keep only a fingerprint of it.
      </p>
      <form onSubmit={create} className="flex flex-wrap items-end gap-2">
        <label htmlFor="token-name" className="space-y-1 text-sm">
          <span className="block font-medium text-ink">Token name</span>
          <input id="token-name" className={`${small} min-h-11 w-64`} value={name} onChange={(e) => setName(e.target.value)} placeholder="e.g. analysis laptop" />
        </label>
        <Button type="submit" className="min-h-11">
          Make a token
        </Button>
      </form>
      {failure && (
        <p role="alert" className="mt-2 text-sm font-medium text-danger">
          {failure}
        </p>
      )}
      {fresh && (
        <div role="status" className="mt-3 rounded-md border border-surface-line bg-surface-sunken p-3 text-sm text-ink">
          <p className="font-medium">Copy “{fresh.name}” now; it will not be shown again:</p>
          <code className="mt-1 block break-all" data-testid="new-token">
            {fresh.token}
          </code>
        </div>
      )}
      <ul className="mt-4 divide-y divide-surface-line text-sm">
        {(data?.tokens ?? []).map((t) => (
          <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <span className="font-medium">{t.name}</span> <code>{t.prefix}…</code> · made {when(t.createdAt)}
              {t.lastUsedAt ? ` · last used ${when(t.lastUsedAt)}` : ' · never used'}
              {t.revokedAt ? ` · revoked ${when(t.revokedAt)}` : ''}
            </span>
            {!t.revokedAt && (
              <Button variant="danger" className="min-h-11" onClick={() => revoke(t.id)} aria-label={`Revoke token ${t.name}`}>
                Revoke
              </Button>
            )}
          </li>
        ))}
        {data && data.tokens.length === 0 && <li className="py-2 text-ink-muted">No tokens yet.</li>}
      </ul>
    </Card>
  );
}

function ExportLog() {
  const { data } = useSWR('/api/exports/audit', fetchJson(exportAuditSchema), { refreshInterval: 5000 });
  return (
    <Card title="Export log">
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Export log, scrolls sideways">
        <table className="min-w-full text-left text-sm" data-testid="export-log">
          <caption className="sr-only">Your exports, newest first</caption>
          <thead>
            <tr className="border-b border-surface-line">
              {['When', 'How', 'Table', 'Filters', 'Players', 'Swings', 'Rows', 'State'].map((h) => (
                <th key={h} scope="col" className="px-2 py-2 font-semibold text-ink">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {(data?.entries ?? []).map((e) => (
              <tr key={e.id} className="border-b border-surface-line/60">
                <td className="whitespace-nowrap px-2 py-2">{when(e.createdAt)}</td>
                <td className="px-2 py-2">{e.token ? `token “${e.token}”` : 'signed in'}</td>
                <td className="px-2 py-2">
                  {e.shape} {e.format.toUpperCase()}
                </td>
                <td className="px-2 py-2">{Object.keys(e.filters).length ? Object.entries(e.filters).map(([k, v]) => `${k}=${v}`).join(', ') : 'none'}</td>
                <td className="px-2 py-2 tabular-nums">{e.players}</td>
                <td className="px-2 py-2 tabular-nums">{e.swings}</td>
                <td className="px-2 py-2 tabular-nums">{e.rows ?? '—'}</td>
                <td className="px-2 py-2">{e.status === 'completed' ? '✓ complete' : e.status === 'failed' ? '✗ broken off' : 'running'}</td>
              </tr>
            ))}
            {data && data.entries.length === 0 && (
              <tr>
                <td colSpan={8} className="px-2 py-4 text-ink-muted">
                  No exports yet.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
