// Compile-time checks of the tools' types (run by `npm run typecheck`).
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { solve, sweep, tolerance } from "../../src/tools/index.js";
import { quantity } from "../../src/units/quantity.js";
import type { Length } from "../../src/units/types.js";

const area = quantity(1, "cm^2");
const target = quantity(100, "pF");

// The result has the solved input's dimension.
const gap: Length = solve(parallelPlateCapacitance, "gap", { target, area });
void gap;

// @ts-expect-error the target must be a capacitance
solve(parallelPlateCapacitance, "gap", { target: quantity(1, "mm"), area });

// @ts-expect-error an input of the formula must be named
solve(parallelPlateCapacitance, "radius", { target, area });

// @ts-expect-error the other required inputs must be given
solve(parallelPlateCapacitance, "gap", { target });

// @ts-expect-error an input given with the wrong dimension
solve(parallelPlateCapacitance, "gap", { target, area: quantity(1, "mm") });

tolerance(parallelPlateCapacitance, { area: { nominal: "1 cm^2", percent: 1 }, gap: 1e-4 });
// @ts-expect-error unknown input name in a tolerance analysis
tolerance(parallelPlateCapacitance, { radius: 1 });

sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 5 } }, fixed: { area: 1e-4 } });
// @ts-expect-error only inputs of the formula can be swept
sweep(parallelPlateCapacitance, { vary: { radius: { from: 1, to: 2, points: 5 } } });

// Progress and cancellation: signal and onProgress in the options of the long calls.
const stop = new AbortController().signal;
sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 5 } } }, { signal: stop, onProgress: (p) => void p.fraction });
tolerance(parallelPlateCapacitance, { gap: { nominal: 1e-4, percent: 1 } }, { samples: 100, signal: stop });
// @ts-expect-error onProgress receives a Progress object, not a number
sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 5 } } }, { onProgress: (p: number) => void p });
// @ts-expect-error signal is an AbortSignal
tolerance(parallelPlateCapacitance, { gap: 1e-4 }, { signal: true });
