import type { DimensionName } from "../units/dimensions.js";
import type { DimensionTypes, Vec3 } from "../units/types.js";

/**
 * The allowed range of an input, in SI. Every quantity input must also be
 * finite; `integer` means a count (turns).
 */
export interface Domain {
  readonly min?: number;
  readonly minExclusive?: boolean;
  readonly max?: number;
  readonly maxExclusive?: boolean;
  readonly integer?: boolean;
}

/** Common domains, so definitions read as words. */
export const POSITIVE: Domain = { min: 0, minExclusive: true };
export const NON_NEGATIVE: Domain = { min: 0 };
export const AT_LEAST_ONE: Domain = { min: 1 };
export const COUNT: Domain = { min: 1, integer: true };

/** Number of turns of a winding: a whole number, at least 1. Spread it and set the example. */
export const TURNS = {
  dimension: "Dimensionless",
  description: "Number of turns of the winding",
  domain: COUNT,
  example: 20,
} as const;

/**
 * Relative permeability: one domain across the library, any value > 0 (copper
 * is diamagnetic, mu_r = 0.999994). A formula that assumes a magnetic material
 * warns below its range instead of refusing. Spread it; set the description
 * and example where the material differs (a core, a conductor).
 */
export const RELATIVE_PERMEABILITY = {
  dimension: "Dimensionless",
  description: "Relative permeability of the material (1 for air)",
  default: 1,
  domain: POSITIVE,
  example: 2000,
} as const;

/**
 * How many samples a series input takes. Every tool's cost grows with the
 * length, so each series has a ceiling (the HTTP body limit is not enough:
 * a sweep evaluates the whole series at every grid point).
 */
export interface SeriesLength {
  readonly minLength: number;
  readonly maxLength: number;
  /** Made by `seriesOf` (src/core/series.ts): how `defineFormula` checks the series. */
  readonly check: import("./series.js").SeriesCheck;
}

/**
 * An input measured in a dimension: a scalar, a 3-vector when `vector`, or a
 * series of samples (a waveform over one period) when `series`.
 */
export interface QuantityInput {
  readonly dimension: DimensionName;
  readonly description: string;
  /** SI default; an input with a default may be omitted. */
  readonly default?: number;
  /** Omitted means any finite value. For vectors it applies to each component. */
  readonly domain?: Domain;
  readonly vector?: boolean;
  /**
   * A series of samples of any length within these bounds (plain SI numbers in
   * an array). Each sample must be finite and within `domain`. Only scalar
   * inputs are solved for, swept or toleranced: a series is held as given.
   */
  readonly series?: SeriesLength;
  /**
   * A typical SI value (a 3-array for vectors, an array for series) within the domain and satisfying
   * the relations together with the other inputs' examples. Used by the CLI,
   * docs, solve's search start, sweeps and the registry-wide property tests.
   * Every input is expected to have one (a registry test checks).
   */
  readonly example?: number | readonly number[];
}

/** An input that takes one of a fixed list of words (a coil shape, a mode). */
export interface ChoiceInput {
  readonly choices: readonly string[];
  readonly description: string;
  readonly default?: string;
  readonly example?: string;
}

export type InputSpec = QuantityInput | ChoiceInput;
/** The declared inputs by name, in declaration order (`definition.inputs`). */
export type InputSpecs = Readonly<Record<string, InputSpec>>;

/** An input as declared in a formula: its name (a whole word, the key callers use) and its spec. */
export type NamedInput = InputSpec & { readonly name: string };
/**
 * A formula's inputs as declared: a list in calling order. A list and not an
 * object keyed by input name, because in V8 such an object literal shares its
 * hidden class with every caller's `{ area, gap, ... }` argument object; its
 * spec-object fields then force the callers' numbers to be boxed, which made
 * typed calls several times slower (measured in bench/typed.ts).
 */
