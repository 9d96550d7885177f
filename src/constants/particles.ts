import type { Charge, Mass } from "../units/types.js";
import {
  ALPHA_PARTICLE_MASS, DEUTERON_MASS, ELECTRON_MASS, ELEMENTARY_CHARGE, MUON_MASS, NEUTRON_MASS, PROTON_MASS,
} from "./si.js";

/**
 * A charged (or neutral) particle as formula inputs: signed charge in C and
 * rest mass in kg. Charges are whole multiples of the exact elementary charge;
 * masses are CODATA 2022.
 */
export interface Particle {
  readonly name: string;
  /** Charge in units of the elementary charge (-1 for the electron). */
  readonly chargeNumber: number;
  /** Signed charge, C. */
  readonly charge: Charge;
  /** Rest mass, kg. */
  readonly mass: Mass;
}

function particle(name: string, chargeNumber: number, mass: number): Particle {
  // Multiplying e by -1, 0, 1 or 2 is exact in binary floating point.
  return Object.freeze({ name, chargeNumber, charge: (chargeNumber * ELEMENTARY_CHARGE) as Charge, mass: mass as Mass });
}

/** The electron: charge -e, mass m_e. */
export const electron = /* @__PURE__ */ particle("electron", -1, ELECTRON_MASS);
/** The positron: charge +e, mass m_e. */
export const positron = /* @__PURE__ */ particle("positron", 1, ELECTRON_MASS);
/** The proton: charge +e, mass m_p. */
export const proton = /* @__PURE__ */ particle("proton", 1, PROTON_MASS);
/** The neutron: no charge, mass m_n. */
export const neutron = /* @__PURE__ */ particle("neutron", 0, NEUTRON_MASS);
/** The alpha particle (helium-4 nucleus): charge +2e, mass m_alpha. */
export const alphaParticle = /* @__PURE__ */ particle("alpha particle", 2, ALPHA_PARTICLE_MASS);
/** The deuteron (hydrogen-2 nucleus): charge +e, mass m_d. */
export const deuteron = /* @__PURE__ */ particle("deuteron", 1, DEUTERON_MASS);
/** The negative muon: charge -e, mass m_mu. */
export const muon = /* @__PURE__ */ particle("muon", -1, MUON_MASS);

/** Every particle preset by key. */
export const PARTICLES = /* @__PURE__ */ Object.freeze({
  electron, positron, proton, neutron, alphaParticle, deuteron, muon,
});

/** Key of a particle preset. */
export type ParticleKey = keyof typeof PARTICLES;
