/**
 * Registry-wide invariants, checked with fast-check for every formula from its
 * definition alone: unit prefixes do not change answers, the typed call and
 * `evaluate` agree, notes are deterministic, and the results are dimensionally
 * homogeneous (electromagnetic similitude and geometric similarity), which
 * catches unit slips inside `compute`.
 */
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { EPSILON0, MU0 } from "../../src/constants/si.js";
import { FormulaError } from "../../src/core/errors.js";
import { defineFormula } from "../../src/core/formula.js";
import { outputDimension, POSITIVE } from "../../src/core/spec.js";
import { evaluate } from "../../src/core/evaluate.js";
import type { AnyFormula } from "../../src/core/formula.js";
import { DIMENSIONS, type DimensionName, sameExponents } from "../../src/units/dimensions.js";
import { parseQuantity } from "../../src/units/parse.js";
import { listUnitSymbols, lookupUnit } from "../../src/units/unit-table.js";
import { unitDimension } from "../../src/units/unit-symbols.js";
import {
  components, domainsHold, evLocal, exps, failingRelations, type Inputs, isChoice, relDiff, specsOf, withExamples,
} from "./harness.js";


const RUNS = 25;
const list = withExamples();
const registered = new Set(list.map((e) => e.f));

/**
 * Formulas whose compute carries a dimensional constant besides eps0, mu0 and c
 * (an empirical coefficient, a particle mass), so electromagnetic similitude does
 * not apply; id -> why. They must still be geometrically similar.
 */
const NOT_SIMILITUDE_INVARIANT: Readonly<Record<string, string>> = {
  exposureReferenceLevel: "ICNIRP's tables set levels in T and V/m at given frequencies in Hz",
  coreLoss: "the Steinmetz coefficients are empirical, with units fitted to W/m^3 at given f and B",
  coreLossForWaveform: "the Steinmetz coefficients are empirical, with units fitted to W/m^3 at given f and B",
  debyeLength: "the electron's charge e and Boltzmann's constant are fixed (electron temperature in kelvin, electron density)",
  traceResistance: "copper's resistivity (IEC 60028) is a material constant in ohm m",
  wireGaugeDiameter: "a gauge names a fixed diameter (ASTM B258 defines 36 AWG as 0.005 in)",
  wireResistance: "the material's standard resistivity and temperature coefficient are fixed dimensional constants",
  temperatureRise: "McLyman's fit is empirical, with units fitted to K for W/cm^2",
  traceCurrentForTemperatureRise: "the IPC-2221 fit is empirical, with units fitted to A for K and square mils",
};
let tried = 0;
const similitudeOnlyGeometric: string[] = [];
const geometricPowers: string[] = [];

/** Unit symbols of the typed table by dimension, with their SI factors. */
const SYMBOLS = new Map<string, [string, number][]>();
for (const s of listUnitSymbols()) {
  const [factor] = lookupUnit(s)!;
  const dim = unitDimension(s)!;
  if (s === "") continue;
  SYMBOLS.set(dim, [...(SYMBOLS.get(dim) ?? []), [s, factor]]);
}

/** Inputs near the example: each quantity input times a factor in [0.5, 2], choices at random. */
function nearExample(f: AnyFormula, ex: Inputs): fc.Arbitrary<Inputs> {
  const parts: Record<string, fc.Arbitrary<unknown>> = {};
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec)) {
      parts[name] = fc.constantFrom(...spec.choices);
      continue;
    }
    if (spec.domain?.integer) {
      parts[name] = fc.constant(ex[name]);
      continue;
    }
    const k = fc.double({ min: 0.5, max: 2, noNaN: true });
    const v = ex[name];
    // A vector's components vary apart; a series (a waveform) is scaled as a whole, keeping its shape.
    parts[name] = !Array.isArray(v)
      ? k.map((m) => (v as number) * m)
      : spec.series
        ? k.map((m) => v.map((c: number) => c * m))
        : fc.tuple(k, k, k).map((ks) => v.map((c: number, i) => c * ks[i]!));
  }
  return fc.record(parts).filter((x) => domainsHold(f, x) && failingRelations(f, x).length === 0);
}

