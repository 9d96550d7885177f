// The private mathjs instance for unit strings, built from only the factories
// that unit parsing needs (mathjs's documented create(factories) pattern), so a
// bundle that calls `evaluate` does not carry the expression parser, matrices
// algebra or decimal.js. The dependency closure of Unit, unit and createUnit
// was listed by walking each factory's `dependencies` field (mathjs 15.2.0); pow, fix, round and equal are replaced by number-only versions.
import {
  create,
  factory,
  createAbs,
  createAddScalar,
  createComplexClass,
  createCreateUnit,
  createDivideScalar,
  createEqualScalar,
  createFormat,
  createFraction,
  createFractionClass,
  createIsNumeric,
  createMultiplyScalar,
  createNumber,
  createNumeric,
  createSubtractScalar,
  createTyped,
  createUnitClass,
  createUnitFunction,
  type FactoryFunction,
  type MathJsInstance,
} from "mathjs";

// mathjs's type declarations describe the `*Dependencies` maps but not the
// factories themselves, which the package does export at run time (mathjs
// docs, "Custom bundling"). Declared here; the maps would drag in decimal.js.
declare module "mathjs" {
  export const createAbs: FactoryFunction<unknown>;
  export const createAddScalar: FactoryFunction<unknown>;
  export const createComplexClass: FactoryFunction<unknown>;
  export const createCreateUnit: FactoryFunction<unknown>;
  export const createDivideScalar: FactoryFunction<unknown>;
  export const createEqualScalar: FactoryFunction<unknown>;
  export const createFormat: FactoryFunction<unknown>;
  export const createFraction: FactoryFunction<unknown>;
  export const createFractionClass: FactoryFunction<unknown>;
  export const createIsNumeric: FactoryFunction<unknown>;
  export const createMultiplyScalar: FactoryFunction<unknown>;
  export const createNumber: FactoryFunction<unknown>;
  export const createNumeric: FactoryFunction<unknown>;
  export const createSubtractScalar: FactoryFunction<unknown>;
  export const createTyped: FactoryFunction<unknown>;
  export const createUnitClass: FactoryFunction<unknown>;
  export const createUnitFunction: FactoryFunction<unknown>;
}

/**
 * Stands in for mathjs's BigNumber class (decimal.js): unit parsing runs with
 * number values only (config number: "number"), so no BigNumber is ever built.
 * Constructing one is a programming error, reported as such.
 */
const createBigNumberStub = factory(
  "BigNumber",
  [],
  () => {
    function BigNumber(): never {
      throw new Error("emquant's unit parser works with numbers only; BigNumber is not included");
    }
    BigNumber.prototype.isBigNumber = true;
    return BigNumber;
  },
  { isClass: true },
);

/**
 * Number-only versions of pow, fix, round and equal. mathjs's own carry
 * matrix signatures (pow needs inv, det, multiply; equal needs SparseMatrix;
 * fix, floor and ceil load decimal.js), which a parser of scalar unit strings
 * never calls: Unit uses pow(unit value x prefix, power) to normalize, with a
 * positive base (every unit and prefix value is positive), and the other three
 * only in splitUnit/equals. Same results as mathjs for numbers.
 */
const createPowNumber = factory("pow", ["typed"], ({ typed }) =>
  typed("pow", { "number, number": (x: number, y: number) => Math.pow(x, y) }),
);
const createFixNumber = factory("fix", ["typed"], ({ typed }) => typed("fix", { number: (x: number) => Math.trunc(x) }));
const createRoundNumber = factory("round", ["typed"], ({ typed }) => typed("round", { number: (x: number) => Math.round(x) }));
// equalScalar (mathjs's relative/absolute tolerance compare) is missing from
// the typed list of names a factory may depend on, hence the casts.
const createEqualNumber = factory("equal", ["typed", "equalScalar"] as unknown as ["typed"], (scope) => {
  const { typed, equalScalar } = scope as unknown as {
    typed: MathJsInstance["typed"];
    equalScalar: (x: number, y: number) => boolean;
  };
  return typed("equal", { "number, number": (x: number, y: number) => equalScalar(x, y) });
});

const FACTORIES = {
  createPowNumber,
  createFixNumber,
  createRoundNumber,
  createEqualNumber,
  createAbs,
  createAddScalar,
  createBigNumberStub,
  createComplexClass,
  createCreateUnit,
  createDivideScalar,
  createEqualScalar,
  createFormat,
  createFraction,
  createFractionClass,
  createIsNumeric,
  createMultiplyScalar,
  createNumber,
  createNumeric,
  createSubtractScalar,
  createTyped,
  createUnitClass,
  createUnitFunction,
};

/**
 * A new mathjs instance holding only `Unit`, `unit`, `createUnit` and what they
 * depend on. Typed as a full instance for callers' convenience; functions
 * outside the subset are absent at run time.
 */
export function createSubsetMath(): MathJsInstance {
  return create(FACTORIES, { number: "number" }) as MathJsInstance;
}
