import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  evaluate, FormulaError, hallVoltage, lorentzForce, magneticPressure, parallelWiresForce, quantity, wireForce,
  type Angle, type Charge, type Current, type ElectricField, type FluxDensity, type Length, type NumberDensity,
  type Vec3, type Velocity,
} from "../../src/index.js";
import { ELEMENTARY_CHARGE, MU0 as MU0_SI, SPEED_OF_LIGHT } from "../../src/constants/si.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, d, E, MU0, PI } from "./oracle.js";
import { codeOf } from "../helpers/errors.js";

const A = (v: number) => v as Current;
const m = (v: number) => v as Length;
const T = (v: number) => v as FluxDensity;
const vecE = (v: readonly number[]) => v as unknown as Vec3<ElectricField>;
const vecV = (v: readonly number[]) => v as unknown as Vec3<Velocity>;
const vecB = (v: readonly number[]) => v as unknown as Vec3<FluxDensity>;
const finite = (lim: number) => fc.double({ min: -lim, max: lim, noNaN: true, noDefaultInfinity: true });
const vec = (lim: number) => fc.tuple(finite(lim), finite(lim), finite(lim));
/** The result, or undefined when it is out_of_range (an exact result below the smallest subnormal). */
function inRange<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch (e) {
    if (e instanceof FormulaError && e.code === "out_of_range") return undefined;
    throw e;
  }
}
// Speeds below c/2 per component keep |v| < c.
const speedVec = vec(SPEED_OF_LIGHT / 2);


describe("lorentzForce", () => {
  it("gives q v B on a proton crossing a 1 T field, as a decimal.js oracle of q(E + v x B)", () => {
    const f = lorentzForce({ charge: ELEMENTARY_CHARGE as Charge, electricField: vecE([0, 0, 0]), velocity: vecV([1e6, 0, 0]), fluxDensity: vecB([0, 0, 1]) });
    // x-hat cross z-hat = -y-hat: F = -e v B y-hat.
    expect(f[0]).toBe(0);
    expect(f[2]).toBe(0);
    expectClose(f[1]!, { expected: E.times(1e6).neg().toNumber(), tolerance: 1e-15, source: "decimal.js oracle, e exact (SI 2019)" });
  });

  it("balances in a velocity filter when v = E/B (Wien filter condition, common practice)", () => {
    const f = lorentzForce({ charge: -ELEMENTARY_CHARGE as Charge, electricField: vecE([0, 1e4, 0]), velocity: vecV([1e5, 0, 0]), fluxDensity: vecB([0, 0, 0.1]) });
    // v x B = 1e5 x-hat x 0.1 z-hat = -1e4 y-hat, cancelling E. With 0.1 as a double the balance is
    // off by 1e5 (0.1 - double(0.1)) = -5.55e-13 V/m, and the residual force keeps those digits
    // (decimal.js oracle of q (E_y - v_x B_z) from the exact double inputs).
    expect(f[0]).toBe(0);
    expect(f[2]).toBe(0);
    const exact0_1 = new D("0.1000000000000000055511151231257827021181583404541015625"); // the double 0.1, exactly
    const want = E.neg().times(new D(1e4).minus(new D(1e5).times(exact0_1)));
    expectClose(f[1]!, { expected: want.toNumber(), tolerance: 2 * Number.EPSILON, source: "decimal.js oracle of q (E_y - v_x B_z)" });
  });

  it("accepts unit strings per vector component through evaluate", () => {
    const r = evaluate("lorentzForce", { charge: "1.602176634e-19 C", electricField: ["0 V/m", "0 V/m", "0 V/m"], velocity: ["1000 km/s", "0 m/s", "0 m/s"], fluxDensity: ["0 T", "0 T", "10 kG"] });
    expect(r.unit).toBe("N");
    expectClose((r.value as number[])[1]!, { expected: -1.602176634e-13, tolerance: 1e-12, source: "e v B with e exact, v = 1e6 m/s, B = 1 T (10 kG)" });
  });

  it("rejects a speed at or above c and a short vector", () => {
    expect(codeOf(() => lorentzForce({ charge: 1 as Charge, electricField: vecE([0, 0, 0]), velocity: vecV([SPEED_OF_LIGHT, 0, 0]), fluxDensity: vecB([0, 0, 1]) }))).toBe("out_of_domain");
    expect(codeOf(() => evaluate("lorentzForce", { charge: 1, electricField: [0, 0], velocity: [0, 0, 0], fluxDensity: [0, 0, 1] }))).toBe("wrong_type");
    expect(codeOf(() => evaluate("lorentzForce", { charge: 1, electricField: [0, 0, NaN], velocity: [0, 0, 0], fluxDensity: [0, 0, 1] }))).toBe("not_finite");
  });

  it("does no work through the magnetic part: F . v = 0 when E = 0", () => {
    fc.assert(
      fc.property(finite(1e-15), speedVec, vec(1e3), (q, v, b) => {
        const f = inRange(() => lorentzForce({ charge: q as Charge, electricField: vecE([0, 0, 0]), velocity: vecV(v), fluxDensity: vecB(b) }));
        if (f === undefined) return; // every component below the smallest subnormal (extremes-accuracy checks that case)
        const scale = Math.hypot(...f) * Math.hypot(...v);
        const power = f[0]! * v[0] + f[1]! * v[1] + f[2]! * v[2];
        expect(Math.abs(power)).toBeLessThanOrEqual(1e-14 * scale + 1e-300);
      }),
    );
  });

  it("is linear in the charge", () => {
    fc.assert(
      fc.property(finite(1e-12), fc.integer({ min: -8, max: 8 }), vec(1e6), speedVec, vec(1e3), (q, k, e, v, b) => {
        const one = inRange(() => lorentzForce({ charge: q as Charge, electricField: vecE(e), velocity: vecV(v), fluxDensity: vecB(b) }));
        const many = inRange(() => lorentzForce({ charge: (k * q) as Charge, electricField: vecE(e), velocity: vecV(v), fluxDensity: vecB(b) }));
        if (one === undefined || many === undefined) return; // below the smallest subnormal (see extremes-accuracy)
        for (let i = 0; i < 3; i++) expect(Math.abs(many[i]! - k * one[i]!)).toBeLessThanOrEqual(1e-15 * Math.abs(k * one[i]!) + 1e-300);
      }),
    );
  });
});

