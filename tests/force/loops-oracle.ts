// decimal.js oracle of the axial force between coaxial filaments as Babic and
// Akyel (2008) write it, with K and E by the AGM (tests/math/decimal-elliptic.ts):
//   F = mu0 I1 I2 d k / (4 sqrt(ab)) [(2 - m) E / (1 - m) - 2 K],  m = k^2 = 4ab/((a+b)^2 + d^2),
// positive = attraction. The bracket cancels like m^2 (loops far apart) and
// 1 - m is tiny for touching loops, so the working precision grows with both.
import { constant } from "../../src/constants/index.js";
import { dec, ellipticKE, exact, type Dec } from "../math/decimal-elliptic.js";

export function loopsForceOracleDecimal(i1: number, i2: number, a: number, b: number, d: number): Dec {
  const probe = dec(40);
  const pa = exact(a, 40), pb = exact(b, 40), pd = exact(d, 40);
  const s = pa.plus(pb).pow(2).plus(pd.pow(2));
  const mApprox = new probe(pa.times(pb).times(4)).div(s);
  const mcApprox = new probe(pa.minus(pb).pow(2).plus(pd.pow(2))).div(s);
  const lg = (x: Dec) => Math.abs(x.log(10).toNumber());
  const digits = Math.min(1000, 60 + Math.ceil(2 * lg(mApprox)) + Math.ceil(lg(mcApprox)));
  const Dm = dec(digits);
  const a_ = exact(a, digits), b_ = exact(b, digits), d_ = exact(d, digits);
  const r2sq = a_.plus(b_).pow(2).plus(d_.pow(2));
  const mm = new Dm(a_.times(b_).times(4)).div(r2sq);
  const mc = new Dm(a_.minus(b_).pow(2).plus(d_.pow(2))).div(r2sq);
  const { K, E } = ellipticKE(mm, mc, digits);
  const bracket = new Dm(2).minus(mm).times(E).div(mc).minus(K.times(2));
  const mu0 = new Dm(constant("vacuumPermeability").decimal); // CODATA 2022 string
  return mu0.times(exact(i1, digits)).times(exact(i2, digits)).times(d_).times(mm.sqrt())
    .div(new Dm(a_.times(b_)).sqrt().times(4)).times(bracket);
}

export function loopsForceOracle(i1: number, i2: number, a: number, b: number, d: number): number {
  return loopsForceOracleDecimal(i1, i2, a, b, d).toNumber();
}
