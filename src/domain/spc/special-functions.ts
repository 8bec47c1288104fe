// Special functions behind the SPC constants and the robust-sigma consistency factor.

// Lanczos (1964) series for g = 7 with 9 terms, coefficients as commonly published (from memory);
// relative error below about 1e-15 for real x > 0.
const LANCZOS_G = 7;
const LANCZOS_COEFFICIENTS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
] as const;

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
const SQRT_PI = Math.sqrt(Math.PI);

/** ln Γ(x) for real x > 0: Lanczos approximation (g = 7, 9 terms), reflection Γ(x)Γ(1−x) = π/sin(πx) below 0.5; RangeError for x ≤ 0 or non-finite x. */
export function lnGamma(x: number): number {
  if (!Number.isFinite(x) || x <= 0) throw new RangeError(`lnGamma needs a finite x > 0, got ${x}`);
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - lnGamma(1 - x);
  const z = x - 1;
  let series = LANCZOS_COEFFICIENTS[0];
  for (let i = 1; i < LANCZOS_COEFFICIENTS.length; i++) series += (LANCZOS_COEFFICIENTS[i] ?? 0) / (z + i);
  const t = z + LANCZOS_G + 0.5;
  return LN_SQRT_2PI + (z + 0.5) * Math.log(t) - t + Math.log(series);
}

// Below this |x| the power series is used, above it the continued fraction; both agree to ~1e-15 there.
const ERFC_SERIES_LIMIT = 2.5;

/** erfc(x) = (2/√π)∫ₓ^∞ e^(−t²) dt: series erf x = (2/√π)e^(−x²)Σ 2ⁿx^(2n+1)/(1·3···(2n+1)) for |x| < 2.5 (A&S 7.1.6), Laplace continued fraction above (A&S 7.1.14); NaN → NaN, ±∞ → 0 or 2. */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  if (x < 0) return 2 - erfc(-x);
  if (x < ERFC_SERIES_LIMIT) return 1 - erfSeries(x);
  if (x > 27) return 0; // e^(−x²) underflows double precision
  return erfcContinuedFraction(x);
}

function erfSeries(x: number): number {
  const twoXSquared = 2 * x * x;
  let term = x;
  let sum = x;
  for (let n = 1; term > sum * 1e-17; n++) {
    term *= twoXSquared / (2 * n + 1);
    sum += term;
  }
  return ((2 / SQRT_PI) * Math.exp(-x * x) * sum);
}

// erfc x = (e^(−x²)/√π) · 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + …)))), evaluated by the modified Lentz method.
function erfcContinuedFraction(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k < 500; k++) {
    const a = k / 2;
    d = x + a * d;
    if (d === 0) d = tiny;
    c = x + a / c;
    if (c === 0) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / SQRT_PI / f;
}

/** Standard normal density φ(x) = e^(−x²/2)/√(2π). */
export function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x - LN_SQRT_2PI);
}

/** Standard normal distribution function Φ(x) = erfc(−x/√2)/2, accurate in relative terms in the lower tail; NaN → NaN. */
export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / Math.SQRT2);
}

// Abramowitz & Stegun 26.2.23 rational starting point, |error| < 4.5e-4 (coefficients from memory);
// Halley steps on Φ then take it to full double precision, so these only need to be close.
const AS_C = [2.515517, 0.802853, 0.010328] as const;
const AS_D = [1.432788, 0.189269, 0.001308] as const;

/** Standard normal quantile Φ⁻¹(p): A&S 26.2.23 start refined by Halley iteration on Φ; ±∞ at p = 0 or 1; RangeError outside [0, 1] or NaN. */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`normalQuantile needs 0 ≤ p ≤ 1, got ${p}`);
  if (p === 0) return Number.NEGATIVE_INFINITY;
  if (p === 1) return Number.POSITIVE_INFINITY;
  if (p > 0.5) return -lowerTailQuantile(1 - p);
  return lowerTailQuantile(p);
}

// Solves Φ(x) = q for q ≤ 0.5 (x ≤ 0), where Φ is evaluated without cancellation.
function lowerTailQuantile(q: number): number {
  const t = Math.sqrt(-2 * Math.log(q));
  let x = -(t - (AS_C[0] + t * (AS_C[1] + t * AS_C[2])) / (1 + t * (AS_D[0] + t * (AS_D[1] + t * AS_D[2]))));
  for (let i = 0; i < 6; i++) {
    const u = (normalCdf(x) - q) / normalPdf(x);
    const step = u / (1 + 0.5 * x * u);
    x -= step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(x))) break;
  }
  return x;
}
