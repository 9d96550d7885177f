/**
 * 2-D field solver: the per-length capacitance matrix of a line's cross-section
 * by the method of moments (R. F. Harrington, Field Computation by Moment
 * Methods, 1968, ch. 1-2), and the line parameters that follow from it.
 *
 * Formulation (total charge in free space). Every dielectric is replaced by
 * its polarisation charge, so all charge radiates through the free-space log
 * kernel (src/interconnect/solver/kernels.ts) and the ground planes through
 * images. The unknowns are
 *  - the total (free plus bound) surface charge on the conductors: uniform on
 *    each straight panel of a strip, a Fourier series on each round conductor;
 *  - the bound charge on each dielectric interface (uniform per panel).
 * The equations are
 *  - on a conductor, the potential equals its voltage (at panel midpoints:
 *    point matching; on a circle: the Fourier coefficients of the potential,
 *    i.e. Galerkin testing with the same modes);
 *  - on an interface between eps_a (below) and eps_b (above), normal D is
 *    continuous: sigma/2 + E_pv (eps_b - eps_a)/(eps_a + eps_b) = 0, with E_pv
 *    the vertical field of all the other charge at the panel's midpoint
 *    (C. Wei, R. F. Harrington, J. R. Mautz and T. K. Sarkar, IEEE Trans.
 *    MTT-32 (1984) 439-450, the same boundary conditions).
 * The free charge on a conductor, which defines capacitance, is eps_r times the
 * total charge beside it; on a sheet between two permittivities each face is
 * counted apart: sigma_free = (eps+ + eps-)/2 sigma + (eps+ - eps-) E_pv.
 *
 * Reference. The 2-D log kernel has no zero at infinity: the potential of a
 * net line charge grows like -ln r. With a ground plane the images cancel every
 * charge's net part, so the potential is referred to the grounded plane(s).
 * Without a ground, the conductors' charges must add up to zero (a 2-D line's
 * capacitance to infinity is 0), and the potential at infinity is then finite
 * but unknown: it is one more unknown, V_inf, added to every potential
 * equation, and the extra equation is sum of charges = 0. The capacitance
 * matrix then has zero column sums (Q = C V with sum_k Q_k = 0).
 *
 * Solve: one dense LU with partial pivoting (src/math/lu.ts), one
 * back-substitution per conductor. The unknowns are capped at MAX_UNKNOWNS
 * (the LU costs n^3/3) and the call is refused above it.
 *
 * Long calls: every entry takes `signal` and `onProgress` in its options
 * (core/progress.ts). The meshes of all the call's solves (two with
 * `extrapolate`, twice that when a layered section is also solved in vacuum)
 * are built first; progress then counts work in multiply-adds of the LU:
 * (n - 1) n (2n - 1)/6 for the factorisation of n unknowns, n^2 per conductor
 * for the back-substitutions, and for the assembly 32 per kernel evaluation
 * (plus 64 per node of the two-plane remainder), a model of their measured
 * cost (solver/system.ts, solveWork). Ticks come before every assembled row (or
 * column of a circle's rows), every LU step and every back-substitution.
 */
import { EPSILON0, SPEED_OF_LIGHT } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";
import { cancelledError, type LongRunOptions, ticker } from "../core/progress.js";
import { countLoop } from "../math/loop-count.js";
import { buildMesh, MAX_MODES, type Mesh } from "./solver/mesh.js";
import { solveMesh, solveWork, WorkMeter } from "./solver/system.js";
import { type CrossSection, type NormSection, readSection } from "./solver/section.js";

export type { CrossSection, DielectricLayer, RoundConductor, SectionConductor, StripConductor } from "./solver/section.js";
export { MAX_CONDUCTORS, MAX_LAYERS } from "./solver/section.js";
export { MAX_MODES, MAX_UNKNOWNS, TRUNCATION } from "./solver/mesh.js";

export interface FieldSolverOptions {
  /**
   * Panels across the widest side of each strip (narrower sides in proportion,
   * at least 2); also sets the interface grading (default 32, 2..1000).
   */
  readonly panels?: number;
  /** Fourier modes per round conductor (default: chosen for 1e-13 from the geometry; 0..256). */
  readonly modes?: number;
  /**
   * Solve with `panels` and with twice as many and combine as (4 C(2N) - C(N))/3
   * (Richardson extrapolation): strips converge as N^-2 (measured), so this
   * removes the leading error term (default false).
   */
  readonly extrapolate?: boolean;
}

