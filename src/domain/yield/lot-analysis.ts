// Lot-level aggregations behind the lot page's analysis views; they compose the wafer-level functions of this
// module and the type-7 quantile of domain/spc rather than repeat them.
import { quantile } from "../spc/robust";
import type { RadialZone, WaferGeometry } from "./geometry";
import { countDiesInside, grossDiesPerWafer } from "./gross-dies";
import { edgeVersusCentre, zoneYields, type EdgeVersusCentre, type ZoneYield } from "./spatial-yield";
import { BINS, type Bin } from "./yield";

/** Bins whose conductance is a parametric result; SHORT and OPEN are gross fails and NODATA has no usable G. */
export const PARAMETRIC_BINS: readonly Bin[] = ["NONLINEAR", "LOW", "HIGH", "PASS"];

export interface Spread {
  /** Finite values counted. */
  readonly n: number;
  readonly q1: number | null;
  readonly median: number | null;
  readonly q3: number | null;
  /** Q₃ − Q₁; null when n = 0. */
  readonly iqr: number | null;
}

export interface WaferDistribution {
  readonly wafer: number;
  /** counts[i] covers [edges[i], edges[i + 1]), the last bin closed on the right. */
  readonly counts: number[];
  /** Finite values below the first edge and above the last (beyond the far fences). */
  readonly below: number;
  readonly above: number;
  readonly spread: Spread;
}

export interface ZoneRow {
  /** The wafer, or null for the whole lot. */
  readonly wafer: number | null;
  readonly zones: Record<RadialZone, ZoneYield>;
  readonly edgeVersusCentre: EdgeVersusCentre;
}

export interface GrossDieCheck {
  /** πd²/(4A) − πd/√(2A) with d the usable diameter (wafer diameter − 2·edge exclusion), unrounded. */
  readonly estimateUsable: number;
  /** The same estimate over the whole wafer diameter, unrounded. */
  readonly estimateWhole: number;
  /** Whole dies inside the usable circle, best grid placement (countDiesInside). */
  readonly exactInside: number;
}

/** The bin named by an API bin string, or null when it names none of the §5 bins (exact, case-sensitive match). */
export function parseBin(text: string): Bin | null {
  return (BINS as readonly string[]).includes(text) ? (text as Bin) : null;
}

/** Quartiles by Hyndman & Fan (1996) type 7 (domain/spc `quantile`) of the finite values, same unit as the input; non-finite skipped, all null when none remain. */
export function spreadOf(values: readonly number[]): Spread {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return { n: 0, q1: null, median: null, q3: null, iqr: null };
  const q1 = quantile(finite, 0.25);
  const q3 = quantile(finite, 0.75);
  return { n: finite.length, q1, median: quantile(finite, 0.5), q3, iqr: q3 - q1 };
}

// Tukey's "far out" fence multiplier (published, Tukey 1977): values beyond Q₁ − 3·IQR or Q₃ + 3·IQR.
const FAR_FENCE_IQR = 3;
// Bin widths are rounded up to 1, 2, 2.5 or 5 × 10ᵏ so edges print as round numbers (common practice for axes).
const NICE_MANTISSAS = [1, 2, 2.5, 5, 10];

function niceWidth(rawWidth: number): number {
  const power = 10 ** Math.floor(Math.log10(rawWidth));
  const mantissa = NICE_MANTISSAS.find((m) => m * power >= rawWidth * (1 - 1e-12)) ?? 10;
  return mantissa * power;
}

/**
 * Equal-width bin edges over the finite values clipped to Tukey's far fences [Q₁ − 3·IQR, Q₃ + 3·IQR] (so a few
 * shorts-like outliers do not squeeze the bulk into one bin; the whole range when IQR = 0). The bin count comes from the Freedman–Diaconis rule
 * (published, Freedman & Diaconis 1981: width 2·IQR/∛n), Sturges' ⌈log₂ n⌉ + 1 when IQR = 0, capped at maxBins;
 * the width is then rounded up to 1, 2, 2.5 or 5 × 10ᵏ and the edges laid on its multiples, covering the clipped range.
 * No finite value → []; all values equal → one bin of ±0.5 % round the value (±0.5 at zero).
 */
