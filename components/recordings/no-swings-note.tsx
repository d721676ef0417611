/** A file that was read fine but held no golf swing (walking, standing, putting drills below the thresholds). */
export function NoSwingsNote() {
  return (
    <p className="rounded-md border border-surface-line bg-surface-sunken px-3 py-2 text-sm text-ink" data-testid="no-swings">
      No golf swings were found in this file. It was read and processed without errors, but nothing in it looks like
      a full swing (address, backswing, downswing and a held finish).
    </p>
  );
}
