/**
 * a + b + c for doubles a, b, c, with error at most about eps |sum| + eps^2 max(|a|, |b|, |c|):
 * Knuth's two-sum twice, the two rounding errors added last. Used where a small difference of
 * lengths (a gap between coils, a short coil's extent far out along a long one) must keep its
 * digits although its terms are large.
 */
export function sum3(a: number, b: number, c: number): number {
  const s1 = a + b;
  const z1 = s1 - a;
  const e1 = a - (s1 - z1) + (b - z1);
  const s2 = s1 + c;
  const z2 = s2 - s1;
  const e2 = s1 - (s2 - z2) + (c - z2);
  return s2 + (e1 + e2);
}

/**
 * A corner of a piecewise-linear overlap weight (coaxial coils): position
 * x hmax + y hmin + z d from whole coefficients of the half lengths and the
 * centre distance, and the weight there. Widths between corners come from the
 * coefficients' differences (sum3), so short pieces far out keep their digits.
 */
export interface Corner {
  readonly x: number;
  readonly y: number;
  readonly z: number;
  readonly at: number;
  readonly weight: number;
}

/** q - p for two corners of the same (hmax, hmin, d). */
export function cornerWidth(p: Corner, q: Corner, hmax: number, hmin: number, d: number): number {
  return sum3((q.x - p.x) * hmax, (q.y - p.y) * hmin, (q.z - p.z) * d);
}

/**
 * One Gauss-Legendre panel over offsets [lo, hi] from a piece's start at `base`, of
 * (w0 + slope o) kernel(base + o): the weight interpolated linearly from the piece's
 * exact corner weight at the offset, never formed from absolute positions.
 */
export function linearWeightPanel(
  rule: { readonly nodes: Float64Array; readonly weights: Float64Array },
  w0: number, slope: number, base: number, lo: number, hi: number, kernel: (v: number) => number,
): number {
  const c = 0.5 * (lo + hi);
  const hw = 0.5 * (hi - lo);
  let s = 0;
  for (let j = 0; j < rule.nodes.length; j++) {
    const o = c + hw * rule.nodes[j]!;
    const weight = w0 + slope * o;
    if (weight > 0) s += rule.weights[j]! * weight * kernel(base + o);
  }
  return s * hw;
}
