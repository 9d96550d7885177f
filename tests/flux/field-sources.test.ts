import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FormulaError, evaluate, helmholtzCenterField, loopAxialField, loopField, solenoidAxialField, toroidField, wireField,
  type Current, type Length,
} from "../../src/index.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, MU0, PI, loopFieldOracle } from "./oracle.js";

const A = (v: number) => v as Current;
const m = (v: number) => v as Length;
const MU0_NUM = MU0.toNumber();

describe("wireField", () => {
  it("gives 2e-7 T at 1 m from 1 A, the basis of the former SI ampere definition", () => {
    // BIPM, The International System of Units, 8th ed. (2006), sec. 2.1.1.4: 1 A in two long wires 1 m apart
    // gives 2e-7 N per metre, i.e. 2e-7 T at 1 m. mu0 (CODATA 2022) differs from 4 pi 1e-7 by about 1e-10.
    expectClose(wireField({ current: A(1), distance: m(1) }), { input: "1 A, 1 m", expected: 2e-7, tolerance: 1e-9, source: "BIPM SI Brochure 8th ed. (2006), former ampere definition" });
  });

  it("matches mu0 I / (2 pi d) from a decimal.js oracle", () => {
    checkCases(
      [
        { input: { current: 1000, distance: 0.05 }, expected: MU0.times(1000).div(PI.times(2).times(0.05)).toNumber(), tolerance: 1e-15, source: "decimal.js oracle of mu0 I / (2 pi d)" },
        { input: { current: -3, distance: 2e-3 }, expected: MU0.times(-3).div(PI.times(2).times("2e-3")).toNumber(), tolerance: 1e-15, source: "decimal.js oracle" },
      ],
      (x) => wireField({ current: A(x.current), distance: m(x.distance) }),
    );
  });

  it("cautions from the ICNIRP 2010 public reference level, 200 uT, and names the 0.5 mT implant line for static fields", () => {
    // ICNIRP 2010 (1 Hz-100 kHz) public reference level at 50-60 Hz: 200 uT; ICNIRP 2009 static: 0.5 mT for implants (from memory).
    // mu0 / (2 pi) is 1.99999999974e-7 T m/A (CODATA 2022), so 1000 A at 1 m is just under 200 uT.
    expect(wireField.details({ current: A(999), distance: m(1) }).cautions).toEqual([]);
    const above = wireField.details({ current: A(1001), distance: m(1) }).cautions;
    expect(above.map((c) => c.code)).toEqual(["strong_field"]);
    expect(above[0]!.message).toMatch(/200 uT.*below the 0\.5 mT line/);
    const implant = wireField.details({ current: A(-2600), distance: m(1) }).cautions[0]!.message; // 0.52 mT, either direction
    expect(implant).toMatch(/at or above the 0\.5 mT \(5 G\) line/);
  });

  it("prints no Infinity or NaN in its caution for the largest fields (9e300 T at 2.2e-308 m)", () => {
    const d = wireField.details({ current: A(10), distance: m(2.2e-308) });
    expect(d.value).toBeGreaterThan(9e300);
    expect(d.cautions[0]!.message).not.toMatch(/Infinity|NaN/);
    expect(d.cautions[0]!.message).toMatch(/ T:/);
  });
});

describe("loopAxialField", () => {
  it("gives mu0 I / (2 R) at the centre of the loop", () => {
    // The on-axis formula mu0 I R^2 / (2 (R^2 + z^2)^(3/2)) at z = 0.
    expectClose(loopAxialField({ current: A(1), radius: m(0.1), axialDistance: m(0) }), {
      input: "1 A, R = 0.1 m", expected: MU0.div(0.2).toNumber(), tolerance: 1e-15, source: "decimal.js oracle of mu0 I / (2R), the on-axis formula at z = 0",
    });
  });

  it("matches mu0 I R^2 / (2 (R^2 + z^2)^(3/2)) from a decimal.js oracle, near and far", () => {
    for (const [R, z] of [[0.1, 0.05], [0.1, -0.3], [1e-3, 1e3], [2, 1e-9]] as const) {
      const expected = MU0.times(R * R).div(new D(R * R).plus(new D(z).pow(2)).pow(1.5).times(2)).toNumber();
      expectClose(loopAxialField({ current: A(1), radius: m(R), axialDistance: m(z) }), {
        input: { R, z }, expected, tolerance: 1e-14, source: "decimal.js oracle",
      });
    }
  });
});

