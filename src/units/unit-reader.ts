import { DIMENSIONS, type DimensionName, type Exponents } from "./dimensions.js";
import { exactSI, type UnitTerms } from "./parse-exact.js";
import type { ParsedQuantity } from "./parse.js";

/**
 * The fast reader for the unit strings engineers usually write: a number, then
 * unit symbols with an optional SI prefix, whole powers, products and
 * quotients ("0.2 mm", "4.7 uF", "kg*m/s^2", "mm^2", "1/s", "A/m", "20 degC").
 *
 * It follows mathjs's own grammar (Unit.parse) and takes mathjs's own values
 * for the units and prefixes it knows (with the trade's units of parse.ts), and
 * rounds through the same exactSI, so for every string it reads it gives the
 * SI value and dimension the mathjs path gives, bit for bit (tests check every
 * symbol and generated strings against mathjs). It does not load mathjs, and
 * it never throws: for anything else (parentheses, long names, unknown units,
 * mistakes) it returns undefined and mathjs reads the string and words the
 * error. mathjs's `unit()` spends most of its time on a fresh string searching
 * every unit name for the whole string; this reader looks up each symbol once.
 */

// A unit as mathjs defines it: value in SI, offset (degC only), dimension.
interface UnitDef {
  readonly value: number;
  readonly offset: number;
  readonly exps: Exponents;
}

// [symbol, dimension, SI value as mathjs (or parse.ts's addTradeUnits) defines it, takes SI prefixes].
// Long names, plurals and units outside electromagnetics are left to mathjs.
const SYMBOLS: readonly (readonly [string, DimensionName, number, boolean])[] = [
  ["m", "Length", 1, true],
  ["g", "Mass", 0.001, true],
  ["s", "Time", 1, true],
  ["A", "Current", 1, true],
  ["K", "Temperature", 1, true],
  ["mol", "Amount", 1, true],
  ["Hz", "Frequency", 1, true],
  ["C", "Charge", 1, true],
  ["V", "Voltage", 1, true],
  ["F", "Capacitance", 1, true],
  ["H", "Inductance", 1, true],
  ["ohm", "Resistance", 1, true],
  ["S", "Conductance", 1, true],
  ["Wb", "MagneticFlux", 1, true],
  ["T", "FluxDensity", 1, true],
  ["N", "Force", 1, true],
  ["Pa", "Pressure", 1, true],
  ["J", "Energy", 1, true],
  ["W", "Power", 1, true],
  ["eV", "Energy", 1.602176634e-19, true],
  ["rad", "Angle", 1, true],
  ["deg", "Angle", Math.PI / 180, true],
  ["At", "Current", 1, true],
  ["G", "FluxDensity", 1e-4, true],
  ["Mx", "MagneticFlux", 1e-8, true],
  ["Oe", "MagneticFieldStrength", 1000 / (4 * Math.PI), true],
  ["Da", "Mass", 1.66053906892e-27, true],
  ["u", "Mass", 1.66053906892e-27, false],
  ["mil", "Length", 0.0000254, false],
  ["in", "Length", 0.0254, false],
  ["min", "Time", 60, false],
  ["h", "Time", 3600, false],
];

// mathjs's short prefixes with its values (written as the same literals, so the same doubles).
const PREFIXES: readonly (readonly [string, number])[] = [
  ["da", 10], ["h", 100], ["k", 1000], ["M", 1e6], ["G", 1e9], ["T", 1e12], ["P", 1e15], ["E", 1e18], ["Z", 1e21],
  ["Y", 1e24], ["R", 1e27], ["Q", 1e30], ["d", 0.1], ["c", 0.01], ["m", 0.001], ["u", 0.000001], ["n", 1e-9],
  ["p", 1e-12], ["f", 1e-15], ["a", 1e-18], ["z", 1e-21], ["y", 1e-24], ["r", 1e-27], ["q", 1e-30],
];

type Term = UnitTerms["units"][number];
interface Reading {
  readonly unit: UnitDef;
  readonly prefix: { readonly value: number };
}

let symbols: Map<string, Reading> | undefined;

function buildSymbols(): Map<string, Reading> {
  const t = new Map<string, Reading>();
  const none = { value: 1 };
  const defs = SYMBOLS.map(([sym, dim, value, prefixed]): [string, UnitDef, boolean] => [sym, { value, offset: 0, exps: DIMENSIONS[dim].exps }, prefixed]);
  // The Celsius degree is read alone and unprefixed, like mathjs: 20 degC is 293.15 K.
  defs.push(["degC", { value: 1, offset: 273.15, exps: DIMENSIONS.Temperature.exps }, false]);
  // A symbol as written wins over a prefix reading of the same text ("min" is the minute), as in mathjs.
  for (const [sym, unit] of defs) t.set(sym, { unit, prefix: none });
  for (const [sym, unit, prefixed] of defs) {
    if (!prefixed) continue;
    for (const [p, value] of PREFIXES) if (!t.has(p + sym)) t.set(p + sym, { unit, prefix: { value } });
  }
  return t;
}

