/** One line segment in pixels: [x1, y1, x2, y2]. */
export type SegmentPx = readonly [number, number, number, number];

/**
 * Diagonal hatch ("/", rising to the right on screen, y down) filling the rectangle [left, left + width] ×
 * [top, top + height] in px: lines u + v = k·s·√2 (k = 1, 2, … while inside) in rectangle coordinates, so
 * neighbouring lines sit spacingPx apart; every end point lies on the rectangle's edge. Empty for a
 * non-positive or non-finite size or spacing.
 */
export function hatchSegments(leftPx: number, topPx: number, widthPx: number, heightPx: number, spacingPx: number): SegmentPx[] {
  const sizes = [widthPx, heightPx, spacingPx];
  if (!sizes.every((v) => Number.isFinite(v) && v > 0) || !Number.isFinite(leftPx) || !Number.isFinite(topPx)) return [];
  const stepPx = spacingPx * Math.SQRT2;
  const segments: SegmentPx[] = [];
  for (let c = stepPx; c < widthPx + heightPx; c += stepPx) {
    segments.push([
      leftPx + Math.max(0, c - heightPx),
      topPx + Math.min(heightPx, c),
      leftPx + Math.min(widthPx, c),
      topPx + Math.max(0, c - widthPx),
    ]);
  }
  return segments;
}