export type InputList = readonly NamedInput[];
/** The by-name view of a declared input list. */
export type InputsByName<L extends InputList> = { readonly [S in L[number] as S["name"]]: S };

/** What a formula returns: a scalar, or named components (a vector is ["x","y","z"]). */
export interface OutputSpec {
  /** The output's dimension; with `byChoice`, the dimension of the first choice (the entry's default reading). */
  readonly dimension: DimensionName;
  readonly description: string;
  readonly components?: readonly string[];
  /**
   * When a choice input decides what is returned (a flux density or an electric
   * field): that input's name and the dimension for each of its choices. Every
   * tool reads the dimension through `outputDimension`, and the typed call
   * returns the quantity of the choice passed.
   */
  readonly byChoice?: { readonly input: string; readonly dimensions: Readonly<Record<string, DimensionName>> };
}

/** The output's dimension for these inputs (a choice input may decide it; see `OutputSpec.byChoice`). */
export function outputDimension(output: OutputSpec, inputs: Readonly<Record<string, unknown>>): DimensionName {
  const by = output.byChoice;
  if (by === undefined) return output.dimension;
  const c = Object.hasOwn(inputs, by.input) ? inputs[by.input] : undefined;
  return typeof c === "string" && Object.hasOwn(by.dimensions, c) ? by.dimensions[c]! : output.dimension;
}

/** A published source, or "common practice" / a derivation named as such. */
export interface Source {
  /** Authors or body, e.g. "H. A. Wheeler"; "common practice" for trade knowledge. */
  readonly authors: string;
  readonly year?: number;
  readonly title: string;
  /** Equation, table or page, e.g. "eq. (21)". */
  readonly locator?: string;
}

/** SI values handed to `compute`, defaults filled in. */
export type ComputeInputs<I extends InputSpecs> = {
  readonly [K in keyof I]: I[K] extends { readonly choices: readonly (infer C)[] }
    ? C
    : I[K] extends { readonly vector: true }
      ? Vec3<number>
      : I[K] extends { readonly series: SeriesLength }
        ? readonly number[]
        : number;
};

/** A condition on the inputs (and result) under which a warning or caution applies. */
export interface Condition<I extends InputSpecs> {
  /** Stable identifier, e.g. "fringing". */
  readonly code: string;
  /** Text shown to the user; may quote the inputs. */
  readonly message: string | ((x: ComputeInputs<I>, value: number | readonly number[]) => string);
  /** True when the note applies. Cautions without `when` always apply. */
  readonly when?: (x: ComputeInputs<I>, value: number | readonly number[]) => boolean;
  /**
   * How far past its threshold a point is: larger is worse (a ratio such as
   * gap / sqrt(area), or the hazardous quantity itself). Bulk tools (sweeps,
   * tolerance, columns, designs) report, per note code, the point where it is
   * largest. Every condition with `when` has one (a registry test checks);
   * a condition that always applies needs none.
   */
  readonly measure?: (x: ComputeInputs<I>, value: number | readonly number[]) => number;
}

/** A relation between inputs that must hold (inner < outer), with its rule text. */
export interface Relation<I extends InputSpecs> {
  /** The rule as a user reads it, e.g. "innerRadius < outerRadius". */
  readonly rule: string;
  readonly holds: (x: ComputeInputs<I>) => boolean;
}

export type ComputeOutput<O extends OutputSpec> = O extends { readonly components: readonly string[] }
  ? readonly number[]
  : number;