describe("loopField", () => {
  const cases: [number, number, string][] = [
    [0.05, 0.05, "general point"],
    [0.3, 0.0, "in the plane, outside"],
    [0.02, -0.07, "below the plane"],
    [1e-9, 0.04, "very near the axis (series branch)"],
    [1e-4, 1e-3, "near the axis, near the centre"],
    [1e3, 2e3, "far away (m ~ 1e-7)"],
    [1e6, 0, "very far, in the plane"],
    [0.1 + 1e-7, 1e-7, "1e-6 radii from the wire"],
    [0.0999999999, 0, "1e-9 radii inside the wire"],
    [0.1 * (1 + 0.2236), 0.01, "near the loop (m ~ 0.95)"],
    [2.4, 0.5, "outside the radius, m ~ 0.75 (axial bracket switch)"],
    [14.3, 3e-5, "far out in the plane, m ~ 0.24"],
  ];

  it("matches Smythe's elliptic expression evaluated in 40 digits (decimal.js oracle), near the axis, far and near the wire", () => {
    for (const [rho, z, name] of cases) {
      const [er, ez] = loopFieldOracle(1, 0.1, rho, z);
      const [br, bz] = loopField({ current: A(1), radius: m(0.1), radialDistance: m(rho), axialDistance: m(z) });
      const scale = Math.hypot(er, ez);
      // Component errors measured against |B|: a component crossing zero keeps an absolute accuracy.
      expect(Math.abs(br! - er) / scale, `${name} radial`).toBeLessThan(3e-14);
      expect(Math.abs(bz! - ez) / scale, `${name} axial`).toBeLessThan(3e-14);
    }
  });

  it("is continuous across the switch between its series and closed forms (m = 0.2)", () => {
    // m = 4 rho / ((1 + rho)^2 + z^2) = 0.2 at z = 0.3 for the smaller root rho0; probe both sides.
    const p = 4 / 0.2 - 2;
    const rho0 = (p - Math.sqrt(p * p - 4 * (1 + 0.09))) / 2;
    for (const rho of [rho0 * (1 - 1e-12), rho0 * (1 + 1e-12), rho0 * 0.9, rho0 * 1.1]) {
      const [er, ez] = loopFieldOracle(1, 1, rho, 0.3);
      const [br, bz] = loopField({ current: A(1), radius: m(1), radialDistance: m(rho), axialDistance: m(0.3) });
      expect(relativeError(br!, er)).toBeLessThan(1e-13);
      expect(relativeError(bz!, ez)).toBeLessThan(1e-13);
    }
  });

  it("is finite on the axis, with a zero radial part equal to loopAxialField", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.double({ min: -100, max: 100, noNaN: true }), (R, z) => {
        const [br, bz] = loopField({ current: A(2), radius: m(R), radialDistance: m(0), axialDistance: m(z) });
        const axial = loopAxialField({ current: A(2), radius: m(R), axialDistance: m(z) });
        expect(Math.abs(br!)).toBe(0);
        expect(relativeError(bz!, axial)).toBeLessThan(1e-14);
      }),
    );
  });

  it("tends to the on-axis values as the radial distance shrinks (B_rho ~ (3/4) mu0 I R^2 z rho / (R^2+z^2)^(5/2))", () => {
    // Near-axis expansion B_rho = -(rho/2) dB_z/dz (div B = 0), Jackson 3rd ed. eq. (5.49) (from memory).
    const R = 0.1, z = 0.05, rho = 1e-7;
    const [br] = loopField({ current: A(1), radius: m(R), radialDistance: m(rho), axialDistance: m(z) });
    const expected = (0.75 * MU0_NUM * R * R * z * rho) / Math.pow(R * R + z * z, 2.5);
    expectClose(br!, { input: { R, z, rho }, expected, tolerance: 1e-12, source: "near-axis expansion from div B = 0" });
  });

  it("approaches the dipole field far away", () => {
    // Dipole m = I pi R^2: B_z = mu0 m (3 cos^2 - 1) / (4 pi r^3), the far field of a current loop (from memory).
    const R = 0.01, rho = 30, z = 40, r = 50;
    const [, bz] = loopField({ current: A(1), radius: m(R), radialDistance: m(rho), axialDistance: m(z) });
    const cos = z / r;
    const dip = (MU0_NUM * Math.PI * R * R * (3 * cos * cos - 1)) / (4 * Math.PI * r ** 3);
    expect(relativeError(bz!, dip)).toBeLessThan(1e-6); // corrections are O((R/r)^2) = 4e-8
  });

  it("is linear in current and antisymmetric in z for the radial part (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e3, max: 1e3, noNaN: true }).filter((i) => Math.abs(i) > 1e-6),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 1e-3, max: 5, noNaN: true }),
        (I, rho, z) => {
          const base = loopField({ current: A(1), radius: m(1), radialDistance: m(rho), axialDistance: m(z) });
          const scaled = loopField({ current: A(I), radius: m(1), radialDistance: m(rho), axialDistance: m(z) });
          const mirror = loopField({ current: A(1), radius: m(1), radialDistance: m(rho), axialDistance: m(-z) });
          const mag = Math.hypot(base[0]!, base[1]!);
          expect(Math.abs(scaled[0]! - I * base[0]!)).toBeLessThanOrEqual(1e-14 * Math.abs(I) * mag);
          expect(Math.abs(scaled[1]! - I * base[1]!)).toBeLessThanOrEqual(1e-14 * Math.abs(I) * mag);
          expect(mirror[0]).toBeCloseTo(-base[0]!, 20);
          expect(mirror[1]).toBe(base[1]);
        },
      ),
    );
  });

  it("rejects a point on the wire with out_of_domain, and never returns NaN far away", () => {
    expect(() => loopField({ current: A(1), radius: m(1), radialDistance: m(1), axialDistance: m(0) })).toThrow(FormulaError);
    try {
      evaluate("loopField", { current: 1, radius: 1, radialDistance: 1, axialDistance: 0 });
    } catch (e) {
      expect((e as FormulaError).code).toBe("out_of_domain");
    }
    const far = loopField({ current: A(1), radius: m(1), radialDistance: m(1e200), axialDistance: m(1e200) });
    expect(far.every((v) => Number.isFinite(v))).toBe(true);
  });

  it("accepts unit strings through evaluate and returns radial and axial components", () => {
    const r = evaluate("loopField", { current: "1 A", radius: "10 cm", radialDistance: "5 cm", axialDistance: "50 mm" });
    const direct = loopField({ current: A(1), radius: m(0.1), radialDistance: m(0.05), axialDistance: m(0.05) });
    expect(r.unit).toBe("T");
    expect(r.value).toEqual(direct);
    expect(loopField.definition.output.components).toEqual(["radial", "axial"]);
  });
});

