import { expectedConductance, suggestedWindowV, type DeviceModel } from "../transport";
import { asDeviceModelError, assertFermiLevel, assertTemperature, assertUsableModel, DeviceModelError } from "./device-model-error";

/** Default thermal-window factor w of PRODUCT §5 step 1 (V_w = w·kT/q). */
export const DEFAULT_WINDOW_FACTOR = 0.5;

export interface EvaluationRequest {
  model: DeviceModel;
  fermiLevelEv: number;
  temperaturesK: readonly number[];
  /** w of V_w = w·kT/q; DEFAULT_WINDOW_FACTOR when omitted. */
  windowFactor?: number;
}

/** Expected linear-response G of a model at one temperature. */
export interface ExpectedPoint {
  temperatureK: number;
  conductanceS: number;
  /** G/G₀. */
  modes: number;
  warnings: string[];
}

export interface TemperatureEvaluation extends ExpectedPoint {
  /** Suggested bias half-window w·kT/q. */
  windowV: number;
}

export interface DeviceModelEvaluation {
  fermiLevelEv: number;
  results: TemperatureEvaluation[];
}

export interface ExpectedShift {
  fermiLevelEv: number;
  from: ExpectedPoint;
  to: ExpectedPoint;
  /** G(to)/G(from) − 1; null when G(from) = 0. */
  relativeChange: number | null;
}

/**
 * Expected linear-response G = ∫ G(E) F_T(E − μ) dE in S, G/G₀ and the bias half-window w·kT/q in V at each temperature
 * (PRODUCT §5, §8, §9 evaluate), in the order given; T = 0 gives G(μ) and a 0 V window. DeviceModelError (with the field
 * path) for an unusable model, a non-finite μ, a negative or non-finite T, or a w that is not a finite number > 0.
 */
export function evaluateDeviceModel(request: EvaluationRequest): DeviceModelEvaluation {
  const { model, fermiLevelEv, temperaturesK } = request;
  const windowFactor = request.windowFactor ?? DEFAULT_WINDOW_FACTOR;
  if (!(Number.isFinite(windowFactor) && windowFactor > 0)) {
    throw new DeviceModelError("windowFactor", `window factor ${windowFactor} must be a finite number > 0`);
  }
  assertUsableModel(model);
  assertFermiLevel(fermiLevelEv, "fermiLevelEv");
  temperaturesK.forEach((temperatureK, i) => assertTemperature(temperatureK, `temperaturesK.${i}`));
  const results = temperaturesK.map((temperatureK) => {
    const { conductanceS, modes, warnings } = expectedPoint(model, fermiLevelEv, temperatureK);
    return { temperatureK, conductanceS, modes, windowV: suggestedWindowV(temperatureK, windowFactor), warnings };
  });
  return { fermiLevelEv, results };
}

/**
 * Expected G in S at fromK and at toK for the same μ (PRODUCT §8: a lot probed at another chuck temperature), and the
 * relative change G(to)/G(from) − 1 (positive when the lot should read higher); null when G(from) = 0.
 * DeviceModelError for an unusable model, a non-finite μ (path "fermiLevelEv"), or a bad T (path "fromK" / "toK").
 */
export function expectedShift(model: DeviceModel, fermiLevelEv: number, fromK: number, toK: number): ExpectedShift {
  assertUsableModel(model);
  assertFermiLevel(fermiLevelEv, "fermiLevelEv");
  assertTemperature(fromK, "fromK");
  assertTemperature(toK, "toK");
  const from = expectedPoint(model, fermiLevelEv, fromK);
  const to = expectedPoint(model, fermiLevelEv, toK);
  const relativeChange = from.conductanceS === 0 ? null : to.conductanceS / from.conductanceS - 1;
  return { fermiLevelEv, from, to, relativeChange };
}

/**
 * The transport module's expectedConductance at one (μ, T) as an ExpectedPoint; any RangeError it still throws becomes
 * a DeviceModelError (path "model" unless its message names a field). Callers check μ and T first.
 */
export function expectedPoint(model: DeviceModel, fermiLevelEv: number, temperatureK: number): ExpectedPoint {
  try {
    return { temperatureK, ...expectedConductance(model, fermiLevelEv, temperatureK) };
  } catch (error) {
    throw asDeviceModelError(error, "model");
  }
}
