import type {
  DivExponents, ExponentsOf, MulExponents, Named, NeverIn, Quantity, SqrtExponents,
} from "./types.js";

// Typed arithmetic. Each function is the plain operation; the types carry the
// dimension bookkeeping, so these inline to ordinary arithmetic.

/** Sum of two quantities of the same dimension. */
export function add<Q extends number>(a: Q, b: NoInfer<Q>): Q {
  return (a + b) as Q;
}

/** Difference of two quantities of the same dimension. */
export function sub<Q extends number>(a: Q, b: NoInfer<Q>): Q {
  return (a - b) as Q;
}

/** Product; dimension exponents add; the result type is the named quantity where there is one. A plain number scales without changing the dimension. */
export function mul<A extends number, B extends number>(
  a: A,
  b: B,
): Named<MulExponents<ExponentsOf<A>, ExponentsOf<B>>> {
  return (a * b) as Named<MulExponents<ExponentsOf<A>, ExponentsOf<B>>>;
}

/** Quotient; dimension exponents subtract. */
export function div<A extends number, B extends number>(
  a: A,
  b: B,
): Named<DivExponents<ExponentsOf<A>, ExponentsOf<B>>> {
  return (a / b) as Named<DivExponents<ExponentsOf<A>, ExponentsOf<B>>>;
}

/**
 * Square root; only for quantities whose exponents are all even (an Area gives
 * a Length). An odd exponent makes the call demand a second argument that can
 * never be supplied, so the mistake is a compile error.
 */
export function sqrt<A extends number>(
  a: A,
  ..._evenExponentsOnly: NeverIn<SqrtExponents<ExponentsOf<A>>> extends true
    ? [error: "square root needs every dimension exponent even"]
    : []
): Quantity<SqrtExponents<ExponentsOf<A>>> {
  // Not Named<...>: with the rest-parameter check above, naming the result
  // makes inference from a contextual type blow up (TS2590).
  return Math.sqrt(a) as Quantity<SqrtExponents<ExponentsOf<A>>>;
}

/** Negation keeps the dimension. */
export function neg<Q extends number>(a: Q): Q {
  return -a as Q;
}
