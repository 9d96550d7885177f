// The coil geometries the coil-force accuracy tests cover, shared by the tests
// (tests/force/coils-offset.test.ts, coils-accuracy.test.ts) and the script that
// writes the oracle's values for them (tests/force/make-coils-fixture.ts), so the
// fixture holds exactly the cases the tests ask for.

/** Radius, length of coil 1, radius, length of coil 2, in m. */
export type Coils = readonly [a: number, l1: number, b: number, l2: number];
/** The same and the centre distance, in m. */
export type CoilsAt = readonly [a: number, l1: number, b: number, l2: number, d: number];

// --- nearly concentric coils (window oracle, tests/force/coils-offset-oracle.ts) ---

// Identical coils, equal radii with unequal lengths and the reverse, nested, flat sheets,
// lengths one ulp apart (turns of equal radii meeting |h1 - h2| = 2^-53 from the offset),
// radii 1e-9 apart, a short coil inside a long one.
export const OFFSET_GEOMETRIES: readonly Coils[] = [
  [1, 1, 1, 1],
  [1, 1, 1, 0.7],
  [1, 1, 0.8, 1],
  [1, 4, 0.5, 1],
  [1, 1e-3, 1, 1e-3],
  [1, 1, 1, 1 - 2 ** -52],
  [1, 1, 1 - 1e-9, 1 - 1e-9],
  [1, 100, 0.5, 0.01],
];
export const OFFSETS = [1e-2, 1e-5, 1e-10, 2.5e-20, 1e-200]; // of the first coil's length
/** Every geometry at every offset (the offset a fraction of the first length). */
export const OFFSET_CASES: readonly CoilsAt[] = OFFSET_GEOMETRIES.flatMap((c) => OFFSETS.map((r): CoilsAt => [...c, r * c[1]]));

/** Flat coils of unequal radii, lengths 1e-160 to 1e-300 of a radius, offsets 3, 0.5 and 1e-3 of the length. */
export const FLAT_CASES: readonly CoilsAt[] = [1e-160, 1e-200, 1e-300].flatMap((l) => [3, 0.5, 1e-3].map((r): CoilsAt => [1, l, 0.5, l, r * l]));

/** Where the window oracle is compared with its leading term (no quadrature). */
export const LEADING_CASES: readonly CoilsAt[] = ([[1, 1, 1, 1], [1, 4, 0.5, 1], [1, 1, 0.8, 1]] as const).flatMap((c) =>
  [1e-20, 1e-200].map((d): CoilsAt => [...c, d]));

/** Where the window oracle is compared with the double integral of the filament force (both converge). */
export const WINDOW_VS_DOUBLE: readonly CoilsAt[] = [[1, 1, 1, 1, 0.1], [1, 4, 0.5, 1, 1e-2], [1, 1, 0.8, 1, 1e-3], [1, 1, 1, 1, 1e-20]];

// --- coils anywhere (filament-force oracle, tests/force/coils-oracle.ts) ---

/** A region of the accuracy test: its cases, each also at the given scales (every length times the scale). */
export interface Region { readonly name: string; readonly cases: readonly CoilsAt[]; readonly scales: readonly number[] }

export const REGIONS = {
  nearTouching: { name: "near touching", scales: [1], cases: [
    [1, 1, 1, 0.7, 0.85 * (1 + 1e-3)],
    [1, 1, 1, 0.7, 0.85 * (1 + 1e-12)],
    [1, 1, 1, 0.7, 0.85], // touching: the windings meet at one plane
    [1, 1, 0.999, 0.7, 0.85 * (1 + 1e-6)],
    [1, 0.018336, 1, 1.5714, 0.794866], // overlapping by 2e-6
    [1, 23.2271, 1, 0.245359, 11.7362], // overlapping by 3e-5, long against short
  ] },
  differentRadii: { name: "different radii", scales: [1, 1e-200, 1e200], cases: [
    [1, 0.5, 1e-3, 0.5, 1],
    [1e-3, 0.5, 1, 0.5, 1],
    [1, 2, 1e-3, 0.5, 0.3],
    [1, 0.0054, 6236.2, 4.1276, 1.89973],
  ] },
  farApart: { name: "far apart", scales: [1, 1e-150], cases: [
    [1, 1, 0.8, 0.5, 1e3],
    [1, 1, 0.8, 0.5, 1e6],
    [1, 0.0039, 0.0025, 920.9, 4.161e6],
  ] },
  overlapping: { name: "overlapping", scales: [1], cases: [
    [1, 4, 0.5, 1, 0.5],
    [1, 4, 0.5, 1, 1e-3],
    [1, 4, 0.5, 1, 1e-8],
    [1, 171.06, 0.0311685, 0.0157482, 2.02992], // a short coil deep inside a long one
    [1, 910.035, 0.569725, 0.00322232, 436.875],
  ] },
  equalRadii: { name: "equal radii", scales: [1], cases: [
    [1, 1, 1, 1, 3],
    [1, 1, 1, 0.7, 0.3],
    [1, 1, 1, 0.7, 1e-6],
    [1, 511.984, 1, 8.42628, 216.49],
    [1, 1e-5, 1, 1e-5, 1e-20], // 1e-15 of a length off centre: the 1/v attraction below 1e-16 of the piece (was 1.6e-3 low)
  ] },
  differentLengths: { name: "different lengths", scales: [1], cases: [
    [1, 281.842, 32.2115, 0.102877, 281.487],
    [1, 420.31, 0.00166183, 23.7483, 261.077],
    [1, 1000, 0.5, 0.01, 1.5],
    [1, 1e4, 1, 1e4, 1e4],
  ] },
} as const satisfies Record<string, Region>;

/** A case at a scale, as the tests pass it: every length times the scale, in doubles. */
export const scaled = (c: CoilsAt, s: number): CoilsAt => c.map((v) => v * s) as unknown as CoilsAt;

/** Every region case at every scale. */
export const REGION_CASES: readonly CoilsAt[] = Object.values(REGIONS).flatMap((r: Region) => r.cases.flatMap((c) => r.scales.map((s) => scaled(c, s))));

/** Where the reduction is compared with the double integral of Babic and Akyel's force as written (separated coils). */
export const REDUCTION_CASES: readonly CoilsAt[] = [[1, 1, 0.8, 0.5, 2], [0.3, 0.2, 1, 0.6, 1.1]];
/** Where the oracle's convergence is checked (other orders, grading, tanh-sinh steps and digits). */
export const CONVERGENCE_CASES: readonly CoilsAt[] = [[1, 1, 1, 0.7, 0.3], [1, 1, 1, 0.7, 0.85 * (1 + 1e-9)], [1, 4, 0.5, 1, 1e-3]];
/** The other settings of the convergence check. */
export const CONVERGENCE_SETTINGS = { order: 32, grade: 0.2, step: 1 / 32, extraDigits: 8 } as const;
