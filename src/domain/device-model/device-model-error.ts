import { conductanceFunctionS, type DeviceModel } from "../transport";

/**
 * A model, Fermi level or temperature the evaluation cannot use. `path` names the field as the API spells it, dot
 * separated with 0-based indices like zod issue paths ("model.points.2", "temperaturesK.0"); `message` the reason.
 */
export class DeviceModelError extends Error {
  readonly path: string;

  constructor(path: string, message: string) {
    super(message);
    this.name = "DeviceModelError";
    this.path = path;
  }
}

// The transport module's RangeError messages (src/domain/transport/device-model.ts), mapped to the field they refuse.
const MODEL_FIELDS: readonly [RegExp, (match: RegExpMatchArray) => string][] = [
  [/^modes /, () => "model.modes"],
  [/^transmission /, () => "model.transmission"],
  [/^band edge /, () => "model.edgeEv"],
  [/^a conductance table needs/, () => "model.points"],
  [/^point (\d+)/, (match) => `model.points.${Number(match[1]) - 1}`],
];

/**
 * Checks a model with the transport module's conductanceFunctionS and rethrows its RangeError as a DeviceModelError
 * whose path names the refused field ("model" when the message is not recognised); other errors pass through.
 */
export function assertUsableModel(model: DeviceModel): void {
  try {
    conductanceFunctionS(model);
  } catch (error) {
    throw asDeviceModelError(error, "model");
  }
}

/** Refuses a non-finite Fermi level (eV) with a DeviceModelError at `path`. */
export function assertFermiLevel(fermiLevelEv: number, path: string): void {
  if (!Number.isFinite(fermiLevelEv)) throw new DeviceModelError(path, `Fermi level ${fermiLevelEv} eV is not a finite energy`);
}

/** Refuses a negative or non-finite temperature (K) with a DeviceModelError at `path`; 0 K is accepted. */
export function assertTemperature(temperatureK: number, path: string): void {
  if (!(Number.isFinite(temperatureK) && temperatureK >= 0)) {
    throw new DeviceModelError(path, `temperature ${temperatureK} K must be a finite number ≥ 0`);
  }
}

/** A RangeError as a DeviceModelError (path from its message, else `fallbackPath`); anything else is returned unchanged. */
export function asDeviceModelError(error: unknown, fallbackPath: string): unknown {
  if (!(error instanceof RangeError)) return error;
  for (const [pattern, path] of MODEL_FIELDS) {
    const match = error.message.match(pattern);
    if (match) return new DeviceModelError(path(match), error.message);
  }
  return new DeviceModelError(fallbackPath, error.message);
}
