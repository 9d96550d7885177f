import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EPSILON0, MU0 } from "../../src/constants/si.js";
import {
  FormulaError, circularToroidInductance, coaxialInductance, evaluate, loopInductance, straightWireInductance, toroidInductance,
  twoWireInductance, type Length,
} from "../../src/index.js";
import { maxwellMutual } from "../../src/inductance/shared.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { dec, exact } from "../math/decimal-elliptic.js";

const m = (v: number) => v as Length;
const D = dec(80);
const PI = D.acos(-1);
const mu0 = new D(MU0);

describe("toroidInductance and circularToroidInductance", () => {
  it("both tend to mu N^2 A / (2 pi R) for a thin section", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e-2, noNaN: true }), fc.double({ min: 1, max: 1e4, noNaN: true }), (t, mur) => {
        const R = 0.05;
        const N = 40;
        const r = t * R;
        const thin = (A: number) => (MU0 * mur * N * N * A) / (2 * Math.PI * R);
        // Rectangular section of side 2r centred on R; circular section of radius r.
        const inner = R - r;
        const outer = R + r;
        const rect = toroidInductance({ turns: N, innerRadius: m(inner), outerRadius: m(outer), height: m(2 * r), relativePermeability: mur });
        const circ = circularToroidInductance({ turns: N, majorRadius: m(R), minorRadius: m(r), relativePermeability: mur });
        // Both differ from the thin limit at order (r/R)^2.
        expect(relativeError(rect, (thin(2 * r * (outer - inner)) * 2 * R) / (outer + inner))).toBeLessThan(0.5 * t * t + 1e-14);
        expect(relativeError(circ, thin(Math.PI * r * r))).toBeLessThan(0.5 * t * t + 1e-14);
      }),
    );
  });

  it("circular section matches a decimal.js oracle of R - sqrt(R^2 - r^2) for thin sections", () => {
    for (const t of [0.9, 0.5, 1e-3, 1e-6, 1e-9]) {
      const R = 0.05;
      const r = t * R;
      const ex = mu0.times(100 * 100).times(exact(R, 80).minus(exact(R, 80).pow(2).minus(exact(r, 80).pow(2)).sqrt())).toNumber();
      expectClose(circularToroidInductance({ turns: 100, majorRadius: m(R), minorRadius: m(r) }), {
        input: { R, r }, expected: ex, tolerance: 1e-14, source: "decimal.js oracle of mu0 N^2 (R - sqrt(R^2 - r^2))",
      });
    }
  });

  it("rectangular section matches a decimal.js oracle of ln(b/a) for thin cores", () => {
    for (const g of [1, 1e-3, 1e-8, 1e-12]) {
      const a = 0.02;
      const b = a * (1 + g);
      const ex = mu0.times(50 * 50).times(exact(0.01, 80)).times(exact(b, 80).div(exact(a, 80)).ln()).div(PI.times(2)).toNumber();
      expectClose(toroidInductance({ turns: 50, innerRadius: m(a), outerRadius: m(b), height: m(0.01) }), {
        input: { a, b }, expected: ex, tolerance: 1e-14, source: "decimal.js oracle of mu0 N^2 h ln(b/a)/(2 pi)",
      });
    }
  });

  it("scales with mu_r and N^2, linearly with all lengths", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (s, t) => {
        const x = { turns: 7, majorRadius: m(0.1), minorRadius: m(0.1 * t), relativePermeability: 3 };
        const L = circularToroidInductance(x);
        expect(relativeError(circularToroidInductance({ ...x, majorRadius: m(0.1 * s), minorRadius: m(0.1 * t * s) }), s * L)).toBeLessThan(1e-14);
        expect(relativeError(circularToroidInductance({ ...x, turns: 14, relativePermeability: 6 }), 8 * L)).toBeLessThan(1e-15);
      }),
    );
  });

  it("rejects a section that does not fit", () => {
    expect(() => evaluate("circularToroidInductance", { turns: 5, majorRadius: 0.01, minorRadius: 0.02 })).toThrow(/minorRadius < majorRadius/);
    expect(() => evaluate("toroidInductance", { turns: 5, innerRadius: 0.02, outerRadius: 0.01, height: 0.01 })).toThrow(/innerRadius < outerRadius/);
  });
});

