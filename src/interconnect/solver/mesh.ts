/**
 * The mesh of a normalised cross-section: the charge elements and, for each,
 * what its row of the moment system says.
 *
 * - Strips of finite thickness: the outline, counter-clockwise, each side cut
 *   into panels graded towards the corners by cosine spacing (side fractions
 *   (1 - cos(pi k/n))/2), where the charge density is singular (like r^(-1/3)
 *   at a right-angled corner); `panels` on the longest side, N sqrt(side/longest)
 *   on the others. A sheet (thickness 0) is one line of `panels`
 *   panels, graded towards its edges, where the density goes like r^(-1/2).
 * - Round conductors: 2M + 1 Fourier modes, M chosen from how close the nearest
 *   other charge is (coefficients fall like rho^M, see `modeCount`).
 * - Dielectric interfaces: horizontal lines from 200 section-widths left to
 *   200 right, minus the faces of strips resting on them, with panels whose
 *   size grows in proportion to the distance from the nearest conductor corner,
 *   edge or surface (ratio `grading`), so the count grows only logarithmically
 *   with the truncation distance. Beyond it the polarisation charge falls like
 *   1/x^2 (the field of the line and its image is a dipole's) and its effect on
 *   the conductors like 1/x^4: truncating at 200 widths leaves about 1e-9.
 */
import { FormulaError } from "../../core/errors.js";
import { countLoop } from "../../math/loop-count.js";
import type { CircleMode, Element, Panel } from "./kernels.js";
import { epsAt, insideRound, type NormConductor, type NormSection, type NormStrip, rectReach, TOUCH } from "./section.js";

/** Most unknowns one solve may have: the dense LU costs n^3/3 (2500 -> about 5e9 operations, seconds). */
export const MAX_UNKNOWNS = 2500;
/** Most Fourier modes per round conductor (each adds two unknowns). */
export const MAX_MODES = 256;
/** Interfaces reach this many times the section's size beyond its conductors. */
export const TRUNCATION = 200;
/** Target size of the Fourier coefficients left out on a round conductor. */
const MODE_TOLERANCE = 1e-13;

/** What a row of the system states. */
export type RowKind =
  /** Potential at the panel's midpoint equals its conductor's voltage. */
  | { readonly kind: "conductor"; readonly conductor: number; readonly eps: number; readonly sheet: false }
  /** A sheet panel: like "conductor", with the permittivities above (+) and below (-). */
  | { readonly kind: "conductor"; readonly conductor: number; readonly sheet: true; readonly epsPlus: number; readonly epsMinus: number }
  /** One Fourier coefficient of the potential around circle `circle` (mode element's own index). */
  | { readonly kind: "circle"; readonly conductor: number; readonly circle: number; readonly eps: number }
  /** Normal D continuous across an interface panel. */
  | { readonly kind: "interface"; readonly below: number; readonly above: number };

export interface Mesh {
  readonly elements: Element[];
  readonly rows: RowKind[];
  /** Circles in order: their centre, radius, first element index and mode count. */
  readonly circles: { readonly cx: number; readonly cy: number; readonly r: number; readonly first: number; readonly modes: number; readonly conductor: number }[];
}

function tooBig(tool: string, n: number, input: string): never {
  throw new FormulaError("invalid_argument", {
    formula: tool,
    input,
    value: n,
    detail: `the mesh needs more than ${MAX_UNKNOWNS} unknowns (found ${n} so far); use fewer panels or modes, or a simpler section`,
  });
}

function panel(ax: number, ay: number, bx: number, by: number): Panel {
  return { kind: "panel", ax, ay, bx, by, length: Math.hypot(bx - ax, by - ay) };
}

/**
 * Modes for a round conductor: the potential induced on it by a charge at
 * distance D from its centre has Fourier coefficients falling like (R/D)^n, so
 * M = ln(tolerance)/ln(rho) with rho the largest R/D over the other charges (and
 * the images in planes, and the polarisation of interfaces, whose nearest
 * image lies at 2 |y - h| - R). Inside a shield the roles swap.
 */
