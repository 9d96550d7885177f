import { expect } from "vitest";
import { FormulaError } from "../../src/core/errors.js";

/** The FormulaError `fn` throws, or undefined if it returns; anything else thrown fails the test. */
export function errorOf(fn: () => unknown): FormulaError | undefined {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(FormulaError);
    return e as FormulaError;
  }
  return undefined;
}

/** The code of the FormulaError `fn` throws, or undefined if it returns. */
export function codeOf(fn: () => unknown): string | undefined {
  return errorOf(fn)?.code;
}

/** The FormulaError `fn` throws; the test fails if it returns or throws anything else. */
export function expectFormulaError(fn: () => unknown): FormulaError {
  return errorOf(fn) ?? expect.fail("expected a FormulaError");
}

/** The FormulaError a promise rejects with; the test fails if it resolves or rejects with anything else. */
export async function expectRejection(p: Promise<unknown>): Promise<FormulaError> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(FormulaError);
    return e as FormulaError;
  }
  return expect.fail("expected a FormulaError");
}
