// A sweep drawn as hand-written SVG: one line over the computed points (broken
// where points were not computed), dots when there are few, axes in
// engineering units chosen from the data (axisUnit), "nice" ticks.
import { axisTitle, axisUnit } from "emquant";

const W = 640;
const H = 380;
const M = { left: 72, right: 20, top: 34, bottom: 52 };
const SVG = "http://www.w3.org/2000/svg";

export interface PlotData {
  readonly title: string;
  readonly xName: string;
  readonly xUnit: string;
  readonly log: boolean;
  readonly x: Float64Array;
  readonly yName: string;
  readonly yUnit: string;
  readonly y: Float64Array;
  readonly computed: Uint8Array;
}

/** Ticks at 1, 2 or 5 times a power of ten, about `count` of them across [lo, hi]. */
export function linearTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const ticks: number[] = [];
  // At most count + 2 ticks: step >= (hi - lo) / count.
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return ticks;
}

/** Log ticks: 1, 2, 5 per decade across [lo, hi] (lo > 0); only the powers of ten when the span is wide. */
export function logTicks(lo: number, hi: number): number[] {
  const d0 = Math.floor(Math.log10(lo));
  const d1 = Math.ceil(Math.log10(hi));
  const mult = d1 - d0 > 4 ? [1] : [1, 2, 5];
  const ticks: number[] = [];
  // d1 - d0 decades, each with at most three ticks; a double spans at most ~630 decades.
  for (let d = d0; d <= d1; d++) for (const m of mult) {
    const t = m * 10 ** d;
    if (t >= lo * (1 - 1e-9) && t <= hi * (1 + 1e-9)) ticks.push(t);
  }
  return ticks;
}

/** A tick label: up to 4 significant digits, no trailing zeros, no exponent in the usual range. */
export function tickLabel(v: number): string {
  return String(Number(v.toPrecision(4)));
}

function el<K extends keyof SVGElementTagNameMap>(name: K, attrs: Record<string, string | number>, text?: string): SVGElementTagNameMap[K] {
  const e = document.createElementNS(SVG, name);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, String(v));
  if (text !== undefined) e.textContent = text;
  return e;
}

function range(values: ArrayLike<number>, use: ArrayLike<number> | undefined): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = 0; k < values.length; k++) {
    if (use !== undefined && use[k] !== 1) continue;
    lo = Math.min(lo, values[k]!);
    hi = Math.max(hi, values[k]!);
  }
  return [lo, hi];
}

/** The SVG element of a sweep plot. */
export function plotSweep(d: PlotData): SVGSVGElement {
  const maxAbs = (v: ArrayLike<number>, use?: ArrayLike<number>) => {
    const [lo, hi] = range(v, use);
    return Math.max(Math.abs(lo), Math.abs(hi));
  };
  const xu = axisUnit(d.xUnit, maxAbs(d.x));
  const yu = axisUnit(d.yUnit, maxAbs(d.y, d.computed));
  // Displayed values (engineering units).
  const xs = Array.from(d.x, (v) => v / xu.factor);
  const ys = Array.from(d.y, (v) => v / yu.factor);
  const [x0, x1] = range(xs, undefined);
  let [y0, y1] = range(ys, d.computed);
  if (y0 === y1) { y0 -= Math.abs(y0) * 0.1 || 1; y1 += Math.abs(y1) * 0.1 || 1; }
  // The y range widened to the ticks just outside the data, so both ends of the axis are labelled.
  const yt = linearTicks(y0, y1);
  const yStep = yt.length > 1 ? yt[1]! - yt[0]! : 0;
  if (yStep > 0) {
    // Snapped to 0 when rounding leaves a speck (0.1 - 0.1 as 1e-17).
    const snap = (t: number) => (Math.abs(t) < yStep * 1e-9 ? 0 : t);
    if (yt[0]! > y0) yt.unshift(snap(yt[0]! - yStep));
    if (yt[yt.length - 1]! < y1) yt.push(yt[yt.length - 1]! + yStep);
    y0 = yt[0]!;
    y1 = yt[yt.length - 1]!;
  }
  const log = d.log && x0 > 0;
  const xt = log ? logTicks(x0, x1) : linearTicks(x0, x1);
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const sx = (v: number) => M.left + (log ? Math.log(v / x0) / Math.log(x1 / x0 || 1) : x1 === x0 ? 0.5 : (v - x0) / (x1 - x0)) * pw;
  const sy = (v: number) => M.top + ph - ((v - y0) / (y1 - y0)) * ph;

  const svg = el("svg", { xmlns: SVG, viewBox: `0 0 ${W} ${H}`, width: W, height: H, role: "img", "aria-label": d.title });
  svg.append(el("rect", { x: 0, y: 0, width: W, height: H, fill: "#fff" }));
  svg.append(el("text", { x: W / 2, y: 20, "text-anchor": "middle", "font-weight": 600, "font-size": 14 }, d.title));
  const grid = el("g", { class: "grid", stroke: "#e3e6ea" });
  const labels = el("g", { class: "ticks", "font-size": 11, fill: "#333" });
  for (const t of xt) {
    const x = sx(t);
    grid.append(el("line", { x1: x, x2: x, y1: M.top, y2: M.top + ph }));
    labels.append(el("text", { x, y: M.top + ph + 16, "text-anchor": "middle" }, tickLabel(t)));
  }
  for (const t of yt) {
    const y = sy(t);
    grid.append(el("line", { x1: M.left, x2: M.left + pw, y1: y, y2: y }));
    labels.append(el("text", { x: M.left - 6, y: y + 4, "text-anchor": "end" }, tickLabel(t)));
  }
  svg.append(grid, labels);
  svg.append(el("rect", { x: M.left, y: M.top, width: pw, height: ph, fill: "none", stroke: "#888" }));
  svg.append(el("text", { class: "x-title", x: M.left + pw / 2, y: H - 12, "text-anchor": "middle", "font-size": 13 }, axisTitle(d.xName, xu)));
  svg.append(el("text", { class: "y-title", x: 0, y: 0, transform: `translate(16 ${M.top + ph / 2}) rotate(-90)`, "text-anchor": "middle", "font-size": 13 }, axisTitle(d.yName, yu)));

  // The line: a new subpath after every point not computed.
  let path = "";
  let pen = false;
  const dots = el("g", { class: "points", fill: "#1f5fa8" });
  const few = d.x.length <= 60;
  for (let k = 0; k < xs.length; k++) {
    if (d.computed[k] !== 1) { pen = false; continue; }
    const px = sx(xs[k]!).toFixed(2);
    const py = sy(ys[k]!).toFixed(2);
    path += `${pen ? "L" : "M"}${px},${py}`;
    pen = true;
    if (few) dots.append(el("circle", { cx: px, cy: py, r: 2.5 }));
  }
  if (path) svg.append(el("path", { class: "line", d: path, fill: "none", stroke: "#1f5fa8", "stroke-width": 2 }));
  svg.append(dots);
  return svg;
}