export interface LineCapacitanceResult {
  /** Number of conductors. */
  readonly size: number;
  /** Maxwell capacitance matrix in F/m, row-major: Q_i = sum_j C_ij V_j (per metre of line). */
  readonly matrix: Float64Array;
  /** Unknowns of the moment system. */
  readonly unknowns: number;
}

const TOOL = "lineCapacitance";

interface Options {
  readonly panels: number;
  readonly modes: number | undefined;
  readonly extrapolate: boolean;
}

function readOptions(o: FieldSolverOptions | undefined, tool: string): Options {
  const panels = o?.panels ?? 32;
  if (!Number.isInteger(panels) || panels < 2 || panels > 1000) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "options.panels", value: panels, detail: "a whole number 2..1000" });
  }
  const modes = o?.modes;
  if (modes !== undefined && (!Number.isInteger(modes) || modes < 0 || modes > MAX_MODES)) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "options.modes", value: modes, detail: `a whole number 0..${MAX_MODES}` });
  }
  const extrapolate = o?.extrapolate ?? false;
  if (typeof extrapolate !== "boolean") {
    throw new FormulaError("invalid_argument", { formula: tool, input: "options.extrapolate", detail: "true or false" });
  }
  return { panels, modes, extrapolate };
}

/**
 * The exact Maxwell matrix is symmetric (reciprocity: C_ij = C_ji), but point
 * matching is not a Galerkin method: the charge induced on j by a unit
 * potential on i and the charge on i by a unit potential on j come from
 * different rows of a non-symmetric system, and differ by the discretisation
 * error (measured up to 6e-3 relative at 8 panels, 2e-4 at 32, for unequal strips
 * on a substrate). Averaging the two keeps the error of the same order and gives
 * users (and the even/odd split of a pair) a symmetric matrix. Without ground the
 * exact matrix also has zero row and column sums (charge neutrality); the solve
 * gives zero column sums, and the average would move them by the discretisation
 * error, so the mean of each row and column is then taken out again
 * (S - r 1^T - 1 r^T + g 1 1^T, which keeps S symmetric). In place.
 */
function symmetrise(C: Float64Array, n: number, neutral: boolean): Float64Array {
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const m = 0.5 * C[i * n + j]! + 0.5 * C[j * n + i]!;
      C[i * n + j] = m;
      C[j * n + i] = m;
    }
  }
  countLoop(n * n);
  if (!neutral) return C;
  const r = new Float64Array(n);
  let g = 0;
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (let j = 0; j < n; j++) sum += C[i * n + j]!;
    r[i] = sum / n;
    g += r[i]! / n;
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) C[i * n + j] = C[i * n + j]! - r[i]! - r[j]! + g;
  countLoop(2 * n * n);
  return C;
}

/** A section with the meshes its solve needs: N panels, and 2N when extrapolating. */
interface Planned {
  readonly s: NormSection;
  readonly meshes: readonly Mesh[];
}

/** A signal aborted before the call ends it before the meshes are built (the ticker checks the rest). */
function abortedEarly(options: LongRunOptions | undefined, tool: string): void {
  const signal = options?.signal;
  if (signal?.aborted === true) throw cancelledError(tool, signal);
}

function plan(s: NormSection, o: Options, tool: string): Planned {
  const first = buildMesh(s, { panels: o.panels, modes: o.modes }, tool);
  return { s, meshes: o.extrapolate ? [first, buildMesh(s, { panels: 2 * o.panels, modes: o.modes }, tool)] : [first] };
}

/** The progress of a call over its planned solves (work counted by solveWork). */
function meter(tool: string, options: LongRunOptions | undefined, plans: readonly Planned[]): { meter: WorkMeter; finish: () => void } {
  // The ticker (which also refuses an aborted signal) needs the meshes' sizes; an abort
  // made before the call is refused before they are built, by abortedEarly.
  let total = 0;
  for (const p of plans) for (const m of p.meshes) total += solveWork(p.s, m);
  const t = ticker(tool, options, total);
  return { meter: new WorkMeter(t), finish: () => t.finish() };
}

