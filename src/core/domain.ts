import type { Domain } from "./spec.js";

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
