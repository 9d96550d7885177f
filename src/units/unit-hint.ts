import { didYouMean } from "../core/suggest.js";
import { listUnitSymbols } from "./unit-table.js";

// Names that unit strings accept beyond the typed table's symbols, as the trade writes them.
const MORE_NAMES = [
  "gauss", "oersted", "maxwell", "dalton", "electronvolt", "ampereturn", "inch", "degC", "degF", "degree", "ohm",
  "kohm", "Mohm", "meter", "metre", "second", "ampere", "volt", "farad", "henry", "tesla", "weber", "newton", "joule",
  "watt", "coulomb", "siemens", "hertz", "pascal", "kelvin", "gram", "hour", "minute",
];

let candidates: string[] | undefined;

/**
 * The detail of an unparsable unit string when mathjs does not know a unit:
 * names the unit and suggests the closest known ones ('unknown unit "uh";
 * did you mean "uH"?'). Undefined for other parse failures.
 */
export function unknownUnitDetail(error: unknown): string | undefined {
  const m = /^Unit "(.*)" not found/.exec(error instanceof Error ? error.message : "");
  // A "unit" glued to a word that messages never show ("Infinity1") is no unit the user meant: the generic message.
  if (m === null || /Infinity|NaN|undefined/.test(m[1]!)) return undefined;
  candidates ??= [...new Set([...listUnitSymbols().filter((s) => s !== ""), ...MORE_NAMES])];
  const hint = didYouMean(m[1]!, candidates);
  return `unknown unit "${m[1]}"${hint ? `; ${hint}` : ""}`;
}
