import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  chargedSphereField, closedSurfaceFlux, evaluate, lineChargeField, pointChargeField, sphereMesh,
  type Charge, type Length, type LineChargeDensity,
} from "../../src/index.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { EPS0, PI } from "./oracle.js";

const C = (v: number) => v as Charge;
const m = (v: number) => v as Length;

describe("pointChargeField", () => {
  it("gives the Coulomb constant 1/(4 pi eps0) = 8.9875517862e9 V m/C for 1 C at 1 m (CODATA 2022)", () => {
    // CODATA 2022: eps0 = 8.8541878188(14)e-12 F/m, hence 1/(4 pi eps0) = 8.9875517862e9 to its 11 digits.
    expectClose(pointChargeField({ charge: C(1), distance: m(1) }), { input: "1 C, 1 m", expected: 8.9875517862e9, tolerance: 2e-11, source: "CODATA 2022 eps0" });
    expectClose(pointChargeField({ charge: C(1), distance: m(1) }), {
      input: "1 C, 1 m", expected: EPS0.times(PI).times(4).pow(-1).toNumber(), tolerance: 1e-15, source: "decimal.js oracle of 1/(4 pi eps0)",
    });
  });

  it("falls as 1/r^2, scales with charge, and divides by the medium's permittivity (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e-3, max: 1e-3, noNaN: true }).filter((q) => Math.abs(q) > 1e-15), fc.double({ min: 1e-6, max: 1e3, noNaN: true }), fc.double({ min: 1, max: 100, noNaN: true }), (q, r, er) => {
        const E = pointChargeField({ charge: C(q), distance: m(r), relativePermittivity: er });
        expect(relativeError(pointChargeField({ charge: C(q), distance: m(2 * r), relativePermittivity: er }), E / 4)).toBeLessThan(1e-15);
        expect(relativeError(pointChargeField({ charge: C(-2 * q), distance: m(r), relativePermittivity: er }), -2 * E)).toBeLessThan(1e-15);
        expect(relativeError(pointChargeField({ charge: C(q), distance: m(r) }), er * E)).toBeLessThan(1e-14);
      }),
    );
  });

  it("cautions when the field reaches the breakdown strength of air", () => {
    const d = pointChargeField.details({ charge: C(1e-6), distance: m(1e-3) }); // ~9e9 V/m
    expect(d.cautions.map((c) => c.code)).toContain("air_breakdown");
    expect(pointChargeField.details({ charge: C(1e-9), distance: m(1) }).cautions).toHaveLength(0);
  });

  it("cautions from 3 MV/m (dry air at sea level, common practice), in either sign, with a finite message at the largest fields", () => {
    // 1/(4 pi eps0) = 8.9875517862e9 V m/C (CODATA 2022): 3.3e-4 C at 1 m gives 2.97 MV/m, 3.4e-4 C gives 3.06 MV/m.
    expect(pointChargeField.details({ charge: C(3.3e-4), distance: m(1) }).cautions).toEqual([]);
    const c = pointChargeField.details({ charge: C(-3.4e-4), distance: m(1) }).cautions;
    expect(c.map((n) => n.code)).toEqual(["air_breakdown"]);
    expect(c[0]!.message).toMatch(/3 MV\/m.*Local codes, standards and licensed practice govern/);
    const huge = pointChargeField.details({ charge: C(1e-12), distance: m(1e-155) }); // 9e307 V/m
    expect(huge.value).toBeGreaterThan(1e300);
    expect(huge.cautions[0]!.message).not.toMatch(/Infinity|NaN/);
  });
});

describe("lineChargeField", () => {
  it("is lambda / (2 pi eps0 epsr d) (decimal.js oracle)", () => {
    checkCases(
      [{ input: { l: 1e-9, d: 0.1 }, expected: EPS0.times(PI).times(2).times("0.1").pow(-1).times("1e-9").toNumber(), tolerance: 1e-15, source: "decimal.js oracle" }],
      (x) => lineChargeField({ chargePerLength: x.l as LineChargeDensity, distance: m(x.d) }),
    );
  });

  it("obeys Gauss's law on a cylinder: E 2 pi d = lambda / eps0 (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e-3, noNaN: true }), fc.double({ min: 1e-4, max: 1e2, noNaN: true }), (l, d) => {
        const E = lineChargeField({ chargePerLength: l as LineChargeDensity, distance: m(d) });
        expect(relativeError(E * 2 * Math.PI * d, l / EPS0.toNumber())).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("chargedSphereField", () => {
  it("is zero inside the conductor and the point-charge field from the surface outward", () => {
    const q = C(1e-9);
    expect(chargedSphereField({ charge: q, radius: m(0.01), distance: m(0.005) })).toBe(0);
    expect(chargedSphereField({ charge: q, radius: m(0.01), distance: m(0.01) })).toBe(pointChargeField({ charge: q, distance: m(0.01) }));
    expect(chargedSphereField({ charge: q, radius: m(0.01), distance: m(1) })).toBe(pointChargeField({ charge: q, distance: m(1) }));
  });

  it("gives a flux of Q / eps0 through a sphere around it (Gauss's law, Dunavant quadrature on an icosphere)", () => {
    const Q = 2e-9;
    const field = (x: number, y: number, z: number): [number, number, number] => {
      const r = Math.hypot(x, y, z);
      const E = chargedSphereField({ charge: C(Q), radius: m(0.1), distance: m(r) });
      return [(E * x) / r, (E * y) / r, (E * z) / r];
    };
    const { flux } = closedSurfaceFlux(sphereMesh([0, 0, 0], 0.5, 3), field);
    expect(relativeError(flux, Q / EPS0.toNumber())).toBeLessThan(1e-7); // measured 7e-9 with 1280 flat triangles
  });

  it("accepts unit strings and reports V/m", () => {
    const r = evaluate("chargedSphereField", { charge: "1 nC", radius: "1 cm", distance: "1 m" });
    expect(r.unit).toBe("V/m");
    expect(relativeError(r.value as number, 8.9875517862)).toBeLessThan(1e-10);
  });
});
