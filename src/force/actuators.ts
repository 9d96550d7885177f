import { EPSILON0, MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { strongFieldCaution, voltageCautions } from "../core/hazards.js";
import { COUNT, POSITIVE, RELATIVE_PERMEABILITY } from "../core/spec.js";
import { RELATIVE_PERMITTIVITY } from "../capacitance/shared.js";
import { Scaled, scaledProduct } from "../math/scaled.js";
import { pinchCaution } from "./shared.js";

const HALF_MU0 = MU0 / 2;
const TWO_MU0 = 2 * MU0;

const ROTERS = {
  authors: "H. C. Roters",
  year: 1941,
  title: "Electromagnetic Devices",
  locator: "ch. 5, force from the energy of the air gap, F = B^2 A / (2 mu0) (chapter from memory)",
} as const;

const SENTURIA = {
  authors: "S. D. Senturia",
  year: 2001,
  title: "Microsystem Design",
  locator: "ch. 6, electrostatic actuators: parallel plates and pull-in (from memory)",
} as const;

/** Fringing: from a gap of a tenth of the pole's width the uniform-gap model is off by more than about 10 % (common practice). */
const FRINGE_RATIO = 0.1;

/** Iron saturates: the linear core model holds to about 1.5 T in electrical steel (common practice). */
const SATURATION_FLUX_DENSITY = 1.5;

/**
 * Pull of a magnet pole on its armature across an air gap (Maxwell stress).
 *
 * F = B^2 A / (2 mu0), with F in N, B the flux density in the gap in T, A the
 * area of one pole face in m^2 and mu0 in H/m (CODATA 2022).
 *
 * Validity: uniform B over the pole face, iron of high permeability on both
 * sides of the gap; for a magnet with two pole faces (a U-core and its
 * armature) add the pull of each face.
 *
 * Cautions: pinch points from 140 N (ISO/TS 15066), strong fields.
 *
 * Reference: Roters, Electromagnetic Devices (1941), ch. 5 (from memory).
 *
 * @example
 * gapPullForce({ fluxDensity: quantity(1, "T"), poleArea: quantity(1, "cm^2") }); // ≈ 39.8 N
 */
export const gapPullForce = /* @__PURE__ */ defineFormula({
  id: "gapPullForce",
  title: "Pull across a magnet gap",
  category: "force",
  description: "Attraction of one magnet pole face on its armature across an air gap, from the Maxwell stress B^2/(2 mu0).",
  equation: "F = B^2 A / (2 mu0)",
  inputs: [
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density in the gap (its sign does not matter)", example: 1 },
    { name: "poleArea", dimension: "Area", description: "Area of the pole face", domain: POSITIVE, example: 1e-4 },
  ],
  output: { dimension: "Force", description: "Attraction of the pole face" },
  cautions: [pinchCaution(), strongFieldCaution((x: { readonly fluxDensity: number }) => Math.abs(x.fluxDensity))],
  source: ROTERS,
  // scaledProduct: B^2 A with no intermediate overflow or underflow; within 2 ulp.
  compute: (x) => scaledProduct([x.fluxDensity, x.fluxDensity, x.poleArea], [TWO_MU0]),
});

/**
 * Effective gap g + l/mu_r of a gapped core as a scaled number (l/mu_r may
 * overflow or underflow while the force is representable).
 */
function effectiveGap(x: { readonly gapLength: number; readonly pathLength: number; readonly relativePermeability: number }): Scaled {
  return Scaled.of(x.pathLength).div(x.relativePermeability).plus(x.gapLength);
}

/** Gap flux density mu0 N I / (g + l/mu_r) of the linear gapped-core model, as a plain double (for notes). */
function gapFluxDensity(x: { readonly turns: number; readonly current: number; readonly gapLength: number; readonly pathLength: number; readonly relativePermeability: number }): number {
  return Scaled.of(MU0).times(x.turns).times(Math.abs(x.current)).div(effectiveGap(x)).toNumber();
}

/**
 * Pull of an electromagnet across its air gap, from the co-energy of a gapped core.
 *
 * L(g) = mu0 N^2 A / (g + l/mu_r), W' = L I^2 / 2, and F = -dW'/dg at constant current:
 * F = mu0 N^2 I^2 A / (2 (g + l/mu_r)^2) = B^2 A / (2 mu0), B = mu0 N I / (g + l/mu_r),
 * with N turns, I the current in A, A the pole area in m^2, g the gap length in
 * m, l the magnetic path length in the core in m and mu_r the core's relative
 * permeability; F in N (attraction, closing the gap).
 *
 * Validity: linear iron (a warning above 1.5 T, where electrical steel
 * saturates, common practice), one gap of uniform field; fringing widens the
 * field beyond the pole face as the gap grows (a warning from g > 0.1 sqrt(A),
 * common practice): the real pull is then lower than this at a given B and the
 * flux higher. The force rises as 1/(g + l/mu_r)^2 as the gap closes.
 *
 * Cautions: pinch points from 140 N (ISO/TS 15066), strong fields in the gap.
 *
 * Reference: Roters, Electromagnetic Devices (1941), ch. 5 (from memory);
 * Senturia, Microsystem Design (2001), ch. 6, co-energy method (from memory).
 *
 * @example
 * gappedCorePullForce({ turns: 500, current: quantity(1, "A"), poleArea: quantity(1, "cm^2"),
 *   gapLength: quantity(1, "mm"), pathLength: quantity(10, "cm"), relativePermeability: 2000 }); // ≈ 14.2 N
 */
export const gappedCorePullForce = /* @__PURE__ */ defineFormula({
  id: "gappedCorePullForce",
  title: "Electromagnet pull across a gap",
  category: "force",
  description: "Attraction across the air gap of a gapped-core electromagnet at constant current, from the derivative of the co-energy (linear iron, uniform gap field).",
  equation: "F = mu0 N^2 I^2 A / (2 (g + l/mu_r)^2)",
  inputs: [
    { name: "turns", dimension: "Dimensionless", description: "Turns of the winding", domain: COUNT, example: 500 },
    { name: "current", dimension: "Current", description: "Current in the winding (its sign does not matter)", example: 1 },
    { name: "poleArea", dimension: "Area", description: "Area of the pole face at the gap", domain: POSITIVE, example: 1e-4 },
    { name: "gapLength", dimension: "Length", description: "Length of the air gap", domain: POSITIVE, example: 1e-3 },
    { name: "pathLength", dimension: "Length", description: "Magnetic path length in the core", domain: POSITIVE, example: 0.1 },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY, description: "Relative permeability of the core" },
  ],
  output: { dimension: "Force", description: "Attraction across the gap" },
  validity: [
    {
      code: "fringing",
      when: (x) => x.gapLength > FRINGE_RATIO * Math.sqrt(x.poleArea),
      measure: (x) => x.gapLength / Math.sqrt(x.poleArea),
      message: (x) =>
        `the gap is ${formatNumber(x.gapLength / Math.sqrt(x.poleArea), 2)} times the pole's width (above 0.1, common practice): ` +
        "fringing spreads the flux beyond the pole face, so the uniform-gap model overstates the pull at this current",
    },
    {
      code: "core_saturation",
      when: (x) => gapFluxDensity(x) > SATURATION_FLUX_DENSITY,
      measure: (x) => gapFluxDensity(x),
      message: (x) =>
        `the linear model gives ${formatNumber(gapFluxDensity(x), 3)} T in the gap, above about 1.5 T where electrical steel saturates (common practice): ` +
        "the real flux and pull are lower",
    },
  ],
  cautions: [pinchCaution(), strongFieldCaution((x: { readonly turns: number; readonly current: number; readonly gapLength: number; readonly pathLength: number; readonly relativePermeability: number }) => gapFluxDensity(x))],
  source: [ROTERS, SENTURIA],
  // Scaled throughout: N^2 I^2 and the squared effective gap may overflow or underflow while F does not.
  compute: (x) => {
    const g = effectiveGap(x);
    return Scaled.of(HALF_MU0).times(x.turns).times(x.turns).times(x.current).times(x.current).times(x.poleArea).div(g).div(g).toNumber();
  },
});