describe("coaxialInductance and twoWireInductance", () => {
  it("two-wire line matches a decimal.js oracle of the acosh form, also nearly touching", () => {
    for (const s of [1e6, 10, 1, 1e-3, 1e-8, 1e-12]) {
      const a = 0.001;
      const Dsep = 2 * a * (1 + s);
      const x = exact(Dsep, 80).div(exact(a, 80).times(2));
      const acosh = x.plus(x.pow(2).minus(1).sqrt()).ln();
      const ex = mu0.div(PI).times(acosh).toNumber();
      expectClose(twoWireInductance({ wireRadius: m(a), separation: m(Dsep), length: m(1) }), {
        input: { a, D: Dsep }, expected: ex, tolerance: 1e-12, source: "decimal.js oracle of (mu0/pi) acosh(D/2a)",
      });
    }
  });

  it("two-wire line tends to (mu0 l/pi) ln(D/a) for widely spaced wires", () => {
    // acosh(x) = ln(2x) - 1/(4x^2) + ...: with x = D/2a, ln(2x) = ln(D/a)
    const L = twoWireInductance({ wireRadius: m(1e-4), separation: m(1), length: m(2) });
    expectClose(L, { expected: ((MU0 * 2) / Math.PI) * Math.log(1e4), tolerance: 1e-8, source: "thin-wire limit" });
  });

  it("L C = mu0 eps0 l^2 for the two-wire and coaxial TEM lines (with the capacitance module)", () => {
    // TEM lines in vacuum: L C = mu0 eps0 l^2 exactly; C from twoWireCapacitance and
    // coaxialCapacitance (electrostatics, written independently in src/capacitance).
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (g, l) => {
        const a = 1e-3;
        const Dsep = 2 * a * (1 + g);
        const Lt = twoWireInductance({ wireRadius: m(a), separation: m(Dsep), length: m(l) });
        const Ct = evaluate("twoWireCapacitance", { wireRadius: a, separation: Dsep, length: l }).value as number;
        expect(relativeError(Lt * Ct, MU0 * EPSILON0 * l * l)).toBeLessThan(1e-13);
        const Lc = coaxialInductance({ innerRadius: m(a), outerRadius: m(a * (1 + g)), length: m(l) });
        const Cc = evaluate("coaxialCapacitance", { innerRadius: a, outerRadius: a * (1 + g), length: l }).value as number;
        expect(relativeError(Lc * Cc, MU0 * EPSILON0 * l * l)).toBeLessThan(1e-13);
      }),
    );
  });

  it("coaxial line matches 2e-7 H/m times ln(b/a) within the mu0 revision", () => {
    // Classic value: 0.2 uH/m per neper of ln(b/a) with mu0 = 4 pi 1e-7 (common practice);
    // CODATA 2022 mu0 differs from 4 pi 1e-7 by about 1e-10 relative.
    const L = coaxialInductance({ innerRadius: m(1), outerRadius: m(Math.E), length: m(1) });
    expectClose(L, { expected: 2e-7, tolerance: 1e-9, source: "common practice: 0.2 uH/m per neper" });
  });

  it("warns about end effects on a short two-wire line", () => {
    expect(evaluate("twoWireInductance", { wireRadius: 0.001, separation: 0.1, length: 0.2 }).warnings.map((w) => w.code)).toContain("end_effects");
  });
});

