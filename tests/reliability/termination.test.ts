/**
 * Termination: every registry formula, driven with inputs spread over the whole
 * double range (1e-300 to 1e300 and beyond, both signs where the domain allows,
 * exactly 0 where allowed, subnormals, inputs equal or nearly equal to one
 * another so ratios and differences are extreme), through the typed call and
 * through `evaluate`, runs a bounded number of loop iterations and either returns
 * finite values or throws a FormulaError with a known code: never a TypeError,
 * never NaN or Infinity, never a hang.
 *
 * Iterations are counted by the test build's countLoop (tests/helpers/loop-count.ts):
 * every iterative loop in the library reports its count when it ends.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ERROR_CODES, FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { getFormula } from "../../src/core/registry.js";
import type { AnyFormula } from "../../src/core/formula.js";
import type { InputSpec } from "../../src/core/spec.js";
import { MU0 } from "../../src/constants/si.js";
import { DUPLICATION_BOUND, LOG_FORM_LIMIT } from "../../src/math/elliptic.js";
import { SERIES_LIMIT } from "../../src/flux/loop-series.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { dec, ellipticKE, exact } from "../math/decimal-elliptic.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { type Inputs, inDomain, isChoice, specsOf, withExamples } from "./harness.js";

/**
 * The longest single loop any formula may run. The caps in the library: Carlson's
 * duplication 15 (12 proven, src/math/elliptic.ts), E - 1's series 32, Gauss-Legendre
 * Newton 10 per node. 32 is therefore the most a loop can report; a loop without a
 * proven bound (a while on a floating-point test) would show here as a larger count.
 */
const LONGEST_LOOP = 32;

/**
 * All iterations of one call together. The heaviest formula, coaxialCoilsMutualInductance,
 * sums at most 5 intervals x 60 graded panels x 20 nodes = 6,000 filament terms, each one
 * R_D of at most 12 steps (72,000), plus the first construction of its 20-point rule
 * (10 nodes x at most 10 Newton steps); every other formula evaluates a handful of
 * elliptic integrals (under 100 iterations). 100,000 holds all of them with margin and
 * is still far below anything that looks like a hang (measured worst: see the last test).
 */
const TOTAL_PER_CALL = 100_000;

const CODES = new Set<string>(ERROR_CODES);

/** Magnitudes across the double range: subnormals, both ends, and ordinary values. */
const MAGNITUDES = [
  5e-324, 1e-320, 1e-310, 2.2250738585072014e-308, 1e-300, 1e-250, 1e-200, 1e-150, 1e-100, 1e-50, 1e-30, 1e-15,
  1e-8, 1e-3, 0.05, 0.25, 0.5, 1, 2, 3, 10, 1e3, 1e8, 1e15, 1e30, 1e50, 1e100, 1e150, 1e200, 1e250, 1e300,
  1.7976931348623157e308,
];

/** A candidate for one numeric input: a magnitude, or a relation to another input (equal, nearly equal). */
type Pick =
  | { kind: "value"; magnitude: number; negative: boolean; zero: boolean }
  | { kind: "like"; other: number; factor: number };

const NEAR = [1, 1 + Number.EPSILON, 1 - Number.EPSILON / 2, 1 + 1e-8, 1 - 1e-8, 1 + 2 ** -12, 2, 0.5, 1e-200, 1e200];

const pickArb: fc.Arbitrary<Pick> = fc.oneof(
  { weight: 3, arbitrary: fc.record({ kind: fc.constant("value" as const), magnitude: fc.constantFrom(...MAGNITUDES), negative: fc.boolean(), zero: fc.constantFrom(false, false, false, true) }) },
  {
    weight: 2,
    arbitrary: fc.record({
      kind: fc.constant("value" as const),
      // log-uniform over 1e-310 .. 1e308
      magnitude: fc.double({ min: -310, max: 308, noNaN: true }).map((e) => 10 ** e),
      negative: fc.boolean(),
      zero: fc.constant(false),
    }),
  },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant("like" as const), other: fc.nat(20), factor: fc.constantFrom(...NEAR) }) },
);

/** The number a pick gives for an input with this domain, or undefined when it falls outside. */
function valueFor(spec: InputSpec, pick: Pick, earlier: number[]): number | undefined {
  if (isChoice(spec)) return undefined;
  let v: number;
  if (pick.kind === "like") {
    if (earlier.length === 0) return undefined;
    v = earlier[pick.other % earlier.length]! * pick.factor;
  } else {
    v = pick.zero ? 0 : pick.negative ? -pick.magnitude : pick.magnitude;
  }
  const d = spec.domain;
  if (d?.integer) v = Math.round(v);
  if (!inDomain(v, d)) {
    // Fold into the domain where that is a plain sign or clamp: keeps most picks useful.
    v = Math.abs(v);
    if (d?.integer) v = Math.round(v);
    if (d?.max !== undefined && v >= d.max) v = d.maxExclusive ? d.max * (1 - Number.EPSILON) : d.max;
    if (!inDomain(v, d)) return undefined;
  }
  return v;
}

