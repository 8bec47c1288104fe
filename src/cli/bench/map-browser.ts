// Headless-Chromium measurements of the lot page's wafer map for `npm run bench:map`.
import { chromium, type Browser, type Page } from "playwright-core";
import type { BenchLot } from "./map-fixture";
import { NEXT_FRAME, PAGE_NOW, PROBE_READ, probeScript, type ProbeState } from "./map-page-probe";
import { droppedFrames, intervals, median, quantile } from "./map-stats";

const CHROMIUM_FLAGS = ["--no-sandbox", "--headless", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];
// The map's height follows its width (aspect 1.25), so a tall window keeps all of it on screen for the hover
// without changing what is drawn.
const VIEWPORT = { width: 1440, height: 1400 };
// The large map's plot box as fractions of its container, and the view margin (wafer-map-options, domain/wafer-map/layout).
const PLOT = { x: 0.02, y: 0.02, width: 0.768, height: 0.96 };
const VIEW_MARGIN = 1.04;
const QUIET_MS = 750;

export interface PaintRun {
  readyMs: number;
  paintedMs: number;
  /** The dies response's last byte to the first frame after the map's last draw: the map's own render time. */
  dataToPaintMs: number;
  diesFetchMs: number;
  longTaskMs: number;
  longestTaskMs: number;
  idleFrameMs: number;
  hoverFrameP50Ms: number;
  hoverFrameP95Ms: number;
  hoverDroppedFrames: number;
  hoverFrames: number;
  diesHovered: number;
}

export interface InteractiveRun {
  /** Navigation start to the first tooltip, hovering from the moment the map container holds every die. */
  interactiveMs: number;
  /** First mouse move over the map to the tooltip. */
  tooltipLatencyMs: number;
  /** The dies response's last byte to the first tooltip: the map's own time to interactive. */
  dataToInteractiveMs: number;
}

export async function launchBench(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", headless: true, args: CHROMIUM_FLAGS });
}

async function openLot(browser: Browser, appUrl: string, email: string, password: string, lot: BenchLot): Promise<Page> {
  const context = await browser.newContext({ viewport: VIEWPORT });
  const signIn = await context.request.post(`${appUrl}/api/v1/session`, { data: { email, password } });
  if (signIn.status() !== 200) throw new Error(`sign-in answered ${signIn.status()}: ${await signIn.text()}`);
  const page = await context.newPage();
  await page.addInitScript(probeScript(lot.dieCount));
  await page.goto(`${appUrl}/lots/${encodeURIComponent(lot.lot)}?wafer=1`, { waitUntil: "commit" });
  return page;
}

async function probe(page: Page): Promise<ProbeState> {
  return (await page.evaluate(PROBE_READ)) as ProbeState;
}

