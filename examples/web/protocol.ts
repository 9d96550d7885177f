// Messages between the page and the sweep worker (worker.ts).
import type { NoteSummary, SweepAxisSpec } from "emquant";

export interface SweepJob {
  readonly id: number;
  readonly formula: string;
  readonly input: string;
  readonly axis: SweepAxisSpec;
  /** The other inputs as typed in the form (unit strings, choice words, 3-arrays). */
  readonly fixed: Readonly<Record<string, unknown>>;
}

export interface SweepDone {
  readonly id: number;
  readonly ok: true;
  readonly input: string;
  readonly inputUnit: string;
  readonly scale: "linear" | "log";
  readonly x: Float64Array;
  readonly outputName: string;
  readonly outputDescription: string;
  readonly outputUnit: string;
  readonly y: Float64Array;
  readonly computed: Uint8Array;
  readonly notComputed: number;
  readonly notes: readonly NoteSummary[];
}

export interface SweepFailed {
  readonly id: number;
  readonly ok: false;
  readonly error: { readonly code: string; readonly message: string; readonly input?: string };
}

export type SweepReply = SweepDone | SweepFailed;
