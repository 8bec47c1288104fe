import { formatPlain } from "../transport/format-si";
import type { MapDie } from "./map-die";
import { conductanceUnitSymbol, scaleConductance, type ConductanceUnit } from "./units";

export interface SummaryRow {
  readonly label: string;
  readonly value: string;
}

const MISSING = "—";

function plainOrMissing(value: number | null): string {
  return value === null || !Number.isFinite(value) ? MISSING : formatPlain(value);
}

/** G/G₀ of a die: the reported `modes`, else conductanceS / G₀ (G₀ = 2q²/h, SI 2019 exact); null without either. */
export function dieModes(die: Pick<MapDie, "modes" | "conductanceS">): number | null {
  if (die.modes !== null && Number.isFinite(die.modes)) return die.modes;
  return scaleConductance(die.conductanceS, "G0");
}

/**
 * The rows a die's tooltip and screen-reader text show: position, bin, G in the unit (left out when the unit is
 * G₀, where it equals G/G₀), G/G₀, η, R² (4 decimals), points in window, V_w in mV, T in K, and the
 * out-of-window / inked flags when set. Numbers to 3 significant digits; a missing value prints "—".
 */
export function dieSummaryRows(die: MapDie, unit: ConductanceUnit): SummaryRow[] {
  const rows: SummaryRow[] = [
    { label: "Die", value: `(${die.x}, ${die.y})` },
    { label: "Bin", value: die.bin },
  ];
  const scaled = scaleConductance(die.conductanceS, unit);
  if (unit !== "G0") {
    rows.push({ label: "G", value: scaled === null ? MISSING : `${formatPlain(scaled)} ${conductanceUnitSymbol(unit)}` });
  }
  rows.push(
    { label: "G/G₀", value: plainOrMissing(dieModes(die)) },
    { label: "η", value: plainOrMissing(die.nonlinearity) },
    { label: "R²", value: die.r2 === null || !Number.isFinite(die.r2) ? MISSING : die.r2.toFixed(4) },
    { label: "Points in window", value: String(die.pointsInWindow) },
    { label: "V_w", value: Number.isFinite(die.windowV) ? `${formatPlain(die.windowV * 1e3)} mV` : MISSING },
    { label: "T", value: Number.isFinite(die.temperatureK) ? `${Number(die.temperatureK.toFixed(2))} K` : MISSING },
  );
  const flags = [die.outOfWindow ? "out of window" : null, die.inked ? "inked" : null].filter((f) => f !== null);
  if (flags.length > 0) rows.push({ label: "Flags", value: flags.join(", ") });
  return rows;
}

/** One line for a screen reader: "Die (3, -2), bin PASS, G 12.3 µS, …" built from dieSummaryRows. */
export function dieSummaryText(die: MapDie, unit: ConductanceUnit): string {
  const [position, ...rest] = dieSummaryRows(die, unit);
  return [`Die ${position?.value ?? ""}`, ...rest.map((row) => `${row.label} ${row.value}`)].join(", ");
}