function modeCount(s: NormSection, i: number): number {
  const c = s.conductors[i] as Extract<NormConductor, { kind: "round" }>;
  const R = c.r;
  let rho = 0;
  if (s.ground !== "none") rho = Math.max(rho, R / (2 * c.y - R));
  if (s.ground === "two planes") rho = Math.max(rho, R / (2 * (s.spacing - c.y) - R));
  for (const f of s.interfaces) rho = Math.max(rho, R / (2 * Math.abs(c.y - f.h) - R));
  s.conductors.forEach((o, j) => {
    if (j === i) return;
    if (o.kind === "round" && insideRound(c, o)) {
      rho = Math.max(rho, R / (o.r - Math.hypot(c.x - o.x, c.y - o.y)));
    } else if (insideRound(o, c)) {
      const reach = o.kind === "round" ? Math.hypot(o.x - c.x, o.y - c.y) + o.r : rectReach(c.x, c.y, o);
      rho = Math.max(rho, reach / R);
    } else {
      const d = o.kind === "round" ? Math.hypot(o.x - c.x, o.y - c.y) - o.r : rectDistance(c.x, c.y, o);
      rho = Math.max(rho, R / d);
    }
  });
  if (!(rho > 0)) return 0;
  if (!(rho < 1)) return MAX_MODES;
  return Math.min(MAX_MODES, Math.ceil(Math.log(MODE_TOLERANCE) / Math.log(rho)));
}

function rectDistance(px: number, py: number, s: NormStrip): number {
  return Math.hypot(Math.max(s.x0 - px, 0, px - s.x1), Math.max(s.y0 - py, 0, py - s.y1));
}

/** Cosine-graded points from a to b (n panels). */
function graded(n: number, k: number): number {
  return 0.5 * (1 - Math.cos((Math.PI * k) / n));
}

export interface MeshOptions {
  readonly panels: number;
  readonly modes: number | undefined;
}

export function buildMesh(s: NormSection, o: MeshOptions, tool: string): Mesh {
  const elements: Element[] = [];
  const rows: RowKind[] = [];
  const circles: Mesh["circles"] = [];
  const N = o.panels;
  let smallest = Infinity; // smallest conductor panel: the interface panels start at this size
  s.conductors.forEach((c, ci) => {
    if (c.kind === "round") {
      const M = o.modes ?? modeCount(s, ci);
      if (elements.length + 2 * M + 1 > MAX_UNKNOWNS) tooBig(tool, elements.length + 2 * M + 1, "options.modes");
      const eps = epsAt(s, c.y);
      const first = elements.length;
      for (let n = 0; n <= M; n++) {
        const base = { kind: "mode" as const, cx: c.x, cy: c.y, r: c.r, n };
        elements.push({ ...base, sine: false } satisfies CircleMode);
        rows.push({ kind: "circle", conductor: ci, circle: circles.length, eps });
        if (n > 0) {
          elements.push({ ...base, sine: true } satisfies CircleMode);
          rows.push({ kind: "circle", conductor: ci, circle: circles.length, eps });
        }
      }
      circles.push({ cx: c.x, cy: c.y, r: c.r, first, modes: M, conductor: ci });
      smallest = Math.min(smallest, (2 * Math.PI * c.r) / (4 * M + 8));
      return;
    }
    const w = c.x1 - c.x0;
    const t = c.y1 - c.y0;
    if (t === 0) {
      if (elements.length + N > MAX_UNKNOWNS) tooBig(tool, elements.length + N, "options.panels");
      const epsPlus = epsAt(s, c.y0 + TOUCH);
      const epsMinus = epsAt(s, c.y0 - TOUCH);
      for (let k = 0; k < N; k++) {
        elements.push(panel(c.x0 + w * graded(N, k), c.y0, c.x0 + w * graded(N, k + 1), c.y0));
        rows.push({ kind: "conductor", conductor: ci, sheet: true, epsPlus, epsMinus });
      }
      smallest = Math.min(smallest, w * graded(N, 1));
      return;
    }
    const longest = Math.max(w, t);
    const corners = [c.x0, c.y0, c.x1, c.y0, c.x1, c.y1, c.x0, c.y1, c.x0, c.y0];
    for (let side = 0; side < 4; side++) {
      const ax = corners[2 * side]!;
      const ay = corners[2 * side + 1]!;
      const bx = corners[2 * side + 2]!;
      const by = corners[2 * side + 3]!;
      const len = Math.hypot(bx - ax, by - ay);
      // Cosine grading with n panels puts an end panel of len (pi/n)^2/4 at each corner; n =
      // N sqrt(len/longest) matches it to the long side's, so a thin side refines with N too.
      const n = Math.max(2, Math.ceil(N * Math.sqrt(len / longest)));
      if (elements.length + n > MAX_UNKNOWNS) tooBig(tool, elements.length + n, "options.panels");
      smallest = Math.min(smallest, len * graded(n, 1));
      for (let k = 0; k < n; k++) {
        const f0 = graded(n, k);
        const f1 = graded(n, k + 1);
        const p = panel(ax + (bx - ax) * f0, ay + (by - ay) * f0, ax + (bx - ax) * f1, ay + (by - ay) * f1);
        // Outward normal of a counter-clockwise outline: (ty, -tx).
        const my = 0.5 * (p.ay + p.by) - ((bx - ax) / len) * TOUCH * 10;
        elements.push(p);
        rows.push({ kind: "conductor", conductor: ci, sheet: false, eps: epsAt(s, my) });
      }
    }
  });
  meshInterfaces(s, N, smallest, elements, rows, tool);
  return { elements, rows, circles };
}

