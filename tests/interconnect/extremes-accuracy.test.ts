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
import { microstripEffectivePermittivity, microstripImpedance } from "../../src/index.js";
import { agreesWithOracle, type Dec, microstripOracle } from "./oracle.js";

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

  it("reports the worst error measured per formula (in eps)", () => {
    const rows = [...worst].map(([id, e]) => `${id} ${(e / EPS).toFixed(2)}`);
    console.log(`transmission line worst relative error / eps: ${rows.join(", ")}`);
    expect(worst.size).toBeGreaterThanOrEqual(2);
  });
});
