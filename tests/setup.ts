import fc from "fast-check";

/**
 * Every property test runs from one fixed seed, so a run (CI above all) is
 * reproducible and cannot fail by the luck of the draw. FC_SEED=<number>
 * runs other cases; FC_SEED=random draws a new seed each run, for exploring.
 */
const seed = process.env.FC_SEED;
fc.configureGlobal(seed === "random" ? {} : { seed: Number(seed ?? 20261202) });