/** Inputs for one call: each numeric input from its pick (or its example when the pick does not fit). */
function inputsFor(f: AnyFormula, example: Inputs, picks: Pick[], choiceIndex: number): Inputs {
  const out: Inputs = {};
  const earlier: number[] = [];
  let i = 0;
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec)) {
      out[name] = spec.choices[choiceIndex % spec.choices.length];
      continue;
    }
    const ex = example[name];
    if (Array.isArray(ex)) {
      out[name] = ex.map((c: number, k: number) => valueFor(spec, picks[(i + k) % picks.length]!, earlier) ?? c);
      i += 3;
      continue;
    }
    const v = valueFor(spec, picks[i++ % picks.length]!, earlier) ?? (ex as number);
    out[name] = v;
    earlier.push(v);
  }
  return out;
}

interface Tally {
  calls: number;
  values: number;
  errors: Map<string, number>;
  longest: number;
  mostTotal: number;
  heaviest: string;
}

const tally: Tally = { calls: 0, values: 0, errors: new Map(), longest: 0, mostTotal: 0, heaviest: "" };

/** One call through one path: finite values or a coded FormulaError, within the loop bounds. */
function check(f: AnyFormula, how: "typed" | "evaluate", inputs: Inputs): void {
  resetLoopCount();
  let value: unknown;
  try {
    value = how === "typed" ? (f as (x: unknown) => unknown)(inputs) : evaluate(f.id, inputs).value;
  } catch (e) {
    if (!(e instanceof FormulaError)) {
      throw new Error(`${f.id} (${how}) threw ${(e as Error)?.constructor?.name}: ${String(e)} for ${JSON.stringify(inputs)}`);
    }
    expect(CODES.has(e.code), `${f.id}: unknown code ${e.code}`).toBe(true);
    expect(e.message.length).toBeGreaterThan(0);
    tally.errors.set(e.code, (tally.errors.get(e.code) ?? 0) + 1);
    value = undefined;
  }
  const { total, largest } = loopCount();
  tally.calls++;
  if (largest > tally.longest) tally.longest = largest;
  if (total > tally.mostTotal) {
    tally.mostTotal = total;
    tally.heaviest = f.id;
  }
  const where = `${f.id} (${how}) at ${JSON.stringify(inputs)}`;
  expect(largest, `longest loop of ${where}`).toBeLessThanOrEqual(LONGEST_LOOP);
  expect(total, `iterations of ${where}`).toBeLessThanOrEqual(TOTAL_PER_CALL);
  if (value === undefined) return;
  tally.values++;
  const parts = typeof value === "number" ? [value] : (value as number[]);
  expect(Array.isArray(parts) && parts.length > 0, `value shape of ${where}`).toBe(true);
  for (const c of parts) expect(Number.isFinite(c), `value of ${where}: ${String(c)}`).toBe(true);
}

const FORMULAS = withExamples();

describe("every registry formula terminates on any input", () => {
  it("has formulas to drive", () => {
    expect(FORMULAS.length).toBeGreaterThan(40);
  });

  for (const { f, ex } of FORMULAS) {
    it(`${f.id} returns finite values or a coded FormulaError within the loop bounds, over the whole double range`, () => {
      fc.assert(
        fc.property(fc.array(pickArb, { minLength: 8, maxLength: 8 }), fc.nat(5), (picks, choice) => {
          const inputs = inputsFor(f, ex, picks, choice);
          check(f, "typed", inputs);
          check(f, "evaluate", inputs);
        }),
        { numRuns: 120 },
      );
    });
  }
});

/** The representable neighbours of x. */
function nextUp(x: number): number {
  const b = new Float64Array([x]);
  const u = new BigInt64Array(b.buffer);
  u[0] = u[0]! + (x >= 0 ? 1n : -1n);
  return b[0]!;
}
function nextDown(x: number): number {
  return -nextUp(-x);
}

