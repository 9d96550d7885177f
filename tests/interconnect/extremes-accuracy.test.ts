// The transmission-line closed forms against the 50-digit decimal.js oracle
// (tests/interconnect/oracle.ts), which evaluates the published expressions as
// printed: within a stated bound over the whole double range of the lengths
// (only ratios and f h enter), near-degenerate geometry included. The oracle
// checks the numerics; the reference tests check the physics.
//
// Bounds (in eps = 2^-52, relative) are set from the conditioning of each
// expression: the microstrip fits chain exp, pow and log of rounded
// intermediate values (u = w/h, a(u) b(epsr), the thickness corrections), whose
// rounding is amplified by the exponents of the fit (up to about 12 for the
// dispersion terms). The measured worst cases are printed by the last test.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  coaxialImpedance, lineInputImpedance, microstripEffectivePermittivity, microstripImpedance, propagationDelay,
  reflectionCoefficient, returnLoss, standingWaveRatio, twoWireImpedance, striplineImpedance, coplanarWaveguideImpedance,
  coplanarWaveguideEffectivePermittivity, traceCurrentForTemperatureRise,
} from "../../src/index.js";
import { representable } from "../capacitance/oracle.js";
import {
  agreesWithOracle, coaxialImpedanceOracle, type Dec, delayOracle, exact, gammaOracle, inputImpedanceOracle, microstripOracle,
  returnLossOracle, swrOracle, twoWireImpedanceOracle, striplineOracle, cpwOracle, traceCurrentOracle,
} from "./oracle.js";

const EPS = Number.EPSILON;
const BOUND = { microstripStatic: 12 * EPS, microstripDispersive: 32 * EPS } as const;
const RUNS = 300;

const worst = new Map<string, number>();
const agrees = (f: unknown, x: object, want: Dec, tol: number) => agreesWithOracle(f, x, want, tol, worst);

const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);

describe("transmission-line closed forms against a 50-digit decimal.js oracle", () => {
  it("microstrip impedance and effective permittivity (0 Hz) follow Hammerstad and Jensen's equations, heights 1e-300 m to 1e300 m", () => {
    fc.assert(
      fc.property(decades(-295, 295), decades(-2, 2), decades(0, 2.1), fc.oneof(fc.constant(0), decades(-4, -1)), (height, u, er, t) => {
        const x = { width: height * u, height, relativePermittivity: er, thickness: height * t, frequency: 0 };
        fc.pre(Number.isFinite(x.width) && x.width > 0 && (t === 0 || x.thickness > 0));
        const o = microstripOracle(x);
        agrees(microstripImpedance, x, o.z0, BOUND.microstripStatic);
        agrees(microstripEffectivePermittivity, x, o.ee, BOUND.microstripStatic);
      }),
      { numRuns: RUNS },
    );
  });

  it("above 0 Hz they follow Kirschning and Jansen (1982) and Jansen and Kirschning (1983) within the stated bound", () => {
    fc.assert(
      fc.property(decades(-290, 290), decades(-1, 2), fc.double({ min: 1.5, max: 20, noNaN: true }), fc.oneof(fc.constant(0), decades(-4, -1)), decades(-2, 1.6), (height, u, er, t, fn) => {
        const x = { width: height * u, height, relativePermittivity: er, thickness: height * t, frequency: (fn * 1e6) / height };
        fc.pre(Number.isFinite(x.width) && x.width > 0 && Number.isFinite(x.frequency) && x.frequency > 0 && (t === 0 || x.thickness > 0));
        const o = microstripOracle(x);
        agrees(microstripImpedance, x, o.z0, BOUND.microstripDispersive);
        agrees(microstripEffectivePermittivity, x, o.ee, BOUND.microstripDispersive);
      }),
      { numRuns: RUNS },
    );
  });

});

