import { inputError, limitError } from '../errors';

/** Nodes and weights of n-point Gauss–Legendre quadrature on [−1, 1] (Newton on P_n). */
export function gaussLegendre(n: number): { nodes: Float64Array; weights: Float64Array } {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = x;
      for (let j = 2; j <= n; j++) {
        const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-17) break;
    }
    // Recompute the derivative at the converged node.
    let p0 = 1;
    let p1 = x;
    for (let j = 2; j <= n; j++) {
      const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
      p0 = p1;
      p1 = p2;
    }
    dp = (n * (x * p1 - p0)) / (x * x - 1);
    nodes[i] = x;
    weights[i] = 2 / ((1 - x * x) * dp * dp);
  }
  return { nodes, weights };
}

const RULE = gaussLegendre(20);
const PANEL = 0.5;

/**
 * Li_k(x) = ∫_2^x dt / ln^k t for an integer k ≥ 1 and real x ≥ 2 (Li_1 is the offset logarithmic
 * integral Li(x) = li(x) − li(2)). Computed as ∫_{ln 2}^{ln x} e^u u^(−k) du by 20-point
 * Gauss–Legendre on panels of width ≤ 1/2 (a sum of positive terms: relative error ≈ 10^(−15)).
 * @throws EngineError(input) for k not a positive integer or x < 2 or not finite;
 *   EngineError(limit) for k > 10^4 or x > 10^300.
 */
export function logIntegralK(k: number, x: number | bigint | string): number {
  if (!Number.isSafeInteger(k) || k < 1) throw inputError(`Li_k: k = ${k} is not a positive integer`);
  if (k > 10_000) throw limitError(`Li_k: k = ${k} is above 10^4`);
  const X = typeof x === 'number' ? x : Number(x);
  if (!Number.isFinite(X) || X < 2) throw inputError(`Li_k(x) is defined here for x ≥ 2, not ${String(x)}`);
  if (X > 1e300) throw limitError(`Li_k: x = ${String(x)} is above 10^300`);
  const a = Math.LN2;
  const b = Math.log(X);
  if (b <= a) return 0;
  const panels = Math.ceil((b - a) / PANEL);
  const h = (b - a) / panels;
  let total = 0;
  for (let j = 0; j < panels; j++) {
    const mid = a + (j + 0.5) * h;
    let s = 0;
    for (let i = 0; i < RULE.nodes.length; i++) {
      const u = mid + 0.5 * h * RULE.nodes[i]!;
      s += RULE.weights[i]! * Math.exp(u - k * Math.log(u));
    }
    total += 0.5 * h * s;
  }
  return total;
}
