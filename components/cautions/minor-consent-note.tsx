import { ageOn } from '@/lib/contracts/athletes';

// Shown next to the date of birth of a player under 18.
export function MinorConsentNote({ dateOfBirth }: { dateOfBirth: string }) {
  const age = ageOn(dateOfBirth, new Date().toISOString().slice(0, 10));
  return (
    <p role="note" className="rounded-md border border-band/40 bg-band-soft px-3 py-2 text-sm text-ink">
      <span className="font-semibold">Under 18 (age {age}).</span> Recording and keeping this player&apos;s data needs
      the consent of a parent or guardian; follow your academy&apos;s safeguarding policy and local rules for coaching
      minors.
    </p>
  );
}
