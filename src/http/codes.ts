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
  "unknown_job", // 404: no such job id in the path
  "job_gone", // 410: a job this server no longer keeps (expired, made room for newer ones, or deleted)
  "job_not_done", // 409: the result of a job still queued or running
  "job_cancelled", // 409: the result of a cancelled job
  "result_too_large", // 422: a job's result is over the server's size limit
  "too_many_jobs", // 503: the server holds as many unfinished jobs as it allows
  "shutting_down", // 503: the job store is closed
  "internal", // 500: a bug, never user input
] as const;
export type HttpErrorCode = (typeof HTTP_ERROR_CODES)[number];
