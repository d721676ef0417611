// Shown wherever drills, targets or a student's data appear (see the product's cautions).
export function CoachingCaution() {
  return (
    <aside role="note" aria-label="Health caution" className="rounded-md border border-notice-line bg-notice-soft px-4 py-3 text-sm text-notice">
      <p className="font-semibold">Coaching information, not a medical assessment</p>
      <p className="mt-1">
        Pressure patterns describe how weight moves between the feet; they do not diagnose anything. Golf loads the
        lower back and neck: stop and consult a physician or physiotherapist if a drill or swing change causes pain,
        and follow the player&apos;s own medical advice.
      </p>
    </aside>
  );
}