async function waitFor<T>(page: Page, what: string, check: (s: ProbeState) => T | null, timeoutMs = 60_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = check(await probe(page));
    if (value !== null) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Page px of die (x, y)'s centre, from the container box and the layout the map uses (centre of extents, y up). */
async function diePixel(page: Page, lot: BenchLot): Promise<(x: number, y: number) => { x: number; y: number }> {
  const box = await page.locator('[role="application"]').boundingBox();
  if (!box) throw new Error("the map container has no box");
  const { centre, dies } = lot.wafer;
  const s = lot.dieSideMm;
  let reachMm = 100;
  for (const d of dies) reachMm = Math.max(reachMm, Math.abs(d.x - centre.x) * s + s / 2, Math.abs(d.y - centre.y) * s + s / 2);
  const half = reachMm * VIEW_MARGIN;
  const left = box.x + PLOT.x * box.width;
  const top = box.y + PLOT.y * box.height;
  return (x, y) => ({
    x: left + (((x - centre.x) * s + half) / (2 * half)) * PLOT.width * box.width,
    y: top + ((half - (y - centre.y) * s) / (2 * half)) * PLOT.height * box.height,
  });
}

/** 50 neighbouring dies round the centre: a 10 × 5 zig-zag, one die per step. */
function hoverPath(lot: BenchLot): { x: number; y: number }[] {
  const cx = Math.round(lot.wafer.centre.x);
  const cy = Math.round(lot.wafer.centre.y);
  const path: { x: number; y: number }[] = [];
  for (let row = 0; row < 5; row++) for (let i = 0; i < 10; i++) path.push({ x: cx - 5 + (row % 2 === 0 ? i : 9 - i), y: cy - 2 + row });
  return path;
}

/** One load: time to every die in the DOM and to the last map paint, then frame times while hovering 50 dies. */
export async function measurePaint(browser: Browser, appUrl: string, email: string, password: string, lot: BenchLot): Promise<PaintRun> {
  const page = await openLot(browser, appUrl, email, password, lot);
  try {
    await waitFor(page, `${lot.dieCount} dies on the map`, (s) => (s.readyAt ? true : null));
    const quiet = await waitFor(page, "the map to stop drawing", (s) => {
      const now = s.frames[s.frames.length - 1] ?? 0;
      return s.mapDraws > 0 && now - s.lastMapDrawAt > QUIET_MS ? s : null;
    });
    const paintedMs = quiet.frames.find((t) => t > quiet.lastMapDrawAt) ?? Number.NaN;
    const idle = intervals(quiet.frames.filter((t) => t > quiet.lastMapDrawAt + 100));
    const idleFrameMs = median(idle);
    const at = await diePixel(page, lot);
    const seen = new Set<string>();
    const moveStart = (await page.evaluate(PAGE_NOW)) as number;
    for (const die of hoverPath(lot)) {
      const { x, y } = at(die.x, die.y);
      await page.mouse.move(x, y);
      const name = (await page.evaluate(`${NEXT_FRAME}.then(() => window.__bench.tooltipNow())`)) as string;
      if (name) seen.add(name);
    }
    const moveEnd = (await page.evaluate(PAGE_NOW)) as number;
    const after = await probe(page);
    const moveFrames = after.frames.filter((t) => t >= moveStart && t <= moveEnd);
    const frameMs = intervals(moveFrames);
    const tasks = after.longTasks.filter(([start]) => start < quiet.lastMapDrawAt + 1);
    return {
      readyMs: quiet.readyAt,
      paintedMs,
      dataToPaintMs: after.diesFetch ? paintedMs - after.diesFetch[1] : Number.NaN,
      diesFetchMs: after.diesFetch ? after.diesFetch[1] - after.diesFetch[0] : Number.NaN,
      longTaskMs: tasks.reduce((sum, [, d]) => sum + d, 0),
      longestTaskMs: Math.max(0, ...tasks.map(([, d]) => d)),
      idleFrameMs,
      hoverFrameP50Ms: median(frameMs),
      hoverFrameP95Ms: quantile(frameMs, 0.95),
      hoverDroppedFrames: droppedFrames(moveFrames, Number.isFinite(idleFrameMs) ? idleFrameMs : 1000 / 60),
      hoverFrames: moveFrames.length,
      diesHovered: seen.size,
    };
  } finally {
    await page.context().close();
  }
}

/** One load: hover the centre die (1 px wiggle, one move a frame) from the moment every die is in the DOM until the tooltip shows. */
export async function measureInteractive(browser: Browser, appUrl: string, email: string, password: string, lot: BenchLot): Promise<InteractiveRun> {
  const page = await openLot(browser, appUrl, email, password, lot);
  try {
    await waitFor(page, `${lot.dieCount} dies on the map`, (s) => (s.readyAt ? true : null));
    const at = await diePixel(page, lot);
    const centre = at(Math.round(lot.wafer.centre.x), Math.round(lot.wafer.centre.y));
    const firstMoveAt = (await page.evaluate(PAGE_NOW)) as number;
    const deadline = Date.now() + 30_000;
    for (let i = 0; ; i++) {
      await page.mouse.move(centre.x + (i % 2), centre.y);
      const state = await probe(page);
      if (state.tooltipAt) {
        const dataAt = state.diesFetch ? state.diesFetch[1] : Number.NaN;
        return { interactiveMs: state.tooltipAt, tooltipLatencyMs: state.tooltipAt - firstMoveAt, dataToInteractiveMs: state.tooltipAt - dataAt };
      }
      if (Date.now() > deadline) throw new Error("no tooltip within 30 s of hovering the centre die");
      await page.evaluate(NEXT_FRAME);
    }
  } finally {
    await page.context().close();
  }
}