describe("loopField and coaxialLoopsMutualInductance at their branch edges", () => {
  // With a = 1 and z = 0: m = 4 rho / (1 + rho)^2 and k' = (1 - rho)/(1 + rho). The radii below put
  // m at the series limit (0.2) and at 0.5 (the axial form's switch), k'^2 at 1/4 (E - 1's series)
  // and at LOG_FORM_LIMIT (Carlson -> logarithmic forms), each with its two neighbours.
  const kcEdge = (kc: number) => (1 - kc) / (1 + kc);
  const mEdge = (m: number) => (2 - m - 2 * Math.sqrt(1 - m)) / m; // root rho < 1 of 4 rho = m (1 + rho)^2
  const edges = [mEdge(SERIES_LIMIT), mEdge(0.5), kcEdge(0.5), kcEdge(Math.sqrt(LOG_FORM_LIMIT)), 1 / mEdge(SERIES_LIMIT), 1 / mEdge(0.5)];
  const loop = getFormula("loopField");
  const mutual = getFormula("coaxialLoopsMutualInductance");

  it("loopField terminates and is finite on both sides of every edge, on and off the loop's plane", () => {
    for (const rho of edges) {
      for (const r of [nextDown(rho), rho, nextUp(rho)]) {
        for (const z of [0, 1e-300, 1e-8, 0.3]) {
          check(loop, "typed", { current: 1, radius: 1, radialDistance: r, axialDistance: z });
          check(loop, "evaluate", { current: 1, radius: 1, radialDistance: r, axialDistance: -z });
        }
      }
    }
  });

  it("coaxialLoopsMutualInductance terminates and is finite on both sides of every edge", () => {
    for (const rho of edges) {
      for (const r of [nextDown(rho), rho, nextUp(rho)]) {
        for (const d of [0, 5e-324, 1e-300, 1e-8, 0.3]) {
          if (d === 0 && r === 1) continue;
          check(mutual, "typed", { radius1: 1, radius2: r, distance: d });
          check(mutual, "evaluate", { radius1: r, radius2: 1, distance: d });
        }
      }
    }
  });
});

/**
 * Oracle: Smythe (1968) sec. 7.10 loop field,
 *   B_rho = mu0 I z / (2 pi rho beta) [-K + (a^2 + rho^2 + z^2) E / alpha^2],
 *   B_z   = mu0 I / (2 pi beta) [K + (a^2 - rho^2 - z^2) E / alpha^2],
 * with K, E from the AGM (DLMF 19.8.1, 19.8.6) at 60 digits, m = 4 a rho / beta^2 and
 * mc = alpha^2 / beta^2 formed exactly in decimal from the doubles given.
 */
function smytheField(a: number, rho: number, z: number, I: number): [number, number] {
  const D = dec(60);
  const A = exact(a), R = exact(rho), Z = exact(z);
  const alpha2 = A.minus(R).pow(2).plus(Z.pow(2));
  const beta2 = A.plus(R).pow(2).plus(Z.pow(2));
  const { K, E } = ellipticKE(new D(4).times(A).times(R).div(beta2), alpha2.div(beta2), 60);
  const k = exact(MU0).times(exact(I)).div(new D(2).times(D.acos(-1)).times(beta2.sqrt()));
  const bRho = k.times(Z).div(R).times(K.neg().plus(A.pow(2).plus(R.pow(2)).plus(Z.pow(2)).times(E).div(alpha2)));
  const bZ = k.times(K.plus(A.pow(2).minus(R.pow(2)).minus(Z.pow(2)).times(E).div(alpha2)));
  return [bRho.toNumber(), bZ.toNumber()];
}
const SMYTHE = "Smythe (1968) 7.10 loop field with K, E from the DLMF 19.8 AGM at 60 digits";

/**
 * Oracle: Maxwell (1873) art. 701, M = mu0 sqrt(ab) [(2/k - k) K - (2/k) E], with
 * k^2 = 4ab / ((a + b)^2 + d^2) and k'^2 = ((a - b)^2 + d^2) / ((a + b)^2 + d^2) exact in
 * decimal, K, E from the AGM (DLMF 19.8.1, 19.8.6) at 60 digits (the AGM works on k'
 * itself, so k' ~ 5e-325 needs no more digits).
 */
function maxwellOracle(a: number, b: number, d: number): number {
  const D = dec(60);
  const A = exact(a), B = exact(b), Dd = exact(d);
  const den = A.plus(B).pow(2).plus(Dd.pow(2));
  const m = A.times(B).times(4).div(den);
  const mc = A.minus(B).pow(2).plus(Dd.pow(2)).div(den);
  const { K, E } = ellipticKE(m, mc, 60);
  const k = m.sqrt();
  return exact(MU0).times(A.times(B).sqrt()).times(new D(2).div(k).minus(k).times(K).minus(new D(2).div(k).times(E))).toNumber();
}
const MAXWELL = "Maxwell (1873) art. 701 with K, E from the DLMF 19.8 AGM at 60 digits";

