/**
 * The handler's own error codes, beside the library's FormulaError codes
 * (ERROR_CODES). Public API like those: adding one is a minor change,
 * renaming or removing one a breaking change.
 */
export const HTTP_ERROR_CODES = [
  "not_found", // 404: no such route
  "method_not_allowed", // 405
  "bad_json", // 400: the body is not JSON
  "bad_request", // 400: the body is not a JSON object, or not UTF-8
  "bad_escape", // 400: a malformed percent-escape in the path or query
  "body_too_large", // 413
  "over_limit", // 422: more work than a limit allows
  "internal", // 500: a bug, never user input
] as const;
export type HttpErrorCode = (typeof HTTP_ERROR_CODES)[number];
