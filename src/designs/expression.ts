import { FormulaError } from "../core/errors.js";
import { type Exponents, nameExponents } from "../units/dimensions.js";
import { parseQuantity } from "../units/parse.js";

// The small arithmetic of a design: named quantities, numbers with units,
// + - * / ^ sqrt and parentheses, and one comparison in a check. Nothing else
// can be written: no calls but sqrt, no assignment, no property access, so a
// design file from a stranger can only compute. Parsed once into a tree whose
// unit literals are already in SI; dimensions are checked on the tree before
// any value is computed.

/** A parsed expression. Literals hold SI values with their dimension. */
export type Expr =
  | { readonly k: "literal"; readonly si: number; readonly exps: Exponents; readonly text: string }
  | { readonly k: "name"; readonly name: string }
  | { readonly k: "negate"; readonly a: Expr }
  | { readonly k: "binary"; readonly op: "+" | "-" | "*" | "/"; readonly a: Expr; readonly b: Expr }
  | { readonly k: "power"; readonly a: Expr; readonly p: number }
  | { readonly k: "sqrt"; readonly a: Expr };

export type Comparison = "<" | "<=" | ">" | ">=";

/** Longest expression text accepted, and deepest nesting: bounds parse time and stack. */
export const EXPRESSION_LIMITS = { length: 500, depth: 40 } as const;

const ZERO: Exponents = Object.freeze([0, 0, 0, 0, 0, 0, 0, 0]) as unknown as Exponents;

type Token =
  | { t: "num"; v: string }
  | { t: "id"; v: string }
  | { t: "op"; v: string };

const TOKEN = /\s*(?:(\d+\.?\d*(?:[eE][+-]?\d+)?|\.\d+(?:[eE][+-]?\d+)?)|([A-Za-z_\u00b5\u03bc\u2126\u03a9][A-Za-z0-9_\u00b5\u03bc\u2126\u03a9]*)|(<=|>=|[-+*/^()<>]))/y;

function tokenize(text: string, where: string): Token[] {
  const tokens: Token[] = [];
  TOKEN.lastIndex = 0;
  let pos = 0;
  while (pos < text.length) {
    if (/^\s*$/.test(text.slice(pos))) break;
    TOKEN.lastIndex = pos;
    const m = TOKEN.exec(text);
    if (!m) throw syntax(where, text, `unexpected "${text.slice(pos).trimStart().slice(0, 10)}"`);
    pos = TOKEN.lastIndex;
    if (m[1] !== undefined) tokens.push({ t: "num", v: m[1] });
    else if (m[2] !== undefined) tokens.push({ t: "id", v: m[2] });
    else tokens.push({ t: "op", v: m[3]! });
  }
  return tokens;
}

function syntax(where: string, text: string, detail: string): FormulaError {
  return new FormulaError("invalid_argument", { formula: "design", input: where, value: text, detail });
}

/**
 * Parse an expression. `isName` tells design names from units: a number
 * followed by words that are not design names is a quantity literal
 * ("0.3 T", "10 A/m^2", "20 degC"), read by the library's unit parser.
 */
export function parseExpression(text: string, where: string, isName: (w: string) => boolean): Expr {
  const p = new Parser(text, where, isName);
  const e = p.expression(0);
  p.end();
  return e;
}

/** Parse a check: "expression < expression" (or <=, >, >=). */
export function parseCheck(
  text: string,
  where: string,
  isName: (w: string) => boolean,
): { left: Expr; op: Comparison; right: Expr } {
  const p = new Parser(text, where, isName);
  const left = p.expression(0);
  const op = p.comparison();
  const right = p.expression(0);
  p.end();
  return { left, op, right };
}

class Parser {
  private readonly tokens: Token[];
  private i = 0;

  constructor(
    private readonly text: string,
    private readonly where: string,
    private readonly isName: (w: string) => boolean,
  ) {
    if (typeof text !== "string") throw new FormulaError("wrong_type", { formula: "design", input: where, value: text, expected: "an expression text" });
    if (text.length > EXPRESSION_LIMITS.length) throw syntax(where, text, `longer than ${EXPRESSION_LIMITS.length} characters`);
    this.tokens = tokenize(text, where);
    if (this.tokens.length === 0) throw syntax(where, text, "empty expression");
  }

