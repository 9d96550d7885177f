// The private mathjs instance for unit strings, built from only the factories
// that unit parsing needs (mathjs's documented create(factories) pattern), so a
// bundle that calls `evaluate` does not carry the expression parser, matrices
// algebra or decimal.js. The dependency closure of Unit, unit and createUnit
// was listed by walking each factory's `dependencies` field (mathjs 15.2.0).
import {
  create,
  factory,
  createAbs,
  createAddScalar,
  createCeil,
  createComplexClass,
  createConj,
  createCreateUnit,
  createDenseMatrixClass,
  createDet,
  createDivideScalar,
  createDot,
  createEqual,
  createEqualScalar,
  createFix,
  createFloor,
  createFormat,
  createFraction,
  createFractionClass,
  createIdentity,
  createInv,
  createIsNumeric,
  createIsZero,
  createMatrix,
  createMatrixClass,
  createMultiply,
  createMultiplyScalar,
  createNumber,
  createNumeric,
  createPow,
  createRound,
  createSize,
  createSparseMatrixClass,
  createSubtractScalar,
  createTyped,
  createUnaryMinus,
  createUnitClass,
  createUnitFunction,
  createZeros,
  type FactoryFunction,
  type MathJsInstance,
} from "mathjs";

// mathjs's type declarations describe the `*Dependencies` maps but not the
// factories themselves, which the package does export at run time (mathjs
// docs, "Custom bundling"). Declared here; the maps would drag in decimal.js.
declare module "mathjs" {
  export const createAbs: FactoryFunction<unknown>;
  export const createAddScalar: FactoryFunction<unknown>;
  export const createCeil: FactoryFunction<unknown>;
  export const createComplexClass: FactoryFunction<unknown>;
  export const createConj: FactoryFunction<unknown>;
  export const createCreateUnit: FactoryFunction<unknown>;
  export const createDenseMatrixClass: FactoryFunction<unknown>;
  export const createDet: FactoryFunction<unknown>;
  export const createDivideScalar: FactoryFunction<unknown>;
  export const createDot: FactoryFunction<unknown>;
  export const createEqual: FactoryFunction<unknown>;
  export const createEqualScalar: FactoryFunction<unknown>;
  export const createFix: FactoryFunction<unknown>;
  export const createFloor: FactoryFunction<unknown>;
  export const createFormat: FactoryFunction<unknown>;
  export const createFraction: FactoryFunction<unknown>;
  export const createFractionClass: FactoryFunction<unknown>;
  export const createIdentity: FactoryFunction<unknown>;
  export const createInv: FactoryFunction<unknown>;
  export const createIsNumeric: FactoryFunction<unknown>;
  export const createIsZero: FactoryFunction<unknown>;
  export const createMatrix: FactoryFunction<unknown>;
  export const createMatrixClass: FactoryFunction<unknown>;
  export const createMultiply: FactoryFunction<unknown>;
  export const createMultiplyScalar: FactoryFunction<unknown>;
  export const createNumber: FactoryFunction<unknown>;
  export const createNumeric: FactoryFunction<unknown>;
  export const createPow: FactoryFunction<unknown>;
  export const createRound: FactoryFunction<unknown>;
  export const createSize: FactoryFunction<unknown>;
  export const createSparseMatrixClass: FactoryFunction<unknown>;
  export const createSubtractScalar: FactoryFunction<unknown>;
  export const createTyped: FactoryFunction<unknown>;
  export const createUnaryMinus: FactoryFunction<unknown>;
  export const createUnitClass: FactoryFunction<unknown>;
  export const createUnitFunction: FactoryFunction<unknown>;
  export const createZeros: FactoryFunction<unknown>;
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

const FACTORIES = {
  createAbs,
  createAddScalar,
  createBigNumberStub,
  createCeil,
  createComplexClass,
  createConj,
  createCreateUnit,
  createDenseMatrixClass,
  createDet,
  createDivideScalar,
  createDot,
  createEqual,
  createEqualScalar,
  createFix,
  createFloor,
  createFormat,
  createFraction,
  createFractionClass,
  createIdentity,
  createInv,
  createIsNumeric,
  createIsZero,
  createMatrix,
  createMatrixClass,
  createMultiply,
  createMultiplyScalar,
  createNumber,
  createNumeric,
  createPow,
  createRound,
  createSize,
  createSparseMatrixClass,
  createSubtractScalar,
  createTyped,
  createUnaryMinus,
  createUnitClass,
  createUnitFunction,
  createZeros,
};

/**
 * A new mathjs instance holding only `Unit`, `unit`, `createUnit` and what they
 * depend on. Typed as a full instance for callers' convenience; functions
 * outside the subset are absent at run time.
 */
export function createSubsetMath(): MathJsInstance {
  return create(FACTORIES, { number: "number" }) as MathJsInstance;
}
