// Where the golfer's handedness and stance width came from (form > file > athlete profile > default), and both
// values when the file and the profile disagree, so nothing is overridden silently.
type Source = 'option' | 'file' | 'fallback' | 'default';
type Entry = { used: string | number; source: Source; file: string | number | null; fallback: string | number | null };

const FROM: Record<Source, string> = {
  option: 'chosen at upload',
  file: 'from the file',
  fallback: 'from the player’s profile',
  default: 'the default',
};

function isEntry(v: unknown): v is Entry {
  return typeof v === 'object' && v !== null && 'used' in v && 'source' in v;
}

const LABEL = { handedness: 'Plays', stanceWidthMm: 'Stance width' } as const;
const fmt = (key: keyof typeof LABEL, v: string | number) => (key === 'stanceWidthMm' ? `${v} mm` : v === 'left' ? 'left-handed' : 'right-handed');

export function ParameterSources({ sources }: { sources: Record<string, unknown> | null | undefined }) {
  if (!sources) return null;
  const rows = (Object.keys(LABEL) as (keyof typeof LABEL)[]).flatMap((key) => {
    const e = sources[key];
    if (!isEntry(e)) return [];
    const disagree = e.file !== null && e.fallback !== null && e.file !== e.fallback;
    return [{ key, e, disagree }];
  });
  if (rows.length === 0) return null;
  return (
    <ul className="space-y-0.5 text-sm text-ink-muted" data-testid="parameter-sources">
      {rows.map(({ key, e, disagree }) => (
        <li key={key} data-disagree={disagree || undefined}>
          {LABEL[key]}: <span className="font-medium text-ink">{fmt(key, e.used)}</span> ({FROM[e.source]})
          {disagree && (
            <span>
              {' '}
              · the file says {fmt(key, e.file!)}, the player’s profile {fmt(key, e.fallback!)}
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}
