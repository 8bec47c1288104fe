import { DistinctCounter } from "./distinct-values";
import type { IvPoint } from "./linear-response";

/** I = I₀ + G₁V + a₂V² + a₃V³ in SI units. */
export interface CubicFit {
  offsetA: number;
  conductanceS: number;
  quadraticAPerV2: number;
  cubicAPerV3: number;
  n: number;
}

const system = new Float64Array(20); // 4 × 5 augmented normal equations, reused

/**
 * Single-pass power sums for the cubic OLS fit. Currents are taken relative to the first one (removing the offset
 * before squaring), and the normal equations are solved on V/max|V| and ΔI/max|ΔI|, which keeps them well
 * conditioned whatever the units.
 */
export class CubicAccumulator {
  n = 0;
  private referenceA = 0;
  private maxAbsV = 0;
  private maxAbsDeltaA = 0;
  private readonly powerSums = new Float64Array(7); // Σ Vᵏ, k = 0…6
  private readonly momentSums = new Float64Array(4); // Σ Vᵏ·ΔI, k = 0…3

  reset(): void {
    this.n = 0;
    this.maxAbsV = 0;
    this.maxAbsDeltaA = 0;
    this.powerSums.fill(0);
    this.momentSums.fill(0);
  }

  add(biasV: number, currentA: number): void {
    if (this.n++ === 0) this.referenceA = currentA;
    const deltaA = currentA - this.referenceA;
    this.maxAbsV = Math.max(this.maxAbsV, Math.abs(biasV));
    this.maxAbsDeltaA = Math.max(this.maxAbsDeltaA, Math.abs(deltaA));
    let power = 1;
    for (let k = 0; k <= 6; k++) {
      this.powerSums[k] = (this.powerSums[k] as number) + power;
      if (k <= 3) this.momentSums[k] = (this.momentSums[k] as number) + power * deltaA;
      power *= biasV;
    }
  }

  /** The fit, or null below 4 points or when the normal equations are singular (fewer than 4 distinct biases). */
  fit(): CubicFit | null {
    if (this.n < 4 || this.maxAbsV === 0) return null;
    const scaleV = this.maxAbsV;
    const scaleA = this.maxAbsDeltaA > 0 ? this.maxAbsDeltaA : 1;
    for (let row = 0; row < 4; row++) {
      for (let col = 0; col < 4; col++) system[row * 5 + col] = (this.powerSums[row + col] as number) / scaleV ** (row + col);
      system[row * 5 + 4] = (this.momentSums[row] as number) / (scaleV ** row * scaleA);
    }
    if (!solveAugmented4(system)) return null;
    return {
      offsetA: this.referenceA + (system[4] as number) * scaleA,
      conductanceS: ((system[9] as number) * scaleA) / scaleV,
      quadraticAPerV2: ((system[14] as number) * scaleA) / scaleV ** 2,
      cubicAPerV3: ((system[19] as number) * scaleA) / scaleV ** 3,
      n: this.n,
    };
  }
}

/** Gauss–Jordan elimination with partial pivoting on a 4 × 5 augmented matrix; solution left in column 4. */
function solveAugmented4(m: Float64Array): boolean {
  const scale = Math.max(m[0] as number, m[6] as number, m[12] as number, m[18] as number);
  for (let col = 0; col < 4; col++) {
    let pivot = col;
    for (let row = col + 1; row < 4; row++) if (Math.abs(m[row * 5 + col] as number) > Math.abs(m[pivot * 5 + col] as number)) pivot = row;
    if (!(Math.abs(m[pivot * 5 + col] as number) > 1e-13 * scale)) return false;
    if (pivot !== col) {
      for (let k = 0; k < 5; k++) {
        const t = m[col * 5 + k] as number;
        m[col * 5 + k] = m[pivot * 5 + k] as number;
        m[pivot * 5 + k] = t;
      }
    }
    const inverse = 1 / (m[col * 5 + col] as number);
    for (let k = col; k < 5; k++) m[col * 5 + k] = (m[col * 5 + k] as number) * inverse;
    for (let row = 0; row < 4; row++) {
      const factor = m[row * 5 + col] as number;
      if (row === col || factor === 0) continue;
      for (let k = col; k < 5; k++) m[row * 5 + k] = (m[row * 5 + k] as number) - factor * (m[col * 5 + k] as number);
    }
  }
  return true;
}

const accumulator = new CubicAccumulator();
const distinct = new DistinctCounter(5);

/**
 * OLS fit of I = I₀ + G₁V + a₂V² + a₃V³ (SI units) over all points (PRODUCT §5 step 3). Returns null below 5 distinct
 * biases or when any point has a non-finite bias or current.
 */
export function fitCubic(points: readonly IvPoint[]): CubicFit | null {
  accumulator.reset();
  distinct.reset(5);
  for (const { biasV, currentA } of points) {
    if (!Number.isFinite(biasV) || !Number.isFinite(currentA)) return null;
    accumulator.add(biasV, currentA);
    distinct.add(biasV);
  }
  return distinct.count < 5 ? null : accumulator.fit();
}

/**
 * Nonlinearity index η = (|a₂|·V_w + |a₃|·V_w²)/|G₁| (PRODUCT §5 step 3), dimensionless: the relative departure from
 * linearity at the window edge. 0 when a₂ = a₃ = 0; Infinity when G₁ = 0 and the curve is not flat.
 */
export function nonlinearityIndex(cubic: CubicFit, windowV: number): number {
  const departure = Math.abs(cubic.quadraticAPerV2) * windowV + Math.abs(cubic.cubicAPerV3) * windowV * windowV;
  return departure === 0 ? 0 : departure / Math.abs(cubic.conductanceS);
}
