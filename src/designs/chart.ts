import { axisTitle, axisUnit, largestMagnitude } from "../tools/axis-units.js";
import type { DesignSweepResult } from "./tools.js";

// One design output against one swept input, as a self-contained SVG for the
// HTML report: no scripts, no fonts to fetch, axes in engineering units, and
// the points where a check fails drawn in red so a reviewer sees the margin.

const W = 560;
const H = 300;
const M = { left: 64, right: 16, top: 16, bottom: 44 };

const esc = (s: string): string => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
const fmt = (v: number): string => String(Number(v.toPrecision(3)));

// About five ticks at 1, 2 or 5 times a power of ten (Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990).
function ticks(lo: number, hi: number): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / 5;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const out: number[] = [];
  for (let t = Math.ceil(lo / step) * step, k = 0; t <= hi + step * 1e-9 && k < 20; t += step, k++) out.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return out;
}

/** The SVG of `output` along a design sweep; points failing any check are red. Undefined when nothing computed. */
export function sweepChartSvg(sweep: DesignSweepResult, output: string): string | undefined {
  const o = sweep.outputs.find((x) => x.name === output);
  if (!o) return undefined;
  const pts: { x: number; y: number; ok: boolean }[] = [];
  sweep.values.forEach((x, k) => {
    const y = o.values[k];
    if (y !== null && y !== undefined) pts.push({ x, y, ok: sweep.checks.every((c) => c.pass[k]) });
  });
  if (pts.length === 0) return undefined;
  const ux = axisUnit(sweep.unit, largestMagnitude(pts.map((p) => p.x)));
  const uy = axisUnit(o.unit, largestMagnitude(pts.map((p) => p.y)));
  const xs = pts.map((p) => p.x / ux.factor);
  const ys = pts.map((p) => p.y / uy.factor);
  const [x0, x1] = [Math.min(...xs), Math.max(...xs)];
  let [y0, y1] = [Math.min(...ys), Math.max(...ys)];
  if (y0 === y1) [y0, y1] = [y0 - 1, y1 + 1];
  const ty = ticks(y0, y1);
  [y0, y1] = [Math.min(y0, ty[0]!), Math.max(y1, ty.at(-1)!)];
  const sx = (v: number): number => M.left + ((v - x0) / (x1 - x0 || 1)) * (W - M.left - M.right);
  const sy = (v: number): number => H - M.bottom - ((v - y0) / (y1 - y0)) * (H - M.top - M.bottom);
  const path = xs.map((x, i) => `${i === 0 ? "M" : "L"}${sx(x).toFixed(1)},${sy(ys[i]!).toFixed(1)}`).join("");
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" font-family="sans-serif" font-size="11">`,
    `<title>${esc(`${output} against ${sweep.input}`)}</title>`,
    `<rect x="${M.left}" y="${M.top}" width="${W - M.left - M.right}" height="${H - M.top - M.bottom}" fill="none" stroke="#888"/>`,
  ];
  for (const t of ticks(x0, x1)) {
    const x = sx(t).toFixed(1);
    parts.push(`<line x1="${x}" x2="${x}" y1="${H - M.bottom}" y2="${H - M.bottom + 4}" stroke="#888"/>`, `<text x="${x}" y="${H - M.bottom + 16}" text-anchor="middle">${fmt(t)}</text>`);
  }
  for (const t of ty) {
    const y = sy(t).toFixed(1);
    parts.push(`<line x1="${M.left - 4}" x2="${M.left}" y1="${y}" y2="${y}" stroke="#888"/>`, `<text x="${M.left - 6}" y="${y}" text-anchor="end" dominant-baseline="middle">${fmt(t)}</text>`);
  }
  parts.push(
    `<path d="${path}" fill="none" stroke="#246" stroke-width="1.5"/>`,
    ...xs.map((x, i) => `<circle cx="${sx(x).toFixed(1)}" cy="${sy(ys[i]!).toFixed(1)}" r="2.5" fill="${pts[i]!.ok ? "#246" : "#c00"}"/>`),
    `<text x="${(M.left + W - M.right) / 2}" y="${H - 8}" text-anchor="middle">${esc(axisTitle(sweep.input, ux))}</text>`,
    `<text transform="translate(14 ${(M.top + H - M.bottom) / 2}) rotate(-90)" text-anchor="middle">${esc(axisTitle(output, uy))}</text>`,
    "</svg>",
  );
  return parts.join("\n");
}
