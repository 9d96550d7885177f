import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  roundWireAcResistanceFactor, skinDepth, wireGaugeDiameter, wireResistance,
  type Conductivity, type Frequency, type Length, type Temperature,
} from "../../src/index.js";
import { WIRE_GAUGES } from "../../src/windings/wire.js";
import { relativeError } from "../helpers/reference.js";

const m = (v: number) => v as Length;
const Hz = (v: number) => v as Frequency;
const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true });

describe("wireResistance properties", () => {
  it("scales with length and with 1 / diameter^2 (fast-check)", () => {
    fc.assert(
      fc.property(pos(1e-3, 1e4), pos(1e-5, 1e-2), pos(1.5, 100), pos(250, 450), fc.constantFrom("copper" as const, "aluminium" as const), (l, d, k, t, mat) => {
        const base = { length: m(l), diameter: m(d), temperature: t as Temperature, material: mat };
        const r = wireResistance(base);
        expect(relativeError(wireResistance({ ...base, length: m(k * l) }), k * r)).toBeLessThan(4e-16 * 8);
        expect(relativeError(wireResistance({ ...base, diameter: m(k * d) }), r / (k * k))).toBeLessThan(4e-16 * 8);
      }),
    );
  });

  it("rises with temperature, aluminium about 1.64 times copper (their IEC resistivities)", () => {
    fc.assert(
      fc.property(pos(250, 450), pos(1, 50), (t, dt) => {
        const r = (T: number, mat: "copper" | "aluminium") => wireResistance({ length: m(1), diameter: m(1e-3), temperature: T as Temperature, material: mat });
        expect(r(t + dt, "copper")).toBeGreaterThan(r(t, "copper"));
        expect(r(t + dt, "aluminium")).toBeGreaterThan(r(t, "aluminium"));
      }),
    );
    const ratio = wireResistance({ length: m(1), diameter: m(1e-3), material: "aluminium" }) / wireResistance({ length: m(1), diameter: m(1e-3) });
    expect(relativeError(ratio, 0.028264 * 58)).toBeLessThan(1e-15);
  });

  it("of every gauge is the resistivity times length over the gauge's area", () => {
    for (const g of WIRE_GAUGES) {
      const d = wireGaugeDiameter({ gauge: g });
      expect(relativeError(wireResistance({ length: m(1), diameter: d }), 1 / 58e6 / (Math.PI * d * d / 4))).toBeLessThan(1e-15);
    }
  });
});

describe("roundWireAcResistanceFactor properties", () => {
  const factor = (d: number, f: number) => roundWireAcResistanceFactor({ diameter: m(d), frequency: Hz(f) });
  const ratio = (d: number, f: number) => (d / 2) / skinDepth({ conductivity: 58e6 as Conductivity, frequency: Hz(f) });

  it("tends to 1 + q^4 / 192 at low frequency (q = sqrt(2) a / delta; leading term of the Kelvin series)", () => {
    fc.assert(
      fc.property(pos(1e-6, 1e-3), pos(1e-6, 1e-1), (d, f) => {
        const x = ratio(d, f);
        fc.pre(x < 0.05);
        const q4 = 4 * x ** 4;
        // Next term of the series is -q^8/(2^11 * 3^2 * 5) (about 5e-5 q^8): well below q^4/192 here.
        const excess = factor(d, f) - 1;
        expect(Math.abs(excess - q4 / 192)).toBeLessThanOrEqual(1e-3 * q4 / 192 + 2.3e-16);
      }),
    );
  });

  it("grows as a / (2 delta) + 1/4 + 3 delta / (32 a) at high frequency (DLMF 10.17.3, first terms)", () => {
    fc.assert(
      fc.property(pos(1e-4, 1e-1), pos(1e6, 1e12), (d, f) => {
        const x = ratio(d, f);
        fc.pre(x > 50);
        // The next term is O(1/x^2) with a zero coefficient, then O(1/x^3): relative error under 1/x^4.
        expect(relativeError(factor(d, f), x / 2 + 0.25 + 3 / (32 * x))).toBeLessThan(Math.max(1 / x ** 4, 1e-15));
      }),
    );
  });

  it("increases with frequency and with diameter, and is never below 1 (fast-check)", () => {
    fc.assert(
      fc.property(pos(1e-5, 1e-2), pos(1, 1e9), pos(1.001, 3), (d, f, k) => {
        const a = factor(d, f);
        expect(a).toBeGreaterThanOrEqual(1);
        expect(factor(d, k * f)).toBeGreaterThanOrEqual(a);
        expect(factor(k * d, f)).toBeGreaterThanOrEqual(a);
      }),
    );
  });

  it("depends on the inputs only through a / delta: mu_r and sigma trade one for one (fast-check)", () => {
    fc.assert(
      fc.property(pos(1e-4, 1e-2), pos(1e2, 1e7), pos(1, 1000), (d, f, mur) => {
        const a = roundWireAcResistanceFactor({ diameter: m(d), frequency: Hz(f), relativePermeability: mur, conductivity: (58e6 / mur) as Conductivity });
        expect(relativeError(a, factor(d, f))).toBeLessThan(1e-14);
      }),
    );
  });
});