  private peek(): Token | undefined {
    return this.tokens[this.i];
  }

  private isOp(v: string): boolean {
    const t = this.peek();
    return t !== undefined && t.t === "op" && t.v === v;
  }

  private fail(detail: string): FormulaError {
    return syntax(this.where, this.text, detail);
  }

  end(): void {
    const t = this.peek();
    if (t) throw this.fail(`unexpected "${t.v}"`);
  }

  comparison(): Comparison {
    const t = this.peek();
    if (t?.t === "op" && (t.v === "<" || t.v === "<=" || t.v === ">" || t.v === ">=")) {
      this.i++;
      return t.v;
    }
    throw this.fail("a check compares two quantities with <, <=, > or >=");
  }

  // Precedence climbing: sums, then products, then unary minus, then powers.
  expression(depth: number): Expr {
    if (depth > EXPRESSION_LIMITS.depth) throw this.fail(`nested deeper than ${EXPRESSION_LIMITS.depth} levels`);
    let a = this.term(depth);
    while (this.isOp("+") || this.isOp("-")) {
      const op = this.tokens[this.i++]!.v as "+" | "-";
      a = { k: "binary", op, a, b: this.term(depth) };
    }
    return a;
  }

  private term(depth: number): Expr {
    let a = this.unary(depth);
    while (this.isOp("*") || this.isOp("/")) {
      const op = this.tokens[this.i++]!.v as "*" | "/";
      a = { k: "binary", op, a, b: this.unary(depth) };
    }
    return a;
  }

  private unary(depth: number): Expr {
    if (this.isOp("-")) {
      this.i++;
      return { k: "negate", a: this.unary(depth + 1) };
    }
    if (this.isOp("+")) {
      this.i++;
      return this.unary(depth + 1);
    }
    const a = this.atom(depth);
    if (this.isOp("^")) {
      this.i++;
      return { k: "power", a, p: this.exponent() };
    }
    return a;
  }

  // An exponent is a constant: a signed number or a parenthesised ratio of two (1/3).
  private exponent(): number {
    let sign = 1;
    if (this.isOp("-")) {
      this.i++;
      sign = -1;
    }
    const t = this.peek();
    if (t?.t === "num") {
      this.i++;
      return sign * Number(t.v);
    }
    if (this.isOp("(")) {
      this.i++;
      const n = this.peek();
      const s = this.tokens[this.i + 1];
      const d = this.tokens[this.i + 2];
      if (n?.t === "num" && s?.t === "op" && s.v === "/" && d?.t === "num" && this.tokens[this.i + 3]?.v === ")") {
        this.i += 4;
        const r = Number(n.v) / Number(d.v);
        if (!Number.isFinite(r)) throw this.fail("an exponent must be a finite number");
        return sign * r;
      }
    }
    throw this.fail('an exponent is a number, e.g. "^2", "^-1" or "^(1/3)"');
  }

  private atom(depth: number): Expr {
    const t = this.peek();
    if (t === undefined) throw this.fail("the expression ends too early");
    if (t.t === "num") {
      this.i++;
      return this.literal(t.v);
    }
    if (t.t === "id") {
      this.i++;
      if (t.v === "sqrt") {
        if (!this.isOp("(")) throw this.fail('sqrt needs parentheses: "sqrt(x)"');
        this.i++;
        const a = this.expression(depth + 1);
        if (!this.isOp(")")) throw this.fail('a ")" is missing');
        this.i++;
        return { k: "sqrt", a };
      }
      if (this.isName(t.v)) return { k: "name", name: t.v };
      throw new FormulaError("unknown_input", {
        formula: "design", input: this.where,
        detail: `"${t.v}" is not a design input, step or derived quantity; a unit must follow a number ("0.3 T")`,
      });
    }
    if (t.v === "(") {
      this.i++;
      const a = this.expression(depth + 1);
      if (!this.isOp(")")) throw this.fail('a ")" is missing');
      this.i++;
      return a;
    }
    throw this.fail(`unexpected "${t.v}"`);
  }

