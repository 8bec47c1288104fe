// Formatting shared by pages, tables and reports. Units are always printed beside values (§14).
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";

export type ConductanceUnit = "S" | "uS" | "G0";

export const UNIT_LABEL: Record<ConductanceUnit, string> = { S: "S", uS: "µS", G0: "G₀" };

export function formatDate(iso: string | Date | null | undefined): string {
  if (!iso) return "—";
  const d = typeof iso === "string" ? new Date(iso) : iso;
  return d.toLocaleDateString("en-GB", { year: "numeric", month: "short", day: "2-digit", timeZone: "UTC" });
}

export function formatDateTime(iso: string | Date | null | undefined): string {
  if (!iso) return "—";
  const d = typeof iso === "string" ? new Date(iso) : iso;
  return `${d.toLocaleString("en-GB", { year: "numeric", month: "short", day: "2-digit", hour: "2-digit", minute: "2-digit", timeZone: "UTC" })} UTC`;
}

/** A conductance in S expressed in the product's unit (S, µS or G₀ = 2q²/h), as a number. */
export function conductanceIn(valueS: number, unit: ConductanceUnit): number {
  return unit === "uS" ? valueS * 1e6 : unit === "G0" ? valueS / CONDUCTANCE_QUANTUM_S : valueS;
}

export function conductanceFromUnit(value: number, unit: ConductanceUnit): number {
  return unit === "uS" ? value / 1e6 : unit === "G0" ? value * CONDUCTANCE_QUANTUM_S : value;
}

export function formatConductance(valueS: number | null | undefined, unit: ConductanceUnit, digits = 4): string {
  if (valueS === null || valueS === undefined || !Number.isFinite(valueS)) return "—";
  const v = conductanceIn(valueS, unit);
  const text = unit === "S" ? v.toExponential(digits - 1) : Number(v.toPrecision(digits)).toString();
  return `${text} ${UNIT_LABEL[unit]}`;
}

export function formatPercent(fraction: number | null | undefined, digits = 1): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return "—";
  return `${(fraction * 100).toFixed(digits)} %`;
}

export function formatTemperature(kelvin: number | null | undefined): string {
  return kelvin === null || kelvin === undefined ? "—" : `${kelvin.toFixed(2)} K`;
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 ** 2) return `${(bytes / 1024).toFixed(1)} KiB`;
  if (bytes < 1024 ** 3) return `${(bytes / 1024 ** 2).toFixed(1)} MiB`;
  return `${(bytes / 1024 ** 3).toFixed(2)} GiB`;
}
