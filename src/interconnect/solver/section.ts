/**
 * The cross-section input of the 2-D field solver: its public types, the
 * checks that turn bad input into coded errors, and the normalised geometry the
 * mesh is built from (every length divided by the largest conductor dimension:
 * capacitance per length depends only on ratios, and the log kernel then works
 * on numbers near 1 whatever the user's scale).
 */
import { FormulaError } from "../../core/errors.js";

/** A round wire: centre (x, y) and radius, in m. */
export interface RoundConductor {
  readonly x: number;
  readonly y: number;
  readonly radius: number;
}

/** A rectangular strip: centre line x, bottom face at height y, width and thickness (0 for a sheet), in m. */
export interface StripConductor {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly thickness: number;
}

export type SectionConductor = RoundConductor | StripConductor;

/** One dielectric layer, counted from the ground plane up. */
export interface DielectricLayer {
  /** Layer thickness in m. */
  readonly thickness: number;
  readonly relativePermittivity: number;
}

/**
 * A 2-D cross-section (uniform along the line). Heights are measured from the
 * ground plane (y = 0) when there is one.
 */
export interface CrossSection {
  readonly conductors: readonly SectionConductor[];
  /**
   * "none": conductors in an unbounded medium (at least two; their charges add up
   * to zero); "plane": a grounded plane at y = 0 below every conductor (default);
   * "two planes": grounded planes at y = 0 and y = groundSpacing (homogeneous only).
   */
  readonly ground?: "none" | "plane" | "two planes";
  /** Distance between the two planes, in m (ground "two planes" only). */
  readonly groundSpacing?: number;
  /** Dielectric layers from the ground plane up (ground "plane" only). */
  readonly layers?: readonly DielectricLayer[];
  /** Relative permittivity of the medium (above the layers, or everywhere): default 1. */
  readonly relativePermittivity?: number;
}

/** Most conductors in one cross-section. */
export const MAX_CONDUCTORS = 32;
/** Most dielectric layers. */
export const MAX_LAYERS = 16;

/** Two shapes closer than this (normalised units) count as touching. */
export const TOUCH = 1e-9;

export interface NormRound {
  readonly kind: "round";
  readonly x: number;
  readonly y: number;
  readonly r: number;
}
export interface NormStrip {
  readonly kind: "strip";
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
}
export type NormConductor = NormRound | NormStrip;

/** A horizontal boundary between two permittivities. */
export interface Interface {
  readonly h: number;
  readonly below: number;
  readonly above: number;
}

export interface NormSection {
  readonly conductors: readonly NormConductor[];
  readonly ground: "none" | "plane" | "two planes";
  /** Upper plane height (normalised), two planes only. */
  readonly spacing: number;
  readonly interfaces: readonly Interface[];
  /** Layer tops (normalised) and permittivities, bottom up; `top` above them. */
  readonly layerTops: readonly number[];
  readonly layerEps: readonly number[];
  readonly topEps: number;
  /** The length unit used (m). */
  readonly scale: number;
}

function fail(tool: string, input: string, value: unknown, detail: string): never {
  throw new FormulaError("invalid_argument", { formula: tool, input, value: typeof value === "number" || typeof value === "string" ? value : undefined, detail });
}

function finite(v: unknown, tool: string, input: string): number {
  if (typeof v !== "number" || v - v !== 0) fail(tool, input, v, "expected a finite number");
  return v;
}

function positive(v: unknown, tool: string, input: string): number {
  const x = finite(v, tool, input);
  if (!(x > 0)) fail(tool, input, x, "expected a positive number");
  return x;
}

/** Permittivity at height y (normalised). */
export function epsAt(s: NormSection, y: number): number {
  for (let i = 0; i < s.layerTops.length; i++) if (y < s.layerTops[i]!) return s.layerEps[i]!;
  return s.topEps;
}

