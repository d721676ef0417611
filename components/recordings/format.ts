import type { RecordingStatus } from '@/lib/contracts/recordings';

/** 1536 -> '1.5 KB' (binary multiples, as file managers show sizes). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  const units = ['KB', 'MB', 'GB'];
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return `${value.toFixed(value < 10 ? 1 : 0)} ${units[unit]}`;
}

/** A number or a dash when the value is undefined (no load under a foot, no swing). */
export function formatNumber(value: number | null | undefined, digits: number, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${value.toFixed(digits)}${unit}`;
}

/** Tempo ratio 3.05 -> '3.05 : 1' (backswing time over top-to-impact time). */
export function formatTempo(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined ? '—' : `${ratio.toFixed(2)} : 1`;
}

export const statusLabels: Record<RecordingStatus, string> = {
  received: 'Queued',
  processing: 'Processing',
  ready: 'Ready',
  failed: 'Failed',
};

export const impactSourceLabels = { marker: 'Impact marker', detected: 'Detected from pressure' } as const;
