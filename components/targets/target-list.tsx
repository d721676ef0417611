'use client';
// Targets per club group: the academy defaults (common practice), the coach's own and those for one player.
import { useState } from 'react';
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { fetchJson } from '@/lib/fetcher';
import { clubGroupLabels, clubGroups, eventLabels, measureLabels, targetsResponseSchema, type Target } from '@/lib/contracts/targets';
import { TARGETS_URL, TargetForm } from './target-form';

const fetchTargets = fetchJson(targetsResponseSchema);

export function TargetList({ athletes, canEdit }: { athletes: { id: number; displayName: string }[]; canEdit: boolean }) {
  const { data, error } = useSWR(TARGETS_URL, fetchTargets, { revalidateOnFocus: false });
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the targets: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  const playerName = (id: number | null) => (id == null ? null : athletes.find((a) => a.id === id)?.displayName ?? `player ${id}`);
  return (
    <div className="space-y-6" data-testid="target-list">
      {canEdit && (editing === 'new' ? <TargetForm athletes={athletes} onDone={() => setEditing(null)} /> : <Button onClick={() => setEditing('new')}>New target</Button>)}
      {clubGroups.map((g) => {
        const list = data.targets.filter((t) => t.clubGroup === g);
        return (
          <section key={g}>
            <h2 className="mb-2 text-base font-semibold text-ink">{clubGroupLabels[g]}</h2>
            {list.length === 0 && <p className="text-sm text-ink-muted">No target for this club group.</p>}
            <div className="grid gap-3 lg:grid-cols-2">
              {list.map((t) =>
                editing === t.id ? (
                  <TargetForm key={t.id} target={t} athletes={athletes} onDone={() => setEditing(null)} />
                ) : (
                  <TargetCard key={t.id} target={t} player={playerName(t.athleteId)} onEdit={canEdit ? () => setEditing(t.id) : undefined} />
                ),
              )}
            </div>
          </section>
        );
      })}
    </div>
  );
}

function TargetCard({ target: t, player, onEdit }: { target: Target; player: string | null; onEdit?: () => void }) {
  return (
    <article className="rounded-md border border-surface-line p-4" data-target={t.id}>
      <header className="mb-2 flex flex-wrap items-center gap-2">
        <h3 className="font-semibold text-ink">{t.name}</h3>
        {t.commonPractice && <Badge tone="band">Common practice</Badge>}
        {t.isDefault && <Badge>Academy default</Badge>}
        {player && <Badge tone="lead">For {player}</Badge>}
        {onEdit && <Button variant="secondary" className="ml-auto px-2 py-1 text-sm" onClick={onEdit}>{t.isDefault ? 'Copy and edit' : 'Edit'}</Button>}
      </header>
      {t.description && <p className="mb-2 text-sm text-ink-muted">{t.description}</p>}
      <table className="w-full text-sm">
        <tbody>
          {t.checks.map((c, i) => (
            <tr key={i} className="border-t border-surface-line">
              <td className="py-1 pr-2">{eventLabels[c.event]}</td>
              <td className="py-1 pr-2">{measureLabels[c.measure]}</td>
              <td className="py-1 text-right tabular-nums">{c.expected} ± {c.tolerance}</td>
            </tr>
          ))}
          {t.tempo && (
            <tr className="border-t border-surface-line"><td className="py-1 pr-2">Swing</td><td className="py-1 pr-2">Tempo</td><td className="py-1 text-right tabular-nums">{t.tempo.min}–{t.tempo.max}</td></tr>
          )}
        </tbody>
      </table>
    </article>
  );
}
