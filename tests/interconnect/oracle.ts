// High-precision oracle for the transmission-line closed forms: decimal.js at
// 50 significant digits from the exact decimal values of the double inputs,
// written from the published expressions as they stand (no rearrangement), so
// it checks the library's numerics (its stable rewritings), while the
// reference tables check the physics.
import { D, type Dec, exact, PI } from "../capacitance/oracle.js";
import { constantDecimal } from "../../src/constants/decimal.js";
import { constant } from "../../src/constants/index.js";

export { D, exact, PI, type Dec };
export { agreesWithOracle, relErr } from "../capacitance/oracle.js";

const MU0 = constantDecimal(constant("vacuumPermeability"), D);
const C0 = new D(299792458);
/** eta0 = mu0 c. */
export const ETA0 = MU0.times(C0);

const n = (v: number | string) => new D(v);

export interface MicrostripX {
  width: number;
  height: number;
  relativePermittivity: number;
  thickness: number;
  frequency: number;
}

/** Hammerstad & Jensen (1980) eq. (1)-(2): Z01(u) in air, ohm. */
export function z01(u: Dec): Dec {
  const f = n(6).plus(PI.times(2).minus(6).times(n(30.666).div(u).pow(0.7528).neg().exp()));
  return ETA0.div(PI.times(2)).times(f.div(u).plus(n(1).plus(n(4).div(u.pow(2))).sqrt()).ln());
}

/** Hammerstad & Jensen (1980) eq. (3)-(5): quasi-static eps_eff(u, epsr) of a zero-thickness strip. */
export function eeStatic(u: Dec, er: Dec): Dec {
  const a = n(1)
    .plus(u.pow(4).plus(u.div(52).pow(2)).div(u.pow(4).plus(0.432)).ln().div(49))
    .plus(n(1).plus(u.div(18.1).pow(3)).ln().div(18.7));
  const b = n(0.564).times(er.minus(0.9).div(er.plus(3)).pow(0.053));
  return er.plus(1).div(2).plus(er.minus(1).div(2).times(n(1).plus(n(10).div(u)).pow(a.times(b).neg())));
}

/** H&J quasi-static Z0 and eps_eff with the strip-thickness correction (eqs. (7)-(10) as quoted in the library). */
export function microstripStaticOracle(x: MicrostripX): { z0: Dec; ee: Dec } {
  const u = exact(x.width).div(exact(x.height));
  const er = exact(x.relativePermittivity);
  let u1 = u;
  let ur = u;
  if (x.thickness > 0) {
    const t = exact(x.thickness).div(exact(x.height));
    const coth = n(6.517).times(u).sqrt();
    const coth2 = n(1).div(coth.tanh()).pow(2);
    const du1 = t.div(PI).times(n(1).plus(n(4).times(n(1).exp()).div(t.times(coth2))).ln());
    const dur = n(0.5).times(n(1).plus(n(1).div(er.minus(1).sqrt().cosh()))).times(du1);
    u1 = u.plus(du1);
    ur = u.plus(dur);
  }
  const eer = eeStatic(ur, er);
  const z0 = z01(ur).div(eer.sqrt());
  const ee = eer.times(z01(u1).div(z01(ur)).pow(2));
  return { z0, ee };
}

/** Kirschning & Jansen (1982): eps_eff(f), fn = f h in GHz mm. */
export function eeDispersive(u: Dec, er: Dec, ee0: Dec, fn: Dec): Dec {
  const e = (v: Dec) => v.exp();
  const p1 = n(0.27488).plus(n(0.6315).plus(n(0.525).div(n(1).plus(n(0.0157).times(fn)).pow(20))).times(u))
    .minus(n(0.065683).times(e(n(-8.7513).times(u))));
  const p2 = n(0.33622).times(n(1).minus(e(n(-0.03442).times(er))));
  const p3 = n(0.0363).times(e(n(-4.6).times(u))).times(n(1).minus(e(fn.div(38.7).pow(4.97).neg())));
  const p4 = n(1).plus(n(2.751).times(n(1).minus(e(er.div(15.916).pow(8).neg()))));
  const p = p1.times(p2).times(n(0.1844).plus(p3.times(p4)).times(fn).pow(1.5763));
  return er.minus(er.minus(ee0).div(n(1).plus(p)));
}

