// Numerical integration for the range constants d₂ and d₃.

export interface QuadratureRule {
  readonly nodes: readonly number[];
  readonly weights: readonly number[];
}

/** m-point Gauss–Legendre rule on [−1, 1]: nodes are the roots of Pₘ found by Newton's method from cos(π(i − ¼)/(m + ½)), weights 2/((1 − x²)Pₘ′(x)²); exact for polynomials of degree ≤ 2m − 1; RangeError unless m is an integer ≥ 1. */
export function gaussLegendreRule(m: number): QuadratureRule {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`gaussLegendreRule needs an integer m ≥ 1, got ${m}`);
  const nodes = new Array<number>(m).fill(0);
  const weights = new Array<number>(m).fill(0);
  for (let i = 0; i < Math.ceil(m / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (m + 0.5));
    for (let iteration = 0; iteration < 100; iteration++) {
      const [value, slope] = legendre(m, x);
      const step = value / slope;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    const derivative = legendre(m, x)[1];
    const weight = 2 / ((1 - x * x) * derivative * derivative);
    nodes[i] = -x;
    nodes[m - 1 - i] = x;
    weights[i] = weight;
    weights[m - 1 - i] = weight;
  }
  return { nodes, weights };
}

// Pₘ(x) and Pₘ′(x) by the three-term recurrence (j)Pⱼ = (2j − 1)xPⱼ₋₁ − (j − 1)Pⱼ₋₂.
function legendre(m: number, x: number): [number, number] {
  let previous = 1;
  let current = x;
  for (let j = 2; j <= m; j++) {
    const next = ((2 * j - 1) * x * current - (j - 1) * previous) / j;
    previous = current;
    current = next;
  }
  return [current, (m * (x * current - previous)) / (x * x - 1)];
}

const PANEL_RULE = gaussLegendreRule(10);

/** ∫ₐᵇ f(x) dx by composite 10-point Gauss–Legendre on equal panels no wider than panelWidth (default 0.5); exact for degree ≤ 19 per panel; 0 when a = b, negative when b < a. */
export function integrate(f: (x: number) => number, a: number, b: number, panelWidth = 0.5): number {
  if (a === b) return 0;
  const panels = Math.max(1, Math.ceil(Math.abs(b - a) / panelWidth));
  const width = (b - a) / panels;
  let total = 0;
  for (let panel = 0; panel < panels; panel++) {
    const middle = a + (panel + 0.5) * width;
    let sum = 0;
    for (let i = 0; i < PANEL_RULE.nodes.length; i++) {
      sum += (PANEL_RULE.weights[i] ?? 0) * f(middle + 0.5 * width * (PANEL_RULE.nodes[i] ?? 0));
    }
    total += 0.5 * width * sum;
  }
  return total;
}
