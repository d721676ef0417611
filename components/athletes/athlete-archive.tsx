'use client';
// Archive a player (coach): they leave the roster and every pick list; sessions, swings, notes and drills are kept
// and the player's page still opens. Nothing is lost, so archive asks once and restore is always there: on the
// player's page and in the roster's "Archived players" list (with Undo right after archiving).
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import useSWR, { mutate as mutateKey } from 'swr';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { formatDate } from '@/components/ui/format';
import { fetchJson, sendJson } from '@/lib/fetcher';
import { athleteListResponseSchema, athleteResponseSchema, type AthleteSummary } from '@/lib/contracts/athletes';

const ARCHIVED_URL = '/api/athletes?archived=true';

/** Restore, then refresh every cached athlete list (the roster's filtered views and the archived list). */
async function restoreAthlete(id: number) {
  await sendJson(`/api/athletes/${id}/restore`, 'POST', undefined, athleteResponseSchema);
  await mutateKey((key) => typeof key === 'string' && key.startsWith('/api/athletes'));
}

const useArchived = () => useSWR(ARCHIVED_URL, fetchJson(athleteListResponseSchema));

/** The Undo line at the top of the roster right after archiving a player. */
export function ArchiveUndo({ justArchived }: { justArchived: number | null }) {
  const router = useRouter();
  const { data } = useArchived();
  const [open, setOpen] = useState(justArchived !== null);
  const just = data?.athletes.find((a) => a.id === justArchived);
  if (!open || !just) return null;
  return (
    <UndoLine
      message={`${just.displayName} archived: off the roster, everything kept.`}
      onUndo={async () => {
        await restoreAthlete(just.id);
        router.refresh();
      }}
      onDismiss={() => setOpen(false)}
    />
  );
}

export function ArchiveAthlete({ athlete }: { athlete: AthleteSummary }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  if (athlete.archivedAt) {
    return (
      <div role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-surface-line bg-surface-sunken px-3 py-2 text-sm" data-testid="archived-note">
        <span>Archived on {formatDate(athlete.archivedAt.slice(0, 10))}: off your roster, everything kept.</span>
        <Button
          type="button"
          variant="secondary"
          onClick={async () => {
            try {
              await restoreAthlete(athlete.id);
              router.refresh();
            } catch (e) {
              setError(e instanceof Error ? e.message : 'Could not restore the player.');
            }
          }}
        >
          Back to the roster
        </Button>
        {error && <span role="alert" className="font-medium text-danger">{error}</span>}
      </div>
    );
  }
  return (
    <ConfirmButton
      label="Archive player…"
      question={`Archive ${athlete.displayName}? They leave your roster and pick lists; every session, swing, note and drill is kept, and you can bring them back at any time from the roster.`}
      confirmLabel="Archive"
      onConfirm={async () => {
        await sendJson(`/api/athletes/${athlete.id}`, 'DELETE', undefined, athleteResponseSchema);
        router.push(`/roster?archived=${athlete.id}`);
      }}
    />
  );
}

/** The roster's list of archived players, each with a way back (open right after an archive). */
export function ArchivedPlayers({ justArchived }: { justArchived: number | null }) {
  const router = useRouter();
  const { data } = useArchived();
  const [error, setError] = useState<string | null>(null);
  const archived = data?.athletes ?? [];
  const just = archived.find((a) => a.id === justArchived);
  async function restore(id: number) {
    setError(null);
    try {
      await restoreAthlete(id);
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not restore the player.');
    }
  }
  if (archived.length === 0) return null;
  return (
    <section aria-labelledby="archived-players" className="mt-6 space-y-2" data-testid="archived-players">
      <details open={just !== undefined}>
        <summary id="archived-players" className="min-h-11 cursor-pointer py-2 text-sm font-medium text-ink">
          Archived players ({archived.length})
        </summary>
        <ul className="divide-y divide-surface-line text-sm">
          {archived.map((a) => (
            <li key={a.id} className="flex flex-wrap items-center gap-3 py-2">
              <Link href={`/athletes/${a.id}`} className="font-medium text-accent underline">
                {a.displayName}
              </Link>
              <span className="text-ink-muted">archived {formatDate((a.archivedAt ?? '').slice(0, 10))}</span>
              <Button type="button" variant="secondary" aria-label={`Bring ${a.displayName} back to the roster`} onClick={() => void restore(a.id)}>
                Back to the roster
              </Button>
            </li>
          ))}
        </ul>
      </details>
      {error && <p role="alert" className="text-sm font-medium text-danger">{error}</p>}
    </section>
  );
}
