import { inWords } from "./format.js";

/**
 * Stable error codes. These strings are public API: adding a code is a minor
 * change, renaming or removing one is a breaking change.
 */
export const ERROR_CODES = [
  "unknown_formula", // no formula with that id
  "unknown_input", // an input name the formula does not have
  "missing_input", // a required input was not given
  "wrong_type", // not a number / string / array of the expected shape
  "unparsable", // a string that is neither a number nor a unit mathjs understands
  "wrong_dimension", // a unit of the wrong dimension ("5 kg" for a length)
  "not_finite", // NaN or +-Infinity
  "out_of_domain", // outside the input's domain, or a relation between inputs fails
  "out_of_range", // the result is not representable (overflow) for legal inputs
  "no_solution", // solve: no input value in range reaches the target
  "several_solutions", // solve: more than one input value reaches the target
  "invalid_argument", // a tool was called with an unusable option
  "cancelled", // a long call was cancelled through its AbortSignal
] as const;

export type ErrorCode = (typeof ERROR_CODES)[number];

export interface FormulaErrorFields {
  /** Formula id, when the error concerns one formula. */
  formula?: string | undefined;
  /** Input name the error is about. */
  input?: string | undefined;
  /** The offending value, as given (numbers and short strings only). */
  value?: unknown;
  /** For wrong_dimension: the dimension the input needs. */
  expected?: string | undefined;
  /** For wrong_dimension: the dimension that was given. */
  received?: string | undefined;
  /** For out_of_domain: the rule that failed, e.g. "> 0" or "innerRadius < outerRadius". */
  rule?: string | undefined;
  /** Free detail appended to the message. */
  detail?: string | undefined;
}

/**
 * The one error class of the library. `code` is stable; `message` is built from
 * the fields, so programs should branch on `code` and `input`, not the text.
 */
export class FormulaError extends Error {
  // `declare`: the constructor assigns every field, so no class-field
  // initialisers need emitting (they cost bytes in every bundle).
  declare readonly code: ErrorCode;
  declare readonly formula: string | undefined;
  declare readonly input: string | undefined;
  declare readonly value: unknown;
  declare readonly expected: string | undefined;
  declare readonly received: string | undefined;
  declare readonly rule: string | undefined;
  /** The free detail of the message, if any (kept so a wrapper can add to it). */
  declare readonly detail: string | undefined;

  constructor(code: ErrorCode, fields: FormulaErrorFields = {}) {
    super(buildMessage(code, fields));
    this.name = "FormulaError";
    this.code = code;
    this.formula = fields.formula;
    this.input = fields.input;
    this.value = fields.value;
    this.expected = fields.expected;
    this.received = fields.received;
    this.rule = fields.rule;
    this.detail = fields.detail;
  }

  /** Plain JSON for API responses. */
  toJSON(): Record<string, unknown> {
    return {
      code: this.code, message: this.message, formula: this.formula, input: this.input,
      expected: this.expected, received: this.received, rule: this.rule,
    };
  }
}

/**
 * A value as quoted in a message. Messages never echo "Infinity", "NaN" or
 * "undefined": those read as a program's internals, so they are said in words.
 */
function show(v: unknown): string {
  if (typeof v === "string") return JSON.stringify(v.length > 60 ? `${v.slice(0, 57)}...` : v);
  // NaN, the infinities and undefined come out as "NaN", "Infinity", "undefined"
  // here and in words once buildMessage's inWords has run.
  if (typeof v === "number" || typeof v === "boolean" || v == null) return String(v);
  if (Array.isArray(v)) return "an array";
  return `a value of type ${typeof v}`;
}

function buildMessage(code: ErrorCode, f: FormulaErrorFields): string {
  // The last guard: free text (detail, rule) built elsewhere may quote a non-finite number through String().
  return inWords(messageOf(code, f));
}

function messageOf(code: ErrorCode, f: FormulaErrorFields): string {
  const where = f.formula ? `${f.formula}: ` : "";
  const inp = f.input ? `input "${f.input}"` : "input";
  const tail = f.detail ? ` (${f.detail})` : "";
  switch (code) {
    case "unknown_formula":
      return `unknown formula ${show(f.value)}${tail}`;
    case "unknown_input":
      return `${where}unknown ${inp}${tail}`;
    case "missing_input":
      return `${where}${inp} is required${tail}`;
    case "wrong_type":
      return `${where}${inp} got ${show(f.value)}; expected ${f.expected ?? "a number or unit string"}${tail}`;
    case "unparsable":
      return `${where}${inp} could not be read: ${show(f.value)}${tail}`;
    case "wrong_dimension":
      return `${where}${inp} needs ${f.expected}, got ${f.received}${f.value !== undefined ? ` from ${show(f.value)}` : ""}${tail}`;
    case "not_finite":
      return `${where}${inp} must be a finite number, got ${show(f.value)}${tail}`;
    case "out_of_domain":
      return f.input && f.value !== undefined
        ? `${where}${inp} must be ${f.rule}, got ${show(f.value)}${tail}`
        : `${where}inputs must satisfy ${f.rule}${tail}`;
    case "out_of_range":
      return `${where}the result is out of the representable range${tail}`;
    case "no_solution":
      return `${where}no value of ${inp} reaches the target${tail}`;
    case "several_solutions":
      return `${where}more than one value of ${inp} reaches the target${tail}`;
    case "invalid_argument":
      return `${where}${f.input ? `${inp}: ` : ""}invalid argument${tail}`;
    case "cancelled":
      return `${where}cancelled${tail}`;
  }
}
