import { FormulaError } from "./errors.js";
import type { Domain, SeriesLength } from "./spec.js";

// Kept apart from the run-time conversion so that typed formulas do not
// import the unit parser (and with it mathjs).

/** True when v lies in the domain (the integer rule is checked only when `integer`). */
export function inDomain(v: number, d: Domain | undefined, checkInteger = true): boolean {
  if (!(v - v === 0)) return false;
  if (d === undefined) return true;
  if (d.min !== undefined && (d.minExclusive ? !(v > d.min) : !(v >= d.min))) return false;
  if (d.max !== undefined && (d.maxExclusive ? !(v < d.max) : !(v <= d.max))) return false;
  if (checkInteger && d.integer && !Number.isInteger(v)) return false;
  return true;
}


/**
 * The shape check of a series input, shared by `prepare` and the run-time
 * conversion (which runs it first, so that a million unit strings are refused
 * before any is parsed): an array within the length bounds, else a coded error
 * naming the input.
 */
export function checkSeriesShape(formula: string, input: string, length: SeriesLength, v: unknown): asserts v is readonly unknown[] {
  if (!Array.isArray(v)) {
    throw new FormulaError("wrong_type", {
      formula, input, value: v, expected: `an array of ${length.minLength} to ${length.maxLength} samples (numbers in SI units)`,
    });
  }
  if (v.length < length.minLength || v.length > length.maxLength) {
    throw new FormulaError("out_of_domain", {
      formula, input, value: v.length, rule: `a series of ${length.minLength} to ${length.maxLength} samples`, detail: "the number of samples given",
    });
  }
}

/** Where a bad sample sits in its series, as an error's detail. */
export function sampleDetail(index: number): string {
  return `sample ${index}, counting from 0`;
}

/** The same error, its detail saying which sample of a series it concerns (other errors pass through). */
export function atSample(e: unknown, index: number): unknown {
  if (!(e instanceof FormulaError)) return e;
  return new FormulaError(e.code, {
    formula: e.formula, input: e.input, value: e.value, expected: e.expected, received: e.received, rule: e.rule,
    detail: `${sampleDetail(index)}${e.detail ? `; ${e.detail}` : ""}`,
  });
}