function closeAll(a: readonly number[], b: readonly number[], tol: number): boolean {
  const scale = Math.max(...a.map(Math.abs), ...b.map(Math.abs));
  return a.length === b.length && a.every((c, i) => relDiff(c, b[i]!, 1e-9 * scale) <= tol);
}

/** Value or undefined when the inputs are rejected (legal rejections only). */
function value(f: AnyFormula, x: Inputs): readonly number[] | undefined {
  tried++;
  try {
    return components(registered.has(f) ? evaluate(f.id, x).value : (evLocal(f, x) as number | readonly number[]));
  } catch (e) {
    if (e instanceof FormulaError && (e.code === "out_of_range" || e.code === "out_of_domain")) return undefined;
    throw e;
  }
}

/**
 * Electromagnetic similitude: with eps0 and mu0 fixed, scaling length and time
 * by s^a, current by s^d and mass by s^(a + 2d) leaves every law built on them
 * unchanged, so each quantity of exponents [L, M, T, I] scales by
 * s^(a L + (a + 2d) M + a T + d I).
 */
function similitudeFactor(dim: DimensionName, s: number, a: number, d: number): number {
  const [L, M, T, I] = exps(dim);
  return Math.pow(s, a * L + (a + 2 * d) * M + a * T + d * I);
}

function similitudeScaled(f: AnyFormula, x: Inputs, s: number, a: number, d: number): Inputs {
  const out: Inputs = { ...x };
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec)) continue;
    const m = similitudeFactor(spec.dimension, s, a, d);
    const v = x[name];
    out[name] = Array.isArray(v) ? v.map((c: number) => c * m) : (v as number) * m;
  }
  return out;
}

function similitudeHolds(f: AnyFormula, x: Inputs, s: number, a: number, d: number): boolean | undefined {
  const v0 = value(f, x);
  const v1 = value(f, similitudeScaled(f, x, s, a, d));
  if (!v0 || !v1) return undefined;
  const m = similitudeFactor(outputDimension(f.definition.output, x), s, a, d);
  return closeAll(v1, v0.map((c) => c * m), scalingTolerance(f, x, v0));
}

const GEO: Partial<Record<DimensionName, number>> = { Length: 1, Area: 2, Volume: 3 };

function geometricScaled(f: AnyFormula, x: Inputs, s: number): Inputs {
  const out: Inputs = { ...x };
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec)) continue;
    const p = GEO[spec.dimension];
    if (p === undefined) continue;
    const v = x[name];
    out[name] = Array.isArray(v) ? v.map((c: number) => c * s ** p) : (v as number) * s ** p;
  }
  return out;
}

/** The exponent k of geometric similarity, if the output scales as s^k with a simple rational k. */
function geometricPower(f: AnyFormula, x: Inputs): number | undefined | "rejected" {
  const v0 = value(f, x);
  const v2 = value(f, geometricScaled(f, x, 2));
  const v3 = value(f, geometricScaled(f, x, 3));
  if (!v0 || !v2 || !v3) return "rejected";
  const i = v0.findIndex((c) => c !== 0);
  if (i < 0) return 0;
  const k = Math.log(v2[i]! / v0[i]!) / Math.log(2);
  if (!Number.isFinite(k)) return undefined;
  // A simple fraction of 1/6, or the exponent an empirical fit declares (definition.geometricExponent).
  const q = (f.definition.geometricExponent as number | undefined) ?? Math.round(k * 6) / 6;
  if (Math.abs(k - q) > Math.max(1e-6, scalingTolerance(f, x, v0))) return undefined;
  const tol = scalingTolerance(f, x, v0);
  if (!closeAll(v3, v0.map((c) => c * 3 ** q), tol)) return undefined;
  for (const s of [5, 0.3]) {
    const v = value(f, geometricScaled(f, x, s));
    if (v && !closeAll(v, v0.map((c) => c * s ** q), tol)) return undefined;
  }
  return q;
}

