// In-page instrumentation for `npm run bench:map`, installed before the page's own scripts run. Kept as source
// text rather than functions because tsx's name-keeping helpers do not exist inside the page.

/** What the probe has recorded, read back with `page.evaluate(PROBE_READ)`; times are performance.now() ms. */
export interface ProbeState {
  /** data-die-count on the role="application" container first equalled the expected count. */
  readyAt: number;
  /** Last canvas draw call on a canvas inside the map container, and how many there were. */
  lastMapDrawAt: number;
  mapDraws: number;
  /** Every rAF callback's start time since navigation. */
  frames: number[];
  /** First time the map's tooltip was visible with a die in it, and the die it named. */
  tooltipAt: number;
  tooltipDie: string;
  /** Long tasks (≥ 50 ms on the main thread): [startTime, duration]. */
  longTasks: [number, number][];
  /** Resource timing of the dies request: [startTime, responseEnd, transferSize]. */
  diesFetch: [number, number, number] | null;
  domContentLoadedAt: number;
}

/** Init script body; `__BENCH_DIE_COUNT__` is replaced by the expected die count. */
const PROBE_SOURCE = `(() => {
  const expected = String(__BENCH_DIE_COUNT__);
  const b = { readyAt: 0, lastMapDrawAt: 0, mapDraws: 0, frames: [], tooltipAt: 0, tooltipDie: "", longTasks: [], diesFetch: null, domContentLoadedAt: 0 };
  Object.defineProperty(window, "__bench", { value: b });
  const inMap = new WeakMap();
  const proto = CanvasRenderingContext2D.prototype;
  for (const name of ["fill", "stroke", "fillRect", "strokeRect", "drawImage", "putImageData", "clearRect", "fillText"]) {
    const original = proto[name];
    proto[name] = function (...args) {
      let mapped = inMap.get(this);
      if (mapped === undefined && this.canvas.isConnected) {
        mapped = this.canvas.closest('[role="application"]') !== null;
        inMap.set(this, mapped);
      }
      if (mapped) { b.mapDraws++; b.lastMapDrawAt = performance.now(); }
      return original.apply(this, args);
    };
  }
  try {
    new PerformanceObserver((list) => { for (const e of list.getEntries()) b.longTasks.push([e.startTime, e.duration]); }).observe({ type: "longtask", buffered: true });
  } catch {}
  const tooltip = () => {
    const map = document.querySelector('[role="application"]');
    if (!map) return null;
    const el = map.querySelector('[role="tooltip"]');
    return el && !el.hidden && /Die\\s*\\(/.test(el.textContent) ? el : null;
  };
  b.tooltipNow = () => { const el = tooltip(); const m = el && /Die\\s*\\(([^)]*)\\)/.exec(el.textContent); return m ? m[1] : ""; };
  const frame = (t) => {
    b.frames.push(t);
    if (!b.readyAt) {
      const map = document.querySelector('[role="application"][data-die-count]');
      if (map && map.getAttribute("data-die-count") === expected) b.readyAt = performance.now();
    } else if (!b.tooltipAt) {
      const die = b.tooltipNow();
      if (die) { b.tooltipAt = performance.now(); b.tooltipDie = die; }
    }
    requestAnimationFrame(frame);
  };
  requestAnimationFrame(frame);
  document.addEventListener("DOMContentLoaded", () => { b.domContentLoadedAt = performance.now(); });
})();`;

export function probeScript(dieCount: number): string {
  return PROBE_SOURCE.replace("__BENCH_DIE_COUNT__", String(dieCount));
}

/** Expression that returns the ProbeState (the dies request's timing filled in from the resource entries). */
export const PROBE_READ = `(() => {
  const b = window.__bench;
  const dies = performance.getEntriesByType("resource").find((e) => e.name.includes("/dies"));
  const { tooltipNow, ...state } = b;
  return { ...state, frames: [...b.frames], diesFetch: dies ? [dies.startTime, dies.responseEnd, dies.transferSize] : null };
})()`;

/** Expression: ms since navigation now. */
export const PAGE_NOW = "performance.now()";

/** Expression: the die named by the visible tooltip now, or "". */
export const TOOLTIP_NOW = "window.__bench.tooltipNow()";

/** Expression: resolves after the next animation frame with its performance.now(). */
export const NEXT_FRAME = "new Promise((resolve) => requestAnimationFrame(() => resolve(performance.now())))";
