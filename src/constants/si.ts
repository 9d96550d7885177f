/**
 * CODATA 2022 values as plain numbers, for formulas. Kept in this small file
 * (no records, no decimal strings) so a bundle that uses one formula stays
 * small; tests check each against the full CODATA records in ./codata.ts.
 */

/** Speed of light in vacuum, m/s (exact). */
export const SPEED_OF_LIGHT = 299792458;
/** Elementary charge, C (exact). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
/** Planck constant, J s (exact). */
export const PLANCK = 6.62607015e-34;
/** Boltzmann constant, J/K (exact). */
export const BOLTZMANN = 1.380649e-23;
/** Vacuum magnetic permeability mu0, N/A^2 (CODATA 2022; no longer exactly 4 pi 1e-7). */
export const MU0 = 1.25663706127e-6;
/** Vacuum electric permittivity eps0, F/m (CODATA 2022). */
export const EPSILON0 = 8.8541878188e-12;
/** Electron mass, kg (CODATA 2022). */
export const ELECTRON_MASS = 9.1093837139e-31;
/** Proton mass, kg (CODATA 2022). */
export const PROTON_MASS = 1.67262192595e-27;
/** Neutron mass, kg (CODATA 2022). */
export const NEUTRON_MASS = 1.67492750056e-27;
/** Atomic mass constant m_u = 1 Da, kg (CODATA 2022). */
export const ATOMIC_MASS_CONSTANT = 1.66053906892e-27;
/** Alpha particle mass, kg (CODATA 2022). */
export const ALPHA_PARTICLE_MASS = 6.644657345e-27;
/** Deuteron mass, kg (CODATA 2022). */
export const DEUTERON_MASS = 3.3435837768e-27;
/** Muon mass, kg (CODATA 2022). */
export const MUON_MASS = 1.883531627e-28;
