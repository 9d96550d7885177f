// Runs sweeps off the page's thread, so a large sweep never freezes the page.
// One job at a time; the page drops replies to jobs it no longer waits for.
import { FormulaError, sweepRequest } from "emquant";
import type { SweepJob, SweepReply } from "./protocol.js";

// The worker's global, typed by hand: the DOM and WebWorker libs cannot be loaded together.
const scope = self as unknown as {
  onmessage: ((event: MessageEvent<SweepJob>) => void) | null;
  postMessage(message: SweepReply, transfer?: Transferable[]): void;
};

scope.onmessage = (event) => {
  const job = event.data;
  let reply: SweepReply;
  try {
    const r = sweepRequest({ formula: job.formula, vary: { [job.input]: job.axis }, fixed: job.fixed });
    const axis = r.axes[0]!;
    // The result's arrays are views into one buffer: copy each out so they travel (transfer) apart.
    const x = axis.values.slice();
    const y = r.output.values.slice();
    const computed = r.computed.slice();
    reply = {
      id: job.id, ok: true, input: axis.name, inputUnit: axis.unit, scale: axis.scale, x,
      outputName: r.output.name, outputDescription: r.output.description, outputUnit: r.output.unit, y,
      computed, notComputed: r.notComputed, notes: r.notes,
    };
    scope.postMessage(reply, [x.buffer, y.buffer, computed.buffer]);
    return;
  } catch (e) {
    const error = e instanceof FormulaError
      ? { code: e.code, message: e.message, ...(e.input !== undefined ? { input: e.input } : {}) }
      : { code: "internal", message: e instanceof Error ? e.message : String(e) };
    reply = { id: job.id, ok: false, error };
  }
  scope.postMessage(reply);
};
