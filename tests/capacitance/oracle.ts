// High-precision oracle for the capacitance closed forms: decimal.js at 50
// significant digits, from the exact decimal values of the double inputs and
// the published CODATA 2022 string for eps0. Written from the textbook
// expressions as they stand (ln(b/a), acosh(D/2a), ab/(b-a)): at 50 digits the
// cancellation that hurts doubles costs nothing.
import Decimal from "decimal.js";
import { exactDecimal } from "../helpers/exact-decimal.js";
import { expect } from "vitest";
import type { FormulaError } from "../../src/core/errors.js";
import { constant } from "../../src/constants/index.js";
import { constantDecimal } from "../../src/constants/decimal.js";

export const D = Decimal.clone({ precision: 50, toExpNeg: -9e15, toExpPos: 9e15, minE: -9e15, maxE: 9e15 });
export type Dec = Decimal;

/** The exact value of a double as a decimal (no rounding: decimal.js keeps constructed digits). */
export function exact(x: number): Dec {
  return exactDecimal(x, D);
}

export const EPS0 = constantDecimal(constant("vacuumPermittivity"), D);
export const PI = D.acos(-1);

export interface LineInputs {
  length: number;
  relativePermittivity: number;
}

/** 2 pi eps0 epsr l / ln(b/a). */
export function coaxialOracle(x: LineInputs & { innerRadius: number; outerRadius: number }): Dec {
  const ln = exact(x.outerRadius).div(exact(x.innerRadius)).ln();
  return PI.times(2).times(EPS0).times(exact(x.relativePermittivity)).times(exact(x.length)).div(ln);
}

/** 4 pi eps0 epsr a b / (b - a). */
export function sphericalOracle(x: { innerRadius: number; outerRadius: number; relativePermittivity: number }): Dec {
  const a = exact(x.innerRadius);
  const b = exact(x.outerRadius);
  return PI.times(4).times(EPS0).times(exact(x.relativePermittivity)).times(a).times(b).div(b.minus(a));
}

/** 4 pi eps0 epsr a. */
export function isolatedSphereOracle(x: { radius: number; relativePermittivity: number }): Dec {
  return PI.times(4).times(EPS0).times(exact(x.relativePermittivity)).times(exact(x.radius));
}

/** pi eps0 epsr l / acosh(D / 2a). */
export function twoWireOracle(x: LineInputs & { wireRadius: number; separation: number }): Dec {
  const ach = exact(x.separation).div(exact(x.wireRadius).times(2)).acosh();
  return PI.times(EPS0).times(exact(x.relativePermittivity)).times(exact(x.length)).div(ach);
}

/** 2 pi eps0 epsr l / acosh(h / a). */
export function wireOverPlaneOracle(x: LineInputs & { wireRadius: number; height: number }): Dec {
  const ach = exact(x.height).div(exact(x.wireRadius)).acosh();
  return PI.times(2).times(EPS0).times(exact(x.relativePermittivity)).times(exact(x.length)).div(ach);
}

/** eps0 epsr A / d. */
export function parallelPlateOracle(x: { area: number; gap: number; relativePermittivity: number }): Dec {
  return EPS0.times(exact(x.relativePermittivity)).times(exact(x.area)).div(exact(x.gap));
}

/** C V^2 / 2. */
export function energyOracle(x: { capacitance: number; voltage: number }): Dec {
  return exact(x.capacitance).times(exact(x.voltage).pow(2)).div(2);
}

/** C V. */
export function chargeOracle(x: { capacitance: number; voltage: number }): Dec {
  return exact(x.capacitance).times(exact(x.voltage));
}

/** |got - want| / |want| as a double. */
export function relErr(got: number, want: Dec): number {
  return exact(got).minus(want).abs().div(want.abs()).toNumber();
}

/** True when a positive decimal lies in the range of normal doubles. */
export function representable(v: Dec): boolean {
  const m = v.abs();
  return m.gte("2.2250738585072014e-308") && m.lte("1.7976931348623157e308");
}

/** C1 C2 / (C1 + C2): two capacitors in series. */
export function seriesOracle(x: { capacitance1: number; capacitance2: number }): Dec {
  const a = exact(x.capacitance1);
  const b = exact(x.capacitance2);
  return a.times(b).div(a.plus(b));
}

