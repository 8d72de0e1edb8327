// Physical constants of the dynamics context, each with where its value comes from.

/** Newtonian constant of gravitation, m³ kg⁻¹ s⁻² (CODATA 2018 recommended value; relative standard
 * uncertainty 2.2e-5, small against every other input here, so it is treated as exact). */
export const G_SI = 6.6743e-11;

/** Heliocentric gravitational constant GM☉, m³ s⁻² (IAU 2015 Resolution B3 nominal value, equal to the
 * DE430 value). Using GM☉ rather than G·M☉ keeps the mass ratio in the Hill radius free of G's uncertainty. */
export const GM_SUN_SI = 1.32712440018e20;

/** Roche's classical coefficient for a fluid (deformable) satellite, d = 2.44 R (ρ_M/ρ_m)^(1/3)
 * (Roche 1849; quoted e.g. in Murray & Dermott, Solar System Dynamics, 1999, §4.x, from memory). A full
 * treatment of the Roche ellipsoid gives 2.455 (Chandrasekhar, Ellipsoidal Figures of Equilibrium,
 * 1969, ch. 8, from memory); the classical 2.44 is kept because the issue asks for Roche's coefficients. */
export const ROCHE_FLUID_COEFFICIENT = 2.44;

/** Rigid spherical satellite held by its own gravity against the tide, d = (2)^(1/3) R (ρ_M/ρ_m)^(1/3)
 * ≈ 1.26 R (ρ_M/ρ_m)^(1/3): tidal acceleration 2GMu/d³ equals self-gravity Gm/u² (from memory). */
export const ROCHE_RIGID_COEFFICIENT = Math.cbrt(2);

export const KM_PER_M = 1e-3;
export const M_PER_KM = 1e3;
export const SECONDS_PER_HOUR = 3_600;