/** Checks the section and returns it normalised; every failure names the input. */
export function readSection(section: CrossSection, tool: string): NormSection {
  if (typeof section !== "object" || section === null) fail(tool, "crossSection", undefined, "expected an object with a conductors list");
  const list = section.conductors;
  if (!Array.isArray(list) || list.length === 0) fail(tool, "crossSection.conductors", undefined, "expected a non-empty array of conductors");
  if (list.length > MAX_CONDUCTORS) fail(tool, "crossSection.conductors", list.length, `at most ${MAX_CONDUCTORS} conductors per cross-section`);
  const ground = section.ground ?? "plane";
  if (ground !== "none" && ground !== "plane" && ground !== "two planes") fail(tool, "crossSection.ground", ground as unknown, 'expected "none", "plane" or "two planes"');
  const topEpsRaw = section.relativePermittivity ?? 1;
  const topEps = positive(topEpsRaw, tool, "crossSection.relativePermittivity");
  const layers = section.layers ?? [];
  if (!Array.isArray(layers)) fail(tool, "crossSection.layers", undefined, "expected an array of { thickness, relativePermittivity }");
  if (layers.length > 0 && ground !== "plane") fail(tool, "crossSection.layers", undefined, 'dielectric layers need ground "plane" (they rest on it)');
  if (layers.length > MAX_LAYERS) fail(tool, "crossSection.layers", layers.length, `at most ${MAX_LAYERS} layers`);
  if (ground === "none" && list.length < 2) {
    fail(tool, "crossSection.conductors", list.length, 'without a ground a 2-D line needs at least two conductors (a lone conductor has no capacitance to infinity in 2-D); add a ground or a return conductor');
  }

  // Raw geometry, checked.
  type Raw = { kind: "round"; x: number; y: number; r: number } | { kind: "strip"; x: number; y: number; w: number; t: number };
  const raw: Raw[] = list.map((c, i) => {
    const at = `crossSection.conductors[${i}]`;
    if (typeof c !== "object" || c === null) fail(tool, at, undefined, "expected { x, y, radius } or { x, y, width, thickness }");
    const x = finite(c.x, tool, `${at}.x`);
    const y = finite(c.y, tool, `${at}.y`);
    if ("radius" in c) return { kind: "round", x, y, r: positive(c.radius, tool, `${at}.radius`) };
    if ("width" in c) {
      const w = positive(c.width, tool, `${at}.width`);
      const t = finite((c as StripConductor).thickness ?? 0, tool, `${at}.thickness`);
      if (t < 0) fail(tool, `${at}.thickness`, t, "expected 0 (a sheet) or a positive thickness");
      return { kind: "strip", x, y, w, t };
    }
    return fail(tool, at, undefined, "expected { x, y, radius } or { x, y, width, thickness }");
  });
  let scale = 0;
  for (const c of raw) scale = Math.max(scale, c.kind === "round" ? 2 * c.r : Math.max(c.w, c.t));
  const conductors: NormConductor[] = raw.map((c) =>
    c.kind === "round"
      ? { kind: "round", x: c.x / scale, y: c.y / scale, r: c.r / scale }
      : { kind: "strip", x0: (c.x - 0.5 * c.w) / scale, x1: (c.x + 0.5 * c.w) / scale, y0: c.y / scale, y1: (c.y + c.t) / scale },
  );
  // Extent check: the normalised geometry must stay where the kernels keep their digits.
  for (let i = 0; i < conductors.length; i++) {
    const c = conductors[i]!;
    const big = c.kind === "round" ? Math.max(Math.abs(c.x), Math.abs(c.y)) : Math.max(Math.abs(c.x0), Math.abs(c.x1), Math.abs(c.y1));
    const small = c.kind === "round" ? c.r : Math.max(c.x1 - c.x0, c.y1 - c.y0);
    if (big > 1e6 || small < 1e-6) fail(tool, `crossSection.conductors[${i}]`, undefined, "sizes and positions span more than 1e6 to 1 across the section; the solver resolves ratios up to 1e6");
  }

  // Layers.
  const layerTops: number[] = [];
  const layerEps: number[] = [];
  let top = 0;
  layers.forEach((l, i) => {
    const at = `crossSection.layers[${i}]`;
    if (typeof l !== "object" || l === null) fail(tool, at, undefined, "expected { thickness, relativePermittivity }");
    top += positive(l.thickness, tool, `${at}.thickness`) / scale;
    if (top > 1e6) fail(tool, `${at}.thickness`, l.thickness, "the layers are more than 1e6 times the largest conductor dimension");
    layerTops.push(top);
    layerEps.push(positive(l.relativePermittivity, tool, `${at}.relativePermittivity`));
  });
  const interfaces: Interface[] = [];
  for (let i = 0; i < layerTops.length; i++) {
    const below = layerEps[i]!;
    const above = i + 1 < layerEps.length ? layerEps[i + 1]! : topEps;
    if (below !== above) interfaces.push({ h: layerTops[i]!, below, above });
  }

  let spacing = Infinity;
  if (ground === "two planes") spacing = positive(section.groundSpacing, tool, "crossSection.groundSpacing") / scale;
  else if (section.groundSpacing !== undefined) fail(tool, "crossSection.groundSpacing", section.groundSpacing, 'only for ground "two planes"');

  const norm: NormSection = { conductors, ground, spacing, interfaces, layerTops, layerEps, topEps, scale };
  checkPlacement(norm, tool);
  return norm;
}

