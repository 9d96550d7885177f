// The field of a cylindrical current sheet (solenoid, or a magnet's equivalent surface
// current) from the Biot-Savart solver: `loops` coaxial polygons of `sides` sides spread
// over the length by the midpoint rule, each carrying `current` (A), radius a, length l.
import { biotSavart } from "../../src/index.js";

export function stackedLoopsField(a: number, l: number, loops: number, sides: number, current: number, points: Float64Array): Float64Array {
  const total = new Float64Array(points.length);
  const path = new Float64Array(3 * (sides + 1));
  for (let k = 0; k < loops; k++) {
    const zk = -l / 2 + ((k + 0.5) * l) / loops;
    for (let i = 0; i <= sides; i++) {
      const t = (2 * Math.PI * i) / sides;
      path[3 * i] = a * Math.cos(t);
      path[3 * i + 1] = a * Math.sin(t);
      path[3 * i + 2] = zk;
    }
    const b = biotSavart(path, current, points);
    for (let j = 0; j < total.length; j++) total[j] = total[j]! + b[j]!;
  }
  return total;
}

/** Largest component error over the magnitude of the expected vector (a component near one of its zeros has no relative accuracy of its own). */
export function vectorError(got: readonly number[], want: readonly number[]): number {
  return Math.max(...got.map((g, i) => Math.abs(g - want[i]!))) / Math.hypot(...want);
}
