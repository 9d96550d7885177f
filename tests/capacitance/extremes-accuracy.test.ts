// Every closed form against the decimal.js oracle (50 digits, exact decimal
// values of the double inputs, CODATA 2022 eps0): within a few ulp over the
// whole domain, including near-degenerate geometry and magnitudes from 1e-300
// to 1e300. Where the exact result lies beyond the largest double or below the
// smallest subnormal the formula must say out_of_range instead of returning a
// wrong number; a subnormal result comes back within one of its ulps (the
// library's range policy, src/math/scaled.ts; see agreesWithOracle).
//
// Bounds per formula (in units of eps = 2^-52, relative): the products go
// through mulDiv (at most 4 roundings) and the constants 2 pi eps0, 4 pi eps0
// carry one rounding each; ln(b/a) and acosh(u/v) add about 2 ulp of the
// logarithm. Measured worst cases are printed by the last test.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  capacitorCharge, capacitorEnergy, coaxialCapacitance, FormulaError, isolatedSphereCapacitance,
  parallelCapacitance, parallelPlateCapacitance, seriesCapacitance, sphericalCapacitance, twoWireCapacitance,
  wireOverPlaneCapacitance,
} from "../../src/index.js";
import {
  chargeOracle, coaxialOracle, type Dec, energyOracle, isolatedSphereOracle, parallelOracle, parallelPlateOracle, seriesOracle,
  agreesWithOracle, relErr, sphericalOracle, twoWireOracle, wireOverPlaneOracle,
} from "./oracle.js";

const EPS = Number.EPSILON;
/**
 * Stated bounds, in eps: products of constants and inputs 4, through a logarithm or acosh 6,
 * series 1.5 (three roundings), parallel 0.5 (one correctly rounded sum), stored energy 1.5 (C V V / 2:
 * three roundings, the halving exact), charge 0.5 (one product).
 */
const BOUND = { product: 4 * EPS, logarithm: 6 * EPS, series: 1.5 * EPS, sum: 0.5 * EPS, energy: 1.5 * EPS, charge: 0.5 * EPS } as const;
const RUNS = 400;

/** Worst relative error seen per formula, reported at the end. */
const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);
const call = (f: unknown, x: object): number => (f as (x: never) => number)(x as never);

/** 10^p for p in [lo, hi]: magnitudes spread evenly over decades. */
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);
/** A relative gap: a few ulps, tiny, moderate or huge. */
const relativeGap = fc.oneof(
  fc.integer({ min: 1, max: 64 }).map((k) => k * 2 ** -52),
  decades(-15.5, 0),
  decades(0, 80),
);
const permittivity = fc.oneof(fc.constant(1), fc.double({ min: 1, max: 1e4, noNaN: true }));
const length = decades(-300, 300);

/** Bigger = small + small * gap, kept only when it is finite and strictly larger. */
function above(small: number, gap: number): number | undefined {
  const big = small + small * gap;
  return Number.isFinite(big) && big > small ? big : undefined;
}