describe("wireForce", () => {
  it("gives B I l for a wire across the field, as a decimal.js oracle", () => {
    checkCases(
      [
        { input: { current: 2, length: 5, fluxDensity: 1 }, expected: 10, tolerance: 1e-15, source: "decimal.js oracle: I l B" },
        { input: { current: 3, length: 0.2, fluxDensity: 0.8, angle: Math.PI / 6 }, expected: D.mul(3, 0.2).times(0.8).times(D.sin(PI.div(6))).toNumber(), tolerance: 1e-14, source: "decimal.js oracle: I l B sin(30 deg)" },
      ],
      (x) => wireForce({ current: A(x.current), length: m(x.length), fluxDensity: T(x.fluxDensity), ...(x.angle === undefined ? {} : { angle: x.angle as Angle }) }),
    );
  });

  it("agrees with the parallel-wire force when B is the field of a long wire, mu0 I/(2 pi d)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e5, noNaN: true }), fc.double({ min: 1e-3, max: 1e5, noNaN: true }), fc.double({ min: 1e-3, max: 10, noNaN: true }), (i1, i2, dist) => {
        const b = (MU0_SI * i1) / (2 * Math.PI * dist);
        const fw = wireForce({ current: A(i2), length: m(1), fluxDensity: T(b) });
        const fp = parallelWiresForce({ current1: A(i1), current2: A(i2), separation: m(dist), length: m(1) });
        expect(relativeError(fw, fp)).toBeLessThan(1e-14);
      }),
    );
  });

  it("takes the angle in degrees through evaluate", () => {
    const r = evaluate("wireForce", { current: "100 A", length: "1 m", fluxDensity: "0.1 T", angle: "30 deg" });
    expectClose(r.value as number, { expected: 5, tolerance: 1e-12, source: "I l B sin(30 deg) = 100 * 1 * 0.1 * 0.5" });
  });

  it("cautions on fault-current forces from 1 kA only: not on a 1 mA wire or a voice coil", () => {
    const codes = (i: string, b = "0.1 mT") => evaluate("wireForce", { current: i, length: "1 m", fluxDensity: b }).cautions.map((c) => c.code);
    expect(codes("1 mA")).toEqual([]);
    expect(codes("999 A")).toEqual([]);
    // A voice coil: a few amperes in a 1 T gap (common practice); the field itself draws the strong-field caution.
    expect(codes("3 A", "1 T")).toEqual(["strong_field"]);
    const r = evaluate("wireForce", { current: "-25 kA", length: "1 m", fluxDensity: "0.1 mT" });
    expect(r.cautions.map((c) => c.code)).toEqual(["fault_current_force"]);
    expect(r.cautions[0]!.message).toContain("IEC 60865-1:2011");
    expect(r.cautions[0]!.message).toContain("1 kA");
    expect(r.cautions[0]!.message).toMatch(/licensed practice govern/);
    const caution = wireForce.definition.cautions!.find((c) => c.code === "fault_current_force")!;
    expect(caution.measure!({ current: -25e3, length: 1, fluxDensity: 1e-4, angle: Math.PI / 2 }, 2.5)).toBe(25e3);
  });
});

