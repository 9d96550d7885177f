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
 */
import { EPSILON0, SPEED_OF_LIGHT } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";
import { countLoop } from "../math/loop-count.js";
import { gaussLegendre } from "../math/quadrature.js";
import { luFactor, luSolve } from "../math/lu.js";
import { type CircleMode, type Element, fieldY, potential, slabRemainder } from "./solver/kernels.js";
import { buildMesh, MAX_MODES, type Mesh } from "./solver/mesh.js";
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
const G8 = /* @__PURE__ */ gaussLegendre(8);

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

/** Quadrature nodes (x, y, weight) of an element, for the smooth part of the two-plane kernel. */
function remainderNodes(e: Element, spacing: number): Float64Array {
  if (e.kind === "panel") {
    // Sub-panels of at most a quarter of the spacing: S varies on the scale of the spacing.
    const parts = Math.max(1, Math.ceil((4 * e.length) / spacing));
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
  const K = Math.max(32, 4 * e.n + 16);
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

interface Assembled {
  readonly A: Float64Array;
  readonly n: number;
  readonly field: (j: number, px: number, py: number) => number;
}

function assemble(s: NormSection, mesh: Mesh): Assembled {
  const els = mesh.elements;
  const m = els.length;
  const ref = s.ground === "none";
  const n = m + (ref ? 1 : 0);
  const A = new Float64Array(n * n);
  const pot = makePotential(s, mesh);
  const field = makeField(s, mesh);
  let work = 0;
  for (let i = 0; i < m; i++) {
    const row = mesh.rows[i]!;
    if (row.kind === "circle") continue;
    const e = els[i]!;
    if (e.kind !== "panel") continue;
    const mx = 0.5 * (e.ax + e.bx);
    const my = 0.5 * (e.ay + e.by);
    const r = i * n;
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
    const K = Math.max(16, 4 * M + 8);
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

/** Solves the normalised section: the capacitance matrix over eps0 (dimensionless). */
function solveSection(s: NormSection, panels: number, modes: number | undefined, tool: string): { C: Float64Array; unknowns: number } {
  const mesh = buildMesh(s, { panels, modes }, tool);
  const { A, n, field } = assemble(s, mesh);
  const lu = luFactor(A, n);
  if (!(lu.pivotRatio > 1e-15)) {
    throw new FormulaError("out_of_range", { formula: tool, detail: "the moment system is numerically singular for this section (conductors nearly touching?)" });
  }
  const nc = s.conductors.length;
  const m = mesh.elements.length;
  const C = new Float64Array(nc * nc);
  // Vertical-field rows at sheet panels between two permittivities (for their free charge).
  const sheetField = new Map<number, Float64Array>();
  mesh.rows.forEach((row, i) => {
    if (row.kind === "conductor" && row.sheet && row.epsPlus !== row.epsMinus) {
      const e = mesh.elements[i]!;
      if (e.kind !== "panel") return;
      const f = new Float64Array(m);
      for (let j = 0; j < m; j++) f[j] = field(j, 0.5 * (e.ax + e.bx), e.ay);
      sheetField.set(i, f);
    }
  });
  const b = new Float64Array(n);
  for (let c = 0; c < nc; c++) {
    b.fill(0);
    mesh.rows.forEach((row, i) => {
      if (row.kind === "conductor" && row.conductor === c) b[i] = 1;
    });
    for (const circ of mesh.circles) if (circ.conductor === c) b[circ.first] = 1;
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

/** solveSection with the options applied (Richardson extrapolation over N and 2N panels when asked). */
function solveWith(s: NormSection, o: Options, tool: string): { C: Float64Array; unknowns: number } {
  const first = solveSection(s, o.panels, o.modes, tool);
  if (!o.extrapolate) return first;
  const fine = solveSection(s, 2 * o.panels, o.modes, tool);
  const C = fine.C.map((v, i) => (4 * v - first.C[i]!) / 3);
  return { C, unknowns: fine.unknowns };
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
 * // ≈ [1.2075e-11, -1.2075e-11, -1.2075e-11, 1.2075e-11] F/m
 */
export function lineCapacitance(crossSection: CrossSection, options?: FieldSolverOptions): LineCapacitanceResult {
  const o = readOptions(options, TOOL);
  const s = readSection(crossSection, TOOL);
  const { C, unknowns } = solveWith(s, o, TOOL);
  for (let i = 0; i < C.length; i++) C[i] = C[i]! * EPSILON0;
  return { size: s.conductors.length, matrix: C, unknowns };
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
function withAir(section: CrossSection, options: FieldSolverOptions | undefined, tool: string): { C: Float64Array; air: Float64Array; s: NormSection } {
  const o = readOptions(options, tool);
  const s = readSection(section, tool);
  const { C } = solveWith(s, o, tool);
  let air: Float64Array;
  if (s.interfaces.length === 0) {
    // One medium everywhere: C is eps_r times its vacuum value.
    air = C.map((v) => v / s.topEps);
  } else {
    const vac: NormSection = { ...s, interfaces: [], layerEps: s.layerEps.map(() => 1), topEps: 1 };
    air = solveWith(vac, o, tool).C;
  }
  return { C, air, s };
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
 * // 50-ohm-class microstrip: 3 mm strip on 1.6 mm of eps_r 4.4
 * lineImpedance({ layers: [{ thickness: 1.6e-3, relativePermittivity: 4.4 }], conductors: [{ x: 0, y: 1.6e-3, width: 3e-3, thickness: 0 }] }).impedance; // ≈ 50 ohm
 */
export function lineImpedance(crossSection: CrossSection, options?: FieldSolverOptions): LineModeParameters {
  const tool = "lineImpedance";
  const { C, air, s } = withAir(crossSection, options, tool);
  const nc = s.conductors.length;
  if (s.ground !== "none" && nc === 1) return mode(C[0]!, air[0]!);
  if (s.ground === "none" && nc === 2) {
    // Go and return: the capacitance between the two, (C00 + C11 - C01 - C10)/4.
    const pair = (x: Float64Array): number => 0.25 * (x[0]! + x[3]! - x[1]! - x[2]!);
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
 */
export function coupledLineImpedances(crossSection: CrossSection, options?: FieldSolverOptions): { even: LineModeParameters; odd: LineModeParameters } {
  const tool = "coupledLineImpedances";
  const { C, air, s } = withAir(crossSection, options, tool);
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
  return { even: mode(c11 + c12, a11 + a12), odd: mode(c11 - c12, a11 - a12) };
}