/** The planned solve (Richardson extrapolation over N and 2N panels when planned), symmetrised. */
function solveWith(p: Planned, tool: string, w: WorkMeter): { C: Float64Array; unknowns: number } {
  const { s, meshes } = p;
  const n = s.conductors.length;
  const neutral = s.ground === "none";
  const first = solveMesh(s, meshes[0]!, tool, w);
  if (meshes.length === 1) return { C: symmetrise(first.C, n, neutral), unknowns: first.unknowns };
  const fine = solveMesh(s, meshes[1]!, tool, w);
  const C = fine.C.map((v, i) => (4 * v - first.C[i]!) / 3);
  return { C: symmetrise(C, n, neutral), unknowns: fine.unknowns };
}

/**
 * Per-length Maxwell capacitance matrix of a 2-D cross-section, by the method of moments.
 *
 * Conductors are round wires { x, y, radius } or rectangular strips { x, y,
 * width, thickness } (x the centre line, y the bottom face; thickness 0 for a
 * sheet), all in m. The medium is homogeneous (relativePermittivity), or
 * layered over a ground plane (layers from the plane up, relativePermittivity
 * above them); ground "none" (at least two conductors, charges summing to
 * zero), "plane" (y = 0, the default) or "two planes" (y = 0 and y =
 * groundSpacing, homogeneous). A round conductor may enclose others (a shield).
 *
 * Accuracy: round conductors converge geometrically (Fourier modes chosen for
 * about 1e-13; two-wire and coaxial sections match their closed forms to
 * rounding). Strips converge like panels^-2 with the cosine grading (measured
 * in tests/interconnect/field-solver.test.ts): a centred stripline sheet is low
 * by 6.5e-4 at the default 32 panels, 4e-5 at 128, and within 1e-6 with
 * `extrapolate` at 64. Interfaces are truncated at TRUNCATION times the
 * section's size (an effect of order 1e-9).
 *
 * Limits: at most MAX_UNKNOWNS (2500) unknowns, MAX_MODES modes per round
 * conductor, 32 conductors, 16 layers; sizes within a ratio of 1e6. Above them
 * a FormulaError "invalid_argument" names the input.
 *
 * @example
 * // two wires of radius 1 mm, centres 10 mm apart, in air
 * lineCapacitance({ ground: "none", conductors: [{ x: 0, y: 0, radius: 1e-3 }, { x: 0.01, y: 0, radius: 1e-3 }] }).matrix;
 * // ≈ [1.2134e-11, -1.2134e-11, -1.2134e-11, 1.2134e-11] F/m = pi eps0 / acosh(5)
 */
export function lineCapacitance(crossSection: CrossSection, options?: FieldSolverOptions & LongRunOptions): LineCapacitanceResult {
  const o = readOptions(options, TOOL);
  const s = readSection(crossSection, TOOL);
  abortedEarly(options, TOOL);
  const p = plan(s, o, TOOL);
  const progress = meter(TOOL, options, [p]);
  const { C, unknowns } = solveWith(p, TOOL, progress.meter);
  for (let i = 0; i < C.length; i++) C[i] = C[i]! * EPSILON0;
  progress.finish();
  return { size: p.s.conductors.length, matrix: C, unknowns };
}

/** Parameters of one propagating mode of a lossless line. */
export interface LineModeParameters {
  /** Capacitance per length, F/m. */
  readonly capacitance: number;
  /** The same with every dielectric replaced by vacuum, F/m. */
  readonly airCapacitance: number;
  /** C / C_air. */
  readonly effectivePermittivity: number;
  /** Z0 = 1 / (c sqrt(C C_air)), ohm. */
  readonly impedance: number;
}

/** The capacitance matrices of the section and of the same section in vacuum (eps0 = 1 units). */
function withAir(
  section: CrossSection,
  options: (FieldSolverOptions & LongRunOptions) | undefined,
  tool: string,
): { C: Float64Array; air: Float64Array; s: NormSection; finish: () => void } {
  const o = readOptions(options, tool);
  const s = readSection(section, tool);
  abortedEarly(options, tool);
  const p = plan(s, o, tool);
  // One medium everywhere: C is eps_r times its vacuum value, no second solve.
  const vac = s.interfaces.length === 0 ? undefined : plan({ ...s, interfaces: [], layerEps: s.layerEps.map(() => 1), topEps: 1 }, o, tool);
  const progress = meter(tool, options, vac ? [p, vac] : [p]);
  const { C } = solveWith(p, tool, progress.meter);
  const air = vac ? solveWith(vac, tool, progress.meter).C : C.map((v) => v / s.topEps);
  return { C, air, s, finish: progress.finish };
}

