import { palette } from '@/tailwind.config';

// Stanceline mark: two offset footprints (lead in blue, trail in vermillion) standing on one stance line.
// One footprint outline: broad forefoot, narrow waist, round heel, drawn in a 10 x 20 box.
const FOOT = 'M5 0C8.6 0 10 3.4 10 7C10 9.8 8.7 11.6 8.2 13.6C7.8 15.6 8.4 20 5 20C1.6 20 2.2 15.6 1.8 13.6C1.3 11.6 0 9.8 0 7C0 3.4 1.4 0 5 0Z';

export function LogoMark({ size = 30, title = 'Stanceline' }: { size?: number; title?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" role="img" aria-label={title}>
      <title>{title}</title>
      <path d={FOOT} fill={palette.foot.trail} transform="translate(5 7) rotate(-6 5 10)" />
      <path d={FOOT} fill={palette.foot.lead} transform="translate(17 2) rotate(6 5 10)" />
      <line x1="2.5" y1="29" x2="29.5" y2="29" stroke={palette.ink.DEFAULT} strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ size = 30 }: { size?: number }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark size={size} />
      <span className="text-lg font-semibold tracking-tight text-ink">
        Stance<span className="font-normal text-ink-muted">line</span>
      </span>
    </span>
  );
}