/**
 * Scaled inputs are rounded by an ulp or so; an ill-conditioned result (a
 * square root of a near-zero difference, a sine near pi) amplifies that by its
 * condition number, which the tolerance allows for.
 */
function scalingTolerance(f: AnyFormula, x: Inputs, base: readonly number[]): number {
  return Math.max(1e-9, 4e-15 * conditionNumber(f, x, base));
}

/**
 * Sum over inputs of |d ln f / d ln x| (largest over components), by finite
 * differences at three step sizes (the largest estimate wins, so a derivative
 * that blows up near a singular point is not missed).
 */
function conditionNumber(f: AnyFormula, x: Inputs, base: readonly number[]): number {
  const scale = Math.max(...base.map(Math.abs));
  let total = 0;
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec) || spec.domain?.integer) continue;
    const v = x[name];
    const bump = (k: number): Inputs => ({ ...x, [name]: Array.isArray(v) ? v.map((c: number) => c * k) : (v as number) * k });
    let worst = 0;
    for (const h of [1e-6, 1e-9, 1e-12]) {
      const r = value(f, bump(1 + h)) ?? value(f, bump(1 - h));
      if (!r) return Infinity;
      worst = Math.max(worst, ...base.map((c, i) => Math.abs(r[i]! - c) / (h * Math.max(Math.abs(c), 1e-9 * scale))));
    }
    total += worst;
  }
  return total;
}

/** The same inputs with each quantity written in a prefixed or other unit of its dimension. */
function inOtherUnits(f: AnyFormula, x: Inputs, pick: number[]): Inputs {
  const out: Inputs = {};
  let i = 0;
  for (const [name, spec] of specsOf(f)) {
    const v = x[name];
    if (isChoice(spec) || !SYMBOLS.has(spec.dimension)) {
      out[name] = v;
      continue;
    }
    const syms = SYMBOLS.get(spec.dimension)!;
    const write = (c: number): string => {
      const [sym, factor] = syms[pick[i++ % pick.length]! % syms.length]!;
      return `${c / factor} ${sym}`;
    };
    out[name] = Array.isArray(v) ? v.map(write) : write(v as number);
  }
  return out;
}

/** Fixtures with deliberate slips (test-only, never registered). */
function depth(id: string, compute: (x: { frequency: number; conductivity: number }) => number): AnyFormula {
  return defineFormula({
    id,
    title: "Fixture",
    category: "fixture",
    description: "Test fixture with or without a deliberate unit slip.",
    equation: "-",
    inputs: [
      { name: "frequency", dimension: "Frequency", description: "frequency", domain: POSITIVE, example: 1e6 },
      { name: "conductivity", dimension: "Conductivity", description: "conductivity", domain: POSITIVE, example: 5.8e7 },
    ],
    output: { dimension: "Length", description: "depth" },
    source: { authors: "test fixture", title: "not a published formula" },
    compute,
  });
}
const FX = { frequency: 1e6, conductivity: 5.8e7 };
const rightForm = depth("fixtureRight", (x) => 1 / Math.sqrt(Math.PI * x.frequency * MU0 * x.conductivity));
// The square root forgotten: no length input, so size scaling cannot see it.
const slipExponent = depth("fixtureSlipExponent", (x) => 1 / (Math.PI * x.frequency * MU0 * x.conductivity));
// A hidden 1 mm added: not a power law in anything.
const slipSum = depth("fixtureSlipSum", (x) => 1 / Math.sqrt(Math.PI * x.frequency * MU0 * x.conductivity) + 1e-3);
// Frequency and conductivity swapped into a product that happens to keep the dimension: invisible, as it should be.
const sameDimension = depth("fixtureSameDimension", (x) => 1 / Math.sqrt(Math.PI * x.frequency * MU0 * x.conductivity * EPSILON0 / EPSILON0));