/** C1 + C2: two capacitors in parallel. */
export function parallelOracle(x: { capacitance1: number; capacitance2: number }): Dec {
  return exact(x.capacitance1).plus(exact(x.capacitance2));
}

const MIN_NORMAL = "2.2250738585072014e-308";
const MIN_SUBNORMAL_HALF = "2.4703282292062328e-324"; // half the smallest subnormal: below it a result rounds to 0

/**
 * The shared extremes check: formula `f` at plain SI inputs `x` against the
 * oracle value `want`. A normal result must be within `tol` (relative); an
 * overflowing or below-subnormal one must be out_of_range; a subnormal one must
 * come back within one subnormal ulp (2^-1074), the library's range policy
 * (src/math/scaled.ts; before it was unified, out_of_range was accepted here
 * too). Between half the smallest subnormal and the smallest subnormal itself
 * (to rounding) out_of_range is the policy and a returned 2^-1074 is also
 * within one ulp. Records
 * the worst relative error per formula id in `worst`.
 */
export function agreesWithOracle(f: unknown, x: object, want: Dec, tol: number, worst: Map<string, number>): void {
  const id = (f as { id: string }).id;
  const call = () => (f as (x: never) => number)(x as never);
  const m = want.abs();
  if (m.isZero()) {
    expect(call() === 0, `${id} ${JSON.stringify(x)}: an exact zero (either sign)`).toBe(true);
  } else if (representable(want)) {
    const got = call();
    const err = relErr(got, want);
    worst.set(id, Math.max(worst.get(id) ?? 0, err));
    const eps = Number.EPSILON;
    if (!(err <= tol)) expect.fail(`${id} ${JSON.stringify(x)}: got ${got}, want ${want.toPrecision(20)}, rel.err ${err / eps} eps > ${tol / eps} eps`);
  } else if (m.lt(MIN_NORMAL) && m.gte(MIN_SUBNORMAL_HALF)) {
    let got: number;
    try {
      got = call();
    } catch (e) {
      expect((e as FormulaError).code).toBe("out_of_range");
      // Refused only where the exact value is below the smallest subnormal (to the scaled value's rounding).
      expect(m.lt(exact(2 ** -1074).times(1 + 1e-14)), `${id} ${JSON.stringify(x)}: refused a subnormal result ${want.toPrecision(5)}`).toBe(true);
      return;
    }
    expect(exact(got).minus(want).abs().lte(exact(2 ** -1074)), `${id} ${JSON.stringify(x)}: got ${got}`).toBe(true);
  } else {
    expect(call, `${id} ${JSON.stringify(x)}`).toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as FormulaError);
  }
}

/**
 * The same for a vector result, component by component: a normal component
 * within `tol`, a zero one exactly 0, a subnormal or smaller one within one
 * subnormal ulp; out_of_range when a component overflows or when every
 * non-zero component is below half the smallest subnormal.
 */
export function vectorAgreesWithOracle(f: unknown, x: object, want: readonly Dec[], tol: number, worst: Map<string, number>): void {
  const id = (f as { id: string }).id;
  const call = () => (f as (x: never) => readonly number[])(x as never);
  const overflow = want.some((w) => w.abs().gt("1.7976931348623157e308"));
  const allTiny = want.every((w) => w.abs().lt(MIN_SUBNORMAL_HALF)) && want.some((w) => !w.isZero());
  if (overflow || allTiny) {
    expect(call, `${id} ${JSON.stringify(x)}`).toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as FormulaError);
    return;
  }
  const got = call();
  for (let i = 0; i < 3; i++) {
    const w = want[i]!;
    if (representable(w)) {
      const err = relErr(got[i]!, w);
      worst.set(id, Math.max(worst.get(id) ?? 0, err));
      if (!(err <= tol)) expect.fail(`${id}[${i}] ${JSON.stringify(x)}: got ${got[i]}, want ${w.toPrecision(20)}, rel.err ${err / Number.EPSILON} eps`);
    } else {
      expect(exact(got[i]!).minus(w).abs().lte(exact(2 ** -1074)), `${id}[${i}] ${JSON.stringify(x)}: got ${got[i]}, want ${w.toPrecision(5)}`).toBe(true);
    }
  }
}
