/**
 * The moment system of a normalised cross-section: assembly (potential rows,
 * Galerkin rows on circles, interface rows, the charge-sum row without ground),
 * the LU solve, and the free charges that make the capacitance matrix. The
 * formulation is described in src/interconnect/field-solver.ts.
 */
import { FormulaError } from "../../core/errors.js";
import type { Ticker } from "../../core/progress.js";
import { countLoop } from "../../math/loop-count.js";
import { gaussLegendre } from "../../math/quadrature.js";
import { luFactor, luSolve } from "../../math/lu.js";
import { type CircleMode, type Element, fieldY, potential, slabRemainder } from "./kernels.js";
import type { Mesh } from "./mesh.js";
import type { NormSection } from "./section.js";

const G8 = /* @__PURE__ */ gaussLegendre(8);

/** Sub-panels of a panel for the two-plane remainder: at most a quarter of the spacing each (S varies on that scale). */
function remainderParts(e: Element & { kind: "panel" }, spacing: number): number {
  return Math.max(1, Math.ceil((4 * e.length) / spacing));
}

/** Trapezoid points on a circle for the two-plane remainder of mode n. */
function remainderPoints(n: number): number {
  return Math.max(32, 4 * n + 16);
}

/** Quadrature nodes (x, y, weight) of an element, for the smooth part of the two-plane kernel. */
function remainderNodes(e: Element, spacing: number): Float64Array {
  if (e.kind === "panel") {
    const parts = remainderParts(e, spacing);
    const out = new Float64Array(parts * 8 * 3);
    let k = 0;
    for (let p = 0; p < parts; p++) {
      for (let q = 0; q < 8; q++) {
        const f = (p + 0.5 + 0.5 * G8.nodes[q]!) / parts;
        out[k++] = e.ax + (e.bx - e.ax) * f;
        out[k++] = e.ay + (e.by - e.ay) * f;
        out[k++] = (0.5 * G8.weights[q]! * e.length) / parts;
      }
    }
    return out;
  }
  // Trapezoid rule on the circle (spectral for the periodic analytic integrand).
  const K = remainderPoints(e.n);
  const out = new Float64Array(K * 3);
  for (let k = 0; k < K; k++) {
    const th = (2 * Math.PI * k) / K;
    out[3 * k] = e.cx + e.r * Math.cos(th);
    out[3 * k + 1] = e.cy + e.r * Math.sin(th);
    out[3 * k + 2] = ((2 * Math.PI * e.r) / K) * (e.sine ? Math.sin(e.n * th) : Math.cos(e.n * th));
  }
  return out;
}

/** Total potential (eps0 = 1) of element j at (px, py): free space, images, two-plane remainder. */
function makePotential(s: NormSection, mesh: Mesh): (j: number, px: number, py: number) => number {
  const els = mesh.elements;
  if (s.ground === "none") return (j, px, py) => potential(els[j]!, px, py);
  if (s.ground === "plane") return (j, px, py) => potential(els[j]!, px, py) - potential(els[j]!, px, -py);
  const b = s.spacing;
  const k = Math.PI / (2 * b);
  const lnK = Math.log(k);
  const nodes = els.map((e) => remainderNodes(e, b));
  return (j, px, py) => {
    const e = els[j]!;
    let v = potential(e, px, py) - potential(e, px, -py) - potential(e, px, 2 * b - py);
    const q = nodes[j]!;
    for (let i = 0; i < q.length; i += 3) v += q[i + 2]! * slabRemainder(px, py, q[i]!, q[i + 1]!, k, lnK);
    countLoop(q.length / 3);
    return v;
  };
}

/** Vertical field (eps0 = 1) of element j at (px, py), with its image in the ground plane. */
function makeField(s: NormSection, mesh: Mesh): (j: number, px: number, py: number) => number {
  const els = mesh.elements;
  if (s.ground === "none") return (j, px, py) => fieldY(els[j]!, px, py);
  // Image density -sigma(x, -y): its vertical field at p is +E_y(x, -y) of the original.
  return (j, px, py) => fieldY(els[j]!, px, py) + fieldY(els[j]!, px, -py);
}

/*
 * Work count for progress (core/progress.ts), in units of one multiply-add of the
 * elimination. Measured on this machine (tsx, loaded, 2026-12-03): one panel's
 * potential with its image costs about 40 multiply-adds of the LU's inner loop
 * (270 ns against 6.6 ns), one node of the two-plane remainder about 70; so a
 * kernel evaluation counts KERNEL_WORK, each remainder node REMAINDER_WORK more. The count is a model of
 * time, not a measurement: the fraction it gives follows elapsed time to within a
 * factor of about 2 between the stages (assembly, LU, back-substitution).
 */
const KERNEL_WORK = 32;
const REMAINDER_WORK = 64;

