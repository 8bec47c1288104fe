import type { GraphicComponentOption, LegendComponentOption, VisualMapComponentOption } from "echarts/components";
import { CIVIDIS_STOPS } from "@/domain/wafer-map/cividis";
import { dieSummaryRows } from "@/domain/wafer-map/die-summary";
import type { Bin, MapDie } from "@/domain/wafer-map/map-die";
import { conductanceTitle, conductanceUnitSymbol, type ConductanceUnit } from "@/domain/wafer-map/units";
import type { ValueRange } from "@/domain/wafer-map/value-range";
import { formatPlain } from "@/domain/transport/format-si";
import { INK_SOFT, TEXT_STYLE, tooltipHtml } from "./chart-theme";

// Legends start right of the square plot (which ends at 78.8 % of the width), so a zoomed map never runs under them.
const LEGEND_LEFT = "80.5%";
const SCALE_LEFT = "82.5%";

/** Bin legend entry text: the bin and its die count, e.g. "PASS  1204". */
function binLegendLabel(bin: string, counts: Readonly<Record<Bin, number>>): string {
  return `${bin}  ${counts[bin as Bin] ?? 0}`;
}

/** Vertical bin legend at the right of the large map; each entry toggles that bin's dies. */
export function binLegend(bins: readonly Bin[], counts: Readonly<Record<Bin, number>>, show: boolean): LegendComponentOption {
  return {
    show,
    data: [...bins],
    orient: "vertical",
    left: LEGEND_LEFT,
    top: "middle",
    itemWidth: 12,
    itemHeight: 12,
    textStyle: { ...TEXT_STYLE, color: INK_SOFT },
    formatter: (name: string) => binLegendLabel(name, counts),
  };
}

/**
 * Cividis legend for the conductance map: a continuous bar from range.min to range.max with the end values
 * and unit printed ("12.5 µS"). It is a key only: the map colours its dies itself from the same stops, so the
 * legend targets no series.
 */
export function conductanceScale(range: ValueRange, unit: ConductanceUnit): VisualMapComponentOption {
  const symbol = conductanceUnitSymbol(unit);
  return {
    type: "continuous",
    id: "conductance-scale",
    min: range.min,
    max: range.max,
    seriesIndex: [],
    calculable: false,
    hoverLink: false,
    inRange: { color: [...CIVIDIS_STOPS] },
    orient: "vertical",
    left: SCALE_LEFT,
    top: 44,
    itemWidth: 14,
    itemHeight: 180,
    text: [`${formatPlain(range.max)} ${symbol}`, `${formatPlain(range.min)} ${symbol}`],
    textStyle: { ...TEXT_STYLE, color: INK_SOFT },
  };
}

/** Title above the cividis legend, conductanceTitle(unit) ("G (µS)", "G/G₀"); kept but hidden when no legend shows. */
export function scaleTitle(unit: ConductanceUnit, visible: boolean): GraphicComponentOption {
  return {
    type: "text",
    id: "scale-title",
    left: LEGEND_LEFT,
    top: 12,
    invisible: !visible,
    style: { text: conductanceTitle(unit), fill: TEXT_STYLE.color, font: `600 12px ${TEXT_STYLE.fontFamily}` },
  };
}

/** Tooltip body for a die (dieSummaryRows: position, bin, G in the unit, η, R², window, flags). */
export function dieTooltipHtml(die: MapDie, unit: ConductanceUnit): string {
  return tooltipHtml(null, dieSummaryRows(die, unit));
}