function mode(c: number, cAir: number): LineModeParameters {
  return {
    capacitance: c * EPSILON0,
    airCapacitance: cAir * EPSILON0,
    effectivePermittivity: c / cAir,
    impedance: 1 / (SPEED_OF_LIGHT * EPSILON0 * Math.sqrt(c * cAir)),
  };
}

/**
 * Characteristic impedance, capacitance and effective permittivity of a
 * single line, from the field solver: one conductor over ground (ground
 * "plane" or "two planes"), or a pair without ground (go and return, e.g. a
 * wire in a round shield, or two wires).
 *
 * Z0 = 1/(c sqrt(C C_air)) and eps_eff = C / C_air, C_air the capacitance of the
 * same section in vacuum (quasi-TEM: exact for a homogeneous medium, the
 * low-frequency limit for a layered one).
 *
 * @example
 * // microstrip: 3 mm strip on 1.6 mm of eps_r 4.4
 * lineImpedance({ layers: [{ thickness: 1.6e-3, relativePermittivity: 4.4 }], conductors: [{ x: 0, y: 1.6e-3, width: 3e-3, thickness: 0 }] }).impedance; // ≈ 50.6 ohm
 */
export function lineImpedance(crossSection: CrossSection, options?: FieldSolverOptions & LongRunOptions): LineModeParameters {
  const tool = "lineImpedance";
  const { C, air, s, finish } = withAir(crossSection, options, tool);
  const nc = s.conductors.length;
  if (s.ground !== "none" && nc === 1) {
    finish();
    return mode(C[0]!, air[0]!);
  }
  if (s.ground === "none" && nc === 2) {
    // Go and return: the capacitance between the two, (C00 + C11 - C01 - C10)/4.
    const pair = (x: Float64Array): number => 0.25 * (x[0]! + x[3]! - x[1]! - x[2]!);
    finish();
    return mode(pair(C), pair(air));
  }
  throw new FormulaError("invalid_argument", {
    formula: tool,
    input: "crossSection.conductors",
    value: nc,
    detail: "a single line is one conductor over ground, or two conductors without ground",
  });
}

/**
 * Even- and odd-mode parameters of a symmetric coupled pair over ground, from
 * the field solver: C_even = C11 + C12, C_odd = C11 - C12 (C12 < 0, the Maxwell
 * mutual term), each with its vacuum value, Z = 1/(c sqrt(C C_air)).
 *
 * @example
 * coupledLineImpedances({ layers: [{ thickness: 1.6e-3, relativePermittivity: 4.4 }],
 *   conductors: [{ x: -2e-3, y: 1.6e-3, width: 3e-3, thickness: 0 }, { x: 2e-3, y: 1.6e-3, width: 3e-3, thickness: 0 }] });
 * // even ≈ 58.4 ohm (eps_eff 3.57), odd ≈ 41.3 ohm (eps_eff 2.97)
 */
export function coupledLineImpedances(crossSection: CrossSection, options?: FieldSolverOptions & LongRunOptions): { even: LineModeParameters; odd: LineModeParameters } {
  const tool = "coupledLineImpedances";
  const { C, air, s, finish } = withAir(crossSection, options, tool);
  if (s.ground === "none" || s.conductors.length !== 2) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "crossSection.conductors", value: s.conductors.length, detail: "needs exactly two conductors over ground" });
  }
  const c11 = 0.5 * (C[0]! + C[3]!);
  const c12 = 0.5 * (C[1]! + C[2]!);
  if (Math.abs(C[0]! - C[3]!) > 1e-6 * c11) {
    throw new FormulaError("invalid_argument", { formula: tool, input: "crossSection.conductors", detail: "even and odd modes need a symmetric pair (equal self-capacitances)" });
  }
  const a11 = 0.5 * (air[0]! + air[3]!);
  const a12 = 0.5 * (air[1]! + air[2]!);
  finish();
  return { even: mode(c11 + c12, a11 + a12), odd: mode(c11 - c12, a11 - a12) };
}
