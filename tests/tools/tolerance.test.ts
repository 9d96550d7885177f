import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { FormulaError } from "../../src/core/errors.js";
import { defineFormula } from "../../src/core/formula.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";
import { createRandom } from "../../src/tools/random.js";
import { tolerance, toleranceRequest } from "../../src/tools/tolerance.js";
import { expectClose } from "../helpers/reference.js";

const A = 1e-4;
const D = 1e-4;
const ER = 4.4;
// eps0, CODATA 2022 (NIST), F/m.
const C = (8.8541878188e-12 * ER * A) / D;

describe("tolerance on the parallel-plate capacitor", () => {
  const r = tolerance(parallelPlateCapacitance, {
    area: { nominal: A, percent: 2 },
    gap: { nominal: D, plusMinus: 1e-5 },
    relativePermittivity: { distribution: "uniform", min: 4.3, max: 4.5 },
  }, { samples: 20000, seed: 7 });

  it("computes slopes that match the analytic derivatives dC/dA = C/A, dC/dd = -C/d, dC/depsr = C/epsr", () => {
    const byName = Object.fromEntries(r.sensitivities.map((s) => [s.input, s]));
    expectClose(byName.area!.derivative, { expected: C / A, tolerance: 1e-9, source: "analytic derivative of C = eps0 epsr A / d" });
    expectClose(byName.gap!.derivative, { expected: -C / D, tolerance: 1e-9, source: "analytic derivative of C = eps0 epsr A / d" });
    expectClose(byName.relativePermittivity!.derivative, { expected: C / ER, tolerance: 1e-9, source: "analytic derivative" });
    expect(byName.gap!.derivativeUnit).toBe("F/m");
  });

  it("gives the RSS of the analytic contributions, and shares that sum to one with the gap dominating", () => {
    const sA = (0.02 * A) / Math.sqrt(3);
    const sD = 1e-5 / Math.sqrt(3);
    const sE = 0.2 / Math.sqrt(12);
    const parts = [(C / A) * sA, (C / D) * sD, (C / ER) * sE];
    const sd = Math.hypot(...parts);
    expectClose(r.rss.sd, { expected: sd, tolerance: 1e-8, source: "first-order propagation with analytic slopes" });
    expectClose(r.rss.plusMinus, { expected: Math.hypot((C / A) * 0.02 * A, (C / D) * 1e-5, (C / ER) * 0.1), tolerance: 1e-8, source: "RSS of band half-widths" });
    const total = r.sensitivities.reduce((s, x) => s + x.share, 0);
    expect(total).toBeCloseTo(1, 12);
    expect(r.sensitivities[0]!.input).toBe("gap");
  });

  it("puts the worst case at the corners: C(A+, d-, epsr+) and C(A-, d+, epsr-)", () => {
    const e0 = 8.8541878188e-12;
    expectClose(r.worstCase.max, { expected: (e0 * 4.5 * A * 1.02) / (D - 1e-5), tolerance: 1e-12, source: "corner of the box" });
    expectClose(r.worstCase.min, { expected: (e0 * 4.3 * A * 0.98) / (D + 1e-5), tolerance: 1e-12, source: "corner of the box" });
    expect(r.worstCase.method).toBe("corners");
    expect(r.worstCase.evaluated).toBe(8);
  });

  it("keeps every Monte Carlo sample inside the worst-case bounds and orders the percentiles", () => {
    const mc = r.monteCarlo!;
    expect(mc.accepted).toBe(20000);
    expect(mc.rejected).toBe(0);
    expect(mc.min).toBeGreaterThanOrEqual(r.worstCase.min);
    expect(mc.max).toBeLessThanOrEqual(r.worstCase.max);
    const ps = [mc.min, mc.p1, mc.p5, mc.p50, mc.p95, mc.p99, mc.max];
    for (let i = 1; i < ps.length; i++) expect(ps[i]!).toBeGreaterThanOrEqual(ps[i - 1]!);
    // Small tolerances: the output is nearly linear, so the sample sd is close to the RSS sd
    // (20000 samples: the sd's own sampling error is about 0.5 %).
    expectClose(mc.sd, { expected: r.rss.sd, tolerance: 0.03, source: "first-order propagation (near-linear regime)" });
    // Independent inputs: E[C] = eps0 E[epsr] E[A] E[1/d], with E[1/d] = ln((d + h)/(d - h)) / (2h) for d uniform on d +- h.
    const h = 1e-5;
    const mean = 8.8541878188e-12 * ER * A * (Math.log((D + h) / (D - h)) / (2 * h));
    expectClose(mc.mean, { expected: mean, tolerance: 0.002, source: "exact mean of a product of independent uniform inputs" });
  });

  it("is reproducible for a seed and changes with the seed", () => {
    const spec = { area: { nominal: A, percent: 2 }, gap: { nominal: D, percent: 5 } } as const;
    const a = tolerance(parallelPlateCapacitance, spec, { samples: 500, seed: 3 });
    const b = tolerance(parallelPlateCapacitance, spec, { samples: 500, seed: 3 });
    const c = tolerance(parallelPlateCapacitance, spec, { samples: 500, seed: 4 });
    expect(a.monteCarlo).toEqual(b.monteCarlo);
    expect(a.monteCarlo!.mean).not.toBe(c.monteCarlo!.mean);
  });

  it("reads unit strings, treats percent and plus-minus alike, and carries the warnings", () => {
    const p = toleranceRequest({ formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "2 mm", percent: 10 } }, options: { samples: 100 } });
    const q = toleranceRequest({ formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "2 mm", plusMinus: "0.2 mm" } }, options: { samples: 100 } });
    expect(p.worstCase).toEqual(q.worstCase);
    expect(p.warnings.map((w) => w.code)).toContain("fringing");
    expect(p.unit).toBe("F");
  });

  it("counts samples outside an input's domain as rejected and says so", () => {
    const t = tolerance(parallelPlateCapacitance, { area: A, gap: { distribution: "normal", mean: D, sd: D } }, { samples: 2000, seed: 1 });
    expect(t.monteCarlo!.rejected).toBeGreaterThan(0);
    expect(t.monteCarlo!.accepted + t.monteCarlo!.rejected).toBe(2000);
    expect(t.remarks.join(" ")).toMatch(/gap reaches below its domain/);
  });

  it("rejects malformed tolerances with invalid_argument naming the input", () => {
    for (const bad of [{ nominal: D, plusMinus: -1 }, { nominal: D }, { distribution: "uniform", min: 2, max: 1 }, { distribution: "normal", mean: D }]) {
      try {
        tolerance(parallelPlateCapacitance, { area: A, gap: bad as never });
        expect.fail("expected an error");
      } catch (e) {
        expect(e).toBeInstanceOf(FormulaError);
        expect((e as FormulaError).code).toBe("invalid_argument");
        expect((e as FormulaError).input).toBe("gap");
      }
    }
  });
});

