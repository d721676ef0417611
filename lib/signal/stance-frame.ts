// The stance frame, on its own so that chart code can use it without pulling the filter into a client bundle.

/**
 * Foot-frame point (x medial, y from the heel) to the stance frame (X toward the target, lead centreline at +w/2,
 * Y from mid-foot). The lead foot's medial side faces the trail foot, i.e. -X; the trail foot's faces +X.
 */
export function toStanceFrame(xMm: number, yMm: number, isLead: boolean, stanceWidthMm: number, footLengthMm: number) {
  return {
    x: isLead ? stanceWidthMm / 2 - xMm : -stanceWidthMm / 2 + xMm,
    y: yMm - footLengthMm / 2,
  };
}
