import type { Unit } from "mathjs";
import { FormulaError } from "../core/errors.js";
import type { Exponents } from "./dimensions.js";
import { loadSubsetMath } from "./load-subset.js";
import type { UnitMath } from "./mathjs-subset.js";
import { exactSI, type UnitTerms } from "./parse-exact.js";
import { unknownUnitDetail } from "./unit-hint.js";
import { readUnitString } from "./unit-reader.js";

/**
 * Run-time unit strings ("0.2 mm", "4.7 uF") are read by mathjs, on a private
 * instance created on first use, so importing typed formulas never loads mathjs.
 */
let instance: UnitMath | undefined;

/** The library's private mathjs instance, with the trade's units put right. */
export function unitMath(): UnitMath {
  instance ??= createUnitMath();
  return instance;
}

/**
 * A fresh instance of the unit-parsing subset of mathjs (Unit, unit, createUnit;
 * see mathjs-subset.ts) with emquant's unit corrections applied.
 */
export function createUnitMath(): UnitMath {
  const math = loadSubsetMath();
  addTradeUnits(math);
  return math;
}

/**
 * Units this trade uses that mathjs 15 lacks or defines with an outdated value.
 * Registered through mathjs's own API on the given instance, never the global one.
 */
export function addTradeUnits(math: Pick<UnitMath, "createUnit">): void {
  math.createUnit(
    {
      // mathjs 15 uses 1.602176565e-19 J (CODATA 2010); the SI fixes e exactly since 2019.
      eV: { definition: "1.602176634e-19 J", prefixes: "short", aliases: ["electronvolt", "electronvolts"] },
      // Long names take long prefixes (milligauss), symbols take short ones (mG).
      gauss: { definition: "1e-4 T", prefixes: "long", aliases: ["gausses"] },
      G: { definition: "1 gauss", prefixes: "short" },
      maxwell: { definition: "1e-8 Wb", prefixes: "long", aliases: ["maxwells"] },
      Mx: { definition: "1 maxwell", prefixes: "short" },
      // 1 Oe = 1000/(4 pi) A/m by definition of the CGS-Gaussian unit.
      oersted: { definition: `${1000 / (4 * Math.PI)} A/m`, prefixes: "long", aliases: ["oersteds"] },
      Oe: { definition: "1 oersted", prefixes: "short" },
      // Unified atomic mass unit (dalton), CODATA 2022 m_u.
      dalton: { definition: "1.66053906892e-27 kg", prefixes: "long", aliases: ["daltons"] },
      Da: { definition: "1 dalton", prefixes: "short" },
      u: { definition: "1 dalton" },
      ampereturn: { definition: "1 A", prefixes: "long", aliases: ["ampereturns"] },
      At: { definition: "1 A", prefixes: "short" },
    },
    { override: true },
  );
}

/** A parsed run-time quantity: SI value and dimension exponents [L,M,T,I,Θ,N,J,angle]. */
export interface ParsedQuantity {
  readonly si: number;
  readonly exps: Exponents;
  /** True for a bare number ("1e-3"), which callers read as SI. */
  readonly plain: boolean;
}

const MAX_TEXT = 200;
// Two generations of at most CACHE_GENERATION strings each: a hit in the older one moves
// the string to the newer; when the newer is full it becomes the older and the oldest go.
// Bounded under hostile input, and strings in use survive a stream of fresh ones.
const CACHE_GENERATION = 2048;
let recent = new Map<string, ParsedQuantity>();
let older = new Map<string, ParsedQuantity>();
const PLAIN_NUMBER = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/;
const ZERO: Exponents = Object.freeze([0, 0, 0, 0, 0, 0, 0, 0]) as Exponents;
// The typed table writes reciprocal units "1/m^3", "1/H"; mathjs reads "5 /m^3" but not "5 1/m^3".
const RECIPROCAL = /^(\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s+)1\s*\//;

/**
 * Parse "value unit" text into SI. Results are cached per exact string; cached
 * records are frozen primitives, so no caller can change another's answer.
 * Throws FormulaError "unparsable" (naming `input`) for anything else.
 */
export function parseQuantity(text: string, input?: string, formula?: string): ParsedQuantity {
  const hit = recent.get(text);
  if (hit !== undefined) return hit;
  const parsed = older.get(text) ?? parseUncached(text, input, formula);
  if (recent.size >= CACHE_GENERATION) {
    older = recent;
    recent = new Map();
  }
  recent.set(text, parsed);
  return parsed;
}

