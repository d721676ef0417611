import { METRICS } from './metrics';

/** Checkboxes choosing which swing metrics a comparison or trend shows. */
export function MetricPicker({ metrics, onChange, className = '', listClassName = '' }: { metrics: string[]; onChange: (next: string[]) => void; className?: string; listClassName?: string }) {
  return (
    <fieldset className={className}>
      <legend className="text-sm text-ink-muted">Metrics</legend>
      <div className={`flex flex-wrap gap-x-3 gap-y-1 ${listClassName}`.trim()}>
        {METRICS.map((m) => (
          <label key={m.id} className="flex items-center gap-1 text-sm">
            <input type="checkbox" checked={metrics.includes(m.id)} onChange={(e) => onChange(e.target.checked ? [...metrics, m.id] : metrics.filter((x) => x !== m.id))} /> {m.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
