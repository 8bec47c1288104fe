/** An axis-aligned rectangle in screen pixels (y down). */
export interface RectPx {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/**
 * Intersection of two screen rectangles, or null when they do not overlap (touching edges count as no overlap).
 * The die painter cuts dies to the plot with it: the raster is the plot's size, and a die half off the plot is drawn half.
 */
export function intersectRect(a: RectPx, b: RectPx): RectPx | null {
  const left = Math.max(a.x, b.x);
  const top = Math.max(a.y, b.y);
  const right = Math.min(a.x + a.width, b.x + b.width);
  const bottom = Math.min(a.y + a.height, b.y + b.height);
  return right > left && bottom > top ? { x: left, y: top, width: right - left, height: bottom - top } : null;
}

/** Whether the point (x, y) lies inside the rectangle, edges included. */
export function containsPoint(rect: RectPx, x: number, y: number): boolean {
  return x >= rect.x && x <= rect.x + rect.width && y >= rect.y && y <= rect.y + rect.height;
}
