'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useRef, useState } from 'react';
import { Button, buttonClass } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { SessionForm } from '@/components/sessions/session-form';
import { type PracticeSession } from '@/lib/contracts/athletes';
import { errorResponseSchema } from '@/lib/contracts/errors';
import { uploadResponseSchema } from '@/lib/contracts/recordings';
import { DropZone } from './drop-zone';
import { UploadItem, type QueuedFile } from './upload-item';
import { checkUploadOptions, toUploadFields, type OptionErrors, type UploadOptionsState } from './upload-options';
import { UploadOptionsForm, type SavedProfile } from './upload-options-form';
import { postFormWithProgress } from './xhr-upload';

export type UploadAthlete = { id: number; displayName: string; handedness: 'right' | 'left'; stanceWidthMm: number };

const optionFields = new Set(['sessionId', 'layout', 'profile', 'profileId', 'saveProfileAs', 'handedness', 'stanceWidthMm', 'cutoffHz']);

/**
 * The upload page's client side: athlete and session, options (defaults from the athlete's profile), the drop zone,
 * and one row per file. Files go one request each, in order, so each has its own byte progress; the first one
 * creates the session when none was chosen and the rest join it.
 */
export function UploadWorkbench({
  athletes,
  athlete,
  sessions,
  initialSessionId,
  profiles,
  defaultCutoffHz,
}: {
  athletes: UploadAthlete[];
  athlete: UploadAthlete;
  sessions: PracticeSession[];
  initialSessionId: number | null;
  profiles: SavedProfile[];
  defaultCutoffHz: number;
}) {
  const router = useRouter();
  const [options, setOptions] = useState<UploadOptionsState>({
    sessionId: initialSessionId ? String(initialSessionId) : '',
    layoutChoice: '',
    layoutFile: null,
    profileChoice: '',
    profileFile: null,
    saveProfileAs: '',
    handedness: '',
    stanceWidthMm: '',
    cutoffHz: String(defaultCutoffHz),
  });
  const [errors, setErrors] = useState<OptionErrors>({});
  const [items, setItems] = useState<QueuedFile[]>([]);
  const [busy, setBusy] = useState(false);
  const [doneSessionId, setDoneSessionId] = useState<number | null>(null);
  const counter = useRef(0);
  // A session made here shows in the list at once; the server's list follows with the refresh.
  const [made, setMade] = useState<PracticeSession[]>([]);
  const [creating, setCreating] = useState(false);
  const allSessions = [...made.filter((m) => !sessions.some((s) => s.id === m.id)), ...sessions];

  const update = (key: string, patch: Partial<QueuedFile>) => setItems((list) => list.map((it) => (it.key === key ? { ...it, ...patch } : it)));

  const addFiles = (files: File[]) =>
    setItems((list) => [...list, ...files.map((file) => ({ key: `f${counter.current++}`, file, state: 'pending' as const, sentBytes: 0 }))]);

  const pending = items.filter((it) => it.state === 'pending');

  async function uploadAll() {
    const problems = checkUploadOptions(athlete.id, options);
    setErrors(problems ?? {});
    if (problems) return;
    setBusy(true);
    let sessionId = options.sessionId;
    for (const item of pending) {
      update(item.key, { state: 'uploading', sentBytes: 0, message: undefined });
      const form = new FormData();
      for (const [k, v] of Object.entries(toUploadFields(athlete.id, { ...options, sessionId }))) form.append(k, v);
      form.append('file', item.file, item.file.name);
      const size = item.file.size;
      try {
        // The body is the fields plus the file; the file's share of the sent bytes is shown against its own size.
        const { status, body } = await postFormWithProgress('/api/recordings', form, (p) =>
          update(item.key, { sentBytes: p.total > 0 ? Math.min(size, Math.round((p.loaded / p.total) * size)) : 0 }),
        ).done;
        if (status === 202) {
          const recording = uploadResponseSchema.parse(body).recordings[0];
          update(item.key, { state: 'stored', sentBytes: size, recordingId: recording.id, duplicate: recording.duplicate ?? false });
          if (!sessionId) sessionId = String(recording.sessionId);
          continue;
        }
        const parsed = errorResponseSchema.safeParse(body);
        const message = parsed.success ? parsed.data.error.message : `The server answered ${status}.`;
        const fieldErrors = parsed.success ? (parsed.data.error.fieldErrors ?? {}) : {};
        const onOptions = Object.entries(fieldErrors).filter(([k]) => optionFields.has(k));
        if (onOptions.length > 0) {
          // A problem with the options applies to every file: show it on its field and stop here.
          setErrors(Object.fromEntries(onOptions.map(([k, m]) => [k, m[0]])));
          update(item.key, { state: 'pending', sentBytes: 0 });
          break;
        }
        const detail = Object.values(fieldErrors).flat()[0];
        update(item.key, { state: 'rejected', message: detail ? `${message} ${detail}` : message });
      } catch (error) {
        update(item.key, { state: 'rejected', message: (error as Error).message });
      }
    }
    setBusy(false);
    if (sessionId) {
      setDoneSessionId(Number(sessionId));
      if (sessionId !== options.sessionId) {
        // A session was created: keep adding to it, and let the server list it among the athlete's sessions.
        setOptions((o) => ({ ...o, sessionId }));
        router.replace(`/upload?athlete=${athlete.id}&session=${sessionId}`, { scroll: false });
        router.refresh();
      }
    }
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
      <div className="space-y-6 rounded-lg border border-surface-line bg-surface p-5">
        <Field id="athlete" label="Athlete">
          <select
            id="athlete"
            className={inputClass}
            disabled={busy}
            value={String(athlete.id)}
            onChange={(e) => router.push(`/upload?athlete=${e.target.value}`)}
          >
            {athletes.map((a) => (
              <option key={a.id} value={String(a.id)}>
                {a.displayName}
              </option>
            ))}
          </select>
        </Field>
        <UploadOptionsForm
          value={options}
          onChange={setOptions}
          errors={errors}
          sessions={allSessions}
          profiles={profiles}
          disabled={busy}
          athlete={athlete}
          sessionExtra={
            creating ? (
              <div className="rounded-md border border-surface-line p-3">
                <SessionForm
                  athleteId={athlete.id}
                  idPrefix="new-session"
                  onCancel={() => setCreating(false)}
                  onSaved={(saved) => {
                    const { binnedAt: _b, restorableUntil: _r, ...session } = saved;
                    setMade((list) => [session, ...list]);
                    setOptions((o) => ({ ...o, sessionId: String(saved.id) }));
                    setCreating(false);
                    router.replace(`/upload?athlete=${athlete.id}&session=${saved.id}`, { scroll: false });
                    router.refresh();
                  }}
                />
              </div>
            ) : (
              <Button type="button" variant="secondary" className="min-h-11" disabled={busy} onClick={() => setCreating(true)} data-testid="new-session">
                New session…
              </Button>
            )
          }
        />
      </div>

      <div className="space-y-4">
        <DropZone onFiles={addFiles} disabled={busy} />
        {errors._form && (
          <p role="alert" className="text-sm text-danger">
            {errors._form}
          </p>
        )}
        {items.length > 0 && (
          <section className="rounded-lg border border-surface-line bg-surface px-5 py-2">
            <ul className="divide-y divide-surface-line" data-testid="upload-list">
              {items.map((item) => (
                <UploadItem key={item.key} item={item} onRemove={busy ? undefined : () => setItems((l) => l.filter((it) => it.key !== item.key))} />
              ))}
            </ul>
          </section>
        )}
        <div className="flex flex-wrap items-center gap-3">
          <Button type="button" onClick={uploadAll} disabled={busy || pending.length === 0}>
            {busy ? 'Uploading…' : pending.length === 0 ? 'Add files to upload' : pending.length === 1 ? 'Upload 1 file' : `Upload ${pending.length} files`}
          </Button>
          {doneSessionId !== null && (
            <Link href={`/sessions/${doneSessionId}`} className={buttonClass('secondary')} data-testid="open-session">
              Open the session
            </Link>
          )}
        </div>
      </div>
    </div>
  );
}
