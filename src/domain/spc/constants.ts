import { integrate } from "./quadrature";
import { lnGamma, normalCdf } from "./special-functions";

/**
 * Control-chart constants for subgroup size n, in the notation of the published tables
 * (ASTM E2587; Montgomery, Introduction to Statistical Quality Control, Appendix VI).
 * Lower-case letters are properties of the sampling distributions, upper-case ones chart factors.
 */
export interface ChartConstants {
  readonly n: number;
  /** E[s]/σ for samples of n normals. */
  readonly c4: number;
  /** E[R]/σ, mean range of n standard normals. */
  readonly d2: number;
  /** sd(R)/σ, standard deviation of that range. */
  readonly d3: number;
  readonly A2: number;
  readonly A3: number;
  readonly B3: number;
  readonly B4: number;
  readonly D3: number;
  readonly D4: number;
}

// Φ(−10) ≈ 7.6e−24, so the integrands vanish at double precision beyond ±10 for any practical n.
const INTEGRATION_LIMIT = 10;

const cache = new Map<number, ChartConstants>();

/** c₄, d₂, d₃ and A₂ = 3/(d₂√n), A₃ = 3/(c₄√n), B₃,₄ = 1 ∓ 3√(1 − c₄²)/c₄ (B₃ floored at 0), D₃,₄ = 1 ∓ 3d₃/d₂ (D₃ floored at 0), computed not tabulated (memoised); RangeError unless n is an integer ≥ 2. */
export function chartConstants(n: number): ChartConstants {
  assertSubgroupSize(n);
  const cached = cache.get(n);
  if (cached) return cached;
  const c4Value = c4(n);
  const d2 = d2Of(n);
  const d3 = d3Of(n, d2);
  const sSpread = (3 * Math.sqrt(1 - c4Value * c4Value)) / c4Value;
  const rSpread = (3 * d3) / d2;
  const constants: ChartConstants = {
    n,
    c4: c4Value,
    d2,
    d3,
    A2: 3 / (d2 * Math.sqrt(n)),
    A3: 3 / (c4Value * Math.sqrt(n)),
    B3: Math.max(0, 1 - sSpread),
    B4: 1 + sSpread,
    D3: Math.max(0, 1 - rSpread),
    D4: 1 + rSpread,
  };
  cache.set(n, constants);
  return constants;
}

/** c₄(n) = E[s]/σ = √(2/(n − 1))·Γ(n/2)/Γ((n − 1)/2), through ln Γ so large n does not overflow; also the bias of a pooled sd with n − 1 degrees of freedom; RangeError unless n is an integer ≥ 2. */
export function c4(n: number): number {
  assertSubgroupSize(n);
  return Math.sqrt(2 / (n - 1)) * Math.exp(lnGamma(n / 2) - lnGamma((n - 1) / 2));
}

// d₂ = E[R] = ∫ 1 − Φ(x)ⁿ − (1 − Φ(x))ⁿ dx over ℝ (Tippett 1925): P(min ≤ x ≤ max) integrated.
function d2Of(n: number): number {
  return integrate(
    (x) => {
      const cdf = normalCdf(x);
      return 1 - cdf ** n - (1 - cdf) ** n;
    },
    -INTEGRATION_LIMIT,
    INTEGRATION_LIMIT,
  );
}

// E[R²] = 2∬_{x<y} P(min ≤ x, max ≥ y) dx dy with P = 1 − Φ(y)ⁿ − (1 − Φ(x))ⁿ + (Φ(y) − Φ(x))ⁿ,
// because R² = 2∬ 1{min ≤ x < y ≤ max} dx dy; then d₃ = √(E[R²] − d₂²).
function d3Of(n: number, d2: number): number {
  const meanSquare =
    2 *
    integrate(
      (y) => {
        const cdfY = normalCdf(y);
        const upper = 1 - cdfY ** n;
        return integrate(
          (x) => {
            const cdfX = normalCdf(x);
            return upper - (1 - cdfX) ** n + Math.max(0, cdfY - cdfX) ** n;
          },
          -INTEGRATION_LIMIT,
          y,
        );
      },
      -INTEGRATION_LIMIT,
      INTEGRATION_LIMIT,
    );
  return Math.sqrt(meanSquare - d2 * d2);
}

function assertSubgroupSize(n: number): void {
  if (!Number.isInteger(n) || n < 2) throw new RangeError(`chart constants need an integer subgroup size n ≥ 2, got ${n}`);
}