describe("line closed forms against the oracle over the double range", () => {
  const lineBound = { logarithm: 6 * EPS, product: 3 * EPS, ratio: 2 * EPS, returnLoss: 8 * EPS } as const;
  const relativeGap = fc.oneof(
    fc.integer({ min: 1, max: 64 }).map((k) => k * 2 ** -52),
    decades(-15.5, 0),
    decades(0, 80),
  );
  const above = (small: number, g: number): number | undefined => {
    const big = small + small * g;
    return Number.isFinite(big) && big > small ? big : undefined;
  };
  const permittivity = fc.oneof(fc.constant(1), fc.double({ min: 1, max: 1e4, noNaN: true }));

  it("coaxial and two-wire impedance are within a few ulp of eta0 ln(b/a)/(2 pi sqrt(epsr)) and eta0 acosh(D/2a)/(pi sqrt(epsr))", () => {
    fc.assert(fc.property(decades(-300, 300), relativeGap, permittivity, (a, g, er) => {
      const b = above(a, g);
      fc.pre(b !== undefined);
      const coax = { innerRadius: a, outerRadius: b!, relativePermittivity: er };
      agrees(coaxialImpedance, coax, coaxialImpedanceOracle(coax), lineBound.logarithm);
      const d = above(2 * a, g);
      fc.pre(d !== undefined);
      const pair = { wireRadius: a, separation: d!, relativePermittivity: er };
      agrees(twoWireImpedance, pair, twoWireImpedanceOracle(pair), lineBound.logarithm);
    }), { numRuns: RUNS });
  });

  it("propagation delay is within a few ulp of l sqrt(eps_eff) / c, lengths 1e-320 m to 1e308 m", () => {
    fc.assert(fc.property(decades(-320, 308), fc.oneof(fc.constant(1), decades(0, 300)), (length, e) => {
      fc.pre(length > 0 && Number.isFinite(length));
      const x = { length, effectivePermittivity: e };
      agrees(propagationDelay, x, delayOracle(x), lineBound.product);
    }), { numRuns: RUNS });
  });

  it("reflection coefficient, return loss and standing-wave ratio are within a few ulp, near a match and at 1e-300..1e308 ohm", () => {
    fc.assert(fc.property(decades(-300, 307), relativeGap, fc.boolean(), (z0, g, loadAbove) => {
      const other = above(z0, g);
      fc.pre(other !== undefined);
      const x = loadAbove ? { loadResistance: other!, characteristicImpedance: z0 } : { loadResistance: z0, characteristicImpedance: other! };
      agrees(reflectionCoefficient, x, gammaOracle(x), lineBound.ratio);
      agrees(returnLoss, x, returnLossOracle(x), lineBound.returnLoss);
      agrees(standingWaveRatio, x, swrOracle(x), lineBound.ratio);
    }), { numRuns: RUNS });
  });

  it("input impedance of a terminated line is within a bound that grows with the phase's own rounding", () => {
    fc.assert(fc.property(decades(-300, 300), decades(-6, 6), decades(-3, 1), fc.oneof(fc.constant(1), decades(0, 2)), (z0, r, bl, e) => {
      // Choose frequency and length to give the electrical length bl (rad).
      const length = 0.1;
      const frequency = (bl * 299792458) / (2 * Math.PI * length * Math.sqrt(e));
      const x = { loadResistance: z0 * r, characteristicImpedance: z0, length, frequency, effectivePermittivity: e };
      fc.pre(Number.isFinite(x.loadResistance) && x.loadResistance > 0);
      const [re, im] = inputImpedanceOracle(x);
      const got = lineInputImpedance(x as never) as readonly number[];
      const mag = re.pow(2).plus(im.pow(2)).sqrt();
      fc.pre(representable(mag) && mag.gt(exact(z0).times(1e-290)));
      const err = exact(got[0]!).minus(re).pow(2).plus(exact(got[1]!).minus(im).pow(2)).sqrt().div(mag).toNumber();
      // The phase carries up to 4 roundings (bl 2^-52 each); Zin's relative sensitivity to bl is at most max(r, 1/r).
      const tol = (8 + 4 * bl * Math.max(r, 1 / r)) * EPS;
      worst.set("lineInputImpedance", Math.max(worst.get("lineInputImpedance") ?? 0, err / (1 + bl * Math.max(r, 1 / r) / 2)));
      expect(err, JSON.stringify(x)).toBeLessThanOrEqual(tol);
    }), { numRuns: RUNS });
  });
});

describe("the IPC-2221 current fit against the oracle over the double range", () => {
  it("the trace current is within a few ulp of k dT^0.44 (w t / mil^2)^0.725, widths, thicknesses and rises 1e-300 to 1e300", () => {
    // Three Math.pow calls or three scaled powers and two products: about 6 roundings.
    fc.assert(fc.property(decades(-300, 300), decades(-300, 300), decades(-300, 300), fc.constantFrom("external", "internal"), (width, thickness, temperatureRise, layer) => {
      const x = { width, thickness, temperatureRise, layer } as const;
      agrees(traceCurrentForTemperatureRise, x, traceCurrentOracle(x), 8 * EPS);
    }), { numRuns: RUNS });
  });
});

describe("conformal-mapping forms against the AGM oracle", () => {
  it("centred stripline (zero thickness) is within a few ulp of Cohn's (eta0 / 4 sqrt(epsr)) K(k)/K(k'), widths 1e-6 to 1e3 spacings", () => {
    fc.assert(fc.property(decades(-290, 290), decades(-6, 3), fc.double({ min: 1, max: 100, noNaN: true }), (b, wb, er) => {
      const x = { width: b * wb, groundSpacing: b, relativePermittivity: er, thickness: 0 };
      fc.pre(Number.isFinite(x.width) && x.width > 0);
      agrees(striplineImpedance, x, striplineOracle(x), 16 * EPS);
    }), { numRuns: 200 });
  });

  it("coplanar waveguide (both backings) is within a small bound of Simons' expressions evaluated as printed", () => {
    fc.assert(fc.property(decades(-290, 290), decades(-3, 2), decades(-3, 2), fc.double({ min: 1, max: 50, noNaN: true }), fc.constantFrom("none", "grounded"), (h, wh, gh, er, backing) => {
      const x = { width: h * wh, gap: h * gh, height: h, relativePermittivity: er, backing };
      fc.pre(Number.isFinite(x.width) && x.width > 0 && x.gap > 0);
      const [ee, z0] = cpwOracle(x);
      agrees(coplanarWaveguideEffectivePermittivity, x, ee, 64 * EPS);
      agrees(coplanarWaveguideImpedance, x, z0, 64 * EPS);
    }), { numRuns: 150 });
  });
});

describe("the measured worst errors", () => {
  it("reports the worst error measured per formula (in eps; lineInputImpedance per unit of its phase-dependent bound)", () => {
    const rows = [...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`);
    console.log(`transmission line worst relative error / eps: ${rows.join(", ")}`);
    expect(worst.size).toBeGreaterThanOrEqual(13);
  });
});