describe("registry-wide invariants", () => {
  it("there are formulas with examples", () => expect(list.length).toBeGreaterThan(0));

  for (const { f, ex } of list) {
    describe(f.id, () => {
      it("gives the same value from SI numbers and from prefixed unit strings (within 1e-12)", () => {
        fc.assert(
          fc.property(nearExample(f, ex), fc.array(fc.nat(), { minLength: 1, maxLength: 12 }), (x, pick) => {
            const a = value(f, x);
            const b = value(f, inOtherUnits(f, x, pick));
            expect(b === undefined).toBe(a === undefined);
            if (!a || !b) return;
            // Unit conversion rounds each input by an ulp or two; an ill-conditioned result
            // (sin near pi) amplifies that by its condition number, which is allowed for.
            const tol = Math.max(1e-12, 1e-15 * conditionNumber(f, x, a));
            expect(closeAll(a, b, tol), `${JSON.stringify(inOtherUnits(f, x, pick))}: ${a} vs ${b}, tolerance ${tol}`).toBe(true);
          }),
          { numRuns: RUNS },
        );
      });

      it("gives the same value from the typed call and from evaluate", () => {
        fc.assert(
          fc.property(nearExample(f, ex), (x) => {
            tried++;
            let typed: unknown;
            try {
              typed = (f as (x: unknown) => unknown)(x);
            } catch (e) {
              expect(e).toBeInstanceOf(FormulaError);
              expect(() => evaluate(f.id, x)).toThrow(FormulaError);
              return;
            }
            expect(evaluate(f.id, x).value).toEqual(typed);
            expect(f.details(x).value).toEqual(typed);
          }),
          { numRuns: RUNS },
        );
      });

      it("gives the same warnings and cautions on every call, through details and evaluate", () => {
        fc.assert(
          fc.property(nearExample(f, ex), (x) => {
            tried++;
            let d1;
            try {
              d1 = f.details(x);
            } catch (e) {
              expect(e).toBeInstanceOf(FormulaError);
              return;
            }
            const d2 = f.details(x);
            const r = evaluate(f.id, x);
            expect(d2).toEqual(d1);
            expect(r.warnings).toEqual(d1.warnings);
            expect(r.cautions).toEqual(d1.cautions);
            for (const n of [...d1.warnings, ...d1.cautions]) {
              expect(typeof n.code).toBe("string");
              expect(n.message.length).toBeGreaterThan(0);
              expect(n.message).not.toMatch(/NaN|undefined|\[object Object\]/);
            }
          }),
          { numRuns: RUNS },
        );
      });

      it("neither mutates nor depends on the order of its inputs", () => {
        fc.assert(
          fc.property(nearExample(f, ex), (x) => {
            tried++;
            const frozen = Object.freeze(Object.fromEntries(Object.entries(x).map(([k, v]) => [k, Array.isArray(v) ? Object.freeze([...v]) : v])));
            const copy = JSON.stringify(frozen);
            const a = value(f, frozen as Inputs);
            try {
              (f as (x: unknown) => unknown)(frozen);
            } catch (e) {
              expect(e).toBeInstanceOf(FormulaError);
            }
            expect(JSON.stringify(frozen)).toBe(copy);
            const reversed = Object.fromEntries(Object.entries(x).reverse());
            expect(value(f, reversed)).toEqual(a);
            // A bare number string is read as SI, exactly like the number.
            const asStrings = Object.fromEntries(Object.entries(x).map(([k, v]) => [k, typeof v === "number" ? String(v) : v]));
            expect(value(f, asStrings)).toEqual(a);
          }),
          { numRuns: 10 },
        );
      });

      it("reports its result in the coherent SI unit of its output dimension", () => {
        tried++;
        const r = evaluate(f.id, ex);
        const dim = outputDimension(f.definition.output, ex);
        expect(r.unit).toBe(DIMENSIONS[dim].unit);
        if (r.unit !== "") expect(sameExponents(parseQuantity(`1 ${r.unit}`).exps, exps(dim))).toBe(true);
        const comps = f.definition.output.components;
        if (comps) expect((r.value as readonly number[]).length).toBe(comps.length);
        else expect(typeof r.value).toBe("number");
      });

      it("is dimensionally homogeneous: electromagnetic similitude in length and time, and in current", () => {
        const exempt = NOT_SIMILITUDE_INVARIANT[f.id];
        let checked = 0;
        fc.assert(
          fc.property(nearExample(f, ex), fc.double({ min: 0.05, max: 20, noNaN: true }), (x, s) => {
            const t = similitudeHolds(f, x, s, 1, 0);
            const c = similitudeHolds(f, x, s, 0, 1);
            if (t === undefined || c === undefined) return;
            checked++;
            if (exempt) {
              expect(typeof geometricPower(f, x), `${f.id} (exempt from similitude: ${exempt}) is not geometrically similar either`).toBe("number");
              return;
            }
            expect(t, `${f.id}: scaling length and time by ${s} (mass by ${s}) does not scale the result by the output's dimension`).toBe(true);
            expect(c, `${f.id}: scaling current by ${s} (mass by ${s}^2) does not scale the result by the output's dimension`).toBe(true);
          }),
          { numRuns: RUNS },
        );
        if (exempt) similitudeOnlyGeometric.push(f.id);
        expect(checked, `${f.id}: no scaled case was accepted`).toBeGreaterThan(0);
      });

      it("scales as a single simple power of size under geometric similarity, or depends on a time scale", () => {
        fc.assert(
          fc.property(nearExample(f, ex), (x) => {
            const k = geometricPower(f, x);
            if (k === "rejected") return;
            if (typeof k === "number") return;
            // Not a power of size: legitimate only when another length scale is set by the
            // inputs (skin depth from frequency, a speed of light, a gyration radius),
            // which similitude in length and time then accounts for.
            expect(similitudeHolds(f, x, 1.7, 1, 0), `${f.id}: not a power of size and not similitude-invariant`).not.toBe(false);
          }),
          { numRuns: 10 },
        );
        const k = geometricPower(f, ex);
        geometricPowers.push(`${f.id}: ${typeof k === "number" ? `s^${Number.isInteger(k) ? k : k.toFixed(3)}` : k ?? "not a power"}`);
      });
    });
  }

  it("the homogeneity checks flag deliberate unit slips in fixture formulas", () => {
    expect(similitudeHolds(rightForm, FX, 3, 1, 0)).toBe(true);
    expect(similitudeHolds(rightForm, FX, 3, 0, 1)).toBe(true);
    expect(similitudeHolds(sameDimension, FX, 3, 1, 0)).toBe(true);
    // Size scaling alone misses the forgotten square root; similitude in time catches it.
    expect(geometricPower(slipExponent, FX)).toBe(0);
    expect(similitudeHolds(slipExponent, FX, 3, 1, 0)).toBe(false);
    expect(similitudeHolds(slipSum, FX, 3, 1, 0)).toBe(false);
  });

  it("every unit symbol of the typed table parses through mathjs to the same dimension and factor", () => {
    for (const s of listUnitSymbols()) {
      if (s === "") continue;
      tried++;
      const [factor] = lookupUnit(s)!;
      const dim = unitDimension(s)!;
      const q = parseQuantity(`1 ${s}`);
      expect(sameExponents(q.exps, exps(dim as DimensionName)), s).toBe(true);
      expect(relDiff(q.si, factor), s).toBeLessThan(1e-15);
    }
  });

  afterAll(() => {
    console.log(`properties: ${tried} evaluations over ${list.length} formulas`);
    if (similitudeOnlyGeometric.length) console.log(`properties: not similitude-invariant (a constant beyond eps0, mu0), geometric similarity checked instead: ${similitudeOnlyGeometric.join(", ")}`);
    console.log(`properties: geometric power at the example: ${geometricPowers.join("; ")}`);
  });
});