/**
 * Attraction between the plates of a parallel-plate capacitor at a voltage.
 *
 * F = eps0 eps_r A V^2 / (2 g^2), with F in N, A the plate area in m^2, g the
 * gap in m, V the voltage in V and eps0 in F/m (CODATA 2022).
 *
 * Validity: plates wide against the gap (a warning from g > 0.1 sqrt(A): fringing
 * adds to the capacitance and the force, common practice); a dielectric filling
 * the gap.
 *
 * Cautions: voltage bands (IEC 61140), pinch points from 140 N.
 *
 * Reference: Senturia, Microsystem Design (2001), ch. 6 (from memory).
 *
 * @example
 * electrostaticForce({ area: quantity(1, "mm^2"), gap: quantity(2, "um"), voltage: quantity(10, "V") }); // ≈ 1.107e-4 N
 */
export const electrostaticForce = /* @__PURE__ */ defineFormula({
  id: "electrostaticForce",
  title: "Force between capacitor plates",
  category: "force",
  description: "Attraction between the plates of a parallel-plate capacitor at a given voltage (energy method at constant voltage).",
  equation: "F = eps0 eps_r A V^2 / (2 g^2)",
  inputs: [
    { name: "area", dimension: "Area", description: "Overlapping plate area", domain: POSITIVE, example: 1e-6 },
    { name: "gap", dimension: "Length", description: "Gap between the plates", domain: POSITIVE, example: 2e-6 },
    { name: "voltage", dimension: "Voltage", description: "Voltage between the plates (its sign does not matter)", example: 10 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY, example: 1 },
  ],
  output: { dimension: "Force", description: "Attraction between the plates" },
  validity: [
    {
      code: "fringing",
      when: (x) => x.gap > FRINGE_RATIO * Math.sqrt(x.area),
      measure: (x) => x.gap / Math.sqrt(x.area),
      message: "the gap is more than 0.1 of the plate width (common practice): fringing fields add to the force, which this formula leaves out",
    },
  ],
  cautions: [...voltageCautions("dc", (x: { readonly voltage: number }) => Math.abs(x.voltage)), pinchCaution()],
  source: SENTURIA,
  // scaledProduct: V^2 and g^2 may overflow or underflow on their own; within 4 ulp.
  compute: (x) => scaledProduct([EPSILON0, x.relativePermittivity, x.area, x.voltage, x.voltage], [2, x.gap, x.gap]),
});

