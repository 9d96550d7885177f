import { FormulaError } from "../core/errors.js";
import type { HttpErrorCode } from "./codes.js";

/**
 * A refusal by the HTTP layer itself (not by the library): its status, code,
 * the field it is about and, for limits, the limit. The handler turns it into
 * `{ error: { code, message, input, limit? } }`; the job store throws it too.
 */
export class HttpError extends Error {
  constructor(readonly status: number, readonly code: HttpErrorCode, message: string, readonly input?: string, readonly limit?: number) {
    super(message);
  }

  /** 405, with the method the route takes (for the allow header). */
  static method(method: string, allow: string): HttpError {
    const e = new HttpError(405, "method_not_allowed", `${method || "an empty method"} is not allowed here; use ${allow}`);
    e.headers = { allow };
    return e;
  }

  /** Extra response headers (allow on 405, retry-after on 503). */
  headers: Record<string, string> | undefined;
}

/** 422 over_limit: `field` asks for more work than this server's `limit` allows. */
export function overLimit(field: string, limit: number, what: string): HttpError {
  return new HttpError(422, "over_limit", `${field} is over this server's limit of ${limit} ${what}`, field, limit);
}

export function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** The error body of a library error: its code, message and input, and the structured fields it has. */
export function formulaErrorBody(e: FormulaError): Record<string, unknown> {
  const error: Record<string, unknown> = { code: e.code, message: e.message, input: e.input ?? null };
  // The structured fields, where the error has them, so clients need not parse the message.
  for (const key of ["formula", "expected", "received", "rule"] as const) if (e[key] !== undefined) error[key] = e[key];
  return error;
}

/** The error body of a refusal: code, message, input, and the limit where one was passed. */
export function httpErrorBody(e: HttpError): Record<string, unknown> {
  const error: Record<string, unknown> = { code: e.code, message: e.message, input: e.input ?? null };
  if (e.limit !== undefined) error.limit = e.limit;
  return error;
}
