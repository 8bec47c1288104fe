import { contrastInk } from "./cividis";
import { hatchSegments } from "./hatch";
import type { MapLayout } from "./layout";
import { containsPoint, intersectRect, type RectPx } from "./rect-px";

/**
 * The part of a 2D canvas context the die painter uses. A real CanvasRenderingContext2D satisfies it; tests pass
 * a recording stand-in. Coordinates are screen px, y down.
 */
export interface PaintContext {
  fillStyle: unknown;
  strokeStyle: unknown;
  lineWidth: number;
  fillRect(x: number, y: number, width: number, height: number): void;
  beginPath(): void;
  moveTo(x: number, y: number): void;
  lineTo(x: number, y: number): void;
  arc(x: number, y: number, radius: number, startAngle: number, endAngle: number): void;
  fill(): void;
  stroke(): void;
}

/** What the painter reads of a die: its grid position and its two marks (a stacked-map cell has neither mark). */
export interface PaintedDie {
  readonly x: number;
  readonly y: number;
  readonly inked?: boolean;
  readonly outOfWindow?: boolean;
}

/** The map plane (mm, y up) to screen px (y down): px = originX + xMm·pxPerMmX, py = originY − yMm·pxPerMmY. */
export interface MmToPx {
  readonly originX: number;
  readonly originY: number;
  readonly pxPerMmX: number;
  readonly pxPerMmY: number;
}

/** What one paint drew: dies filled, out-of-window rings and hatched (inked) dies, all inside the plot. */
export interface PaintCounts {
  readonly dies: number;
  readonly rings: number;
  readonly hatched: number;
}

export const NO_PAINT: PaintCounts = Object.freeze({ dies: 0, rings: 0, hatched: 0 });

/**
 * Paints the dies listed in `indices` (into `dies`, `layout.rects` and `fills`): each a filled rectangle in true
 * aspect with a hairline gap to its neighbours (at most 1 px, 8 % of the smaller side), cut to the plot; an inked
 * die adds a diagonal hatch in black or white, whichever contrasts with its fill; an out-of-window die whose
 * centre is in the plot adds a white dot ringed in black. Both marks read in either colouring and in greyscale.
 * Dies entirely outside the plot are skipped. Draw calls are batched by colour: one fillStyle change per fill,
 * one path for all hatches of a stroke colour, one path for all rings, so 20,000 dies cost a few ms.
 */
export function paintDies(
  ctx: PaintContext,
  dies: readonly PaintedDie[],
  layout: MapLayout,
  fills: readonly string[],
  indices: readonly number[],
  view: MmToPx,
  plot: RectPx,
): PaintCounts {
  const w = layout.dieWidthMm * view.pxPerMmX;
  const h = layout.dieHeightMm * view.pxPerMmY;
  if (!(w > 0 && h > 0)) return NO_PAINT;
  const gap = Math.min(1, 0.08 * Math.min(w, h));
  const byFill = new Map<string, number[]>(); // fill → flat [x, y, width, height, …]
  const hatchByInk = new Map<string, number[]>(); // ink → flat [x1, y1, x2, y2, …]
  const rings: number[] = []; // flat [cx, cy, …]
  let painted = 0;
  let hatched = 0;
  const spacing = Math.max(2, Math.min(w, h) / 3.5);
  for (const i of indices) {
    const rect = layout.rects[i];
    const die = dies[i];
    if (rect === undefined || die === undefined) continue;
    const cx = view.originX + rect.centreXMm * view.pxPerMmX;
    const cy = view.originY - rect.centreYMm * view.pxPerMmY;
    const shape = intersectRect({ x: cx - w / 2 + gap / 2, y: cy - h / 2 + gap / 2, width: w - gap, height: h - gap }, plot);
    if (shape === null) continue;
    const fill = fills[i] ?? "#999999";
    let list = byFill.get(fill);
    if (list === undefined) byFill.set(fill, (list = []));
    list.push(shape.x, shape.y, shape.width, shape.height);
    painted++;
    if (die.inked) {
      const ink = contrastInk(fill);
      let lines = hatchByInk.get(ink);
      if (lines === undefined) hatchByInk.set(ink, (lines = []));
      for (const segment of hatchSegments(shape.x, shape.y, shape.width, shape.height, spacing)) lines.push(...segment);
      hatched++;
    }
    if (die.outOfWindow && containsPoint(plot, cx, cy)) rings.push(cx, cy);
  }
  for (const [fill, list] of byFill) {
    ctx.fillStyle = fill;
    for (let k = 0; k < list.length; k += 4) ctx.fillRect(list[k]!, list[k + 1]!, list[k + 2]!, list[k + 3]!);
  }
  ctx.lineWidth = 1;
  for (const [ink, lines] of hatchByInk) {
    ctx.strokeStyle = ink;
    ctx.beginPath();
    for (let k = 0; k < lines.length; k += 4) {
      ctx.moveTo(lines[k]!, lines[k + 1]!);
      ctx.lineTo(lines[k + 2]!, lines[k + 3]!);
    }
    ctx.stroke();
  }
  if (rings.length > 0) {
    const r = Math.max(1.5, 0.28 * Math.min(w, h));
    ctx.beginPath();
    for (let k = 0; k < rings.length; k += 2) {
      ctx.moveTo(rings[k]! + r, rings[k + 1]!);
      ctx.arc(rings[k]!, rings[k + 1]!, r, 0, 2 * Math.PI);
    }
    ctx.fillStyle = "#ffffff";
    ctx.fill();
    ctx.strokeStyle = "#000000";
    ctx.lineWidth = Math.max(1, 0.3 * r);
    ctx.stroke();
  }
  return { dies: painted, rings: rings.length / 2, hatched };
}

/**
 * Hit test on the map plane: the index of the die whose grid cell holds the point (xMm, yMm), the first die at
 * that grid position on duplicates, or null. A die's cell is its whole pitch, gap included, so the pointer never
 * falls between dies. Built once per layout: O(n) to build, O(1) a query.
 */
export function dieHitTest(dies: readonly { x: number; y: number }[], layout: MapLayout): (xMm: number, yMm: number) => number | null {
  const at = new Map<string, number>();
  dies.forEach((d, i) => {
    const key = `${d.x},${d.y}`;
    if (!at.has(key)) at.set(key, i);
  });
  return (xMm, yMm) => {
    if (!Number.isFinite(xMm) || !Number.isFinite(yMm)) return null;
    // die centre xMm = (x − cx)·w (layout), so the grid column under the point is the nearest integer to xMm/w + cx
    const gx = Math.round(xMm / layout.dieWidthMm + layout.centre.x);
    const gy = Math.round(yMm / layout.dieHeightMm + layout.centre.y);
    return at.get(`${gx},${gy}`) ?? null;
  };
}
