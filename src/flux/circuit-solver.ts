import { FormulaError } from "../core/errors.js";
import { countLoop } from "../math/loop-count.js";
import type { MagneticFlux, MagnetomotiveForce, Reluctance } from "../units/types.js";

/** One branch of a magnetic circuit: a reluctance between two nodes, with an optional MMF source. */
export interface MagneticBranch {
  /** Node the branch leaves (0 is the reference node). */
  readonly from: number;
  /** Node the branch enters. */
  readonly to: number;
  /** Total reluctance of the branch (core legs plus gaps in series), 1/H; > 0. */
  readonly reluctance: Reluctance;
  /** MMF (ampere-turns, N I) driving flux from `from` to `to` inside the branch; default 0. */
  readonly mmf?: MagnetomotiveForce;
}

/** A magnetic circuit: its branches; nodes are numbered 0 .. n-1, node 0 the reference. */
export interface MagneticCircuit {
  readonly branches: readonly MagneticBranch[];
}

/** The solution: flux in each branch (from -> to positive) and the magnetic potential of each node. */
export interface MagneticCircuitSolution {
  /** Flux in each branch, in branch order, positive from `from` to `to` (Wb). */
  readonly flux: readonly MagneticFlux[];
  /** Magnetic scalar potential of each node relative to node 0 (A). */
  readonly potential: readonly MagnetomotiveForce[];
}

/**
 * Most nodes a circuit may have (node numbers 0..999). The dense elimination
 * costs about n^3 / 3 operations: 3e8 at this size, a fraction of a second.
 */
export const MAX_NODES = 1000;
/** Most branches a circuit may have. */
export const MAX_BRANCHES = 100_000;

function bad(input: string, detail: string, value?: unknown): FormulaError {
  return new FormulaError("invalid_argument", { formula: "solveMagneticCircuit", input, value, detail });
}

/**
 * Solve a linear magnetic circuit of reluctances and MMF sources by nodal analysis.
 *
 * Each branch k carries flux Phi_k = (u_from - u_to + F_k) / R_k, where u are the nodes'
 * magnetic potentials (A), F_k the branch MMF (A-turns) and R_k its reluctance (1/H).
 * Flux is conserved at every node (sum of Phi leaving = 0), giving G u = s with
 * G the reluctance-reciprocal (permeance) Laplacian; node 0 is held at u = 0. This is
 * the magnetic analogue of Kirchhoff's laws (Hopkinson's law Phi = F / R).
 *
 * Validity: linear materials (fixed permeability, no saturation); leakage paths only
 * where given as branches.
 *
 * Limits: node numbers below MAX_NODES (1000) and at most MAX_BRANCHES (100,000)
 * branches, which bound every loop: the branch scans by the branch count, the
 * union-find walks by the node count, the elimination by n^3 / 3 for n nodes.
 *
 * Errors: FormulaError "invalid_argument" for non-integer or negative node numbers,
 * node numbers of MAX_NODES or more, more than MAX_BRANCHES branches, a
 * branch from a node to itself, a reluctance not finite and > 0, an MMF not finite, or
 * nodes not connected to node 0.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004)
 * (magnetic circuits); nodal analysis as for resistive networks.
 *
 * @example
 * // A winding of 100 A-turns on a core leg (R = 1e5 /H) feeding two parallel return legs (2e5 /H each):
 * solveMagneticCircuit({ branches: [
 *   { from: 0, to: 1, reluctance: 1e5 as Reluctance, mmf: 100 as Current },
 *   { from: 1, to: 0, reluctance: 2e5 as Reluctance },
 *   { from: 1, to: 0, reluctance: 2e5 as Reluctance },
 * ] }).flux; // ≈ [5e-4, 2.5e-4, 2.5e-4] Wb
 */