/** Galerkin samples around a circle with M modes (assemble). */
function circleSamples(modes: number): number {
  return Math.max(16, 4 * modes + 8);
}

/** Work of evaluating element j's potential at one point (KERNEL_WORK, plus the two-plane remainder). */
function potentialWork(s: NormSection, e: Element): number {
  if (s.ground !== "two planes") return KERNEL_WORK;
  const nodes = e.kind === "panel" ? 8 * remainderParts(e, s.spacing) : remainderPoints(e.n);
  return KERNEL_WORK + REMAINDER_WORK * nodes;
}

/** Sheet panels between two permittivities: their free charge needs the field of every element at them. */
function isFieldSheet(row: Mesh["rows"][number], e: Element): boolean {
  return row.kind === "conductor" && row.sheet && row.epsPlus !== row.epsMinus && e.kind === "panel";
}

/** The whole work count of solveMesh for this mesh (the sum of what it reports). */
export function solveWork(s: NormSection, mesh: Mesh): number {
  const els = mesh.elements;
  const m = els.length;
  const n = m + (s.ground === "none" ? 1 : 0);
  let all = 0; // one potential of every element
  for (const e of els) all += potentialWork(s, e);
  let work = 0;
  let sheets = 0;
  for (let i = 0; i < m; i++) {
    // The rows assemble fills one by one (circle rows are filled by columns, below).
    const row = mesh.rows[i]!;
    if (row.kind === "circle" || els[i]!.kind !== "panel") continue;
    work += row.kind === "conductor" ? all : m * KERNEL_WORK;
    if (isFieldSheet(row, els[i]!)) sheets++;
  }
  for (const c of mesh.circles) {
    const K = circleSamples(c.modes);
    work += K * all + m * K * (2 * c.modes + 1);
  }
  work += sheets * m * KERNEL_WORK;
  work += ((n - 1) * n * (2 * n - 1)) / 6; // LU: sum over k of (n - k - 1)^2
  work += s.conductors.length * (n * n + sheets * m);
  return work;
}

/** The work done so far by a call's solves, reported to its Ticker before each chunk. */
export class WorkMeter {
  done = 0;
  constructor(private readonly ticker: Ticker) {}
  /** Reports the work so far (and checks for cancellation) before a chunk. */
  tick(): void {
    this.ticker.tick(this.done);
  }
}

export interface Assembled {
  readonly A: Float64Array;
  readonly n: number;
  readonly field: (j: number, px: number, py: number) => number;
}

export function assemble(s: NormSection, mesh: Mesh, meter?: WorkMeter): Assembled {
  const els = mesh.elements;
  const m = els.length;
  const ref = s.ground === "none";
  const n = m + (ref ? 1 : 0);
  const A = new Float64Array(n * n);
  const pot = makePotential(s, mesh);
  const field = makeField(s, mesh);
  let all = 0;
  if (meter) for (const e of els) all += potentialWork(s, e);
  let work = 0;
  for (let i = 0; i < m; i++) {
    const row = mesh.rows[i]!;
    if (row.kind === "circle") continue;
    const e = els[i]!;
    if (e.kind !== "panel") continue;
    const mx = 0.5 * (e.ax + e.bx);
    const my = 0.5 * (e.ay + e.by);
    const r = i * n;
    if (meter) {
      meter.tick();
      meter.done += row.kind === "conductor" ? all : m * KERNEL_WORK;
    }
    if (row.kind === "conductor") {
      for (let j = 0; j < m; j++) A[r + j] = pot(j, mx, my);
      if (ref) A[r + m] = 1;
    } else {
      // Scaled by (eps_b - eps_a)/(eps_a + eps_b), which keeps the row bounded as the two
      // permittivities approach each other (the bound charge then goes to 0).
      const contrast = (row.above - row.below) / (row.above + row.below);
      for (let j = 0; j < m; j++) A[r + j] = contrast * field(j, mx, my);
      A[r + i] = A[r + i]! + 0.5;
    }
    work += m;
  }
  for (const c of mesh.circles) {
    // Galerkin rows: Fourier coefficients of the potential on the circle, from
    // K equally spaced samples (exact for the modes up to K - M - 1).
    const M = c.modes;
    const K = circleSamples(M);
    const xs = new Float64Array(K);
    const ys = new Float64Array(K);
    const cosTab = new Float64Array((M + 1) * K);
    const sinTab = new Float64Array((M + 1) * K);
    for (let k = 0; k < K; k++) {
      const th = (2 * Math.PI * k) / K;
      xs[k] = c.cx + c.r * Math.cos(th);
      ys[k] = c.cy + c.r * Math.sin(th);
      for (let q = 0; q <= M; q++) {
        cosTab[q * K + k] = Math.cos(((q * k) % K) * ((2 * Math.PI) / K));
        sinTab[q * K + k] = Math.sin(((q * k) % K) * ((2 * Math.PI) / K));
      }
    }
    const vals = new Float64Array(K);
    for (let j = 0; j < m; j++) {
      if (meter) {
        meter.tick();
        meter.done += K * potentialWork(s, els[j]!) + K * (2 * M + 1);
      }
      for (let k = 0; k < K; k++) vals[k] = pot(j, xs[k]!, ys[k]!);
      let mean = 0;
      for (let k = 0; k < K; k++) mean += vals[k]!;
      A[c.first * n + j] = mean / K;
      for (let q = 1; q <= M; q++) {
        let cs = 0;
        let sn = 0;
        for (let k = 0; k < K; k++) {
          cs += vals[k]! * cosTab[q * K + k]!;
          sn += vals[k]! * sinTab[q * K + k]!;
        }
        A[(c.first + 2 * q - 1) * n + j] = (2 * cs) / K;
        A[(c.first + 2 * q) * n + j] = (2 * sn) / K;
      }
      work += K * (M + 2);
    }
    if (ref) A[c.first * n + m] = 1;
  }
  if (ref) {
    // Sum of the conductors' charges = 0 (one medium: eps_r drops out).
    const r = m * n;
    for (let j = 0; j < m; j++) {
      const e = els[j]!;
      A[r + j] = e.kind === "panel" ? e.length : e.n === 0 && !e.sine ? 2 * Math.PI * e.r : 0;
    }
  }
  countLoop(work);
  return { A, n, field };
}