describe("parallelWiresForce", () => {
  it("gives 2e-7 N per metre between 1 A wires 1 m apart (the ampere's definition before 2019)", () => {
    const f = parallelWiresForce({ current1: A(1), current2: A(1), separation: m(1), length: m(1) });
    // Former SI definition of the ampere (9th CGPM 1948, in force until 20 May 2019): exactly 2e-7 N/m.
    // CODATA 2022 mu0 differs from 4 pi 1e-7 by about 1.3e-10 relative, so the check holds to 1e-9.
    expectClose(f, { expected: 2e-7, tolerance: 1e-9, source: "former SI definition of the ampere (9th CGPM, 1948)" });
    expectClose(f, { expected: MU0.div(PI.times(2)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle, CODATA 2022 mu0" });
  });

  it("is positive (attractive) for like-directed currents and negative for opposed ones", () => {
    expect(parallelWiresForce({ current1: A(10), current2: A(20), separation: m(0.1), length: m(1) })).toBeGreaterThan(0);
    expect(parallelWiresForce({ current1: A(10), current2: A(-20), separation: m(0.1), length: m(1) })).toBeLessThan(0);
  });

  it("is symmetric in the two currents and antisymmetric in the sign of one", () => {
    const cur = fc.double({ min: -1e6, max: 1e6, noNaN: true });
    fc.assert(
      fc.property(cur, cur, fc.double({ min: 1e-4, max: 10, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (i1, i2, sep, len) => {
        // Currents whose product is below the smallest normal double give out_of_range (see extremes-accuracy).
        fc.pre(i1 === 0 || i2 === 0 || Math.abs(i1 * i2) > 1e-250);
        const f = parallelWiresForce({ current1: A(i1), current2: A(i2), separation: m(sep), length: m(len) });
        const swapped = parallelWiresForce({ current1: A(i2), current2: A(i1), separation: m(sep), length: m(len) });
        const flipped = parallelWiresForce({ current1: A(-i1), current2: A(i2), separation: m(sep), length: m(len) });
        expect(relativeError(swapped, f)).toBeLessThanOrEqual(1e-15);
        expect(flipped).toBe(-f);
      }),
    );
  });

  it("warns when the length is not much larger than the separation, with the finite-segment error", () => {
    const short = parallelWiresForce.details({ current1: A(1000), current2: A(1000), separation: m(0.1), length: m(1) });
    const w = short.warnings.find((x) => x.code === "finite_length");
    expect(w).toBeDefined();
    // Two 1 m segments 0.1 m apart: (sqrt(1.01) - 0.1) = 0.90499 of the infinite-wire value -> 9.5 % over.
    expect(w!.message).toContain("9.5 %");
    expect(parallelWiresForce.details({ current1: A(1), current2: A(1), separation: m(0.001), length: m(1) }).warnings).toEqual([]);
    expect(short.cautions.map((c) => c.code)).toEqual(["fault_current_force"]);
    // The caution takes the geometric mean of the currents: 1 kA next to 1 mA is far below it.
    expect(parallelWiresForce.details({ current1: A(1000), current2: A(1e-3), separation: m(0.001), length: m(1) }).cautions).toEqual([]);
    expect(parallelWiresForce.details({ current1: A(10), current2: A(10), separation: m(0.001), length: m(1) }).cautions).toEqual([]);
  });

  it("rejects a zero separation with the input's name", () => {
    try {
      parallelWiresForce({ current1: A(1), current2: A(1), separation: m(0), length: m(1) });
      expect.fail("no error");
    } catch (e) {
      expect((e as FormulaError).code).toBe("out_of_domain");
      expect((e as FormulaError).input).toBe("separation");
    }
  });
});

describe("magneticPressure", () => {
  it("is about 398 kPa at 1 T (derived from CODATA 2022 mu0)", () => {
    const p = magneticPressure({ fluxDensity: quantity(1, "T") });
    expectClose(p, { expected: 397887, tolerance: 1e-6, source: "1/(2 mu0), derived from CODATA 2022" });
    expectClose(p, { expected: D.div(1, MU0.times(2)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" });
  });

  it("scales with the square of B and ignores its sign", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-100, max: 1e3, noNaN: true }), fc.boolean(), fc.double({ min: 0.01, max: 100, noNaN: true }), (mag, negative, k) => {
        const b = negative ? -mag : mag;
        const p = magneticPressure({ fluxDensity: T(b) });
        expect(magneticPressure({ fluxDensity: T(-b) })).toBe(p);
        expect(relativeError(magneticPressure({ fluxDensity: T(k * b) }), k * k * p)).toBeLessThanOrEqual(4e-16 * 4);
      }),
    );
  });

  it("cautions on coil pressure from one atmosphere (about 0.5 T) and with the library's strong-field rule from 200 uT", () => {
    expect(magneticPressure.details({ fluxDensity: T(1) }).cautions.map((c) => c.code)).toEqual(["coil_pressure", "strong_field"]);
    expect(magneticPressure.details({ fluxDensity: T(0.01) }).cautions.map((c) => c.code)).toEqual(["strong_field"]);
    // The shared rule starts at the ICNIRP 2010 public power-frequency reference level, 200 uT (from memory).
    expect(magneticPressure.details({ fluxDensity: T(-3e-4) }).cautions.map((c) => c.code)).toEqual(["strong_field"]);
    expect(magneticPressure.details({ fluxDensity: T(1e-4) }).cautions).toEqual([]);
    expect(magneticPressure.details({ fluxDensity: T(1) }).cautions[1]!.message).toContain("0.5 mT");
  });

  it("reports an unrepresentable pressure as out_of_range, never Infinity", () => {
    expect(codeOf(() => magneticPressure({ fluxDensity: T(1e200) }))).toBe("out_of_range");
  });
});

describe("hallVoltage", () => {
  it("gives the free-electron Hall coefficient of copper, -1/(n e) = -7.4e-11 m^3/C, for a 1 mm strip at 5 A and 1.2 T", () => {
    // Conduction-electron density of copper 8.47e28 m^-3 (Ashcroft & Mermin 1976, Table 1.1, from memory);
    // the expected voltage is a decimal.js oracle of V_H = I B / (n q t), not a printed number.
    const v = hallVoltage({ current: A(5), fluxDensity: T(1.2), carrierDensity: 8.47e28 as NumberDensity, thickness: quantity(0.1, "cm"), carrierCharge: -ELEMENTARY_CHARGE as Charge });
    expectClose(v, { expected: D.mul(5, 1.2).div(d(8.47e28).times(E).neg().times(d(1e-3))).toNumber(), tolerance: 4 * Number.EPSILON, source: "decimal.js oracle of I B / (n q t)" });
    expectClose(v * 1e-3 / (5 * 1.2), { expected: -7.37e-11, tolerance: 1e-3, source: "R_H = -1/(n e) with n = 8.47e28 m^-3 (Ashcroft & Mermin Table 1.1, from memory)" });
  });

  it("is negative for electrons and positive for holes (sign convention: edge toward I x B minus the other)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 10, noNaN: true }), fc.double({ min: 1e-4, max: 10, noNaN: true }), fc.double({ min: 1e18, max: 1e29, noNaN: true }), (i, b, n) => {
        const holes = hallVoltage({ current: A(i), fluxDensity: T(b), carrierDensity: n as NumberDensity, thickness: m(1e-4) });
        const electrons = hallVoltage({ current: A(i), fluxDensity: T(b), carrierDensity: n as NumberDensity, thickness: m(1e-4), carrierCharge: -ELEMENTARY_CHARGE as Charge });
        expect(holes).toBeGreaterThan(0);
        expect(electrons).toBe(-holes);
      }),
    );
  });

  it("rejects a zero carrier charge as a broken relation", () => {
    expect(codeOf(() => hallVoltage({ current: A(1), fluxDensity: T(1), carrierDensity: 1e28 as NumberDensity, thickness: m(1e-3), carrierCharge: 0 as Charge }))).toBe("out_of_domain");
  });
});