export function solveMagneticCircuit(circuit: MagneticCircuit): MagneticCircuitSolution {
  const branches = circuit?.branches;
  if (!Array.isArray(branches) || branches.length === 0) throw bad("branches", "give at least one branch");
  if (branches.length > MAX_BRANCHES) throw bad("branches", `at most ${MAX_BRANCHES} branches`, branches.length);
  let nodes = 1;
  for (let k = 0; k < branches.length; k++) {
    const b = branches[k] as MagneticBranch;
    const where = `branches[${k}]`;
    if (typeof b !== "object" || b === null) throw bad(where, "each branch is an object { from, to, reluctance, mmf? }");
    for (const key of ["from", "to"] as const) {
      const n = b[key];
      if (typeof n !== "number" || !Number.isInteger(n) || n < 0 || n >= MAX_NODES) {
        throw bad(`${where}.${key}`, `node numbers are whole numbers from 0 to ${MAX_NODES - 1}`, n);
      }
      nodes = Math.max(nodes, n + 1);
    }
    if (b.from === b.to) throw bad(where, "a branch must join two different nodes", b.from);
    if (typeof b.reluctance !== "number" || !(b.reluctance > 0) || b.reluctance === Infinity) {
      throw bad(`${where}.reluctance`, "reluctance must be finite and > 0", b.reluctance);
    }
    if (b.mmf !== undefined && (typeof b.mmf !== "number" || b.mmf - b.mmf !== 0)) {
      throw bad(`${where}.mmf`, "mmf must be a finite number", b.mmf);
    }
  }
  // Every node must reach node 0 through branches, or its potential is undefined.
  const parent = Array.from({ length: nodes }, (_, i) => i);
  // Each walk climbs a tree of at most `nodes` members, so it ends within `nodes` steps;
  // with path halving all walks together take O((branches + nodes) log nodes) steps.
  let climbs = 0;
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]!]!;
      i = parent[i]!;
      climbs++;
    }
    return i;
  };
  for (const b of branches) parent[find(b.from)] = find(b.to);
  for (let i = 1; i < nodes; i++) {
    if (find(i) !== find(0)) throw bad("branches", `node ${i} is not connected to node 0`, i);
  }
  countLoop(climbs);

  // Scale permeances by the largest so the matrix entries are O(1) whatever the units.
  let pMax = 0;
  for (const b of branches) pMax = Math.max(pMax, 1 / b.reluctance);
  const n = nodes - 1; // unknowns: potentials of nodes 1 .. nodes-1
  const a = new Float64Array(n * n);
  const s = new Float64Array(n);
  for (const b of branches) {
    const p = 1 / b.reluctance / pMax;
    const f = b.mmf ?? 0;
    const i = b.from - 1;
    const j = b.to - 1;
    // Flux leaving `from`: p (u_i - u_j + f); conservation: sum over branches = 0.
    if (i >= 0) {
      a[i * n + i]! += p;
      if (j >= 0) a[i * n + j]! -= p;
      s[i]! -= p * f;
    }
    if (j >= 0) {
      a[j * n + j]! += p;
      if (i >= 0) a[j * n + i]! -= p;
      s[j]! += p * f;
    }
  }
  const u = solveDense(a, s, n);
  const flux: number[] = [];
  for (const b of branches) {
    const ui = b.from === 0 ? 0 : u[b.from - 1]!;
    const uj = b.to === 0 ? 0 : u[b.to - 1]!;
    flux.push((ui - uj + (b.mmf ?? 0)) / b.reluctance);
  }
  for (const v of flux) if (v - v !== 0) throw new FormulaError("out_of_range", { formula: "solveMagneticCircuit" });
  return { flux: flux as MagneticFlux[], potential: [0, ...u] as MagnetomotiveForce[] };
}

/** Gaussian elimination with partial pivoting on a dense n x n system (the permeance matrix is SPD). */
function solveDense(a: Float64Array, b: Float64Array, n: number): number[] {
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r * n + c]!) > Math.abs(a[piv * n + c]!)) piv = r;
    if (piv !== c) {
      for (let k = 0; k < n; k++) {
        const t = a[c * n + k]!;
        a[c * n + k] = a[piv * n + k]!;
        a[piv * n + k] = t;
      }
      const t = b[c]!;
      b[c] = b[piv]!;
      b[piv] = t;
    }
    const d = a[c * n + c]!;
    for (let r = c + 1; r < n; r++) {
      const factor = a[r * n + c]! / d;
      if (factor === 0) continue;
      for (let k = c; k < n; k++) a[r * n + k]! -= factor * a[c * n + k]!;
      b[r]! -= factor * b[c]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let sum = b[r]!;
    for (let k = r + 1; k < n; k++) sum -= a[r * n + k]! * x[k]!;
    x[r] = sum / a[r * n + r]!;
  }
  countLoop(n); // elimination columns; the inner loops are fixed by n
  return x;
}
