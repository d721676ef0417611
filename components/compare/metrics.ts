// Phase metrics a coach can compare or follow over time (names as the compare and progress APIs take them).
export const METRICS = [
  { id: 'tempoRatio', label: 'Tempo (backswing : downswing)' },
  { id: 'backswing.durationS', label: 'Backswing time (s)' },
  { id: 'downswing.durationS', label: 'Downswing time (s)' },
  { id: 'address.leadPct', label: 'Lead % at address' },
  { id: 'top.leadPct', label: 'Lead % at the top' },
  { id: 'top.trailHeelPct', label: 'Trail heel % at the top' },
  { id: 'impact.leadPct', label: 'Lead % at impact' },
  { id: 'finish.leadPct', label: 'Lead % at finish' },
] as const;

export const metricLabel = (id: string) => METRICS.find((m) => m.id === id)?.label ?? id;
