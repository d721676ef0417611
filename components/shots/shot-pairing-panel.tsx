'use client';
// The session's launch-monitor shots beside its swings: import a shot log (our plain layout, a saved profile or a
// new one), see which shot went with which swing, and fix it: pair, unpair, or shift the clock difference.
import { useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Field, inputClass } from '@/components/ui/field';
import { ApiError, fetchJson, sendJson } from '@/lib/fetcher';
import {
  sessionShotsSchema,
  shotImportResultSchema,
  shotProfilesResponseSchema,
  shotUnitsResponseSchema,
  type SessionShots,
  type ShotImportResult,
  type UnitSystem,
} from '@/lib/contracts/shots';
import { formatOutcome, formatSigned, outcomeUnit } from './shot-format';

const fetchShots = fetchJson(sessionShotsSchema);
const fetchProfiles = fetchJson(shotProfilesResponseSchema);

const PAIRING_WORDS = { auto: 'Matched', manual: 'Set by you', unpaired: 'No swing' } as const;

function ImportForm({ sessionId, onDone }: { sessionId: number; onDone: (r: ShotImportResult) => void }) {
  const { data: saved } = useSWR('/api/shot-profiles', fetchProfiles);
  const [choice, setChoice] = useState('default');
  const [profileText, setProfileText] = useState('');
  const [saveAs, setSaveAs] = useState('');
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData();
    const file = (event.currentTarget.elements.namedItem('shot-file') as HTMLInputElement).files?.[0];
    if (!file) {
      setErrors({ file: ['Choose the shot log file (CSV or TSV).'] });
      return;
    }
    form.append('file', file);
    if (choice === 'json') {
      form.append('profile', profileText);
      if (saveAs.trim()) form.append('saveProfileAs', saveAs.trim());
    } else if (choice !== 'default') form.append('profileId', choice);
    setBusy(true);
    setErrors({});
    try {
      const res = await fetch(`/api/sessions/${sessionId}/shots`, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
      const body: unknown = await res.json().catch(() => null);
      if (!res.ok) {
        const err = body as { error?: { message?: string; fieldErrors?: Record<string, string[]> } } | null;
        setErrors(err?.error?.fieldErrors ?? { _form: [err?.error?.message ?? `The import failed (status ${res.status}).`] });
        return;
      }
      onDone(shotImportResultSchema.parse(body));
    } finally {
      setBusy(false);
    }
  }

  const fileErrors = errors.file ?? [];
  return (
    <form onSubmit={(e) => void submit(e)} className="space-y-4" aria-label="Import a shot log" data-testid="shot-import-form">
      <div className="grid gap-4 md:grid-cols-2">
        <Field id="shot-file" label="Shot log (CSV or TSV)" hint="One row per shot with its time; see “Shot logs” in the help for our plain layout.">
          <input id="shot-file" name="shot-file" type="file" accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values" className={`${inputClass} min-h-11`} aria-invalid={fileErrors.length > 0} />
        </Field>
        <Field id="shot-profile" label="Layout of the file">
          <select id="shot-profile" className={`${inputClass} min-h-11`} value={choice} onChange={(e) => setChoice(e.target.value)}>
            <option value="default">Our plain layout (shot_time, club, ball_speed_m_s, …)</option>
            {saved?.profiles.map((p) => (
              <option key={p.id} value={String(p.id)}>
                Saved: {p.name}
              </option>
            ))}
            <option value="json">Another layout: describe its columns…</option>
          </select>
        </Field>
      </div>
      {choice === 'json' && (
        <div className="grid gap-4 md:grid-cols-2">
          <Field id="shot-profile-json" label="Column mapping (shot profile JSON)" hint='e.g. {"delimiter":";","decimal":",","columns":{"time":"Time","carry":"Carry"},"units":{"carry":"yd"}}' error={errors.profile?.join(' ')}>
            <textarea id="shot-profile-json" rows={4} className={`${inputClass} font-mono`} value={profileText} onChange={(e) => setProfileText(e.target.value)} aria-invalid={!!errors.profile} />
          </Field>
          <Field id="shot-profile-name" label="Save this layout as (optional)" error={errors.saveProfileAs?.join(' ')}>
            <input id="shot-profile-name" className={`${inputClass} min-h-11`} value={saveAs} onChange={(e) => setSaveAs(e.target.value)} maxLength={80} />
          </Field>
        </div>
      )}
      {(fileErrors.length > 0 || errors._form || errors.profileId) && (
        <div role="alert" className="rounded-md border border-danger/30 bg-danger-soft p-3 text-sm text-danger" data-testid="shot-import-errors">
          <p className="font-semibold">The file was kept but could not be read:</p>
          <ul className="mt-1 list-disc pl-5">
            {[...fileErrors, ...(errors._form ?? []), ...(errors.profileId ?? [])].map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </div>
      )}
      <Button type="submit" disabled={busy} className="min-h-11">
        {busy ? 'Importing…' : 'Import shots'}
      </Button>
    </form>
  );
}

function OffsetBar({ view, sessionId, onChanged }: { view: SessionShots; sessionId: number; onChanged: (msg: string) => void }) {
  const imp = view.import!;
  const [text, setText] = useState(imp.offsetS === null ? '' : imp.offsetS.toFixed(2));
  const [error, setError] = useState<string | null>(null);
  async function send(body: unknown, what: string) {
    setError(null);
    try {
      const r = await sendJson(`/api/sessions/${sessionId}/shots`, 'PATCH', body, shotImportResultSchema);
      if (r.offsetS !== null) setText(r.offsetS.toFixed(2));
      onChanged(`${what}: ${r.matched} shots matched, ${r.unmatchedShots} without a swing, ${r.unmatchedSwings} swings without a shot.`);
    } catch (e) {
      setError(e instanceof ApiError ? (Object.values(e.fieldErrors).flat()[0] ?? e.message) : String(e));
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-3" data-testid="shot-offset">
      <Field id="shot-offset-input" label="Clock difference, seconds (launch monitor minus insoles)" error={error ?? undefined} hint={imp.autoOffsetS === null ? 'No clock difference was found: too few shots line up with swings.' : `Found from the gaps between shots: ${formatSigned(imp.autoOffsetS)} s.`}>
        <input id="shot-offset-input" inputMode="decimal" className={`${inputClass} min-h-11 w-40`} value={text} onChange={(e) => setText(e.target.value)} title="Clock offset added to the insoles' time to reach the launch monitor's" />
      </Field>
      <Button
        variant="secondary"
        className="min-h-11"
        onClick={() => {
          const v = Number(text.replace(',', '.'));
          if (text.trim() === '' || !Number.isFinite(v)) setError('Enter a number of seconds, e.g. 37.4 or -12.');
          else void send({ offsetS: v }, 'Shifted');
        }}
      >
        Shift to this
      </Button>
      <Button variant="secondary" className="min-h-11" onClick={() => void send({ refind: true }, 'Found again')}>
        Find it again
      </Button>
    </div>
  );
}

export function ShotPairingPanel({ sessionId, initial, canEdit }: { sessionId: number; initial: SessionShots; canEdit: boolean }) {
  const { data, mutate } = useSWR(`/api/sessions/${sessionId}/shots`, fetchShots, { fallbackData: initial });
  const view = data ?? initial;
  const [status, setStatus] = useState('');
  const [binned, setBinned] = useState(false);
  const [rowError, setRowError] = useState<string | null>(null);
  const units: UnitSystem = view.units;
  const numberOf = new Map(view.swings.map((s) => [s.id, s.number]));
  const pairedSwings = new Set(view.shots.map((s) => s.swingId).filter((v) => v !== null));
  const lonelySwings = view.swings.filter((s) => !pairedSwings.has(s.id));

  async function pair(shotId: number, swingId: number | null) {
    setRowError(null);
    try {
      await mutate(await sendJson(`/api/shots/${shotId}`, 'PATCH', { swingId }, sessionShotsSchema), { revalidate: false });
      setStatus(swingId === null ? 'Shot unpaired.' : `Shot paired with swing ${numberOf.get(swingId)}.`);
    } catch (e) {
      setRowError(e instanceof ApiError ? (Object.values(e.fieldErrors).flat()[0] ?? e.message) : String(e));
    }
  }

  async function setUnits(next: UnitSystem) {
    await sendJson('/api/me/shot-units', 'PATCH', { units: next }, shotUnitsResponseSchema);
    await mutate();
  }

  async function binLog() {
    await mutate(await sendJson(`/api/sessions/${sessionId}/shots`, 'DELETE', undefined, sessionShotsSchema), { revalidate: false });
    setBinned(true);
    setStatus('The shot log went to the bin.');
  }

  async function restoreLog() {
    await mutate(await sendJson(`/api/sessions/${sessionId}/shots/restore`, 'POST', undefined, sessionShotsSchema), { revalidate: false });
    setBinned(false);
    setStatus('The shot log is back.');
  }

  const unitSwitch = (
    <div role="group" aria-label="Units" className="flex gap-1">
      {(['metric', 'imperial'] as const).map((u) => (
        <button key={u} type="button" aria-pressed={units === u} onClick={() => void setUnits(u)} className={`min-h-11 rounded-md border px-3 text-sm ${units === u ? 'border-accent bg-accent text-white' : 'border-surface-line bg-surface text-ink'}`}>
          {u === 'metric' ? 'km/h · m' : 'mph · yd'}
        </button>
      ))}
    </div>
  );

  return (
    <Card title={`Shots from the launch monitor (${view.shots.length})`} action={view.import ? unitSwitch : undefined}>
      <div className="space-y-5" data-testid="shot-pairing">
        <p aria-live="polite" className="text-sm text-ink" data-testid="shot-status">
          {status}
        </p>
        {binned && canEdit && (
          <Button variant="secondary" className="min-h-11" onClick={() => void restoreLog()}>
            Restore the shot log
          </Button>
        )}
        {!view.import && !canEdit && <p className="text-sm text-ink-muted">No shots were imported for this session.</p>}
        {view.import && (
          <>
            <p className="text-sm text-ink-muted">
              {view.import.filename}: {view.shots.filter((s) => s.swingId !== null).length} of {view.shots.length} shots matched to a swing (within {view.import.toleranceS} s);{' '}
              {lonelySwings.length === 0 ? 'every swing has a shot.' : `swings without a shot: ${lonelySwings.map((s) => s.number).join(', ')}.`}
            </p>
            {canEdit && <OffsetBar key={`${view.import.id}-${view.import.offsetS}`} view={view} sessionId={sessionId} onChanged={(m) => { setStatus(m); void mutate(); }} />}
            {rowError && (
              <p role="alert" className="text-sm text-danger">
                {rowError}
              </p>
            )}
            <div className="overflow-x-auto">
              <table className="w-full text-left text-sm" data-testid="shot-table">
                <caption className="sr-only">Shots and the swing each one was paired with</caption>
                <thead className="text-ink-muted">
                  <tr>
                    <th scope="col" className="py-2 pr-3">Shot</th>
                    <th scope="col" className="py-2 pr-3">Time on the monitor</th>
                    <th scope="col" className="py-2 pr-3">Club</th>
                    <th scope="col" className="py-2 pr-3">Ball speed ({outcomeUnit('ball_speed', units)})</th>
                    <th scope="col" className="py-2 pr-3">Carry ({outcomeUnit('carry', units)})</th>
                    <th scope="col" className="py-2 pr-3">Offline ({outcomeUnit('offline', units)})</th>
                    <th scope="col" className="py-2 pr-3">Swing</th>
                    <th scope="col" className="py-2 pr-3">Pairing</th>
                  </tr>
                </thead>
                <tbody>
                  {view.shots.map((s) => (
                    <tr key={s.id} className="border-t border-surface-line" data-shot-index={s.index}>
                      <td className="py-1.5 pr-3">{s.index}</td>
                      <td className="py-1.5 pr-3 font-mono">{s.timeText}</td>
                      <td className="py-1.5 pr-3">{s.club ?? '–'}</td>
                      <td className="py-1.5 pr-3">{formatOutcome('ball_speed', s.ballSpeed, units)}</td>
                      <td className="py-1.5 pr-3">{formatOutcome('carry', s.carry, units)}</td>
                      <td className="py-1.5 pr-3">{formatOutcome('offline', s.offline, units)}</td>
                      <td className="py-1.5 pr-3">
                        {canEdit ? (
                          <select
                            aria-label={`Swing for shot ${s.index}`}
                            className={`${inputClass} min-h-11 w-32`}
                            value={s.swingId === null ? '' : String(s.swingId)}
                            onChange={(e) => void pair(s.id, e.target.value === '' ? null : Number(e.target.value))}
                          >
                            <option value="">No swing</option>
                            {view.swings.map((w) => (
                              <option key={w.id} value={String(w.id)}>
                                Swing {w.number}
                              </option>
                            ))}
                          </select>
                        ) : s.swingId !== null ? (
                          <a className="text-accent underline" href={`/swings/${s.swingId}`}>
                            Swing {numberOf.get(s.swingId)}
                          </a>
                        ) : (
                          '–'
                        )}
                      </td>
                      <td className="py-1.5 pr-3">
                        <Badge tone={s.pairing === 'unpaired' || s.swingId === null ? 'neutral' : s.pairing === 'manual' ? 'band' : 'ok'}>{s.swingId === null ? PAIRING_WORDS.unpaired : PAIRING_WORDS[s.pairing]}</Badge>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {canEdit && (
              <Button variant="danger" className="min-h-11" onClick={() => void binLog()}>
                Delete the shot log (to the bin)
              </Button>
            )}
          </>
        )}
        {canEdit && (
          <details open={!view.import} className="rounded-md border border-surface-line p-3">
            <summary className="flex min-h-11 cursor-pointer items-center text-sm font-medium text-ink">{view.import ? 'Import another shot log (replaces this one; the old one goes to the bin)' : 'Import a shot log'}</summary>
            <div className="mt-3">
              <ImportForm
                sessionId={sessionId}
                onDone={(r) => {
                  setStatus(`Imported ${r.imported} shots: ${r.matched} matched, ${r.unmatchedShots} without a swing, ${r.unmatchedSwings} swings without a shot.`);
                  setBinned(false);
                  void mutate();
                }}
              />
            </div>
          </details>
        )}
      </div>
    </Card>
  );
}
