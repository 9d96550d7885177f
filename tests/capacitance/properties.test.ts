// Physical properties that must hold whatever the formula's details: scaling,
// linearity in the permittivity, image theory, limits where two formulas agree,
// and Q V / 2 = W.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  capacitorCharge, capacitorEnergy, coaxialCapacitance, isolatedSphereCapacitance, parallelPlateCapacitance,
  sphericalCapacitance, twoWireCapacitance, wireOverPlaneCapacitance,
  type Capacitance, type Length, type Voltage, type Area,
} from "../../src/index.js";

const m = (v: number) => v as Length;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

const size = fc.double({ min: -6, max: 3, noNaN: true }).map((p) => 10 ** p);
const ratio = fc.double({ min: 1e-9, max: 1e3, noNaN: true }).map((g) => 1 + g);
const er = fc.double({ min: 1, max: 100, noNaN: true });
/** A power of two, so scaling the inputs is exact and the property can be tight. */
const pow2 = fc.integer({ min: -60, max: 60 }).map((k) => 2 ** k);
const real = fc.double({ min: 0.01, max: 1e4, noNaN: true });

describe("capacitance properties", () => {
  it("scaling every length by s scales each capacitance by s", () => {
    fc.assert(
      fc.property(size, ratio, size, er, pow2, (a, r, l, e, s) => {
        const b = a * r;
        fc.pre(b > a);
        const cases: [number, number][] = [
          [coaxialCapacitance({ innerRadius: m(s * a), outerRadius: m(s * b), length: m(s * l), relativePermittivity: e }),
            coaxialCapacitance({ innerRadius: m(a), outerRadius: m(b), length: m(l), relativePermittivity: e })],
          [sphericalCapacitance({ innerRadius: m(s * a), outerRadius: m(s * b), relativePermittivity: e }),
            sphericalCapacitance({ innerRadius: m(a), outerRadius: m(b), relativePermittivity: e })],
          [isolatedSphereCapacitance({ radius: m(s * a), relativePermittivity: e }), isolatedSphereCapacitance({ radius: m(a), relativePermittivity: e })],
          [twoWireCapacitance({ wireRadius: m(s * a), separation: m(2 * s * b), length: m(s * l), relativePermittivity: e }),
            twoWireCapacitance({ wireRadius: m(a), separation: m(2 * b), length: m(l), relativePermittivity: e })],
          [wireOverPlaneCapacitance({ wireRadius: m(s * a), height: m(s * b), length: m(s * l), relativePermittivity: e }),
            wireOverPlaneCapacitance({ wireRadius: m(a), height: m(b), length: m(l), relativePermittivity: e })],
          [parallelPlateCapacitance({ area: (s * s * a * l) as Area, gap: m(s * b), relativePermittivity: e }),
            parallelPlateCapacitance({ area: (a * l) as Area, gap: m(b), relativePermittivity: e })],
        ];
        for (const [scaled, base] of cases) expect(rel(scaled, s * base)).toBeLessThan(1e-14);
      }),
    );
  });

  it("each capacitance is linear in the relative permittivity", () => {
    fc.assert(
      fc.property(size, ratio, size, er, (a, r, l, e) => {
        const b = a * r;
        fc.pre(b > a);
        const x = { innerRadius: m(a), outerRadius: m(b), length: m(l) };
        expect(rel(coaxialCapacitance({ ...x, relativePermittivity: e }), e * coaxialCapacitance(x))).toBeLessThan(1e-14);
        const w = { wireRadius: m(a), height: m(b), length: m(l) };
        expect(rel(wireOverPlaneCapacitance({ ...w, relativePermittivity: e }), e * wireOverPlaneCapacitance(w))).toBeLessThan(1e-14);
        const t = { wireRadius: m(a), separation: m(2 * b), length: m(l) };
        expect(rel(twoWireCapacitance({ ...t, relativePermittivity: e }), e * twoWireCapacitance(t))).toBeLessThan(1e-14);
        const s = { innerRadius: m(a), outerRadius: m(b) };
        expect(rel(sphericalCapacitance({ ...s, relativePermittivity: e }), e * sphericalCapacitance(s))).toBeLessThan(1e-14);
      }),
    );
  });

  it("a two-wire line of separation D has half the capacitance of a wire at height D/2 over a plane (image theory)", () => {
    fc.assert(
      fc.property(size, ratio, size, er, (a, r, l, e) => {
        const h = a * r;
        fc.pre(h > a);
        const pair = twoWireCapacitance({ wireRadius: m(a), separation: m(2 * h), length: m(l), relativePermittivity: e });
        const plane = wireOverPlaneCapacitance({ wireRadius: m(a), height: m(h), length: m(l), relativePermittivity: e });
        expect(rel(pair, plane / 2)).toBeLessThan(1e-14);
      }),
    );
  });

  it("a coaxial line with a thin gap tends to a parallel plate of area 2 pi r l", () => {
    // ln(1 + g/a) = (g/a)(1 - g/(2a) + ...), so the relative difference is about g / (2a)
    // for the mean radius; with the plate area at the mean radius it is (g/a)^2 / 12.
    fc.assert(
      fc.property(size, fc.double({ min: -9, max: -3, noNaN: true }).map((p) => 10 ** p), size, er, (a, t0, l, e) => {
        const b = a + a * t0;
        const g = b - a; // the gap both formulas actually see (exact difference)
        const t = g / a;
        const coax = coaxialCapacitance({ innerRadius: m(a), outerRadius: m(b), length: m(l), relativePermittivity: e });
        const plate = parallelPlateCapacitance({ area: (2 * Math.PI * (a + g / 2) * l) as Area, gap: m(g), relativePermittivity: e });
        expect(rel(coax, plate)).toBeLessThan(t * t / 12 * 1.01 + 1e-14);
      }),
    );
  });

  it("concentric spheres tend to the isolated sphere as the outer radius grows", () => {
    fc.assert(
      fc.property(size, fc.double({ min: 3, max: 15, noNaN: true }).map((p) => 10 ** p), er, (a, k, e) => {
        const spheres = sphericalCapacitance({ innerRadius: m(a), outerRadius: m(a * k), relativePermittivity: e });
        const isolated = isolatedSphereCapacitance({ radius: m(a), relativePermittivity: e });
        // C_spheres / C_isolated = b / (b - a) = 1 + 1/(k - 1)
        expect(spheres).toBeGreaterThan(isolated);
        expect(rel(spheres, isolated)).toBeLessThan((1 / (k - 1)) * 1.001 + 1e-15);
      }),
    );
  });

  it("capacitance grows as the conductors approach each other", () => {
    fc.assert(
      fc.property(size, ratio, ratio, size, (a, r1, r2, l) => {
        const near = a * Math.min(r1, r2);
        const far = a * Math.max(r1, r2);
        fc.pre(near > a && far > near * (1 + 1e-12)); // apart by more than rounding
        expect(coaxialCapacitance({ innerRadius: m(a), outerRadius: m(near), length: m(l) })).toBeGreaterThan(
          coaxialCapacitance({ innerRadius: m(a), outerRadius: m(far), length: m(l) }));
        expect(twoWireCapacitance({ wireRadius: m(a), separation: m(2 * near), length: m(l) })).toBeGreaterThan(
          twoWireCapacitance({ wireRadius: m(a), separation: m(2 * far), length: m(l) }));
        expect(wireOverPlaneCapacitance({ wireRadius: m(a), height: m(near), length: m(l) })).toBeGreaterThan(
          wireOverPlaneCapacitance({ wireRadius: m(a), height: m(far), length: m(l) }));
      }),
    );
  });

  it("the stored energy equals Q V / 2 with the charge from capacitorCharge", () => {
    fc.assert(
      fc.property(real, fc.oneof(fc.constant(0), fc.double({ min: 1e-3, max: 1e5, noNaN: true }), fc.double({ min: -1e5, max: -1e-3, noNaN: true })), (cMicro, v) => {
        const capacitance = (cMicro * 1e-6) as Capacitance;
        const voltage = v as Voltage;
        const w = capacitorEnergy({ capacitance, voltage });
        const q = capacitorCharge({ capacitance, voltage });
        expect(w).toBeGreaterThanOrEqual(0);
        if (v === 0) expect(w).toBe(0);
        else expect(rel(w, (q * v) / 2)).toBeLessThan(1e-15);
        expect(Math.sign(q)).toBe(Math.sign(v) || 0);
      }),
    );
  });
});
