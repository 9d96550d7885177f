// decimal.js oracle of the block magnet's field in the charge model as published
// (Furlani 2001, sec. 4.3; the same closed form as Yang et al. 1990): the asinh and atan
// corner sums written as they stand, at enough digits for their cancellation far away.
import { dec, exact, type Dec } from "../math/decimal-elliptic.js";

/**
 * asinh((t + h)/r) - asinh((t - h)/r); on the extension of an edge (r = 0, both ends of one
 * sign) the published terms are infinite and their difference is the limit ln(|t + h| / |t - h|) (or its mirror).
 */
function asinhPair(D: ReturnType<typeof dec>, t: Dec, h: Dec, r: Dec): Dec {
  const v1 = t.plus(h), v2 = t.minus(h);
  if (!r.isZero()) return D.asinh(v1.div(r)).minus(D.asinh(v2.div(r)));
  return v2.gte(0) ? v1.div(v2).ln() : v2.div(v1).ln();
}

export function blockOracle(br: number, sizes: readonly [number, number, number], p: readonly [number, number, number]): [Dec, Dec, Dec] {
  const size = Math.min(...sizes);
  const far = Math.max(1, Math.hypot(...p) / size);
  const digits = Math.min(600, 60 + Math.ceil(4 * Math.log10(far)) + Math.ceil(Math.log10(Math.max(...sizes) / size)));
  const D = dec(digits);
  const [a, b, c] = sizes.map((s) => exact(s, digits).div(2)) as [Dec, Dec, Dec];
  const [x, y, z] = p.map((v) => exact(v, digits)) as [Dec, Dec, Dec];
  let fx = new D(0), fy = new D(0), fz = new D(0);
  for (const sz of [1, -1]) {
    const w = z.minus(c.times(sz));
    for (const si of [1, -1]) {
      const u = x.minus(a.times(si));
      const rxz = u.pow(2).plus(w.pow(2)).sqrt();
      fx = fx.plus(asinhPair(D, y, b, rxz).times(si * sz));
      const v0 = y.minus(b.times(si));
      const ryz = v0.pow(2).plus(w.pow(2)).sqrt();
      fy = fy.plus(asinhPair(D, x, a, ryz).times(si * sz));
      for (const sj of [1, -1]) {
        const v = y.minus(b.times(sj));
        if (w.isZero()) continue; // the mean of the two sides of the face plane
        const r = u.pow(2).plus(v.pow(2)).plus(w.pow(2)).sqrt();
        fz = fz.plus(D.atan(u.times(v).div(w.times(r))).times(si * sj * sz));
      }
    }
  }
  const inside = [x.abs().lte(a), y.abs().lte(b), z.abs().lte(c)].every(Boolean);
  const onFace = [x.abs().eq(a), y.abs().eq(b), z.abs().eq(c)].some(Boolean);
  const chi = inside ? (onFace ? 0.5 : 1) : 0;
  const k = exact(br, digits).div(D.acos(-1).times(4));
  return [fx.times(k), fy.times(k), fz.times(k).plus(exact(br, digits).times(chi))];
}