/** Every symbol the reader knows with its unit and prefix values, for the tests that compare it with mathjs. */
export function readerSymbols(): ReadonlyMap<string, Reading> {
  symbols ??= buildSymbols();
  return symbols;
}

const SPACE = 32;
const TAB = 9;
const isSpace = (c: number): boolean => c === SPACE || c === TAB;
const isDigit = (c: number): boolean => c >= 48 && c <= 57;
const isAlpha = (c: number): boolean => (c >= 65 && c <= 90) || (c >= 97 && c <= 122);

/** Index after a number at `i` in mathjs's grammar (sign, digits, one dot, exponent), or -1. */
function scanNumber(text: string, i: number): number {
  const n = text.length;
  let c = text.charCodeAt(i);
  if (c === 43 || c === 45) c = text.charCodeAt(++i); // + -
  const start = i;
  while (i < n && isDigit(text.charCodeAt(i))) i++;
  if (text.charCodeAt(i) === 46) i++; // .
  const intEnd = i;
  while (i < n && isDigit(text.charCodeAt(i))) i++;
  // At least one digit: "." alone or "+" alone is no number.
  if (i === start || (i === intEnd && intEnd === start + 1 && text.charCodeAt(start) === 46)) return -1;
  c = text.charCodeAt(i);
  if (c === 69 || c === 101) {
    // e or E: an exponent only when digits follow ("4eV" is 4 electronvolts).
    let j = i + 1;
    const s = text.charCodeAt(j);
    if (s === 43 || s === 45) j++;
    if (isDigit(text.charCodeAt(j))) {
      while (j < n && isDigit(text.charCodeAt(j))) j++;
      i = j;
    }
  }
  return i;
}

/**
 * The SI value and dimension of `text`, or undefined where the reader leaves
 * it to mathjs. `text` has been through parse.ts's typography already.
 */
export function readUnitString(text: string): ParsedQuantity | undefined {
  const n = text.length;
  let i = 0;
  while (i < n && isSpace(text.charCodeAt(i))) i++;
  const numberStart = i;
  i = scanNumber(text, i);
  if (i < 0) return undefined;
  const value = parseFloat(text.slice(numberStart, i));
  const afterNumber = i;
  while (i < n && isSpace(text.charCodeAt(i))) i++;
  // The typed table writes reciprocals "1/m^3": "5 1/m^3" reads as "5 /m^3" (parse.ts does the same for mathjs).
  if (i > afterNumber && text.charCodeAt(i) === 49) {
    let j = i + 1;
    while (j < n && isSpace(text.charCodeAt(j))) j++;
    if (text.charCodeAt(j) === 47) i = j;
  }
  let sign = 1;
  let expecting = false;
  const op = text.charCodeAt(i);
  if (op === 42 || op === 47) {
    sign = op === 47 ? -1 : 1;
    expecting = true;
    i++;
  }
  const table = readerSymbols();
  const units: Term[] = [];
  const exps = [0, 0, 0, 0, 0, 0, 0, 0];
  let approx = value;
  for (;;) {
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    if (i >= n) break;
    if (!isAlpha(text.charCodeAt(i))) return undefined; // parentheses, stray signs: mathjs
    const start = i;
    while (i < n && (isAlpha(text.charCodeAt(i)) || isDigit(text.charCodeAt(i)))) i++;
    const sym = table.get(text.slice(start, i));
    if (sym === undefined) return undefined;
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    let power = sign;
    if (text.charCodeAt(i) === 94) {
      // ^ and a whole power of at most two digits; fractional and huge powers are mathjs's.
      i++;
      while (i < n && isSpace(text.charCodeAt(i))) i++;
      const p = i;
      const s = text.charCodeAt(i);
      if (s === 43 || s === 45) i++;
      const digits = i;
      while (i < n && isDigit(text.charCodeAt(i))) i++;
      if (i === digits || i - digits > 2) return undefined;
      const c = text.charCodeAt(i);
      if (i < n && !isSpace(c) && c !== 42 && c !== 47) return undefined;
      power *= parseFloat(text.slice(p, i));
    }
    const { unit, prefix } = sym;
    units.push({ unit, prefix, power });
    for (let k = 0; k < 8; k++) exps[k] = exps[k]! + unit.exps[k]! * power;
    // mathjs's Unit._normalize: value times (unit value times prefix value)^power, unit by unit.
    approx *= Math.pow(unit.value * prefix.value, power);
    while (i < n && isSpace(text.charCodeAt(i))) i++;
    const c = text.charCodeAt(i);
    expecting = c === 42 || c === 47;
    sign = c === 47 ? -1 : 1;
    if (expecting) i++;
  }
  if (expecting || units.length === 0) return undefined;
  // mathjs's toSI adds an offset (degC) only for a single unit to the first power.
  const only = units[0]!;
  if (units.length === 1 && only.power === 1 && only.unit.offset !== 0) {
    approx += (only.unit.value as number) * (only.unit.offset as number);
  }
  return Object.freeze({ si: exactSI(text, { units }, approx), exps: Object.freeze(exps) as unknown as Exponents, plain: false });
}
