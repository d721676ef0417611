'use client';
// A player's research consent (PUT /api/athletes/:id/consent): yes or no to research use, the guardian's consent for
// sessions before the adult age, and the history of every decision (who, when, in which role).
import { useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import { ApiError, fetchJson, sendJson } from '@/lib/fetcher';
import { consentResponseSchema, type ConsentResponse } from '@/lib/contracts/research';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' }) + ' UTC';

export function ConsentPanel({ athleteId, self = false }: { athleteId: number; self?: boolean }) {
  const url = `/api/athletes/${athleteId}/consent`;
  const { data, error, mutate } = useSWR(url, fetchJson(consentResponseSchema));
  const [saving, setSaving] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  async function save(body: { research: boolean; guardianConsent?: boolean }, done: string) {
    setSaving(true);
    setMessage(null);
    setFailure(null);
    try {
      const next: ConsentResponse = await sendJson(url, 'PUT', body, consentResponseSchema);
      await mutate(next, { revalidate: false });
      setMessage(done);
    } catch (e) {
      setFailure(e instanceof ApiError ? e.message : 'Could not save the consent.');
    } finally {
      setSaving(false);
    }
  }

  if (error) return <p className="text-sm text-danger">Could not load the consent: {error.message}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading consent…</p>;
  const who = self ? 'your' : 'this player’s';
  return (
    <div className="space-y-4 text-sm text-ink">
      <p>
        Researchers of the academy may use {who} swing numbers only with consent, under a code instead of a name, with
        an age band instead of the date of birth and the week instead of the date. Consent can be withdrawn at any
        time; it then applies to every later export at once.
      </p>
      <p aria-live="polite" className="font-medium" data-testid="consent-state">
        {data.research ? '✓ Research use: yes' : '✗ Research use: no'}
        {data.research && data.guardianNeeded && (data.guardianConsent ? ' · guardian’s consent recorded' : ' · guardian’s consent still needed')}
        {` · ${data.sessionsIncluded} of ${data.sessionsTotal} sessions can be shared`}
      </p>
      {data.guardianNeeded && (
        <p role="note" className="rounded-md border border-band/40 bg-band-soft px-3 py-2 text-sm">
          Some sessions were recorded before age {data.adultAge}, or the date of birth is missing: those sessions also need a
          parent’s or guardian’s consent. The age follows your academy’s setting; defer to local rules and to the study’s
          ethics approval.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {data.research ? (
          <Button variant="danger" className="min-h-11" disabled={saving} onClick={() => save({ research: false }, 'Consent withdrawn.')}>
            Withdraw research consent
          </Button>
        ) : (
          <Button className="min-h-11" disabled={saving} onClick={() => save({ research: true }, 'Consent recorded.')}>
            Record research consent
          </Button>
        )}
        {data.research && data.guardianNeeded && !data.guardianConsent && !self && (
          <Button variant="secondary" className="min-h-11" disabled={saving} onClick={() => save({ research: true, guardianConsent: true }, 'Guardian’s consent recorded.')}>
            Record guardian’s consent
          </Button>
        )}
      </div>
      {message && <p role="status" className="text-sm text-ink">{message}</p>}
      {failure && <p role="alert" className="text-sm font-medium text-danger">{failure}</p>}
      {data.history.length > 0 && (
        <details>
          <summary className="min-h-11 cursor-pointer py-2 font-medium">History ({data.history.length})</summary>
          <ul className="mt-2 space-y-1">
            {data.history.map((h) => (
              <li key={h.id}>
                {when(h.recordedAt)}: {h.research ? 'yes' : 'no'}
                {h.guardianConsent ? ', guardian’s consent' : ''} — recorded by {h.recordedBy ?? 'a removed account'} ({h.recordedByRole})
              </li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}
