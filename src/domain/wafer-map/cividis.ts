// Cividis, the colour-vision-deficiency-optimised scale (published: Nuñez, Anderton & Renslow 2018, PLoS ONE
// 13(7): e0199239). Ten evenly spaced control points of its published 256-entry table, from memory; the map
// interpolates linearly in sRGB between them, as the chart library's continuous legend does.
export const CIVIDIS_STOPS: readonly string[] = Object.freeze([
  "#00204d",
  "#00336f",
  "#39486b",
  "#575c6d",
  "#707173",
  "#8a8779",
  "#a69d75",
  "#c4b56c",
  "#e4cf5b",
  "#ffea46",
]);

type Rgb = readonly [number, number, number];

function parseHex(hex: string): Rgb {
  const match = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new RangeError(`not a #rrggbb colour: ${hex}`);
  return [parseInt(match[1] as string, 16), parseInt(match[2] as string, 16), parseInt(match[3] as string, 16)];
}

function toHex(channels: Rgb): string {
  return `#${channels.map((c) => Math.round(c).toString(16).padStart(2, "0")).join("")}`;
}

const STOPS_RGB: readonly Rgb[] = CIVIDIS_STOPS.map(parseHex);

/**
 * Cividis colour for t ∈ [0, 1] as #rrggbb, linear sRGB interpolation between CIVIDIS_STOPS (dark blue at 0,
 * yellow at 1). t outside [0, 1] is clamped; NaN gives the t = 0 colour.
 */
export function cividis(t: number): string {
  const clamped = Number.isNaN(t) ? 0 : Math.min(1, Math.max(0, t));
  const position = clamped * (STOPS_RGB.length - 1);
  const lower = Math.min(Math.floor(position), STOPS_RGB.length - 2);
  const fraction = position - lower;
  const a = STOPS_RGB[lower] as Rgb;
  const b = STOPS_RGB[lower + 1] as Rgb;
  return toHex([a[0] + (b[0] - a[0]) * fraction, a[1] + (b[1] - a[1]) * fraction, a[2] + (b[2] - a[2]) * fraction]);
}

function linearChannel(channel8: number): number {
  const c = channel8 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/**
 * Relative luminance of a #rrggbb colour, 0 (black) to 1 (white): Y = 0.2126 R + 0.7152 G + 0.0722 B on
 * linearised sRGB (published: IEC 61966-2-1 sRGB transfer, WCAG 2 definition). RangeError on a malformed colour.
 */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHex(hex);
  return 0.2126 * linearChannel(r) + 0.7152 * linearChannel(g) + 0.0722 * linearChannel(b);
}

/**
 * Black or white, whichever has the higher WCAG 2 contrast ratio (L₁ + 0.05)/(L₂ + 0.05) against the fill;
 * the two tie near Y ≈ 0.179 and black wins the tie. Used for marks drawn over a die of any colour.
 */
export function contrastInk(fillHex: string): "#000000" | "#ffffff" {
  const y = relativeLuminance(fillHex);
  return (y + 0.05) / 0.05 >= 1.05 / (y + 0.05) ? "#000000" : "#ffffff";
}