describe("tolerance's treatment of non-monotonic outputs", () => {
  const bump = defineFormula({
    id: "testBump", title: "test", category: "test", description: "test", equation: "y = 1 - x^2",
    inputs: [{ name: "x", dimension: "Dimensionless", description: "x", example: 0 }],
    output: { dimension: "Dimensionless", description: "y" },
    source: { authors: "test", title: "test" },
    compute: (v) => 1 - v.x * v.x,
  });
  it("finds the interior maximum, notes the non-monotonic input, and contains every sample", () => {
    const t = tolerance(bump, { x: { nominal: 0, plusMinus: 1 } }, { samples: 5000 });
    expect(t.worstCase.max).toBe(1);
    expect(t.worstCase.min).toBe(0);
    expect(t.remarks.join(" ")).toMatch(/not monotonic in x/);
    expect(t.monteCarlo!.min).toBeGreaterThanOrEqual(t.worstCase.min);
    expect(t.monteCarlo!.max).toBeLessThanOrEqual(t.worstCase.max);
  });
});

describe("tolerance when slopes at nominal mislead", () => {
  const product = defineFormula({
    id: "testProduct", title: "test", category: "test", description: "test", equation: "y = a b",
    inputs: [{ name: "a", dimension: "Dimensionless", description: "a", example: 1 }, { name: "b", dimension: "Dimensionless", description: "b", example: 1 }],
    output: { dimension: "Dimensionless", description: "y" },
    source: { authors: "test", title: "test" },
    compute: (v) => v.a * v.b,
  });
  it("takes the extremes from all corners (a b over [-1, 3]^2 is -3 to 9) and says the slopes pointed elsewhere", () => {
    const t = tolerance(product, { a: { nominal: 1, plusMinus: 2 }, b: { nominal: 1, plusMinus: 2 } }, { samples: 2000 });
    expect(t.worstCase.min).toBe(-3);
    expect(t.worstCase.max).toBe(9);
    expect(t.remarks.join(" ")).toMatch(/not those the slopes at nominal point to/);
    expect(t.monteCarlo!.min).toBeGreaterThanOrEqual(-3);
  });
});

describe("the seeded generator", () => {
  it("gives uniform numbers in [0, 1) with mean 1/2 and standard normals with sd 1", () => {
    const rng = createRandom(42);
    let s = 0;
    let s2 = 0;
    const n = 100000;
    let inRange = true;
    for (let i = 0; i < n; i++) {
      const u = rng.next();
      inRange &&= u >= 0 && u < 1;
      s += u;
      const z = rng.normal();
      s2 += z * z;
    }
    expect(inRange).toBe(true);
    expect(Math.abs(s / n - 0.5)).toBeLessThan(0.005);
    expect(Math.abs(s2 / n - 1)).toBeLessThan(0.02);
  });
});

describe("tolerance on every registry formula", () => {
  it("brackets the nominal with the worst case and keeps uniform Monte Carlo samples inside it", () => {
    let n = 0;
    for (const f of listFormulas()) {
      if (f.definition.output.components) continue;
      const specs = f.definition.inputs as Record<string, InputSpec>;
      const inputs: Record<string, unknown> = {};
      for (const [name, s] of Object.entries(specs)) {
        if (s.example === undefined) continue;
        // 1 % on every scalar quantity input with a non-zero example; others held.
        inputs[name] = !("choices" in s) && !s.vector && typeof s.example === "number" && s.example !== 0 && !s.domain?.integer
          ? { nominal: s.example, percent: 1 }
          : s.example;
      }
      const t = tolerance(f as never, inputs as never, { samples: 300, seed: 5 });
      const label = `${f.id}: ${JSON.stringify(t.worstCase)} nominal ${t.nominal}`;
      expect(t.worstCase.min, label).toBeLessThanOrEqual(t.nominal);
      expect(t.worstCase.max, label).toBeGreaterThanOrEqual(t.nominal);
      expect(t.monteCarlo!.min, label).toBeGreaterThanOrEqual(t.worstCase.min);
      expect(t.monteCarlo!.max, label).toBeLessThanOrEqual(t.worstCase.max);
      expect(Number.isFinite(t.rss.sd), label).toBe(true);
      n++;
    }
    expect(n).toBeGreaterThan(0);
  });
});
