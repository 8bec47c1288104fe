import type { Bin } from "../yield/yield";

/** Bin colours of §14: the Okabe–Ito colour-blind-safe palette (published, Okabe & Ito 2008); same as tailwind `bin.*`. */
export const BIN_COLOURS: Readonly<Record<Bin, string>> = Object.freeze({
  PASS: "#009E73",
  LOW: "#56B4E9",
  HIGH: "#E69F00",
  OPEN: "#0072B2",
  SHORT: "#D55E00",
  NONLINEAR: "#CC79A7",
  NODATA: "#999999",
});

/** Legend order of the bins: PASS first, then the fails in the order §14 lists them, NODATA last. */
export const BIN_ORDER: readonly Bin[] = Object.freeze(["PASS", "LOW", "HIGH", "OPEN", "SHORT", "NONLINEAR", "NODATA"]);
