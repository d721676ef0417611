'use client';

import type { ReactNode } from 'react';
import { Field, inputClass } from '@/components/ui/field';
import { contextLabels, formatDate } from '@/components/ui/format';
import { STANCE_WIDTH_MAX_MM, STANCE_WIDTH_MIN_MM } from '@/lib/contracts/athletes';
import type { PracticeSession } from '@/lib/contracts/athletes';
import type { LayoutChoice, OptionErrors, UploadOptionsState } from './upload-options';

export type SavedProfile = { id: number; name: string };

function readText(file: File | undefined, set: (value: { name: string; text: string } | null) => void) {
  if (!file) return set(null);
  void file.text().then((text) => set({ name: file.name, text }));
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="min-w-0 space-y-4">
      <legend className="mb-1 text-sm font-semibold uppercase tracking-wide text-ink-muted">{title}</legend>
      {children}
    </fieldset>
  );
}

const selectClass = inputClass;
const fileInputClass =
  'block w-full text-sm text-ink-muted file:mr-3 file:rounded-md file:border file:border-surface-line file:bg-surface file:px-3 file:py-1.5 file:text-sm file:font-medium file:text-ink hover:file:bg-surface-sunken';

export function UploadOptionsForm({
  value,
  onChange,
  errors,
  sessions,
  profiles,
  disabled,
  athlete,
  sessionExtra,
}: {
  value: UploadOptionsState;
  onChange: (next: UploadOptionsState) => void;
  errors: OptionErrors;
  sessions: PracticeSession[];
  profiles: SavedProfile[];
  disabled?: boolean;
  /** the player's profile: used only where the file does not say */
  athlete?: { handedness: 'right' | 'left'; stanceWidthMm: number };
  /** under the session choice: the upload page puts its "new session" form here */
  sessionExtra?: ReactNode;
}) {
  const set = <K extends keyof UploadOptionsState>(key: K, v: UploadOptionsState[K]) => onChange({ ...value, [key]: v });
  const invalid = (key: keyof OptionErrors) => (errors[key] ? { 'aria-invalid': true, 'aria-describedby': `${key}-error` } : {});
  return (
    <div className="space-y-6" data-testid="upload-options">
      <Section title="Session">
        <Field id="sessionId" label="Add the files to" error={errors.sessionId}>
          <select id="sessionId" className={selectClass} disabled={disabled} value={value.sessionId} onChange={(e) => set('sessionId', e.target.value)} {...invalid('sessionId')}>
            <option value="">A new practice session today</option>
            {sessions.map((s) => (
              <option key={s.id} value={String(s.id)}>
                {formatDate(s.sessionDate)} · {contextLabels[s.context]}
                {s.location ? ` · ${s.location}` : ''}
              </option>
            ))}
          </select>
        </Field>
        {sessionExtra}
      </Section>

      <Section title="Reading the file">
        <Field id="layout" label="Sensor layout" hint="Where each sensor sits under the foot. Leave it to the file when its header names a layout." error={errors.layout}>
          <select
            id="layout"
            className={selectClass}
            disabled={disabled}
            value={value.layoutChoice}
            onChange={(e) => onChange({ ...value, layoutChoice: e.target.value as LayoutChoice })}
            {...invalid('layout')}
          >
            <option value="">As named in the file</option>
            <option value="pair-8">pair-8 · 8 sensors per foot</option>
            <option value="pair-16">pair-16 · 16 sensors per foot</option>
            <option value="file">A layout file (JSON)…</option>
          </select>
        </Field>
        {value.layoutChoice === 'file' && (
          <div className="space-y-1">
            <input
              type="file"
              accept=".json,application/json"
              aria-label="Layout file"
              data-testid="layout-file"
              disabled={disabled}
              className={fileInputClass}
              onChange={(e) => readText(e.target.files?.[0], (f) => set('layoutFile', f))}
            />
            {value.layoutFile && <p className="text-sm text-ink-muted">Using {value.layoutFile.name}</p>}
          </div>
        )}

        <Field id="profile" label="Import profile" hint="Only for files that are not in recording format 1: which column holds time and each sensor." error={errors.profile ?? errors.profileId}>
          <select id="profile" className={selectClass} disabled={disabled} value={value.profileChoice} onChange={(e) => set('profileChoice', e.target.value)} {...invalid('profile')}>
            <option value="">None (recording format 1)</option>
            {profiles.map((p) => (
              <option key={p.id} value={String(p.id)}>
                Saved: {p.name}
              </option>
            ))}
            <option value="file">A profile file (JSON)…</option>
          </select>
        </Field>
        {value.profileChoice === 'file' && (
          <div className="space-y-3">
            <input
              type="file"
              accept=".json,application/json"
              aria-label="Profile file (JSON)"
              data-testid="profile-file"
              disabled={disabled}
              className={fileInputClass}
              onChange={(e) => readText(e.target.files?.[0], (f) => set('profileFile', f))}
            />
            {value.profileFile && <p className="text-sm text-ink-muted">Using {value.profileFile.name}</p>}
            <Field id="saveProfileAs" label="Save this profile as (optional)" hint="Saved profiles are yours and can be picked on later uploads." error={errors.saveProfileAs}>
              <input id="saveProfileAs" className={inputClass} disabled={disabled} value={value.saveProfileAs} maxLength={80} onChange={(e) => set('saveProfileAs', e.target.value)} {...invalid('saveProfileAs')} />
            </Field>
          </div>
        )}
      </Section>

      <Section title="Processing">
        <div className="space-y-1.5">
          <span className="block text-sm font-medium text-ink">Plays</span>
          <div className="flex gap-6 text-sm">
            {(['', 'right', 'left'] as const).map((h) => (
              <label key={h || 'file'} className="inline-flex items-center gap-2">
                <input type="radio" name="handedness" value={h} disabled={disabled} checked={value.handedness === h} onChange={() => set('handedness', h)} />
                {h === 'right' ? 'Right-handed' : h === 'left' ? 'Left-handed' : `As the file says${athlete ? ` (else ${athlete.handedness}-handed, from the profile)` : ''}`}
              </label>
            ))}
          </div>
          {errors.handedness && <p className="text-sm font-medium text-danger">{errors.handedness}</p>}
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field id="stanceWidthMm" label="Stance width (mm)" hint={`Leave empty to use the file's own value, else the player's profile${athlete ? ` (${athlete.stanceWidthMm} mm)` : ''}; ${STANCE_WIDTH_MIN_MM}-${STANCE_WIDTH_MAX_MM} mm.`} error={errors.stanceWidthMm}>
            <input
              id="stanceWidthMm"
              type="number"
              inputMode="numeric"
              className={inputClass}
              disabled={disabled}
              value={value.stanceWidthMm}
              placeholder="from the file"
              onChange={(e) => set('stanceWidthMm', e.target.value)}
              {...invalid('stanceWidthMm')}
            />
          </Field>
          <Field id="cutoffHz" label="Filter cutoff (Hz)" hint="Low-pass of the zero-lag filter; 20 Hz unless you have a reason." error={errors.cutoffHz}>
            <input
              id="cutoffHz"
              type="number"
              inputMode="decimal"
              step="any"
              className={inputClass}
              disabled={disabled}
              value={value.cutoffHz}
              onChange={(e) => set('cutoffHz', e.target.value)}
              {...invalid('cutoffHz')}
            />
          </Field>
        </div>
      </Section>
    </div>
  );
}