/** Jansen & Kirschning (1983): Z0(f) from the static values, R1-R17 as quoted in the library (from memory). */
export function z0Dispersive(u: Dec, er: Dec, z0: Dec, ee0: Dec, eef: Dec, fn: Dec): Dec {
  const e = (v: Dec) => v.exp();
  const r1 = n(0.03891).times(er.pow(1.4));
  const r2 = n(0.267).times(u.pow(7));
  const r3 = n(4.766).times(e(n(-3.228).times(u.pow(0.641))));
  const r4 = n(0.016).plus(n(0.0514).times(er).pow(4.524));
  const r5 = fn.div(28.843).pow(12);
  const r6 = n(22.2).times(u.pow(1.92));
  const r7 = n(1.206).minus(n(0.3144).times(e(r1.neg())).times(n(1).minus(e(r2.neg()))));
  const r8 = n(1).plus(n(1.275).times(n(1).minus(e(n(-0.004625).times(r3).times(er.pow(1.674)).times(fn.div(18.365).pow(2.745))))));
  const r9 = n(5.086).times(r4).times(r5).div(n(0.3838).plus(n(0.386).times(r4)))
    .times(e(r6.neg())).div(n(1).plus(n(1.2992).times(r5)))
    .times(er.minus(1).pow(6)).div(n(1).plus(n(10).times(er.minus(1).pow(6))));
  const r10 = n(0.00044).times(er.pow(2.136)).plus(0.0184);
  const r11 = fn.div(19.47).pow(6).div(n(1).plus(n(0.0962).times(fn.div(19.47).pow(6))));
  const r12 = n(1).div(n(1).plus(n(0.00245).times(u.pow(2))));
  const r13 = n(0.9408).times(eef.pow(r8)).minus(0.9603);
  const r14 = n(0.9408).minus(r9).times(ee0.pow(r8)).minus(0.9603);
  const r15 = n(0.707).times(r10).times(fn.div(12.3).pow(1.097));
  const r16 = n(1).plus(n(0.0503).times(er.pow(2)).times(r11).times(n(1).minus(e(u.div(15).pow(6).neg()))));
  const r17 = r7.times(n(1).minus(n(1.1241).times(r12).div(r16).times(e(n(-0.026).times(fn.pow(1.15656)).minus(r15)))));
  return z0.times(r13.div(r14).pow(r17));
}

/** The oracle's microstrip impedance and effective permittivity at any frequency. */
export function microstripOracle(x: MicrostripX): { z0: Dec; ee: Dec } {
  const s = microstripStaticOracle(x);
  if (x.frequency === 0 || x.relativePermittivity === 1) return s;
  const u = exact(x.width).div(exact(x.height));
  const er = exact(x.relativePermittivity);
  const fn = exact(x.frequency).times(exact(x.height)).div(1e6);
  const eef = eeDispersive(u, er, s.ee, fn);
  return { z0: z0Dispersive(u, er, s.z0, s.ee, eef, fn), ee: eef };
}

/** eta0 ln(b/a) / (2 pi sqrt(epsr)). */
export function coaxialImpedanceOracle(x: { innerRadius: number; outerRadius: number; relativePermittivity: number }): Dec {
  return ETA0.times(exact(x.outerRadius).div(exact(x.innerRadius)).ln()).div(PI.times(2).times(exact(x.relativePermittivity).sqrt()));
}

/** eta0 acosh(D/2a) / (pi sqrt(epsr)). */
export function twoWireImpedanceOracle(x: { wireRadius: number; separation: number; relativePermittivity: number }): Dec {
  return ETA0.times(exact(x.separation).div(exact(x.wireRadius).times(2)).acosh()).div(PI.times(exact(x.relativePermittivity).sqrt()));
}

/** l sqrt(eps_eff) / c. */
export function delayOracle(x: { length: number; effectivePermittivity: number }): Dec {
  return exact(x.length).times(exact(x.effectivePermittivity).sqrt()).div(C0);
}

// Gamma, return loss and SWR lose (to 50 digits) what 1 - |Gamma| keeps when the
// load and the line differ by up to 1e600: these three use 1300 digits, where
// every sum of two doubles is exact.
const DW = D.clone({ precision: 1300 });
const wide = (v: number) => new DW(exact(v).toFixed());

/** (R - Z0) / (R + Z0), at 1300 digits. */
function gammaWide(x: { loadResistance: number; characteristicImpedance: number }) {
  const r = wide(x.loadResistance);
  const z = wide(x.characteristicImpedance);
  return r.minus(z).div(r.plus(z));
}

/** (R - Z0) / (R + Z0). */
export function gammaOracle(x: { loadResistance: number; characteristicImpedance: number }): Dec {
  return new D(gammaWide(x).toPrecision(60));
}

/** -20 log10 |Gamma| = 20 log10(1 + e), e = 2 min(R, Z0) / |R - Z0| formed at 1300 digits. */
export function returnLossOracle(x: { loadResistance: number; characteristicImpedance: number }): Dec {
  const r = wide(x.loadResistance);
  const z = wide(x.characteristicImpedance);
  const e = new D(DW.min(r, z).times(2).div(r.minus(z).abs()).toPrecision(60));
  // ln(1 + e): the series where 1 + e would round to 1 at 50 digits.
  const ln = e.lt(1e-20) ? e.minus(e.pow(2).div(2)).plus(e.pow(3).div(3)) : e.plus(1).ln();
  return ln.div(new D(10).ln()).times(20);
}

/** (1 + |Gamma|) / (1 - |Gamma|). */
export function swrOracle(x: { loadResistance: number; characteristicImpedance: number }): Dec {
  const g = gammaWide(x).abs();
  return new D(g.plus(1).div(new DW(1).minus(g)).toPrecision(60));
}