describe("the issue's reproducers", () => {
  const loop = getFormula("loopField");
  const mutual = getFormula("coaxialLoopsMutualInductance");

  it("loopField 1e-200 m above a 1 m loop's wire returns the near-wire field (2e193 T radial) to a few ulp", () => {
    const [bRho, bZ] = smytheField(1, 1, 1e-200, 1);
    resetLoopCount();
    const typed = loop({ current: 1, radius: 1, radialDistance: 1, axialDistance: 1e-200 } as never) as number[];
    expect(loopCount().largest).toBeLessThanOrEqual(DUPLICATION_BOUND);
    const viaEvaluate = evaluate("loopField", { current: 1, radius: 1, radialDistance: 1, axialDistance: 1e-200 }).value as number[];
    for (const got of [typed, viaEvaluate]) {
      expectClose(got[0]!, { input: { z: 1e-200 }, expected: bRho, tolerance: 4 * Number.EPSILON, source: SMYTHE });
      expectClose(got[1]!, { input: { z: 1e-200 }, expected: bZ, tolerance: 8 * Number.EPSILON, source: SMYTHE });
    }
    expect(bRho).toBeGreaterThan(1.9e193); // mu0 I / (2 pi z) = 2e193 T
  });

  it("coaxialLoopsMutualInductance of 1 km loops 1e-321 m apart is finite and matches Maxwell's formula to a few ulp", () => {
    const expected = maxwellOracle(1000, 1000, 1e-321);
    const typed = mutual({ radius1: 1000, radius2: 1000, distance: 1e-321 } as never) as number;
    const viaEvaluate = evaluate("coaxialLoopsMutualInductance", { radius1: "1 km", radius2: "1 km", distance: "1e-321 m" }).value as number;
    expectClose(typed, { input: { a: 1000, d: 1e-321 }, expected, tolerance: 4 * Number.EPSILON, source: MAXWELL });
    expectClose(viaEvaluate, { input: { a: 1000, d: 1e-321 }, expected, tolerance: 4 * Number.EPSILON, source: MAXWELL });
    expect(expected).toBeGreaterThan(0.9); // mu0 a (ln(8a/d) - 2) = 0.94 H
  });
});

describe("next to the filament, a few ulp against the oracle", () => {
  const loop = getFormula("loopField");
  const mutual = getFormula("coaxialLoopsMutualInductance");
  const worst = { radial: 0, axial: 0, mutual: 0 };

  it("loopField from 1e-300 m to 0.1 m off the wire, above it and beside it, inside and outside", () => {
    const a = 0.7;
    for (let e = -300; e <= -1; e += 23) {
      const d = 3 * 10 ** e;
      // Above the wire, and beside it (inside and outside), and diagonally off it.
      for (const [rho, z] of [[a, d], [a - d, 0], [a + d, 0], [a - d, d], [a + d, -d]] as const) {
        if (rho === a && z === 0) continue; // d below an ulp of a: on the wire (refused, tested in the drive)
        const [bRho, bZ] = smytheField(a, rho, z, 2);
        const got = loop({ current: 2, radius: a, radialDistance: rho, axialDistance: z } as never) as number[];
        const input = { a, rho, z };
        if (bRho !== 0) {
          worst.radial = Math.max(worst.radial, relativeError(got[0]!, bRho) / Number.EPSILON);
          expectClose(got[0]!, { name: "B_rho", input, expected: bRho, tolerance: 8 * Number.EPSILON, source: SMYTHE });
        } else {
          expect(got[0]).toBe(0);
        }
        worst.axial = Math.max(worst.axial, relativeError(got[1]!, bZ) / Number.EPSILON);
        expectClose(got[1]!, { name: "B_z", input, expected: bZ, tolerance: 8 * Number.EPSILON, source: SMYTHE });
      }
    }
  });

  it("coaxialLoopsMutualInductance from 1e-321 m to 0.1 m apart, equal and nearly equal radii", () => {
    for (let e = -321; e <= -1; e += 20) {
      const d = 10 ** e;
      for (const [a, b] of [[1, 1], [0.25, 0.25 * (1 + 1e-9)], [1000, 1000 - 1e-6]] as const) {
        const expected = maxwellOracle(a, b, d);
        const got = mutual({ radius1: a, radius2: b, distance: d } as never) as number;
        worst.mutual = Math.max(worst.mutual, relativeError(got, expected) / Number.EPSILON);
        expectClose(got, { input: { a, b, d }, expected, tolerance: 4 * Number.EPSILON, source: MAXWELL });
      }
    }
  });

  it("reports the worst errors", () => {
    console.log(`near the filament, worst ulp: ${JSON.stringify(worst)}`);
    expect(worst.mutual).toBeLessThanOrEqual(4);
  });
});

describe("what the drive covered", () => {
  it("reaches values and errors alike, with the loop counts measured", () => {
    // Printed so a reader sees the measured worst (also quoted in the report of the change).
    console.log(
      `termination drive: ${tally.calls} calls, ${tally.values} finite values, errors ${JSON.stringify(Object.fromEntries(tally.errors))}, ` +
        `longest loop ${tally.longest}, most iterations in one call ${tally.mostTotal} (${tally.heaviest})`,
    );
    expect(tally.values).toBeGreaterThan(tally.calls / 10);
    expect(tally.longest).toBeLessThanOrEqual(LONGEST_LOOP);
  });
});
