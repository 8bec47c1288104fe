import type { TooltipComponentOption } from "echarts/components";

// Chart styling shared by every Lotwarden chart: the §14 ink-and-slate colours (same values as tailwind.config.ts).

export const INK = "#1b2430";
export const INK_SOFT = "#3a4656";
export const INK_MUTED = "#5b6878";
export const SLATE_LINE = "#d5dbe3";
export const SLATE_WASH = "#f3f5f8";
export const ACCENT = "#2f5d8a";
export const ALERT = "#b3261e";
export const CAUTION = "#8a5a00";

export const FONT_FAMILY = '"IBM Plex Sans", system-ui, sans-serif';

// Okabe–Ito palette (published, Okabe & Ito 2008) in its usual order, black last, for series that are not bins.
export const SERIES_COLOURS: readonly string[] = ["#0072B2", "#E69F00", "#009E73", "#CC79A7", "#56B4E9", "#D55E00", "#F0E442", "#000000"];

/** Colour of series i, cycling through SERIES_COLOURS. */
export function seriesColour(index: number): string {
  return SERIES_COLOURS[((index % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length] as string;
}

export const TEXT_STYLE = { fontFamily: FONT_FAMILY, color: INK, fontSize: 12 } as const;

export const TOOLTIP_STYLE: TooltipComponentOption = {
  backgroundColor: "#ffffff",
  borderColor: SLATE_LINE,
  borderWidth: 1,
  padding: [6, 10],
  textStyle: { fontFamily: FONT_FAMILY, color: INK, fontSize: 12 },
  extraCssText: "box-shadow: 0 2px 8px rgba(27,36,48,0.12); font-variant-numeric: tabular-nums;",
};

export const AXIS_STYLE = {
  axisLine: { lineStyle: { color: INK_MUTED } },
  axisTick: { lineStyle: { color: INK_MUTED } },
  axisLabel: { color: INK_SOFT, fontFamily: FONT_FAMILY },
  splitLine: { lineStyle: { color: SLATE_LINE } },
  nameTextStyle: { color: INK_SOFT, fontFamily: FONT_FAMILY },
} as const;

const HTML_ESCAPES: Readonly<Record<string, string>> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Text made safe for the HTML tooltips echarts renders. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c] ?? c);
}

/** A tooltip body: an optional bold heading, then label/value rows as a two-column table; every string escaped. */
export function tooltipHtml(heading: string | null, rows: readonly { label: string; value: string }[]): string {
  const head = heading === null ? "" : `<div style="font-weight:600;margin-bottom:2px">${escapeHtml(heading)}</div>`;
  const body = rows
    .map((r) => `<tr><td style="color:${INK_MUTED};padding-right:10px">${escapeHtml(r.label)}</td><td>${escapeHtml(r.value)}</td></tr>`)
    .join("");
  return `${head}<table style="border-collapse:collapse">${body}</table>`;
}

/** Tailwind classes of a tooltip drawn by the app itself (the wafer map's), matching TOOLTIP_STYLE. */
export const TOOLTIP_BOX_CLASS =
  "whitespace-nowrap rounded border border-slate-line bg-white px-2.5 py-1.5 text-xs text-ink tabular-nums shadow-[0_2px_8px_rgba(27,36,48,0.12)]";