  // A number and the unit words after it, read together so offset units ("20 degC") mean what they say.
  private literal(num: string): Expr {
    let unit = "";
    const word = (k: number): boolean => {
      const w = this.tokens[k];
      return w?.t === "id" && w.v !== "sqrt" && !this.isName(w.v);
    };
    if (word(this.i)) {
      unit = this.tokens[this.i++]!.v;
      for (;;) {
        const op = this.peek();
        if (op?.t === "op" && op.v === "^") {
          const sign = this.tokens[this.i + 1];
          const k = sign?.t === "op" && sign.v === "-" ? this.i + 2 : this.i + 1;
          if (this.tokens[k]?.t !== "num") break;
          unit += `^${k === this.i + 2 ? "-" : ""}${this.tokens[k]!.v}`;
          this.i = k + 1;
        } else if (op?.t === "op" && (op.v === "/" || op.v === "*") && word(this.i + 1)) {
          unit += `${op.v === "/" ? "/" : " "}${this.tokens[this.i + 1]!.v}`;
          this.i += 2;
        } else break;
      }
    }
    const text = unit ? `${num} ${unit}` : num;
    if (!unit) return { k: "literal", si: Number(num), exps: ZERO, text };
    const q = parseQuantity(text, this.where, "design");
    return { k: "literal", si: q.si, exps: q.exps, text };
  }
}

/** Every design name an expression reads. */
export function namesIn(e: Expr, out: Set<string> = new Set()): Set<string> {
  switch (e.k) {
    case "literal":
      break;
    case "name":
      out.add(e.name);
      break;
    case "negate":
    case "power":
    case "sqrt":
      namesIn(e.a, out);
      break;
    case "binary":
      namesIn(e.a, out);
      namesIn(e.b, out);
      break;
  }
  return out;
}

/**
 * The dimension of an expression, given its names' dimensions; throws
 * wrong_dimension (naming `where`) for a sum or difference of unlike quantities.
 */
export function dimensionOf(e: Expr, dims: (name: string) => Exponents, where: string): Exponents {
  switch (e.k) {
    case "literal":
      return e.exps;
    case "name":
      return dims(e.name);
    case "negate":
      return dimensionOf(e.a, dims, where);
    case "sqrt":
      return scale(dimensionOf(e.a, dims, where), 0.5);
    case "power":
      return scale(dimensionOf(e.a, dims, where), e.p);
    case "binary": {
      const a = dimensionOf(e.a, dims, where);
      const b = dimensionOf(e.b, dims, where);
      if (e.op === "*") return add(a, b, 1);
      if (e.op === "/") return add(a, b, -1);
      if (!sameDimension(a, b)) {
        throw new FormulaError("wrong_dimension", {
          formula: "design", input: where, expected: nameExponents(a), received: nameExponents(b),
          detail: `"${e.op}" joins quantities of different dimensions`,
        });
      }
      return a;
    }
  }
}

/** Evaluate in SI; the caller checks that the result is finite. */
export function evaluateExpression(e: Expr, value: (name: string) => number): number {
  switch (e.k) {
    case "literal":
      return e.si;
    case "name":
      return value(e.name);
    case "negate":
      return -evaluateExpression(e.a, value);
    case "sqrt":
      return Math.sqrt(evaluateExpression(e.a, value));
    case "power":
      return evaluateExpression(e.a, value) ** e.p;
    case "binary": {
      const a = evaluateExpression(e.a, value);
      const b = evaluateExpression(e.b, value);
      return e.op === "+" ? a + b : e.op === "-" ? a - b : e.op === "*" ? a * b : a / b;
    }
  }
}

/** Exponents equal up to rounding of fractional powers ((x^(1/3))^3). */
export function sameDimension(a: Exponents, b: Exponents): boolean {
  for (let i = 0; i < 8; i++) if (Math.abs(a[i]! - b[i]!) > 1e-9) return false;
  return true;
}

function scale(a: Exponents, p: number): Exponents {
  return a.map((x) => x * p) as unknown as Exponents;
}

function add(a: Exponents, b: Exponents, s: number): Exponents {
  return a.map((x, i) => x + s * b[i]!) as unknown as Exponents;
}