/**
 * Pull-in voltage of a parallel-plate electrostatic actuator on a linear spring.
 *
 * V_PI = sqrt(8 k g^3 / (27 eps0 eps_r A)), with k the spring constant in N/m,
 * g the rest gap in m, A the plate area in m^2; V_PI in V. Above it the
 * electrostatic force outgrows the spring and the plate snaps shut; the
 * stable travel ends at a third of the gap.
 *
 * Validity: rigid parallel plates, linear spring, voltage applied quasi-statically
 * (a step can snap through below V_PI), no fringing (plates wide against the gap).
 *
 * Cautions: voltage bands (IEC 61140) on V_PI.
 *
 * Reference: Senturia, Microsystem Design (2001), ch. 6, pull-in (from memory).
 *
 * @example
 * pullInVoltage({ springConstant: quantity(1, "N/m"), gap: quantity(2, "um"), area: quantity(0.01, "mm^2") }); // ≈ 5.17 V
 */
export const pullInVoltage = /* @__PURE__ */ defineFormula({
  id: "pullInVoltage",
  title: "Pull-in voltage",
  category: "force",
  description: "Voltage at which a spring-suspended parallel-plate electrostatic actuator snaps shut (travel one third of the gap).",
  equation: "V_PI = sqrt(8 k g^3 / (27 eps0 eps_r A))",
  inputs: [
    { name: "springConstant", dimension: "Stiffness", description: "Spring constant of the suspension", domain: POSITIVE, example: 1 },
    { name: "gap", dimension: "Length", description: "Rest gap between the plates", domain: POSITIVE, example: 2e-6 },
    { name: "area", dimension: "Area", description: "Plate area", domain: POSITIVE, example: 1e-8 },
    { name: "relativePermittivity", ...RELATIVE_PERMITTIVITY, example: 1 },
  ],
  output: { dimension: "Voltage", description: "Pull-in voltage" },
  cautions: voltageCautions("dc"),
  source: SENTURIA,
  // Scaled: k g^3 may overflow or underflow while its root is representable; within a few ulp.
  compute: (x) =>
    Scaled.of(8 / 27).times(x.springConstant).times(x.gap).times(x.gap).times(x.gap)
      .div(EPSILON0).div(x.relativePermittivity).div(x.area).sqrt().toNumber(),
});