describe("solenoidAxialField", () => {
  it("matches the finite current-sheet expression from a decimal.js oracle inside, at the ends and far outside", () => {
    const N = 500, I = 2, R = 0.02, L = 0.2;
    for (const z of [0, 0.05, 0.1, -0.1, 0.3, -2, 50]) {
      const u1 = new D(z).plus(L / 2), u2 = new D(z).minus(L / 2);
      const c1 = u1.div(u1.pow(2).plus(R * R).sqrt()), c2 = u2.div(u2.pow(2).plus(R * R).sqrt());
      const expected = MU0.times(N * I).div(2 * L).times(c1.minus(c2)).toNumber();
      expectClose(solenoidAxialField({ current: A(I), turns: N, radius: m(R), length: m(L), axialPosition: m(z) }), {
        input: { z }, expected, tolerance: 1e-13, source: "decimal.js oracle of mu0 N I / (2l) (cos1 - cos2)",
      });
    }
  });

  it("tends to mu0 N I / l at the centre of a long coil", () => {
    // The long-solenoid limit B = mu0 n I (Ampere's law; common practice). Centre correction ~ 2 (R/l)^2 = 2e-8.
    const got = solenoidAxialField({ current: A(1), turns: 10000, radius: m(0.001), length: m(10), axialPosition: m(0) });
    expectClose(got, { input: "l / R = 1e4", expected: MU0_NUM * 1000, tolerance: 1e-7, source: "long-solenoid limit B = mu0 n I (common practice)" });
  });

  it("is half the central value at the ends of a long coil and symmetric about the centre (fast-check)", () => {
    const end = solenoidAxialField({ current: A(1), turns: 10000, radius: m(0.001), length: m(10), axialPosition: m(5) });
    expect(relativeError(end, (MU0_NUM * 1000) / 2)).toBeLessThan(1e-6);
    fc.assert(
      fc.property(fc.double({ min: -10, max: 10, noNaN: true }), (z) => {
        const a = solenoidAxialField({ current: A(1), turns: 100, radius: m(0.05), length: m(0.3), axialPosition: m(z) });
        const b = solenoidAxialField({ current: A(1), turns: 100, radius: m(0.05), length: m(0.3), axialPosition: m(-z) });
        expect(relativeError(a, b)).toBeLessThan(1e-14);
      }),
    );
  });

  it("warns when the turn pitch exceeds the radius", () => {
    const d = solenoidAxialField.details({ current: A(1), turns: 2, radius: m(0.01), length: m(0.1) });
    expect(d.warnings.map((w) => w.code)).toContain("coarse_pitch");
  });
});