/** Z0 (R + j Z0 tan bl) / (Z0 + j R tan bl), bl = 2 pi f l sqrt(eps)/c, as [real, imaginary]. */
export function inputImpedanceOracle(x: {
  loadResistance: number; characteristicImpedance: number; length: number; frequency: number; effectivePermittivity: number;
}): [Dec, Dec] {
  const r = exact(x.loadResistance);
  const z = exact(x.characteristicImpedance);
  const bl = PI.times(2).times(exact(x.frequency)).times(exact(x.length)).times(exact(x.effectivePermittivity).sqrt()).div(C0);
  const t = bl.tan();
  // (r + j z t) / (z + j r t) = ((r + j z t)(z - j r t)) / (z^2 + r^2 t^2)
  const den = z.pow(2).plus(r.pow(2).times(t.pow(2)));
  const re = r.times(z).plus(z.times(t).times(r).times(t));
  const im = z.times(t).times(z).minus(r.times(r).times(t));
  return [z.times(re).div(den), z.times(im).div(den)];
}

/**
 * K(k) = pi / (2 AGM(1, k')) (DLMF 19.8.5) from the complementary modulus, at
 * the precision of kc's own decimal class. The AGM converges quadratically:
 * under 20 steps reach 200 digits from k' >= 1e-300 (bounded at 60).
 */
export function ellipticKOracle(kc: Dec): Dec {
  const C = kc.constructor as typeof D;
  const eps = new C(10).pow(-(C.precision - 3));
  let a = new C(1);
  let b = kc;
  for (let i = 0; i < 60; i++) {
    const an = a.plus(b).div(2);
    b = a.times(b).sqrt();
    a = an;
    if (a.minus(b).abs().lte(a.times(eps))) break;
  }
  return C.acos(-1).div(a.plus(b));
}

/** K(k)/K(k') from k and k' = sqrt(1 - k^2). */
export function kRatioOracle(k: Dec, kc: Dec): Dec {
  return ellipticKOracle(kc).div(ellipticKOracle(k));
}

/** Cohn (1954): (eta0 / (4 sqrt(epsr))) K(k)/K(k'), k = sech(pi w / 2b). */
export function striplineOracle(x: { width: number; groundSpacing: number; relativePermittivity: number }): Dec {
  const arg = PI.times(exact(x.width)).div(exact(x.groundSpacing).times(2));
  const k = n(1).div(arg.cosh());
  const kc = arg.tanh();
  return ETA0.div(4).div(exact(x.relativePermittivity).sqrt()).times(kRatioOracle(k, kc));
}

/**
 * Simons (2001) CPW [eps_eff, Z0], zero thickness, as printed, with k' = sqrt(1 - k^2)
 * at 200 digits: k3 comes within e^-160 of 1 for wide strips on thin substrates.
 */
const DC = D.clone({ precision: 200 });
export function cpwOracle(x: { width: number; gap: number; height: number; relativePermittivity: number; backing: string }): [Dec, Dec] {
  const big = (v: number) => new DC(exact(v).toFixed());
  const one = new DC(1);
  const pi = DC.acos(-1);
  const eta = new DC(ETA0.toFixed());
  const w = big(x.width);
  const g = big(x.gap);
  const h = big(x.height);
  const er = big(x.relativePermittivity);
  const comp = (k: Dec) => one.minus(k.pow(2)).sqrt();
  const k0 = w.div(w.plus(g.times(2)));
  const r0 = kRatioOracle(k0, comp(k0));
  const A = pi.times(w).div(h.times(4));
  const B = pi.times(w.div(2).plus(g)).div(h.times(2));
  const out = (ee: Dec, z: Dec): [Dec, Dec] => [new D(ee.toPrecision(60)), new D(z.toPrecision(60))];
  if (x.backing === "none") {
    const k1 = A.sinh().div(B.sinh());
    const ee = one.plus(er.minus(1).div(2).times(kRatioOracle(k1, comp(k1))).div(r0));
    return out(ee, eta.div(4).div(r0).div(ee.sqrt()));
  }
  const k3 = A.tanh().div(B.tanh());
  const r3 = kRatioOracle(k3, comp(k3));
  const q = r3.div(r0);
  const ee = one.plus(er.times(q)).div(one.plus(q));
  return out(ee, eta.div(2).div(ee.sqrt().times(r0.plus(r3))));
}

/**
 * IPC-2221B sec. 6.2 (curve fit to its Figure 6-4): I = k dT^0.44 A^0.725, A = w t in square
 * mils (1 mil = 25.4e-6 m exactly), k = 0.048 external, 0.024 internal. The exponents are taken
 * as the doubles the library holds (0.44 and 0.725 are not doubles: they differ from them by under
 * 2^-54, which moves the result by |ln A| * 3e-17 relative, immaterial for a two-figure fit but
 * up to 40 eps at A = 1e300).
 */
export function traceCurrentOracle(x: { width: number; thickness: number; temperatureRise: number; layer: "external" | "internal" }): Dec {
  const mil = n("25.4e-6");
  const k = n(x.layer === "internal" ? "0.024" : "0.048");
  const area = exact(x.width).div(mil).times(exact(x.thickness).div(mil));
  return k.times(exact(x.temperatureRise).pow(exact(0.44))).times(area.pow(exact(0.725)));
}
