import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  evaluate, magneticFlux, motionalEmf, transformerEmf, transformerPeakFluxDensity,
  type Angle, type Area, type FluxDensity, type Frequency, type Length, type Velocity, type Voltage,
} from "../../src/index.js";
import { checkCases, expectClose, relativeError } from "../helpers/reference.js";
import { D, PI } from "./oracle.js";

const T = (v: number) => v as FluxDensity;
const m2 = (v: number) => v as Area;
const Hz = (v: number) => v as Frequency;

describe("magneticFlux", () => {
  it("is B A cos(theta) (decimal.js oracle), with a unit-string angle in degrees", () => {
    const expected = new D("0.2").times("1e-4").times(D.cos(PI.div(6))).toNumber();
    expectClose(evaluate("magneticFlux", { fluxDensity: "0.2 T", area: "1 cm^2", angle: "30 deg" }).value as number, {
      input: "0.2 T, 1 cm^2, 30 deg", expected, tolerance: 1e-15, source: "decimal.js oracle of B A cos(theta)",
    });
    expect(magneticFlux({ fluxDensity: T(1), area: m2(2) })).toBe(2);
  });

  it("is linear in flux density and in area (fast-check)", () => {
    fc.assert(
      fc.property(
        // Magnitudes from 1e-100: a product below the smallest subnormal is out_of_range (tests/flux/extremes-accuracy.test.ts).
        fc.double({ min: -10, max: 10, noNaN: true }).filter((v) => v === 0 || Math.abs(v) > 1e-100),
        fc.double({ min: 0, max: 10, noNaN: true }).filter((v) => v === 0 || v > 1e-100),
        fc.double({ min: 1e-3, max: 100, noNaN: true }),
        fc.double({ min: 0, max: Math.PI, noNaN: true }),
        (B, A, k, th) => {
          const base = magneticFlux({ fluxDensity: T(B), area: m2(A), angle: th as Angle });
          const tol = 1e-15 * Math.abs(B * A * k) + 1e-300;
          expect(Math.abs(magneticFlux({ fluxDensity: T(k * B), area: m2(A), angle: th as Angle }) - k * base)).toBeLessThanOrEqual(2 * tol);
          expect(Math.abs(magneticFlux({ fluxDensity: T(B), area: m2(k * A), angle: th as Angle }) - k * base)).toBeLessThanOrEqual(2 * tol);
        },
      ),
    );
  });
});

describe("transformerEmf", () => {
  it("uses the 4.44 constant of the transformer equation for sine waves", () => {
    // McLyman, Transformer and Inductor Design Handbook 3rd ed.: E = 4.44 B f A N for a sine wave (from memory); 4.44 is rounded.
    expectClose(transformerEmf({ frequency: Hz(1), turns: 1, area: m2(1), peakFluxDensity: T(1) }), {
      input: "unit inputs", expected: 4.44, tolerance: 1e-3, source: "McLyman (2004), K_f = 4.44 for a sine wave (from memory)",
    });
    expectClose(transformerEmf({ frequency: Hz(1), turns: 1, area: m2(1), peakFluxDensity: T(1) }), {
      input: "unit inputs", expected: PI.times(new D(2).sqrt()).toNumber(), tolerance: 2e-16, source: "decimal.js oracle of sqrt(2) pi",
    });
  });

  it("matches sqrt(2) pi f N A B for a mains transformer (decimal.js oracle)", () => {
    checkCases(
      [
        { input: { f: 50, N: 100, A: 1e-3, B: 1.2 }, expected: new D(2).sqrt().times(PI).times(50 * 100).times("1e-3").times("1.2").toNumber(), tolerance: 1e-15, source: "decimal.js oracle" },
        { input: { f: 100e3, N: 7, A: 5.2e-5, B: 0.1 }, expected: new D(2).sqrt().times(PI).times("1e5").times(7).times("5.2e-5").times("0.1").toNumber(), tolerance: 1e-15, source: "decimal.js oracle" },
      ],
      (x) => transformerEmf({ frequency: Hz(x.f), turns: x.N, area: m2(x.A), peakFluxDensity: T(x.B) }),
    );
  });

  it("compares its r.m.s. result with the a.c. voltage bands of IEC 61140 / IEC 60449: 50 V and 1000 V r.m.s.", () => {
    // Band I (extra-low voltage) up to 50 V a.c. r.m.s., band II up to 1000 V a.c. (IEC 60449 / IEC 61140; from memory).
    const codes = (turns: number) => transformerEmf.details({ frequency: Hz(50), turns, area: m2(1e-3), peakFluxDensity: T(1) }).cautions.map((c) => c.code);
    expect(codes(200)).toEqual([]); // 44 V r.m.s.: extra-low voltage
    expect(codes(1000)).toEqual(["above_extra_low_voltage"]); // 222 V r.m.s.: mains-like, a shock hazard but not high voltage
    expect(codes(5000)).toEqual(["high_voltage"]); // 1111 V r.m.s.
    const message = transformerEmf.details({ frequency: Hz(50), turns: 1000, area: m2(1e-3), peakFluxDensity: T(1) }).cautions[0]!.message;
    expect(message).toMatch(/a\.c\. r\.m\.s\..*50 V.*IEC 61140/);
    expect(message).toMatch(/Local codes, standards and licensed practice govern/);
  });

  it("states the sine-wave assumption in its description, not in a warning on every call", () => {
    expect(transformerEmf.definition.description).toMatch(/sinusoidal/);
    expect(transformerEmf.details({ frequency: Hz(50), turns: 100, area: m2(1e-3), peakFluxDensity: T(1.2) }).warnings).toEqual([]);
    expect(transformerPeakFluxDensity.definition.description).toMatch(/sinusoidal/);
    expect(transformerPeakFluxDensity.details({ voltage: 230 as Voltage, frequency: Hz(50), turns: 800, area: m2(1e-3) }).warnings).toEqual([]);
  });
});

