/**
 * Overflow and underflow: every registry formula, with the example inputs of
 * one dimension (all lengths together, all currents together...) scaled by
 * very large or very small legal factors, returns a finite value that follows
 * the power law measured near the example, or fails with a FormulaError
 * (out_of_range; out_of_domain when a relation no longer holds): never NaN,
 * never Infinity, never a silent zero where the true value is representable.
 */
import { afterAll, describe, expect, it } from "vitest";
import type { AnyFormula } from "../../src/core/formula.js";
import type { DimensionName } from "../../src/units/dimensions.js";
import {
  components, ev, type Inputs, isChoice, outcome, type Outcome, relDiff, specsOf, withExamples,
} from "./harness.js";

/** Formulas with a known defect found here, id -> the bug (their test is `it.fails`). */
const KNOWN_BUGS: Readonly<Record<string, string>> = {};

const EXTREME = [1e-150, 1e150];
const MODERATE = [1e-30, 1e30];
/** Representable band: beyond it the expected value itself under- or overflows. */
const TINY = 1e-290;
const HUGE = 1e290;

let tried = 0;
const rejectedModerate: string[] = [];
const rangeAtModerate: string[] = [];
const rangeAtExtreme: string[] = [];
const notPowerLaw: string[] = [];

interface Family {
  label: string;
  /** Power of the factor applied to each input, by name (absent: unchanged). */
  powers: Record<string, number>;
}

/** Families of inputs that can be scaled together without leaving their domain. */
function families(f: AnyFormula): Family[] {
  const byDim = new Map<DimensionName, string[]>();
  for (const [name, spec] of specsOf(f)) {
    if (isChoice(spec)) continue;
    const d = spec.domain;
    const scaleFree = !d || ((d.min === undefined || d.min === 0) && d.max === undefined && !d.integer);
    if (!scaleFree || spec.dimension === "Dimensionless" || spec.dimension === "Angle") continue;
    byDim.set(spec.dimension, [...(byDim.get(spec.dimension) ?? []), name]);
  }
  const out: Family[] = [];
  for (const [dim, names] of byDim) out.push({ label: dim, powers: Object.fromEntries(names.map((n) => [n, 1])) });
  const geo: Record<string, number> = {};
  for (const [dim, p] of [["Length", 1], ["Area", 2], ["Volume", 3]] as const) for (const n of byDim.get(dim) ?? []) geo[n] = p;
  if (Object.keys(geo).length > 1 && Object.values(geo).some((p) => p > 1)) out.push({ label: "geometry (L, L^2, L^3)", powers: geo });
  return out;
}

function scaled(ex: Inputs, fam: Family, k: number): Inputs {
  const out: Inputs = { ...ex };
  for (const [n, p] of Object.entries(fam.powers)) {
    const m = Math.pow(k, p);
    const v = ex[n];
    out[n] = Array.isArray(v) ? v.map((c: number) => c * m) : (v as number) * m;
  }
  return out;
}

function at(f: AnyFormula, ex: Inputs, fam: Family, k: number): Outcome {
  tried++;
  return outcome(() => ev(f, scaled(ex, fam, k)));
}

/** The power p with f(k x) = k^p f(x), if the family scales as a power law with a simple exponent. */
function powerLaw(f: AnyFormula, ex: Inputs, fam: Family, base: readonly number[]): number | undefined {
  const probe = (k: number): readonly number[] | undefined => {
    const o = at(f, ex, fam, k);
    return o.ok ? components(o.value) : undefined;
  };
  const i = base.findIndex((c) => c !== 0);
  if (i < 0) return undefined;
  const v2 = probe(2);
  if (!v2 || v2[i] === 0 || Math.sign(v2[i]!) !== Math.sign(base[i]!)) return undefined;
  const raw = Math.log2(v2[i]! / base[i]!);
  const p = Math.round(raw * 6) / 6;
  if (Math.abs(raw - p) > 1e-6) return undefined;
  for (const k of [8, 1 / 4, 1 / 16]) {
    const v = probe(k);
    if (!v) return undefined;
    const m = Math.pow(k, p);
    const scale = Math.max(...base.map(Math.abs)) * m;
    if (base.some((c, j) => relDiff(v[j]!, c * m, 1e-12 * scale) > 1e-9)) return undefined;
  }
  return p;
}

