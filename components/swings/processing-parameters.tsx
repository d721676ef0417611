import { parameterLabels, parameterTerms } from './labels';

const show = (v: unknown) => (v === null || v === undefined ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v));

/** The parameters that produced these numbers, so a result can be reproduced with `npm run analyze`. */
export function ProcessingParameters({ parameters, algorithmVersion }: { parameters: Record<string, unknown>; algorithmVersion: string | null }) {
  const entries = Object.entries(parameters);
  return (
    <dl className="grid gap-x-8 gap-y-2 text-sm sm:grid-cols-2" data-testid="processing-parameters">
      <div className="flex justify-between gap-4 border-b border-surface-line/60 py-1">
        <dt className="text-ink-muted">Algorithm version</dt>
        <dd className="font-mono text-sm">{algorithmVersion ?? '—'}</dd>
      </div>
      {entries.map(([key, value]) => (
        <div key={key} className="flex justify-between gap-4 border-b border-surface-line/60 py-1">
          <dt className="text-ink-muted" title={parameterTerms[key]}>
            {parameterLabels[key] ?? key}
            {parameterTerms[key] && <span className="sr-only"> ({parameterTerms[key]})</span>}
          </dt>
          <dd className="tabular-nums">{show(value)}</dd>
        </div>
      ))}
    </dl>
  );
}
