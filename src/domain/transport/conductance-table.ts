/** A refused conductance table: `line` is the 1-based physical line, `message` the reason. */
export class DeviceModelTableError extends Error {
  readonly line: number;

  constructor(line: number, message: string) {
    super(message);
    this.name = "DeviceModelTableError";
    this.line = line;
  }
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;
const NON_FINITE_WORD = /^[+-]?(inf|infinity|nan)$/i;
const HEADER = ["energy_ev", "conductance_s"];

/**
 * Parses a G(E) table (PRODUCT §8) of `energy_ev,conductance_s` rows: optional header line, comma, semicolon or tab
 * (detected from the first non-blank line), LF or CRLF, optional UTF-8 BOM, blank lines skipped. Throws
 * DeviceModelTableError for a non-numeric or non-finite value, a row without exactly 2 values, energies not strictly
 * increasing, a negative conductance, or fewer than 2 points.
 */
export function parseConductanceTable(text: string): { points: [number, number][] } {
  const lines = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).split(/\r\n|\n|\r/);
  const points: [number, number][] = [];
  let separator: string | null = null;
  let lastContentLine = 1;
  for (let index = 0; index < lines.length; index++) {
    const raw = (lines[index] as string).trim();
    if (raw === "") continue;
    const line = index + 1;
    lastContentLine = line;
    const isFirst = separator === null;
    separator ??= raw.includes("\t") ? "\t" : raw.includes(";") ? ";" : ",";
    const fields = raw.split(separator).map((f) => f.trim());
    if (isFirst && fields.length === 2 && fields.every((f, i) => f.toLowerCase() === HEADER[i])) continue;
    if (fields.length !== 2) {
      throw new DeviceModelTableError(line, `expected 2 values (energy_ev, conductance_s), found ${fields.length}`);
    }
    const energyEv = parseValue(fields[0] as string, "energy", line);
    const conductanceS = parseValue(fields[1] as string, "conductance", line);
    const previous = points[points.length - 1];
    if (previous && !(energyEv > previous[0])) {
      throw new DeviceModelTableError(line, `energy ${energyEv} eV does not exceed the previous ${previous[0]} eV (energies must strictly increase)`);
    }
    if (conductanceS < 0) throw new DeviceModelTableError(line, `conductance ${conductanceS} S is negative`);
    points.push([energyEv, conductanceS]);
  }
  if (points.length < 2) {
    throw new DeviceModelTableError(lastContentLine, `a conductance table needs at least 2 points, found ${points.length}`);
  }
  return { points };
}

function parseValue(field: string, what: string, line: number): number {
  if (NON_FINITE_WORD.test(field)) throw new DeviceModelTableError(line, `${what} "${field}" is not finite`);
  if (!DECIMAL.test(field)) throw new DeviceModelTableError(line, `${what} "${field}" is not a number`);
  const value = Number(field);
  if (!Number.isFinite(value)) throw new DeviceModelTableError(line, `${what} "${field}" is not finite`);
  return value;
}