describe("capacitance closed forms against a 50-digit decimal.js oracle", () => {
  it("coaxial capacitance is within a few ulp of 2 pi eps0 epsr l / ln(b/a), thin dielectrics included", () => {
    fc.assert(
      fc.property(decades(-300, 300), relativeGap, length, permittivity, (innerRadius, gap, len, er) => {
        const outerRadius = above(innerRadius, gap);
        fc.pre(outerRadius !== undefined);
        const x = { innerRadius, outerRadius: outerRadius!, length: len, relativePermittivity: er };
        agrees(coaxialCapacitance, x, coaxialOracle(x), BOUND.logarithm);
      }),
      { numRuns: RUNS },
    );
  });

  it("concentric-sphere capacitance is within a few ulp of 4 pi eps0 epsr a b / (b - a)", () => {
    fc.assert(
      fc.property(decades(-300, 300), relativeGap, permittivity, (innerRadius, gap, er) => {
        const outerRadius = above(innerRadius, gap);
        fc.pre(outerRadius !== undefined);
        const x = { innerRadius, outerRadius: outerRadius!, relativePermittivity: er };
        agrees(sphericalCapacitance, x, sphericalOracle(x), BOUND.product);
      }),
      { numRuns: RUNS },
    );
  });

  it("isolated-sphere capacitance is within a few ulp of 4 pi eps0 epsr a", () => {
    fc.assert(
      fc.property(decades(-320, 308), permittivity, (radius, er) => {
        fc.pre(radius > 0 && Number.isFinite(radius));
        const x = { radius, relativePermittivity: er };
        agrees(isolatedSphereCapacitance, x, isolatedSphereOracle(x), BOUND.product);
      }),
      { numRuns: RUNS },
    );
  });

  it("two-wire capacitance is within a few ulp of pi eps0 epsr l / acosh(D / 2a), nearly touching wires included", () => {
    fc.assert(
      fc.property(decades(-300, 300), relativeGap, length, permittivity, (wireRadius, gap, len, er) => {
        const separation = above(2 * wireRadius, gap);
        fc.pre(separation !== undefined);
        const x = { wireRadius, separation: separation!, length: len, relativePermittivity: er };
        agrees(twoWireCapacitance, x, twoWireOracle(x), BOUND.logarithm);
      }),
      { numRuns: RUNS },
    );
  });

  it("wire-over-plane capacitance is within a few ulp of 2 pi eps0 epsr l / acosh(h / a), a wire nearly on the plane included", () => {
    fc.assert(
      fc.property(decades(-300, 300), relativeGap, length, permittivity, (wireRadius, gap, len, er) => {
        const height = above(wireRadius, gap);
        fc.pre(height !== undefined);
        const x = { wireRadius, height: height!, length: len, relativePermittivity: er };
        agrees(wireOverPlaneCapacitance, x, wireOverPlaneOracle(x), BOUND.logarithm);
      }),
      { numRuns: RUNS },
    );
  });

  it("parallel-plate capacitance is within a few ulp of eps0 epsr A / d", () => {
    fc.assert(
      fc.property(decades(-300, 300), decades(-300, 300), permittivity, (area, gap, er) => {
        const x = { area, gap, relativePermittivity: er };
        agrees(parallelPlateCapacitance, x, parallelPlateOracle(x), BOUND.product);
      }),
      { numRuns: RUNS },
    );
  });

  it("stored energy and charge are within 1.5 and 0.5 ulp of C V^2 / 2 and C V for either sign of V", () => {
    fc.assert(
      fc.property(decades(-300, 300), decades(-200, 200), fc.boolean(), (capacitance, v, negative) => {
        const x = { capacitance, voltage: negative ? -v : v };
        agrees(capacitorEnergy, x, energyOracle(x), BOUND.energy);
        agrees(capacitorCharge, x, chargeOracle(x), BOUND.charge);
      }),
      { numRuns: RUNS },
    );
  });

  it("series and parallel capacitance are within 1.5 and 0.5 ulp of C1 C2 / (C1 + C2) and C1 + C2, 1e-300 F to 1e300 F", () => {
    fc.assert(
      fc.property(decades(-300, 300), decades(-300, 300), (capacitance1, capacitance2) => {
        const x = { capacitance1, capacitance2 };
        agrees(seriesCapacitance, x, seriesOracle(x), BOUND.series);
        agrees(parallelCapacitance, x, parallelOracle(x), BOUND.sum);
      }),
      { numRuns: RUNS },
    );
    // The reproducers: the product C1 C2 would overflow or underflow.
    for (const [c1, c2] of [[1e308, 1e308], [1e-200, 1e200], [1e-300, 3e-300], [1.7e308, 1e-308]] as const) {
      const x = { capacitance1: c1, capacitance2: c2 };
      agrees(seriesCapacitance, x, seriesOracle(x), BOUND.series);
      agrees(parallelCapacitance, x, parallelOracle(x), BOUND.sum);
    }
  });

  it("named near-degenerate cases keep full precision where ln(b/a) and acosh(x) of a rounded ratio would not", () => {
    for (const a of [1e-200, 1e-6, 0.45e-3, 1, 1e200]) {
      const coax = { innerRadius: a, outerRadius: a * (1 + 1e-9), length: 1, relativePermittivity: 1 };
      agrees(coaxialCapacitance, coax, coaxialOracle(coax), BOUND.logarithm);
      const sphere = { innerRadius: a, outerRadius: a * (1 + 1e-9), relativePermittivity: 1 };
      agrees(sphericalCapacitance, sphere, sphericalOracle(sphere), BOUND.product);
      const pair = { wireRadius: a, separation: 2 * a * (1 + 1e-12), length: 1, relativePermittivity: 1 };
      agrees(twoWireCapacitance, pair, twoWireOracle(pair), BOUND.logarithm);
      const plane = { wireRadius: a, height: a * (1 + 1e-12), length: 1, relativePermittivity: 1 };
      agrees(wireOverPlaneCapacitance, plane, wireOverPlaneOracle(plane), BOUND.logarithm);
    }
    // The naive forms really do fail here, so the check above has teeth.
    const a = 0.45e-3;
    const naive = Math.PI * 8.8541878188e-12 / Math.acosh((2 * a * (1 + 1e-12)) / (2 * a));
    const pair = { wireRadius: a, separation: 2 * a * (1 + 1e-12), length: 1, relativePermittivity: 1 };
    expect(relErr(naive, twoWireOracle(pair))).toBeGreaterThan(1e-6);
  });

  it("results beyond the range of doubles are out_of_range, not Infinity or zero", () => {
    const huge = { innerRadius: 1, outerRadius: 1 + 2 ** -52, length: 1e300, relativePermittivity: 1e4 };
    expect(() => call(coaxialCapacitance, huge)).toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as FormulaError);
    const tiny = { capacitance: 1e-300, voltage: 1e-100 };
    expect(() => call(capacitorEnergy, tiny)).toThrow(expect.objectContaining({ code: "out_of_range" }) as unknown as FormulaError);
  });

  it("reports the worst error measured per formula (in eps)", () => {
    const rows = [...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`);
    console.log(`capacitance worst relative error / eps: ${rows.join(", ")}`);
    expect(worst.size).toBeGreaterThanOrEqual(10);
  });
});
