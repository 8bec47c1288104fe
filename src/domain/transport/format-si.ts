const PREFIXES: readonly [number, string][] = [
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "µ"],
  [1e-9, "n"],
  [1e-12, "p"],
  [1e-15, "f"],
];

/** A value with an SI prefix and 3 significant digits for human-readable reasons: 1.2e-6, "S" → "1.2 µS". */
export function formatSi(value: number, unit: string): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} ${unit}`;
  const rounded = Number(Math.abs(value).toPrecision(3));
  const [factor, prefix] = PREFIXES.find(([f]) => rounded >= f) ?? (PREFIXES[PREFIXES.length - 1] as [number, string]);
  return `${value < 0 ? "-" : ""}${Number((rounded / factor).toPrecision(3))} ${prefix}${unit}`;
}

/** A dimensionless value with 3 significant digits. */
export function formatPlain(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(3))) : String(value);
}
