// The page: pick a formula, fill its generated form, compute with units, see
// warnings, cautions and sources, and plot a sweep of one input (in a worker).
import { catalogEntry, evaluate, formatQuantity, formulaCatalog, FormulaError, type CatalogEntry, type Note } from "emquant";
import { buildForm, exampleText, formValues, markInvalid } from "./form.js";
import { plotSweep } from "./plot.js";
import type { SweepJob, SweepReply } from "./protocol.js";

const $ = <T extends HTMLElement>(id: string): T => document.getElementById(id) as T;
const picker = $<HTMLSelectElement>("formula");
const form = $<HTMLFormElement>("form");
const result = $<HTMLDivElement>("result");
const sweepForm = $<HTMLFormElement>("sweep-form");
const sweepInput = $<HTMLSelectElement>("sweep-input");
const sweepFrom = $<HTMLInputElement>("sweep-from");
const sweepTo = $<HTMLInputElement>("sweep-to");
const sweepPoints = $<HTMLInputElement>("sweep-points");
const sweepLog = $<HTMLInputElement>("sweep-log");
const sweepStatus = $<HTMLParagraphElement>("sweep-status");
const plot = $<HTMLDivElement>("plot");

let entry: CatalogEntry;

// The formula list, grouped by category (the catalog is sorted by category, then id).
const catalog = formulaCatalog();
let group: HTMLOptGroupElement | undefined;
for (const f of catalog) {
  if (group?.label !== f.category) {
    group = document.createElement("optgroup");
    group.label = f.category;
    picker.append(group);
  }
  group.append(new Option(`${f.title} (${f.id})`, f.id));
}

function listNotes(ul: HTMLElement, notes: readonly Note[], head: string): void {
  ul.replaceChildren(...notes.map((n) => {
    const li = document.createElement("li");
    li.dataset.code = n.code;
    li.textContent = `${head} [${n.code}]: ${n.message}`;
    return li;
  }));
}

function select(id: string): void {
  entry = catalogEntry(id);
  picker.value = id;
  $("title").textContent = entry.title;
  $("description").textContent = entry.description;
  $("equation").textContent = entry.equation;
  buildForm(form, entry);
  $("sources").replaceChildren(...entry.sources.map((s) => {
    const li = document.createElement("li");
    li.textContent = `${s.authors}${s.year ? ` (${s.year})` : ""}, ${s.title}${s.locator ? `, ${s.locator}` : ""}`;
    return li;
  }));
  result.className = "empty";
  result.textContent = "Press Compute.";
  delete result.dataset.value;
  listNotes($("cautions"), [], "");
  listNotes($("warnings"), [], "");
  // Only scalar quantity inputs can be swept.
  const sweepable = entry.inputs.filter((i) => i.kind === "quantity" && !i.vector);
  sweepInput.replaceChildren(...sweepable.map((i) => new Option(`${i.name}${i.unit ? ` (${i.unit})` : ""}`, i.name)));
  $("sweep-section").hidden = sweepable.length === 0;
  setSweepRange();
  plot.replaceChildren();
  sweepStatus.textContent = "";
  $("sweep-notes").replaceChildren();
  if (location.hash.slice(1) !== id) history.replaceState(null, "", `#${id}`);
}

/** Sweep range from the chosen input's example: half to twice it (a positive example), else blank. */
function setSweepRange(): void {
  const i = entry.inputs.find((x) => x.name === sweepInput.value);
  const ex = typeof i?.example === "number" ? i.example : typeof i?.default === "number" ? i.default : undefined;
  const unit = i?.unit ?? "";
  if (i && ex !== undefined && ex > 0) {
    const whole = i.domain?.integer === true;
    sweepFrom.value = formatQuantity(whole ? Math.max(1, Math.round(ex / 2)) : ex / 2, unit);
    sweepTo.value = formatQuantity(whole ? Math.round(ex * 2) : ex * 2, unit);
  } else {
    sweepFrom.value = i ? exampleText(i) : "";
    sweepTo.value = "";
  }
}