describe("helmholtzCenterField", () => {
  it("equals (4/5)^(3/2) mu0 N I / R (decimal.js oracle)", () => {
    const expected = new D("0.8").pow(1.5).times(MU0).times(100).div(0.1).toNumber();
    expectClose(helmholtzCenterField({ current: A(1), turns: 100, radius: m(0.1) }), {
      input: "1 A, 100 turns, R = 0.1 m", expected, tolerance: 1e-15, source: "decimal.js oracle of (4/5)^(3/2) mu0 N I / R",
    });
    // The coil constant quoted for Helmholtz pairs, B = 8.992e-7 N I / R in T with R in m (common practice, from memory).
    expectClose(helmholtzCenterField({ current: A(1), turns: 1, radius: m(1) }), {
      input: "1 A, 1 turn, R = 1 m", expected: 8.992e-7, tolerance: 1e-4, source: "Helmholtz coil constant 8.992e-7 T m/A (common practice, from memory)",
    });
  });

  it("equals twice N loopAxialField at R/2 from each coil (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.integer({ min: 1, max: 1000 }), (R, N) => {
        const pair = helmholtzCenterField({ current: A(3), turns: N, radius: m(R) });
        const one = loopAxialField({ current: A(3), radius: m(R), axialDistance: m(R / 2) });
        expect(relativeError(pair, 2 * N * one)).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("toroidField", () => {
  it("equals mu0 N I / (2 pi r), the field of N wires at distance r", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.integer({ min: 1, max: 10000 }), (r, N) => {
        const t = toroidField({ current: A(1), turns: N, radius: m(r) });
        expect(relativeError(t, N * wireField({ current: A(1), distance: m(r) }))).toBeLessThan(1e-14);
      }),
    );
  });

  it("rejects a fractional number of turns", () => {
    expect(() => evaluate("toroidField", { current: 1, turns: 2.5, radius: 0.05 })).toThrow(/whole number/);
  });
});
