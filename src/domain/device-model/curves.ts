import { conductanceFunctionS, thermalBroadeningPerEv, thermalEnergyEv, type DeviceModel } from "../transport";
import { assertFermiLevel, assertUsableModel, DeviceModelError } from "./device-model-error";
import { expectedPoint, type ExpectedPoint } from "./evaluate";

export interface CurveOptions {
  /** Samples on the energy axis; default 401 (odd, so μ itself is the middle sample of the thermal axis). */
  energyPoints?: number;
  /**
   * "thermal" (default): μ ± 12 kT. "model": also the whole table (first to last knot) or, for a step, the band edge
   * ± 12 kT, so a distant edge or a wide table shows (F_T is then resolved only if the axis is not too wide).
   */
  energyAxis?: "thermal" | "model";
  /** Samples of expected G against temperature; default 100. */
  temperaturePoints?: number;
  /** Temperature range of that curve in K; default [4, 400]. */
  temperatureRangeK?: readonly [number, number];
  /** Samples of expected G against the Fermi level; default 201. */
  fermiLevelPoints?: number;
}

export interface EnergySample {
  energyEv: number;
  /** G(E) of the model. */
  conductanceS: number;
  /** F_T(E − μ) = −∂f/∂E. */
  broadeningPerEv: number;
}

export interface ConductanceSample {
  conductanceS: number;
  /** G/G₀. */
  modes: number;
}

export interface DeviceModelCurves {
  fermiLevelEv: number;
  temperatureK: number;
  /** Expected G at (μ, T), with its warnings. */
  expected: ExpectedPoint;
  energy: EnergySample[];
  temperature: (ConductanceSample & { temperatureK: number })[];
  fermiLevel: (ConductanceSample & { fermiLevelEv: number })[];
}

// Half-width of the plotted thermal window in kT, our plotting choice: F_T there is 4e^(−12) ≈ 2.5e−5 of its peak and
// the window holds tanh(6) ≈ 1 − 1.2e−5 of its area.
const SPAN_KT = 12;

/**
 * Plot data for the product page (PRODUCT §8): G(E) in S and F_T(E − μ) in 1/eV on one uniform energy axis in eV
 * (default μ ± 12 kT, 401 samples, μ exactly in the middle); expected G in S and G/G₀ against temperature (default
 * 100 samples, 4 to 400 K, evenly spaced) and against the Fermi level (default 201 samples over the band edge ± 12 kT
 * for a step or the table's knots, widened to μ ± 12 kT). DeviceModelError for an unusable model, a non-finite μ or a
 * temperature that is not a finite number > 0 (F_T at 0 K is a delta function); RangeError for a bad option.
 */
export function curves(model: DeviceModel, fermiLevelEv: number, temperatureK: number, options: CurveOptions = {}): DeviceModelCurves {
  assertUsableModel(model);
  assertFermiLevel(fermiLevelEv, "fermiLevelEv");
  if (!(Number.isFinite(temperatureK) && temperatureK > 0)) {
    throw new DeviceModelError("temperatureK", `temperature ${temperatureK} K must be above 0 K to plot F_T (a delta function at 0 K)`);
  }
  const energyPoints = sampleCount(options.energyPoints ?? 401, "energyPoints");
  const temperaturePoints = sampleCount(options.temperaturePoints ?? 100, "temperaturePoints");
  const fermiLevelPoints = sampleCount(options.fermiLevelPoints ?? 201, "fermiLevelPoints");
  const [fromK, toK] = options.temperatureRangeK ?? [4, 400];
  if (!(Number.isFinite(fromK) && Number.isFinite(toK) && fromK > 0 && toK > fromK)) {
    throw new RangeError(`temperature range ${fromK}–${toK} K must satisfy 0 < from < to`);
  }

  const halfSpanEv = SPAN_KT * thermalEnergyEv(temperatureK);
  const modelRange = modelRangeEv(model, fermiLevelEv, halfSpanEv);
  const energyAxis = options.energyAxis === "model" ? modelRange : { middle: fermiLevelEv, half: halfSpanEv };
  const conductanceS = conductanceFunctionS(model);
  const energy = evenlySpaced(energyAxis, energyPoints).map((energyEv) => ({
    energyEv,
    conductanceS: conductanceS(energyEv),
    broadeningPerEv: thermalBroadeningPerEv(energyEv, fermiLevelEv, temperatureK),
  }));

  const temperature = evenlySpaced({ middle: (fromK + toK) / 2, half: (toK - fromK) / 2 }, temperaturePoints).map((sampleK) => {
    const { conductanceS: g, modes } = expectedPoint(model, fermiLevelEv, sampleK);
    return { temperatureK: sampleK, conductanceS: g, modes };
  });
  const fermiLevel = evenlySpaced(modelRange, fermiLevelPoints).map((sampleEv) => {
    const { conductanceS: g, modes } = expectedPoint(model, sampleEv, temperatureK);
    return { fermiLevelEv: sampleEv, conductanceS: g, modes };
  });
  return { fermiLevelEv, temperatureK, expected: expectedPoint(model, fermiLevelEv, temperatureK), energy, temperature, fermiLevel };
}

interface Span {
  middle: number;
  half: number;
}

/** The span in eV covering μ ± halfSpan and the model: the step edge ± halfSpan, or the table's first to last knot. */
function modelRangeEv(model: DeviceModel, fermiLevelEv: number, halfSpanEv: number): Span {
  const [lowEv, highEv] =
    model.kind === "step"
      ? [model.edgeEv - halfSpanEv, model.edgeEv + halfSpanEv]
      : [model.points[0]?.[0] as number, model.points[model.points.length - 1]?.[0] as number];
  const fromEv = Math.min(lowEv, fermiLevelEv - halfSpanEv);
  const toEv = Math.max(highEv, fermiLevelEv + halfSpanEv);
  return { middle: (fromEv + toEv) / 2, half: (toEv - fromEv) / 2 };
}

/**
 * n values from middle − half to middle + half. Multiplying before dividing keeps an odd n's middle value exactly
 * `middle` and round ranges round (4, 8, …, 400 K).
 */
function evenlySpaced({ middle, half }: Span, n: number): number[] {
  return Array.from({ length: n }, (_, i) => middle + (half * (2 * i - (n - 1))) / (n - 1));
}

function sampleCount(n: number, name: string): number {
  if (!(Number.isInteger(n) && n >= 2 && n <= 100_000)) throw new RangeError(`${name} ${n} must be a whole number from 2 to 100000`);
  return n;
}
