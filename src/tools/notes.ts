import { inWords } from "../core/format.js";
import type { AnyFormula } from "../core/formula.js";
import type { Condition, InputSpecs, Note } from "../core/spec.js";

/**
 * One note code found over many points (a sweep's grid, a tolerance
 * analysis's samples): how many points raised it and the worst of them.
 */
export interface NoteSummary {
  readonly code: string;
  readonly kind: "warning" | "caution";
  /** Points that raised the note. */
  readonly count: number;
  /** The worst point: largest `measure`, or the first point for a condition without one. */
  readonly worst: {
    /** The point's index (grid index of a sweep; sample number of a tolerance analysis). */
    readonly index: number;
    /** The varied inputs' values at that point, SI. */
    readonly inputs: Readonly<Record<string, number>>;
    /** The condition's measure there (larger is worse); absent for conditions without one. */
    readonly measure?: number;
    /** The note's text at that point. */
    readonly message: string;
  };
}

type Value = number | readonly number[];
type AnyCondition = Condition<InputSpecs>;

/**
 * Gathers notes point by point without building messages: per point only the
 * conditions' `when` and `measure` run; the message is built once per code at
 * the end, at the worst point. Applies exactly the rule of `formula.notes`:
 * a warning applies when its `when` holds, a caution when its `when` holds or
 * when it has none.
 */
export class NoteCollector {
  private readonly conditions: readonly AnyCondition[];
  private readonly kinds: readonly ("warning" | "caution")[];
  private readonly counts: number[];
  private readonly worstIndex: number[];
  private readonly worstMeasure: number[];
  private readonly worstInputs: (number[] | undefined)[];
  private readonly worstValue: (Value | undefined)[];

  /**
   * @param formula whose conditions are collected
   * @param names the varied inputs, whose values are recorded at the worst point
   */
  constructor(formula: AnyFormula, private readonly names: readonly string[]) {
    const def = formula.definition;
    const validity = (def.validity ?? []) as readonly AnyCondition[];
    const cautions = (def.cautions ?? []) as readonly AnyCondition[];
    this.conditions = [...validity.filter((c) => c.when !== undefined), ...cautions];
    this.kinds = [...validity.filter((c) => c.when !== undefined).map(() => "warning" as const), ...cautions.map(() => "caution" as const)];
    const n = this.conditions.length;
    this.counts = new Array<number>(n).fill(0);
    this.worstIndex = new Array<number>(n).fill(-1);
    this.worstMeasure = new Array<number>(n).fill(-Infinity);
    this.worstInputs = new Array<number[] | undefined>(n).fill(undefined);
    this.worstValue = new Array<Value | undefined>(n).fill(undefined);
  }

  /** True when the formula has no conditions at all (nothing to collect). */
  get empty(): boolean {
    return this.conditions.length === 0;
  }

  /**
   * Checks every condition at one computed point. `x` holds the point's inputs
   * (read, not kept); `value` its result (an array is copied when kept).
   */
  add(index: number, x: Readonly<Record<string, unknown>>, value: Value): void {
    const cs = this.conditions;
    for (let c = 0; c < cs.length; c++) {
      const cond = cs[c]!;
      if (cond.when !== undefined && !cond.when(x as never, value)) continue;
      this.counts[c]!++;
      // NaN measures never win; the first point stands in until one does.
      const m = cond.measure === undefined ? -Infinity : cond.measure(x as never, value);
      if (this.worstIndex[c] === -1 || m > this.worstMeasure[c]!) {
        this.worstIndex[c] = index;
        if (m > this.worstMeasure[c]!) this.worstMeasure[c] = m;
        this.worstInputs[c] = this.names.map((n) => x[n] as number);
        this.worstValue[c] = typeof value === "number" ? value : [...value];
      }
    }
  }

  /**
   * The summaries, warnings first, in definition order. `x` is an object the
   * conditions can read (a compute-input object of the formula); its varied
   * entries are set to each worst point to build the message, then restored.
   */
  summaries(x: Record<string, unknown>): NoteSummary[] {
    const out: NoteSummary[] = [];
    const saved = this.names.map((n) => x[n]);
    for (let c = 0; c < this.conditions.length; c++) {
      if (this.counts[c] === 0) continue;
      const cond = this.conditions[c]!;
      const inputs: Record<string, number> = {};
      this.names.forEach((n, i) => {
        inputs[n] = this.worstInputs[c]![i]!;
        x[n] = inputs[n];
      });
      const value = this.worstValue[c]!;
      const message = inWords(typeof cond.message === "function" ? cond.message(x as never, value) : cond.message);
      const m = this.worstMeasure[c]!;
      out.push({
        code: cond.code,
        kind: this.kinds[c]!,
        count: this.counts[c]!,
        worst: { index: this.worstIndex[c]!, inputs, ...(cond.measure !== undefined && m - m === 0 ? { measure: m } : {}), message },
      });
    }
    this.names.forEach((n, i) => (x[n] = saved[i]));
    return out;
  }
}

/** The notes of the summaries as plain warnings and cautions (one per code, the worst point's text). */
export function notesOf(summaries: readonly NoteSummary[]): { warnings: Note[]; cautions: Note[] } {
  const pick = (kind: "warning" | "caution"): Note[] =>
    summaries.filter((s) => s.kind === kind).map((s) => ({ code: s.code, message: s.worst.message }));
  return { warnings: pick("warning"), cautions: pick("caution") };
}
