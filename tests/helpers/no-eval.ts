import { vi } from "vitest";

/**
 * Runs `fn` as a page with a strict Content-Security-Policy would: building
 * code from strings (`new Function`) throws, so the library must take its
 * general paths.
 */
export function withoutCodeGeneration<T>(fn: () => T): T {
  vi.stubGlobal("Function", function forbidden() {
    throw new EvalError("code generation from strings disallowed");
  });
  try {
    return fn();
  } finally {
    vi.unstubAllGlobals();
  }
}
