import type { EChartsType } from "echarts/core";
import { containsPoint, type RectPx } from "@/domain/wafer-map/rect-px";

/** What a die-field chart does with the pointer; chart px are relative to the chart's top-left corner. */
export interface FieldPointer {
  /** Index of the die (or cell) under a point of the map plane (mm), or null. */
  dieAt(xMm: number, yMm: number): number | null;
  /** The pointer moved to (x, y) px over `index` (null: no die, or the pointer left the chart). */
  hover(index: number | null, x: number, y: number): void;
  click?(index: number): void;
  /** The legend toggled fields: the names now hidden. */
  legend?(hidden: ReadonlySet<string>): void;
  /** The chart finished drawing a frame. */
  rendered?(): void;
}

/**
 * Routes the pointer over a chart whose dies are painted as rasters (not chart elements) to `pointer()`, which
 * finds the die with its own hit test: moves, leaving, clicks, zoom and pan (which drop the hover, since the die
 * under a resting pointer changes) and legend toggles. `pointer` is read on every event, so it may change.
 */
export function attachFieldPointer(instance: EChartsType, plotRect: (widthPx: number, heightPx: number) => RectPx, pointer: () => FieldPointer | undefined): void {
  const dieUnder = (x: number, y: number): number | null => {
    if (!containsPoint(plotRect(instance.getWidth(), instance.getHeight()), x, y)) return null;
    const mm = instance.convertFromPixel({ gridIndex: 0 }, [x, y]);
    return Array.isArray(mm) ? (pointer()?.dieAt(mm[0] ?? Number.NaN, mm[1] ?? Number.NaN) ?? null) : null;
  };
  const zr = instance.getZr();
  zr.on("mousemove", (e) => pointer()?.hover(dieUnder(e.offsetX, e.offsetY), e.offsetX, e.offsetY));
  zr.on("globalout", () => pointer()?.hover(null, 0, 0));
  zr.on("click", (e) => {
    const index = dieUnder(e.offsetX, e.offsetY);
    if (index !== null) pointer()?.click?.(index);
  });
  instance.on("datazoom", () => pointer()?.hover(null, 0, 0));
  instance.on("legendselectchanged", (event) => {
    const selected = (event as { selected?: Record<string, boolean> }).selected ?? {};
    pointer()?.legend?.(new Set(Object.entries(selected).filter(([, on]) => !on).map(([name]) => name)));
  });
  instance.on("rendered", () => pointer()?.rendered?.());
}

/** Chart px of a point of the map plane (mm), or null before the chart has a grid. */
export function chartPixel(instance: EChartsType, xMm: number, yMm: number): [number, number] | null {
  const p = instance.convertToPixel({ gridIndex: 0 }, [xMm, yMm]);
  return Array.isArray(p) && Number.isFinite(p[0]) && Number.isFinite(p[1]) ? [p[0]!, p[1]!] : null;
}

/**
 * Shows `html` in the tooltip box `tip` (absolutely placed in `box`) below right of (x, y) px, flipped to stay
 * inside the box; null hides it. The HTML is replaced only when `key` changes, so a move within a die is cheap.
 */
export function placeTooltip(tip: HTMLElement, box: HTMLElement, x: number, y: number, key: string | null, html: () => string): void {
  if (key === null) {
    tip.hidden = true;
    delete tip.dataset.key;
    return;
  }
  if (tip.dataset.key !== key) {
    tip.innerHTML = html();
    tip.dataset.key = key;
  }
  tip.hidden = false;
  const offset = 14;
  const left = x + offset + tip.offsetWidth > box.clientWidth ? Math.max(0, x - offset - tip.offsetWidth) : x + offset;
  const top = y + offset + tip.offsetHeight > box.clientHeight ? Math.max(0, y - offset - tip.offsetHeight) : y + offset;
  tip.style.transform = `translate(${Math.round(left)}px, ${Math.round(top)}px)`;
}
