// The private unit parser: mathjs's Unit class (its grammar, prefixes, unit
// table, offsets and createUnit), created from its factory with number-only
// arithmetic. Unit strings are read with config number: "number", so every
// value Unit sees is a JavaScript number; handing it plain functions instead
// of mathjs's typed ones keeps typed-function, mathjs's typed.js, complex.js
// and fraction.js out of a bundle that calls `evaluate` (about 56 kB of
// minified code). tests/units/mathjs-subset.test.ts reads every unit, prefix
// and offset both ways, here and through the complete mathjs, and finds them
// identical.
import { createUnitClass, type CreateUnitOptions, type FactoryFunction, type Unit, type UnitCtor, type UnitDefinition } from "mathjs";

// mathjs's type declarations describe the `*Dependencies` maps but not the
// factories themselves, which the package does export at run time (mathjs
// docs, "Custom bundling"). Declared here; the maps would drag in decimal.js.
declare module "mathjs" {
  export const createUnitClass: FactoryFunction<unknown>;
}

/** What emquant uses of a mathjs instance for unit strings; a full instance (the notebook's) has it too. */
export interface UnitMath {
  readonly Unit: UnitCtor;
  unit(text: string): Unit;
  createUnit(units: Record<string, string | UnitDefinition | Unit>, options?: CreateUnitOptions): Unit;
}

/**
 * The one place a value that is not a real number can arise: mathjs defines
 * VAR (reactive power) as the imaginary unit times the watt, and there the
 * complete mathjs computes a Complex. This marker takes that Complex's place
 * and every arithmetic step below passes it on, so "1 VAR" parses to a unit
 * whose value is not a number, as with the complete mathjs, and parse.ts
 * refuses it the same way. Nothing reads its parts.
 */
class NotReal {
  // mathjs's clone() copies a value through its own clone method; the marker has no parts to copy.
  clone(): NotReal {
    return this;
  }
}
Object.defineProperty(NotReal, "name", { value: "Complex" }); // mathjs's typeOf reads constructor names
(NotReal.prototype as { isComplex?: boolean }).isComplex = true;
const NOT_REAL: NotReal = Object.freeze(new NotReal());
const ComplexStandIn = { I: NOT_REAL };

/**
 * mathjs's unit table writes degF, degR, fahrenheit and rankine as
 * `new Fraction(5, 9)`; Unit turns such a value into a number with `number()`
 * (valueOf) before it normalizes a value, and the arithmetic below takes its
 * number where Unit multiplies it as it is (converting degF). This holds the
 * two whole numbers and gives the same double, 5 / 9, as fraction.js's
 * valueOf (one correctly rounded division of exact integers).
 */
class Fraction {
  readonly s = 1;
  constructor(
    readonly n: number,
    readonly d: number,
  ) {
    if (!Number.isSafeInteger(n) || !Number.isSafeInteger(d) || n < 0 || d <= 0) {
      throw new Error("emquant's unit parser holds only the fractions of its unit table (whole numbers, such as 5/9)");
    }
  }

  valueOf(): number {
    return this.n / this.d;
  }
}
Object.defineProperty(Fraction, "name", { value: "Fraction" });
(Fraction.prototype as { isFraction?: boolean }).isFraction = true;

/**
 * Stands in for mathjs's BigNumber class (decimal.js): with config number:
 * "number" Unit never builds one. Constructing one is a programming error,
 * reported as such.
 */
function BigNumber(): never {
  throw new Error("emquant's unit parser works with numbers only; BigNumber is not included");
}
BigNumber.prototype.isBigNumber = true;

type Real = number | Fraction | NotReal;
// mathjs's defaults (relTol 1e-12, absTol 1e-15), the tolerances of its equal().
const CONFIG = Object.freeze({ number: "number", predictable: false, relTol: 1e-12, absTol: 1e-15 });

// mathjs's nearlyEqual for numbers: |a - b| <= max(relTol max(|a|, |b|), absTol); NaN equals nothing.
function nearlyEqual(a: number, b: number): boolean {
  if (Number.isNaN(a) || Number.isNaN(b)) return false;
  if (!Number.isFinite(a) || !Number.isFinite(b) || a === b) return a === b;
  return Math.abs(a - b) <= Math.max(CONFIG.relTol * Math.max(Math.abs(a), Math.abs(b)), CONFIG.absTol);
}

/**
 * An operation on real values: a table fraction is taken as its number, and
 * anything not real gives NOT_REAL. mathjs multiplies a fraction and a number
 * exactly, as fractions; the table's one such product, 5/9 x 459.67 in
 * converting degF, rounds to the same double either way (45967/180), which
 * the side-by-side test checks for every temperature unit.
 */
function onReals<R>(f: (...xs: number[]) => R): (...xs: Real[]) => R | NotReal {
  return (...xs) => {
    const numbers = xs.map((x) => (x instanceof Fraction ? x.valueOf() : x));
    return numbers.every((x): x is number => typeof x === "number") ? f(...numbers) : NOT_REAL;
  };
}

/**
 * Unit's arithmetic, as mathjs computes it for numbers: plain operators; abs,
 * fix and round as mathjs's number functions (round takes halves away from
 * zero); `pow` is Math.pow, which mathjs's pow is for the positive bases Unit
 * raises (unit and prefix values).
 */
const ARITHMETIC = {
  addScalar: onReals((x, y) => x + y),
  subtractScalar: onReals((x, y) => x - y),
  multiplyScalar: onReals((x, y) => x * y),
  divideScalar: onReals((x, y) => x / y),
  pow: onReals((x, y) => Math.pow(x, y)),
  abs: onReals((x) => Math.abs(x)),
  fix: onReals((x) => Math.trunc(x)),
  round: onReals((x) => Math.sign(x) * Math.round(Math.abs(x))),
  equal: (x: Real, y: Real): boolean => onReals((a, b) => nearlyEqual(a, b))(x, y) === true,
  isNumeric: (x: unknown): boolean => typeof x === "number",
  number: (x: unknown): unknown => (x instanceof Fraction ? x.valueOf() : x),
  // Unit's format()/toString() text: JavaScript's number text (mathjs's own
  // notation, e.g. "1e-4" for 0.0001, is not included), with `precision`
  // significant digits when asked.
  format: (x: unknown, options?: { precision?: number }): string =>
    typeof x === "number" && options?.precision !== undefined ? String(Number(x.toPrecision(options.precision))) : String(x),
};

/**
 * A new, independent Unit class with its own unit table (createUnit on one
 * never reaches another or the global mathjs), with `unit` and `createUnit`
 * as mathjs's functions of those names do for their string and object
 * arguments.
 */
export function createSubsetMath(): UnitMath {
  const Unit = createUnitClass({ config: CONFIG, Complex: ComplexStandIn, BigNumber, Fraction, ...ARITHMETIC }) as UnitCtor;
  // The arguments mathjs's code takes, beyond what its declarations list.
  const U = Unit as unknown as UnitStaticCalls;
  return {
    Unit,
    // A bare unit name ("mm") is a unit without value; anything else goes to the parser.
    unit: (text) => (U.isValuelessUnit(text) ? new U(null, text) : U.parse(text, { allowNoUnits: true })),
    createUnit: (units, options) => U.createUnit(units, options ?? {}),
  };
}

interface UnitStaticCalls {
  new (value: null, name: string): Unit;
  isValuelessUnit(name: string): boolean;
  parse(text: string, options: { allowNoUnits: boolean }): Unit;
  createUnit(units: Record<string, string | UnitDefinition | Unit>, options: CreateUnitOptions): Unit;
}