/**
 * Lateral force of an electrostatic comb drive.
 *
 * F = n eps0 t V^2 / g, with n the number of movable fingers (each between two
 * fixed ones, so two gaps per finger), t the structure thickness in m, g the
 * gap between interdigitated fingers in m and V the voltage in V; F in N, along
 * the fingers, independent of the engagement.
 *
 * Validity: fingers engaged well beyond the gap (end and fringing fields left
 * out), thickness large against the gap; lateral instability is not checked.
 *
 * Cautions: voltage bands (IEC 61140).
 *
 * Reference: Senturia, Microsystem Design (2001), ch. 6, comb drives (from memory);
 * W. C. Tang, T.-C. H. Nguyen, R. T. Howe, Laterally driven polysilicon resonant
 * microstructures, Sensors and Actuators 20 (1989) 25-32 (from memory).
 *
 * @example
 * combDriveForce({ fingers: 100, thickness: quantity(2, "um"), gap: quantity(2, "um"), voltage: quantity(20, "V") }); // ≈ 3.54e-7 N
 */
export const combDriveForce = /* @__PURE__ */ defineFormula({
  id: "combDriveForce",
  title: "Comb-drive force",
  category: "force",
  description: "Lateral electrostatic force of an interdigitated comb drive (two gaps per movable finger).",
  equation: "F = n eps0 t V^2 / g",
  inputs: [
    { name: "fingers", dimension: "Dimensionless", description: "Number of movable fingers", domain: COUNT, example: 100 },
    { name: "thickness", dimension: "Length", description: "Structure thickness (finger height)", domain: POSITIVE, example: 2e-6 },
    { name: "gap", dimension: "Length", description: "Gap between adjacent fingers", domain: POSITIVE, example: 2e-6 },
    { name: "voltage", dimension: "Voltage", description: "Drive voltage (its sign does not matter)", example: 20 },
  ],
  output: { dimension: "Force", description: "Lateral force along the fingers" },
  cautions: voltageCautions("dc", (x: { readonly voltage: number }) => Math.abs(x.voltage)),
  source: [SENTURIA, { authors: "W. C. Tang, T.-C. H. Nguyen, R. T. Howe", year: 1989, title: "Laterally driven polysilicon resonant microstructures, Sensors and Actuators 20, 25-32", locator: "comb-drive force (from memory)" }],
  // scaledProduct: V^2 may overflow or underflow on its own; within 3 ulp.
  compute: (x) => scaledProduct([EPSILON0, x.fingers, x.thickness, x.voltage, x.voltage], [x.gap]),
});