describe("straightWireInductance", () => {
  /** Rosa's expression as written, in 80-digit decimals. */
  function rosaOracle(l: number, r: number): number {
    const L = new D(l);
    const R = new D(r);
    const h = L.pow(2).plus(R.pow(2)).sqrt();
    return mu0.div(PI.times(2)).times(L.times(L.plus(h).div(R).ln()).minus(h).plus(R).plus(L.div(4))).toNumber();
  }

  it("matches a decimal.js oracle of Rosa's expression from stubs to long wires", () => {
    for (let e = -8; e <= 8; e += 0.5) {
      const l = Math.pow(10, e);
      expectClose(straightWireInductance({ length: m(l), radius: m(1) }), {
        input: { l, r: 1 }, expected: rosaOracle(l, 1), tolerance: 1e-13, source: "decimal.js oracle of Rosa (1908)",
      });
    }
  });

  it("tends to (mu0 l / 2 pi)(ln(2l/r) - 3/4) for long wires", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e3, max: 1e12, noNaN: true }), (ratio) => {
        const l = 1;
        const r = l / ratio;
        const limit = ((MU0 * l) / (2 * Math.PI)) * (Math.log(2 * ratio) - 0.75);
        // the difference is r/l + O((r/l)^2) relative to the bracket
        expect(relativeError(straightWireInductance({ length: m(l), radius: m(r) }), limit)).toBeLessThan(2 / ratio);
      }),
    );
  });

  it("scales linearly with all lengths", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (s, ratio) => {
        const L = straightWireInductance({ length: m(ratio), radius: m(1) });
        expect(relativeError(straightWireInductance({ length: m(s * ratio), radius: m(s) }), s * L)).toBeLessThan(1e-14);
      }),
    );
  });
});

describe("loopInductance", () => {
  it("equals the mutual inductance of two filaments one geometric mean distance apart", () => {
    // Maxwell's GMD method: the self-inductance of a thin ring of round wire is the mutual
    // inductance of two coaxial filaments of radius R at a distance a e^(-1/4) (Maxwell,
    // Treatise (1873) arts. 691-693); the two agree up to terms of order (a/R)^2 ln(8R/a).
    for (const t of [1e-2, 1e-3, 1e-4, 1e-6]) {
      const R = 0.1;
      const a = t * R;
      const gmd = maxwellMutual(R, R, a * Math.exp(-0.25));
      const got = loopInductance({ loopRadius: m(R), wireRadius: m(a) });
      expect(relativeError(got, gmd)).toBeLessThan(t * t * (Math.log(8 / t) + 1));
    }
  });

  it("warns for thick wire", () => {
    expect(evaluate("loopInductance", { loopRadius: 0.01, wireRadius: 0.002 }).warnings.map((w) => w.code)).toContain("thick_wire");
    expect(evaluate("loopInductance", { loopRadius: 0.01, wireRadius: 0.0002 }).warnings).toHaveLength(0);
  });
});

describe("relative permeability of the toroid cores", () => {
  it("takes any mu_r > 0 (the core spec of src/core/spec.ts), a diamagnetic core included, with no note", () => {
    // Copper's mu_r = 0.999994 (from memory): the winding confines the flux whatever the material.
    const r = evaluate("toroidInductance", { turns: 50, innerRadius: "1 cm", outerRadius: "2 cm", height: "1 cm", relativePermeability: 0.999994 });
    expect(r.warnings).toEqual([]);
    expect(r.cautions).toEqual([]);
    expect(evaluate("circularToroidInductance", { turns: 50, majorRadius: "2 cm", minorRadius: "5 mm", relativePermeability: 2000 }).warnings).toEqual([]);
    expect(() => evaluate("toroidInductance", { turns: 50, innerRadius: "1 cm", outerRadius: "2 cm", height: "1 cm", relativePermeability: 0 })).toThrow(FormulaError);
  });
});

describe("notes at extreme shapes", () => {
  it("longSolenoidInductance states a huge overestimate for a very flat coil as a factor, never NaN", () => {
    const r = evaluate("longSolenoidInductance", { turns: 1, radius: 1, length: 1e-305 });
    const w = r.warnings.find((n) => n.code === "short_coil")!;
    expect(w.message).toMatch(/a factor of/);
    expect(w.message).not.toMatch(/NaN|Infinity/);
  });
});