function checkFormula(f: AnyFormula, ex: Inputs): void {
  const base = outcome(() => ev(f, ex));
  expect(base.ok, `${f.id}: the example inputs evaluate`).toBe(true);
  if (!base.ok) return;
  const b = components(base.value);
  const problems: string[] = [];
  for (const fam of families(f)) {
    const p = powerLaw(f, ex, fam, b);
    if (p === undefined) notPowerLaw.push(`${f.id}/${fam.label}`);
    for (const k of [...MODERATE, ...EXTREME]) {
      // A volume scaled by (1e150)^3 is beyond the doubles: no legal input to try.
      if (!Object.values(scaled(ex, fam, k)).flat().every((v) => typeof v !== "number" || Number.isFinite(v))) continue;
      const o = at(f, ex, fam, k);
      const where = `${f.id}: ${fam.label} x ${k}`;
      const moderate = MODERATE.includes(k);
      if (!o.ok) {
        if (o.code !== "out_of_range" && o.code !== "out_of_domain") problems.push(`${where}: unexpected ${o.code}: ${o.message}`);
        if (moderate && o.code === "out_of_domain") rejectedModerate.push(`${where} (${o.message})`);
        if (o.code === "out_of_range" && p !== undefined) {
          const m = Math.pow(k, p);
          const representable = b.every((c) => c === 0 || (Math.abs(c * m) > TINY && Math.abs(c * m) < HUGE));
          if (representable) (moderate ? rangeAtModerate : rangeAtExtreme).push(`${where} (k^${p.toFixed(3)})`);
        }
        continue;
      }
      const v = components(o.value);
      if (v.some((c) => !Number.isFinite(c))) problems.push(`${where}: non-finite ${v.join(", ")}`);
      if (p === undefined) continue;
      const m = Math.pow(k, p);
      const scale = Math.max(...b.map(Math.abs)) * m;
      if (!(scale > TINY && scale < HUGE)) continue; // the exact answer itself is at the edge of doubles
      b.forEach((c, j) => {
        const want = c * m;
        if (relDiff(v[j]!, want, 1e-12 * scale) > 1e-9) problems.push(`${where}: got ${v[j]} expected ${want} (power ${p})`);
      });
    }
  }
  expect(problems, problems.join("\n")).toEqual([]);
}

describe("extreme but legal inputs never give NaN, Infinity or a wrong finite value", () => {
  const list = withExamples();
  it("there are formulas to scale", () => expect(list.length).toBeGreaterThan(0));
  for (const { f, ex } of list) {
    const bug = KNOWN_BUGS[f.id];
    if (bug) it.fails(`${f.id} stays finite and follows its scaling law (known bug: ${bug})`, () => checkFormula(f, ex));
    else it(`${f.id} stays finite and follows its scaling law at factors 1e±30 and 1e±150`, () => checkFormula(f, ex));
  }
  afterAll(() => {
    console.log(`extremes: ${tried} evaluations tried over ${list.length} formulas`);
    if (rangeAtModerate.length) console.log(`extremes: out_of_range at 1e±30 although the answer is representable:\n  ${rangeAtModerate.join("\n  ")}`);
    if (rangeAtExtreme.length) console.log(`extremes: out_of_range at 1e±150 although the answer is representable:\n  ${rangeAtExtreme.join("\n  ")}`);
    if (rejectedModerate.length) console.log(`extremes: rejected as out_of_domain at 1e±30:\n  ${rejectedModerate.join("\n  ")}`);
    if (notPowerLaw.length) console.log(`extremes: not a power law in the family (only finiteness checked): ${notPowerLaw.join(", ")}`);
  });
});