/** Conductor c at 1 (in every row that sets its potential), the others at 0. */
export function rightHandSide(mesh: Mesh, c: number, b: Float64Array): void {
  b.fill(0);
  mesh.rows.forEach((row, i) => {
    if (row.kind === "conductor" && row.conductor === c) b[i] = 1;
  });
  for (const circ of mesh.circles) if (circ.conductor === c) b[circ.first] = 1;
}

/**
 * Solves the normalised section on a mesh (from buildMesh): the capacitance matrix over
 * eps0. With a meter, reports solveWork(s, mesh) in all, before each row or column of the
 * assembly, each step of the LU and each back-substitution.
 */
export function solveMesh(s: NormSection, mesh: Mesh, tool: string, meter?: WorkMeter): { C: Float64Array; unknowns: number } {
  const { A, n, field } = assemble(s, mesh, meter);
  const lu = luFactor(
    A,
    n,
    meter &&
      ((k) => {
        meter.tick();
        meter.done += (n - k - 1) * (n - k - 1);
      }),
  );
  if (!(lu.pivotRatio > 1e-15)) {
    throw new FormulaError("out_of_range", { formula: tool, detail: "the moment system is numerically singular for this section (conductors nearly touching?)" });
  }
  const nc = s.conductors.length;
  const m = mesh.elements.length;
  const C = new Float64Array(nc * nc);
  // Vertical-field rows at sheet panels between two permittivities (for their free charge).
  const sheetField = new Map<number, Float64Array>();
  mesh.rows.forEach((row, i) => {
    const e = mesh.elements[i]!;
    if (isFieldSheet(row, e) && e.kind === "panel") {
      if (meter) {
        meter.tick();
        meter.done += m * KERNEL_WORK;
      }
      const f = new Float64Array(m);
      for (let j = 0; j < m; j++) f[j] = field(j, 0.5 * (e.ax + e.bx), e.ay);
      sheetField.set(i, f);
    }
  });
  const b = new Float64Array(n);
  for (let c = 0; c < nc; c++) {
    if (meter) {
      meter.tick();
      meter.done += n * n + sheetField.size * m;
    }
    rightHandSide(mesh, c, b);
    luSolve(lu, b);
    for (let i = 0; i < m; i++) {
      const row = mesh.rows[i]!;
      const e = mesh.elements[i]!;
      let q = 0;
      if (row.kind === "conductor" && e.kind === "panel") {
        if (!row.sheet) q = row.eps * e.length * b[i]!;
        else {
          const f = sheetField.get(i);
          let epv = 0;
          if (f) for (let j = 0; j < m; j++) epv += f[j]! * b[j]!;
          q = e.length * (0.5 * (row.epsPlus + row.epsMinus) * b[i]! + (row.epsPlus - row.epsMinus) * epv);
        }
      } else if (row.kind === "circle" && (e as CircleMode).n === 0) {
        q = row.eps * 2 * Math.PI * (e as CircleMode).r * b[i]!;
      } else continue;
      C[row.conductor * nc + c] = C[row.conductor * nc + c]! + q;
    }
    countLoop(m * (sheetField.size + 1));
  }
  return { C, unknowns: n };
}

