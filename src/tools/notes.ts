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

/** A NoteCollector's findings as plain data (see NoteCollector.state), per condition. */
export interface CollectedNotes {
  readonly counts: readonly number[];
  readonly index: readonly number[];
  readonly measure: readonly (number | null)[];
  readonly inputs: readonly (readonly number[])[];
  readonly value: readonly number[];
}
export type AnyCondition = Condition<InputSpecs>;

/**
 * The conditions bulk tools check, in summary order (warnings first, then
 * cautions, each in definition order), with their kinds. Warnings without
 * `when` never apply (the rule of `formula.notes`), so they are left out.
 */
export function noteConditions(formula: AnyFormula): { conditions: AnyCondition[]; kinds: ("warning" | "caution")[] } {
  const def = formula.definition;
  const validity = ((def.validity ?? []) as readonly AnyCondition[]).filter((c) => c.when !== undefined);
  const cautions = (def.cautions ?? []) as readonly AnyCondition[];
  return {
    conditions: [...validity, ...cautions],
    kinds: [...validity.map(() => "warning" as const), ...cautions.map(() => "caution" as const)],
  };
}

/**
 * The summary of one condition from its count and worst point. `x` must hold
 * the worst point's inputs (the message is built from it, then passed
 * through inWords); `inputs` are the varied ones to report.
 */
export function noteSummary(
  cond: AnyCondition, kind: "warning" | "caution", count: number, index: number, measure: number,
  inputs: Record<string, number>, x: Readonly<Record<string, unknown>>, value: Value,
): NoteSummary {
  const message = inWords(typeof cond.message === "function" ? cond.message(x as never, value) : cond.message);
  return { code: cond.code, kind, count, worst: { index, inputs, ...(cond.measure !== undefined && measure - measure === 0 ? { measure } : {}), message } };
}

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
  // Preallocated per condition and overwritten in place: on a monotonic grid
  // every point can be a new worst, and an allocation per point would cost
  // more than the conditions themselves.
  private readonly worstInputs: Float64Array[];
  private readonly worstScalar: Float64Array;
  private readonly worstArray: number[][];

  /**
   * @param formula whose conditions are collected
   * @param names the varied inputs, whose values are recorded at the worst point
   */
  constructor(formula: AnyFormula, private readonly names: readonly string[]) {
    ({ conditions: this.conditions, kinds: this.kinds } = noteConditions(formula));
    const n = this.conditions.length;
    this.counts = new Array<number>(n).fill(0);
    this.worstIndex = new Array<number>(n).fill(-1);
    this.worstMeasure = new Array<number>(n).fill(-Infinity);
    this.worstInputs = Array.from({ length: n }, () => new Float64Array(names.length));
    this.worstScalar = new Float64Array(n);
    this.worstArray = Array.from({ length: n }, () => []);
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
        const inputs = this.worstInputs[c]!;
        for (let i = 0; i < this.names.length; i++) inputs[i] = x[this.names[i]!] as number;
        if (typeof value === "number") this.worstScalar[c] = value;
        else {
          const arr = this.worstArray[c]!;
          arr.length = value.length;
          for (let i = 0; i < value.length; i++) arr[i] = value[i]!;
        }
      }
    }
  }

  /**
   * The collected counts and worst points as plain data (structured-clone and
   * JSON safe: a measure of -Infinity, "none yet", may come back as null), for
   * a worker or a shard to hand back. Scalar results only.
   */
  state(): CollectedNotes {
    return {
      counts: [...this.counts],
      index: [...this.worstIndex],
      measure: [...this.worstMeasure],
      inputs: this.worstInputs.map((a) => [...a]),
      value: [...this.worstScalar],
    };
  }

  /**
   * Adds the notes collected over later points (higher indices than any added
   * so far), as if those points had been added here one by one: counts add up,
   * and the later worst point wins only with a strictly larger measure (or when
   * none was found here), the rule of `add`. Scalar results only.
   */
  merge(later: CollectedNotes): void {
    for (let c = 0; c < this.conditions.length; c++) {
      const count = later.counts[c]!;
      if (count === 0) continue;
      this.counts[c]! += count;
      const m = later.measure[c] ?? -Infinity;
      if (this.worstIndex[c] === -1 || m > this.worstMeasure[c]!) {
        this.worstIndex[c] = later.index[c]!;
        if (m > this.worstMeasure[c]!) this.worstMeasure[c] = m;
        this.worstInputs[c]!.set(later.inputs[c]!);
        this.worstScalar[c] = later.value[c]!;
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
      const value: Value = this.worstArray[c]!.length > 0 ? this.worstArray[c]! : this.worstScalar[c]!;
      out.push(noteSummary(cond, this.kinds[c]!, this.counts[c]!, this.worstIndex[c]!, this.worstMeasure[c]!, inputs, x, value));
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