/** Distance from a point on an interface to the nearest conductor feature (corner, edge end, surface). */
function featureDistance(s: NormSection, x: number, h: number): number {
  let d = Infinity;
  for (const c of s.conductors) {
    if (c.kind === "round") d = Math.min(d, Math.hypot(x - c.x, h - c.y) - c.r);
    else {
      for (const cx of [c.x0, c.x1]) for (const cy of [c.y0, c.y1]) d = Math.min(d, Math.hypot(x - cx, h - cy));
    }
  }
  return Math.max(d, 0);
}

function meshInterfaces(s: NormSection, N: number, hmin: number, elements: Element[], rows: RowKind[], tool: string): void {
  if (s.interfaces.length === 0) return;
  // Size of the section: conductor span and the height of the top interface.
  let xmin = Infinity;
  let xmax = -Infinity;
  let ytop = 0;
  for (const c of s.conductors) {
    xmin = Math.min(xmin, c.kind === "round" ? c.x - c.r : c.x0);
    xmax = Math.max(xmax, c.kind === "round" ? c.x + c.r : c.x1);
    ytop = Math.max(ytop, c.kind === "round" ? c.y + c.r : c.y1);
  }
  for (const f of s.interfaces) ytop = Math.max(ytop, f.h);
  const reach = TRUNCATION * (xmax - xmin + ytop);
  const grading = Math.min(0.5, 4 / N);
  for (const f of s.interfaces) {
    // Where an interface meets a thick strip's corner (conductor, dielectric and air at one
    // point) its bound charge is more singular than the conductor's: panels starting at the
    // conductor's smallest size held a thick strip on a substrate to order 1.2-1.5 (measured);
    // starting at 1/64 of it restores about 2 for some 40 more panels. Sheet edges on an
    // interface converge at order 2 without it (measured), so they keep hmin.
    const thickCorner = s.conductors.some((c) => c.kind === "strip" && c.y1 > c.y0 && (Math.abs(c.y0 - f.h) <= TOUCH || Math.abs(c.y1 - f.h) <= TOUCH));
    const start = thickCorner ? hmin / 64 : hmin;
    // Pieces of the line not covered by strip faces resting on (or hanging from) it.
    const covered: [number, number][] = [];
    for (const c of s.conductors) {
      if (c.kind === "strip" && (Math.abs(c.y0 - f.h) <= TOUCH || Math.abs(c.y1 - f.h) <= TOUCH)) covered.push([c.x0, c.x1]);
    }
    covered.sort((a, b) => a[0] - b[0]);
    const pieces: [number, number][] = [];
    let from = xmin - reach;
    for (const [a, b] of covered) {
      if (a > from) pieces.push([from, a]);
      from = Math.max(from, b);
    }
    pieces.push([from, xmax + reach]);
    for (const [a, b] of pieces) {
      // Walk from each end of the piece to its middle, so a mirror-symmetric
      // section gets a mirror-symmetric mesh. A step s from x keeps
      // s <= grading * D(x + s) when s <= grading * D(x) / (1 + grading) (D is
      // 1-Lipschitz), so panels shrink geometrically towards a feature and
      // grow geometrically away from it, never below `start`. Bound: every step
      // is at least `start` and the walk stops with an error once the unknowns
      // pass MAX_UNKNOWNS.
      const mid = 0.5 * (a + b);
      const left: number[] = [a];
      const right: number[] = [b];
      for (const [pts, dir] of [[left, 1], [right, -1]] as const) {
        let x = pts[0]!;
        let steps = 0;
        while (dir * (mid - x) > 0) {
          const step = Math.max(start, (grading * featureDistance(s, x, f.h)) / (1 + grading));
          x = dir * (mid - x) <= 1.5 * step ? mid : x + dir * step;
          pts.push(x);
          steps++;
          if (elements.length + left.length + right.length > MAX_UNKNOWNS) tooBig(tool, elements.length + left.length + right.length, "options.panels");
        }
        countLoop(steps);
      }
      right.pop(); // mid, already the last point of `left`
      const xs = left.concat(right.reverse());
      for (let k = 0; k + 1 < xs.length; k++) {
        elements.push(panel(xs[k]!, f.h, xs[k + 1]!, f.h));
        rows.push({ kind: "interface", below: f.below, above: f.above });
      }
    }
  }
}
