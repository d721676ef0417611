import type { ReactNode } from 'react';

type Tone = 'neutral' | 'lead' | 'trail' | 'band' | 'notice' | 'ok' | 'danger';

const tones: Record<Tone, string> = {
  neutral: 'bg-surface-sunken text-ink-muted border-surface-line',
  lead: 'bg-foot-lead/10 text-foot-lead-ink border-foot-lead/30',
  trail: 'bg-foot-trail/10 text-foot-trail-ink border-foot-trail/30',
  band: 'bg-band-soft text-ink border-band/40',
  notice: 'bg-notice-soft text-notice border-notice-line',
  ok: 'bg-ok-soft text-ok border-ok/30',
  danger: 'bg-danger-soft text-danger border-danger/30',
};

export function Badge({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center rounded-full border px-2 py-0.5 text-sm font-medium ${tones[tone]}`}>{children}</span>
  );
}