export function sharedBinEdges(values: readonly number[], maxBins = 60): number[] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [];
  // A loop rather than Math.min(...values): a lot's dies can outnumber the engine's argument limit.
  let min = Infinity;
  let max = -Infinity;
  for (const value of finite) {
    min = Math.min(min, value);
    max = Math.max(max, value);
  }
  if (min === max) {
    const half = min === 0 ? 0.5 : Math.abs(min) * 0.005;
    return [min - half, max + half];
  }
  const n = finite.length;
  const q1 = quantile(finite, 0.25);
  const q3 = quantile(finite, 0.75);
  const iqr = q3 - q1;
  // With IQR = 0 the fences would collapse onto the quartile, so the whole range is binned instead.
  const low = iqr > 0 ? Math.max(min, q1 - FAR_FENCE_IQR * iqr) : min;
  const high = iqr > 0 ? Math.min(max, q3 + FAR_FENCE_IQR * iqr) : max;
  const rule = iqr > 0 ? Math.ceil((high - low) / ((2 * iqr) / Math.cbrt(n))) : Math.ceil(Math.log2(n)) + 1;
  const bins = Math.max(1, Math.min(Math.floor(maxBins), rule));
  const width = niceWidth((high - low) / bins);
  const first = Math.floor(low / width);
  const count = Math.max(1, Math.ceil(high / width - first - 1e-9));
  return Array.from({ length: count + 1 }, (_, i) => Number(((first + i) * width).toPrecision(12)));
}

/** Count per bin [edges[i], edges[i + 1]), the last bin closed on the right; values outside the edges and non-finite values are not counted; fewer than 2 edges → []. */
export function histogramCounts(values: readonly number[], edges: readonly number[]): number[] {
  if (edges.length < 2) return [];
  const counts = new Array<number>(edges.length - 1).fill(0);
  const last = edges.length - 1;
  for (const value of values) {
    if (!(value >= (edges[0] as number) && value <= (edges[last] as number))) continue;
    let low = 0;
    let high = last;
    while (high - low > 1) {
      const mid = (low + high) >> 1;
      if (value >= (edges[mid] as number)) low = mid;
      else high = mid;
    }
    counts[low]!++;
  }
  return counts;
}

/**
 * Per-wafer distributions over shared edges: sharedBinEdges of all wafers' values pooled, then each wafer's
 * histogramCounts, the finite values left below and above the edges, and spreadOf over all its finite values.
 * Values in any one unit; edges and quartiles come back in it. No finite value → edges [].
 */
export function waferDistributions(
  wafers: readonly { readonly wafer: number; readonly values: readonly number[] }[],
  maxBins?: number,
): { edges: number[]; wafers: WaferDistribution[] } {
  const edges = sharedBinEdges(
    wafers.flatMap((w) => w.values),
    maxBins,
  );
  const first = edges[0] ?? Number.NaN;
  const last = edges[edges.length - 1] ?? Number.NaN;
  return {
    edges,
    wafers: wafers.map((w) => ({
      wafer: w.wafer,
      counts: histogramCounts(w.values, edges),
      below: w.values.filter((v) => v < first).length,
      above: w.values.filter((v) => v > last).length,
      spread: spreadOf(w.values),
    })),
  };
}

/**
 * zoneYields and edgeVersusCentre for each wafer and for the lot, the lot row pooling every wafer's dies (each
 * die keeps the zone its own wafer gave it), so its yield is PASS / tested over the lot, not a mean of wafer yields.
 */
export function zoneTable(
  wafers: readonly { readonly wafer: number; readonly dies: readonly { readonly zone: RadialZone; readonly bin: Bin }[] }[],
): { wafers: ZoneRow[]; lot: ZoneRow } {
  const row = (wafer: number | null, dies: readonly { zone: RadialZone; bin: Bin }[]): ZoneRow => {
    const zones = zoneYields(dies);
    return { wafer, zones, edgeVersusCentre: edgeVersusCentre(zones) };
  };
  return { wafers: wafers.map((w) => row(w.wafer, w.dies)), lot: row(null, wafers.flatMap((w) => w.dies)) };
}

/** Gross dies per wafer (common practice) over the usable and the whole diameter, against the exact count of whole dies inside the usable circle; die area A = width·height in mm². */
export function grossDieCheck(geometry: WaferGeometry): GrossDieCheck {
  const areaMm2 = geometry.dieWidthMm * geometry.dieHeightMm;
  return {
    estimateUsable: grossDiesPerWafer(2 * geometry.usableRadiusMm, areaMm2),
    estimateWhole: grossDiesPerWafer(geometry.waferDiameterMm, areaMm2),
    exactInside: countDiesInside(geometry),
  };
}