function parseUncached(text: string, input?: string, formula?: string): ParsedQuantity {
  if (text.length > MAX_TEXT) {
    throw new FormulaError("unparsable", { input, formula, value: text, detail: `longer than ${MAX_TEXT} characters` });
  }
  const plainText = typography(text);
  if (PLAIN_NUMBER.test(plainText)) return Object.freeze({ si: Number(plainText), exps: ZERO, plain: true });
  // The common strings ("0.2 mm", "kg*m/s^2") without mathjs; the rest, and every error, through mathjs.
  return readUnitString(plainText) ?? parseWithMathjs(text, plainText, input, formula);
}

/**
 * Read a unit string (already through `typography`) with mathjs. Exported for
 * the tests that compare it with the fast reader; callers use parseQuantity.
 */
export function parseWithMathjs(text: string, plainText: string, input?: string, formula?: string): ParsedQuantity {
  const fail = (detail?: string): FormulaError =>
    new FormulaError("unparsable", { input, formula, value: text, detail });
  let unit;
  const unitText = plainText.replace(RECIPROCAL, "$1/");
  try {
    // Unit.parse, not math.unit(): unit() first searches every unit name for the
    // whole text (is it a bare unit?), most of the cost of a fresh string. A bare
    // unit ("mm") parses here too, with no value, and is refused below.
    unit = (unitMath().Unit.parse as (text: string, options: { allowNoUnits: boolean }) => Unit)(unitText, { allowNoUnits: true });
  } catch (e) {
    throw fail(unknownUnitDetail(e) ?? 'expected a number followed by a unit, e.g. "0.2 mm"');
  }
  if (typeof (unit.value as unknown) !== "number") throw fail("a unit needs a numeric value in front of it");
  // toSI applies offsets (degC) and scale; the value of a unit is not always SI.
  const value = unit.toSI().value as unknown;
  if (typeof value !== "number") throw fail("a unit needs a real numeric value");
  const d = unit.dimensions;
  // mathjs order: MASS, LENGTH, TIME, CURRENT, TEMPERATURE, LUMINOUS_INTENSITY, AMOUNT, ANGLE, BIT
  if (!d.every(Number.isFinite)) throw fail("unit exponents must be finite numbers");
  if (d[8] !== 0) throw fail("bits and bytes are not physical quantities here");
  const exps = Object.freeze([d[1], d[0], d[2], d[3], d[4], d[6], d[5], d[7]]) as unknown as Exponents;
  return Object.freeze({ si: exactSI(unitText, unit as unknown as UnitTerms, value), exps, plain: false });
}

const SUPERSCRIPTS = "\u2070\u00b9\u00b2\u00b3\u2074\u2075\u2076\u2077\u2078\u2079";
const SUPERSCRIPT_POWER = /\u207b?[\u2070\u00b9\u00b2\u00b3\u2074-\u2079]+/g;

/**
 * The typography engineers paste from data sheets and papers, written the way
 * mathjs reads it: the micro sign and Greek mu before a unit letter ("4.7 µF")
 * as "u", the ohm sign and Greek capital omega as "ohm", superscript powers
 * ("cm²", "m⁻¹") as "^2", "^-1", the minus sign U+2212 as "-", and any run of
 * Unicode white space (no-break, thin) as one space. Symbols as the SI Brochure
 * (BIPM, 9th edition, 2019) prints them: µ for micro, Ω for the ohm (from memory).
 * Plain ASCII text passes unchanged.
 */
function typography(text: string): string {
  // eslint-disable-next-line no-control-regex
  if (/^[\x00-\x7f]*$/.test(text)) return text;
  return text
    .replace(/\s+/g, " ")
    .replace(/\u2212/g, "-")
    .replace(/[\u00b5\u03bc](?=[A-Za-z\u03a9\u2126])/g, "u")
    .replace(/[\u03a9\u2126]/g, "ohm")
    .replace(SUPERSCRIPT_POWER, (p) => `^${p.startsWith("\u207b") ? "-" : ""}${[...p.replace("\u207b", "")].map((c) => SUPERSCRIPTS.indexOf(c)).join("")}`);
}

/** Number of cached unit strings (for tests and diagnostics). */
export function unitCacheSize(): number {
  return recent.size + older.size;
}
