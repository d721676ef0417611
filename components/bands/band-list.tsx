'use client';
// The bands the coach can use: their own and those shared in the academy. The coach who built a band can rename it,
// share it or stop sharing, and delete it (asks first; to the bin for 30 days, with Undo).
import { useState } from 'react';
import { mutate } from 'swr';
import { formatDate } from '@/components/ui/format';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { BIN_DAYS } from '@/lib/contracts/sessions';
import { bandBinnedResponseSchema, bandPatchSchema, bandResponseSchema, type BandSummary } from '@/lib/contracts/bands';
import { useBandList } from './band-overlay';

const BANDS_URL = '/api/bands';

function BandEdit({ band, onDone }: { band: BandSummary; onDone: () => void }) {
  const [name, setName] = useState(band.name);
  const [shared, setShared] = useState(band.shared);
  const [error, setError] = useState<string | null>(null);
  async function save() {
    const parsed = bandPatchSchema.safeParse({ name, shared });
    if (!parsed.success) return setError(`Name: ${parsed.error.issues[0].message}`);
    try {
      await sendJson(`${BANDS_URL}/${band.id}`, 'PATCH', parsed.data, bandResponseSchema);
      await mutate(BANDS_URL);
      onDone();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not save the band.');
    }
  }
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={`band-name-${band.id}`} className="sr-only">
        Band name
      </label>
      <input id={`band-name-${band.id}`} value={name} onChange={(e) => setName(e.target.value)} className={`${inputClass} w-auto`} aria-invalid={error ? true : undefined} />
      <label className="inline-flex min-h-11 items-center gap-1.5">
        <input type="checkbox" checked={shared} onChange={(e) => setShared(e.target.checked)} /> Shared with the academy’s coaches
      </label>
      <Button type="button" onClick={() => void save()}>
        Save
      </Button>
      <Button type="button" variant="secondary" onClick={onDone}>
        Cancel
      </Button>
      {error && (
        <p role="alert" className="basis-full text-sm text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

export function BandList({ viewerId }: { viewerId: number }) {
  const { data, error } = useBandList();
  const [editing, setEditing] = useState<number | null>(null);
  const [undo, setUndo] = useState<{ id: number; name: string } | null>(null);
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the bands: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  async function remove(b: BandSummary) {
    await sendJson(`${BANDS_URL}/${b.id}`, 'DELETE', undefined, bandBinnedResponseSchema);
    await mutate(BANDS_URL);
    setUndo({ id: b.id, name: b.name });
  }
  async function restore(id: number) {
    await sendJson(`${BANDS_URL}/${id}/restore`, 'POST', undefined, bandResponseSchema);
    await mutate(BANDS_URL);
  }
  return (
    <>
      {undo && <UndoLine message={`“${undo.name}” moved to the bin.`} onUndo={() => restore(undo.id)} onDismiss={() => setUndo(null)} />}
      {data.bands.length === 0 ? (
        <p className="text-sm text-ink-muted">No bands yet. Pick three or more swings above.</p>
      ) : (
        <table className="w-full text-left text-sm" data-testid="band-list">
          <thead className="text-ink-muted">
            <tr>
              <th className="py-1 font-medium">Name</th>
              <th className="py-1 font-medium">Swings</th>
              <th className="py-1 font-medium">
                <abbr title="mean ± k standard deviations of the chosen swings" className="no-underline">Width</abbr>
              </th>
              <th className="py-1 font-medium">Made by</th>
              <th className="py-1 font-medium">Built</th>
              <th className="py-1 font-medium"><span className="sr-only">Shared</span></th>
              <th className="py-1 font-medium"><span className="sr-only">Change</span></th>
            </tr>
          </thead>
          <tbody>
            {data.bands.map((b) => (
              <tr key={b.id} className="border-t border-surface-line align-top">
                <td className="py-1.5 font-medium">{editing === b.id ? <BandEdit band={b} onDone={() => setEditing(null)} /> : b.name}</td>
                <td className="py-1.5 tabular-nums">{b.swingCount}</td>
                <td className="py-1.5" title={`mean ± ${b.k} SD`}>
                  typical spread × {b.k}
                </td>
                <td className="py-1.5">{b.ownerName ?? '—'}</td>
                <td className="py-1.5">{formatDate(b.createdAt.slice(0, 10))}</td>
                <td className="py-1.5">{b.shared && <Badge tone="band">Shared</Badge>}</td>
                <td className="py-1.5">
                  {b.ownerUserId === viewerId && editing !== b.id && (
                    <div className="flex flex-wrap justify-end gap-2">
                      <Button type="button" variant="secondary" aria-label={`Edit ${b.name}`} onClick={() => setEditing(b.id)}>
                        Edit
                      </Button>
                      <ConfirmButton
                        label="Delete…"
                        accessibleLabel={`Delete ${b.name}`}
                        question={`Delete the band “${b.name}”? It goes to the bin: you can undo for ${BIN_DAYS} days.`}
                        confirmLabel="Move to bin"
                        onConfirm={() => remove(b)}
                      />
                    </div>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
