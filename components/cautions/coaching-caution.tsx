// Shown once per page wherever drills, targets or a student's data appear (see the product's cautions): one compact
// line that opens to the full text, so it never pushes the page's own content below the fold.
export function CoachingCaution() {
  return (
    <aside role="note" aria-label="Health caution" className="rounded-md border border-notice-line bg-notice-soft text-sm text-notice" data-testid="coaching-caution">
      <details>
        <summary className="flex min-h-11 cursor-pointer items-center px-3 py-1.5">
          <span>
            <span className="font-semibold">Coaching information, not a medical assessment</span>
            <span className="hidden sm:inline"> · stop on pain and see a physician or physiotherapist</span>
            <span className="ml-2 underline">Read more</span>
          </span>
        </summary>
        <p className="px-3 pb-3">
          Pressure patterns describe how weight moves between the feet; they do not diagnose anything. Golf loads the
          lower back and neck: stop and consult a physician or physiotherapist if a drill or swing change causes pain,
          and follow the player&apos;s own medical advice.
        </p>
      </details>
    </aside>
  );
}
