import { FormulaError } from "./errors.js";
import type { Domain, SeriesLength } from "./spec.js";

// Series inputs (a waveform as samples) in their own module: a formula declares
// one with `seriesOf`, which brings the checking along, so the typed path of a
// formula without a series (bundle (a) of scripts/check-package.mjs) carries
// none of it.

/** How defineFormula checks a series: its shape, then each sample as a number. */
export type SeriesCheck = (
  formula: string, input: string, length: SeriesLength, domain: Domain | undefined, v: unknown,
  checkNumber: (input: string, domain: Domain | undefined, v: unknown) => void,
) => void;

/** The length bounds of a series input, with its checker. */
export function seriesOf(minLength: number, maxLength: number): SeriesLength {
  return { minLength, maxLength, check: checkSeries };
}

// A bad sample's error names the input and, in its detail, the sample's index (a waveform can be long).
function checkSeries(...[formula, input, length, domain, v, checkNumber]: Parameters<SeriesCheck>): void {
  checkSeriesShape(formula, input, length, v);
  for (let i = 0; i < v.length; i++) {
    try {
      checkNumber(input, domain, v[i]);
    } catch (e) {
      throw atSample(e, i);
    }
  }
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