function compute(): void {
  try {
    const r = evaluate(entry.id, formValues(form, entry));
    markInvalid(form, undefined);
    result.className = "";
    result.dataset.value = JSON.stringify(r.value);
    result.dataset.unit = r.unit;
    const comps = entry.output.components;
    const line = (label: string, v: number) => {
      const div = document.createElement("div");
      const si = document.createElement("span");
      si.className = "si";
      si.textContent = `   (${v} ${r.unit})`;
      div.append(`${label} = ${formatQuantity(v, r.unit)}`, si);
      return div;
    };
    result.replaceChildren(...(Array.isArray(r.value)
      ? (r.value as number[]).map((v, k) => line(`${entry.output.description}, ${comps?.[k] ?? k}`, v))
      : [line(entry.output.description, r.value as number)]));
    listNotes($("cautions"), r.cautions, "CAUTION");
    listNotes($("warnings"), r.warnings, "warning");
  } catch (e) {
    if (!(e instanceof FormulaError)) throw e;
    markInvalid(form, e.input);
    result.className = "error";
    delete result.dataset.value;
    result.textContent = `${e.code}: ${e.message}`;
    listNotes($("cautions"), [], "");
    listNotes($("warnings"), [], "");
  }
}

// ---- sweeps, in a worker ----
const worker = new Worker(new URL("./worker.ts", import.meta.url), { type: "module" });
let jobId = 0;

function runSweep(): void {
  const input = sweepInput.value;
  const job: SweepJob = {
    id: ++jobId,
    formula: entry.id,
    input,
    axis: { from: sweepFrom.value.trim(), to: sweepTo.value.trim(), points: Number(sweepPoints.value), scale: sweepLog.checked ? "log" : "linear" },
    fixed: formValues(form, entry, input),
  };
  sweepStatus.textContent = `Computing ${job.axis.points} points...`;
  plot.setAttribute("aria-busy", "true");
  worker.postMessage(job);
}

worker.onmessage = (event: MessageEvent<SweepReply>) => {
  const r = event.data;
  if (r.id !== jobId) return; // an older job, superseded
  plot.removeAttribute("aria-busy");
  if (!r.ok) {
    sweepStatus.textContent = `${r.error.code}: ${r.error.message}`;
    markInvalid(form, r.error.input);
    return;
  }
  plot.replaceChildren(plotSweep({
    title: r.outputDescription, xName: r.input, xUnit: r.inputUnit, log: r.scale === "log", x: r.x,
    yName: r.outputName, yUnit: r.outputUnit, y: r.y, computed: r.computed,
  }));
  sweepStatus.textContent = `${r.x.length - r.notComputed} of ${r.x.length} points computed${r.notComputed ? ` (${r.notComputed} outside a domain or breaking a relation)` : ""}.`;
  const notes = [...r.notes.filter((n) => n.kind === "caution"), ...r.notes.filter((n) => n.kind === "warning")];
  $("sweep-notes").replaceChildren(...notes.map((n) => {
    const li = document.createElement("li");
    li.className = n.kind;
    li.textContent = `${n.kind === "caution" ? "CAUTION" : "warning"} [${n.code}] at ${n.count} of ${r.x.length - r.notComputed} points; ${n.worst.measure !== undefined ? "worst" : "first"} at ${r.input} = ${formatQuantity(n.worst.inputs[r.input]!, r.inputUnit)}: ${n.worst.message}`;
    return li;
  }));
};

// A worker that failed to load or crashed: say so instead of waiting forever.
worker.onerror = (event) => {
  plot.removeAttribute("aria-busy");
  sweepStatus.textContent = `The sweep worker failed: ${event.message || "could not start"}`;
};

picker.addEventListener("change", () => select(picker.value));
sweepInput.addEventListener("change", setSweepRange);
form.addEventListener("submit", (e) => { e.preventDefault(); compute(); });
sweepForm.addEventListener("submit", (e) => { e.preventDefault(); runSweep(); });
window.addEventListener("hashchange", () => {
  const id = location.hash.slice(1);
  if (id !== entry.id && catalog.some((f) => f.id === id)) select(id);
});

const start = location.hash.slice(1);
select(catalog.some((f) => f.id === start) ? start : catalog[0]!.id);
document.body.dataset.ready = "true";