/** Everything in a formula's definition except its inputs. */
interface FormulaBody<I extends InputSpecs, O extends OutputSpec> {
  /** Exported name and registry id, e.g. "coaxialCapacitance". */
  readonly id: string;
  readonly title: string;
  /** Module family: "capacitance", "inductance", "flux", "fields", "force", "motion", "displacement". */
  readonly category: string;
  /** One or two sentences: what is computed and under which assumptions. */
  readonly description: string;
  /** The equation in plain text with its symbols. */
  readonly equation: string;
  readonly output: O;
  readonly relations?: readonly Relation<I>[];
  /** Warnings when the approximation's stated accuracy no longer holds. */
  readonly validity?: readonly Condition<I>[];
  /** Hazards (stored energy, high voltage, strong fields, fault forces). */
  readonly cautions?: readonly Condition<I>[];
  readonly source: Source | readonly Source[];
  /**
   * For an empirical fit whose result is a power of size that is not a simple fraction
   * (McLyman's rise ~ (P/A)^0.826 ~ size^-1.652): that exponent, so the registry's
   * geometric-similarity test checks it instead of looking for a multiple of 1/6.
   */
  readonly geometricExponent?: number;
  /** Plain-number SI computation in a numerically stable form. */
  readonly compute: (x: ComputeInputs<I>) => ComputeOutput<O>;
}

/** A formula as written: what `defineFormula` takes, inputs as a list in calling order. */
export interface FormulaDeclaration<L extends InputList, O extends OutputSpec> extends FormulaBody<InputsByName<L>, O> {
  readonly inputs: L;
}

/**
 * The one declarative definition from which everything else is derived, as
 * held by a formula (`formula.definition`): inputs by name, in declaration order.
 */
export interface FormulaDefinition<I extends InputSpecs, O extends OutputSpec> extends FormulaBody<I, O> {
  readonly inputs: I;
}

// ---- the typed face ----

type InputType<S> = S extends { readonly choices: readonly (infer C)[] }
  ? C
  : S extends { readonly dimension: infer D extends DimensionName; readonly vector: true }
    ? Vec3<DimensionTypes[D]>
    : S extends { readonly dimension: infer D extends DimensionName; readonly series: SeriesLength }
      ? readonly DimensionTypes[D][]
      : S extends { readonly dimension: infer D extends DimensionName }
        ? DimensionTypes[D]
        : never;

type OptionalKeys<I> = { [K in keyof I]: I[K] extends { readonly default: unknown } ? K : never }[keyof I];
type Simplify<T> = { [K in keyof T]: T[K] } & {};

/** The typed input object of a formula: required inputs plus optional ones that have defaults. */
export type FormulaInputs<I extends InputSpecs> = Simplify<
  { readonly [K in Exclude<keyof I, OptionalKeys<I>>]: InputType<I[K]> } & {
    readonly [K in OptionalKeys<I>]?: InputType<I[K]>;
  }
>;

/** The dimension names an output can take: its one dimension, or every choice's. */
export type OutputDimensions<O extends OutputSpec> = O extends { readonly byChoice: { readonly dimensions: infer M } }
  ? M[keyof M] & DimensionName
  : O["dimension"];

/** The typed result of a formula: a quantity (a union when a choice decides it), or a readonly array of component quantities. */
export type FormulaOutput<O extends OutputSpec> = O extends { readonly components: readonly string[] }
  ? readonly DimensionTypes[OutputDimensions<O>][]
  : DimensionTypes[OutputDimensions<O>];

/**
 * The typed call of a formula whose output dimension a choice decides: passing
 * `quantity: "electricField"` returns an ElectricField. Nothing (unknown) for
 * every other formula, so their call signature is untouched.
 */
export type ChoiceCall<I extends InputSpecs, O extends OutputSpec> = O extends {
  readonly byChoice: { readonly input: infer N extends string; readonly dimensions: infer M };
}
  ? <C extends keyof M & string>(inputs: FormulaInputs<I> & { readonly [K in N]: C }) => DimensionTypes[M[C] & DimensionName]
  : unknown;

/** A warning or caution attached to a result. */
export interface Note {
  readonly code: string;
  readonly message: string;
}

/** A value together with the notes that apply to it. */
export interface Detailed<V> {
  readonly value: V;
  readonly warnings: readonly Note[];
  readonly cautions: readonly Note[];
}