describe("transformerPeakFluxDensity", () => {
  it("inverts transformerEmf (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.integer({ min: 1, max: 5000 }),
        fc.double({ min: 1e-6, max: 1e-1, noNaN: true }),
        fc.double({ min: 1e-3, max: 2, noNaN: true }),
        (f, N, A, B) => {
          const v = transformerEmf({ frequency: Hz(f), turns: N, area: m2(A), peakFluxDensity: T(B) });
          const back = transformerPeakFluxDensity({ voltage: v, frequency: Hz(f), turns: N, area: m2(A) });
          expect(relativeError(back, B)).toBeLessThan(1e-14);
        },
      ),
    );
  });

  it("warns when the given saturation flux density is reached, and not when none is given", () => {
    const input = { voltage: 230 as Voltage, frequency: Hz(50), turns: 800, area: m2(1e-3) };
    expect(transformerPeakFluxDensity.details({ ...input, saturationFluxDensity: T(1.2) }).warnings.map((w) => w.code)).toContain("saturation");
    expect(transformerPeakFluxDensity.details({ ...input, saturationFluxDensity: T(1.6) }).warnings.map((w) => w.code)).not.toContain("saturation");
    expect(transformerPeakFluxDensity.details(input).warnings.map((w) => w.code)).not.toContain("saturation");
  });
});

describe("motionalEmf", () => {
  it("is B l v and changes sign with the speed", () => {
    expect(motionalEmf({ fluxDensity: T(0.5), length: 0.2 as Length, speed: 10 as Velocity })).toBeCloseTo(1, 15);
    expect(motionalEmf({ fluxDensity: T(0.5), length: 0.2 as Length, speed: -10 as Velocity })).toBeCloseTo(-1, 15);
  });

  it("compares its steady (d.c.) result with the ripple-free d.c. bands: 120 V and 1500 V (IEC 61140 / IEC 60449; from memory)", () => {
    const codes = (speed: number) => motionalEmf.details({ fluxDensity: T(1), length: 1 as Length, speed: speed as Velocity }).cautions.map((c) => c.code);
    expect(codes(100)).toEqual([]); // 100 V d.c. is still extra-low voltage
    expect(codes(-200)).toEqual(["above_extra_low_voltage"]); // the sign of the speed does not matter
    expect(codes(2000)).toEqual(["high_voltage"]);
    expect(motionalEmf.details({ fluxDensity: T(1), length: 1 as Length, speed: 200 as Velocity }).cautions[0]!.message).toMatch(/ripple-free d\.c\./);
  });

  it("agrees with the rate of change of flux through a sliding-bar circuit, dPhi/dt = B l v (Faraday's law)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 5, noNaN: true }), fc.double({ min: 1e-2, max: 2, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (B, l, v) => {
        const dt = 1e-3;
        const area = (t: number) => m2(l * (1 + v * t));
        const dPhi = magneticFlux({ fluxDensity: T(B), area: area(dt) }) - magneticFlux({ fluxDensity: T(B), area: area(0) });
        expect(relativeError(dPhi / dt, motionalEmf({ fluxDensity: T(B), length: l as Length, speed: v as Velocity }))).toBeLessThan(1e-9);
      }),
    );
  });
});