/** Distance from (px, py) to the rectangle [x0, x1] x [y0, y1] (0 inside). */
function rectDistance(px: number, py: number, s: NormStrip): number {
  const dx = Math.max(s.x0 - px, 0, px - s.x1);
  const dy = Math.max(s.y0 - py, 0, py - s.y1);
  return Math.hypot(dx, dy);
}

/** Largest distance from (px, py) to a corner of the rectangle. */
export function rectReach(px: number, py: number, s: NormStrip): number {
  return Math.hypot(Math.max(Math.abs(px - s.x0), Math.abs(px - s.x1)), Math.max(Math.abs(py - s.y0), Math.abs(py - s.y1)));
}

/** True when conductor `inner` lies strictly inside the round conductor `outer` (a shield). */
export function insideRound(inner: NormConductor, outer: NormRound): boolean {
  if (inner.kind === "round") return Math.hypot(inner.x - outer.x, inner.y - outer.y) + inner.r < outer.r - TOUCH;
  return rectReach(outer.x, outer.y, inner) < outer.r - TOUCH;
}

/** Conductors must not touch or overlap each other, the planes, or straddle an interface. */
function checkPlacement(s: NormSection, tool: string): void {
  const cs = s.conductors;
  for (let i = 0; i < cs.length; i++) {
    const a = cs[i]!;
    const at = `crossSection.conductors[${i}]`;
    const bottom = a.kind === "round" ? a.y - a.r : a.y0;
    const top = a.kind === "round" ? a.y + a.r : a.y1;
    if (s.ground !== "none" && !(bottom > TOUCH)) fail(tool, `${at}.y`, undefined, "the conductor touches or crosses the ground plane at y = 0 (it must lie above it)");
    if (s.ground === "two planes" && !(top < s.spacing - TOUCH)) fail(tool, `${at}.y`, undefined, "the conductor touches or crosses the upper plane (y = groundSpacing)");
    for (const f of s.interfaces) {
      if (a.kind === "round" && Math.abs(a.y - f.h) < a.r + TOUCH) fail(tool, at, undefined, "a round conductor must lie inside one dielectric layer, clear of the interfaces");
      if (a.kind === "strip" && a.y0 < f.h - TOUCH && a.y1 > f.h + TOUCH) fail(tool, at, undefined, "a strip may rest on or hang below a layer interface but not cross it");
    }
    for (let j = 0; j < i; j++) {
      const b = cs[j]!;
      if (a.kind === "round" && insideRound(b, a)) continue;
      if (b.kind === "round" && insideRound(a, b)) continue;
      let gap: number;
      if (a.kind === "round" && b.kind === "round") gap = Math.hypot(a.x - b.x, a.y - b.y) - a.r - b.r;
      else if (a.kind === "round") gap = rectDistance(a.x, a.y, b as NormStrip) - a.r;
      else if (b.kind === "round") gap = rectDistance(b.x, b.y, a) - b.r;
      else gap = Math.hypot(Math.max(a.x0 - b.x1, 0, b.x0 - a.x1), Math.max(a.y0 - b.y1, 0, b.y0 - a.y1));
      if (!(gap > TOUCH)) fail(tool, at, undefined, `conductors ${j} and ${i} touch or overlap (a conductor may only lie wholly inside a round one, as in a shield)`);
    }
  }
}
