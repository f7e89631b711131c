/**
 * Physical constants and unit factors used everywhere in forehalo (cgs unless the name says otherwise).
 * Values follow CODATA 2018 and the IAU 2015 nominal solar mass as realised by astropy 5.x, so that
 * reference fixtures generated with astropy agree to round-off.
 */

/** Speed of light [cm s⁻¹] (exact, SI definition). */
export const C_CM_S = 2.99792458e10;
/** Speed of light [km s⁻¹] (exact). */
export const C_KM_S = 299792.458;
/** Newtonian constant of gravitation [cm³ g⁻¹ s⁻²] (CODATA 2018). */
export const G_CGS = 6.6743e-8;
/** Proton mass [g] (CODATA 2018). */
export const M_P_G = 1.67262192369e-24;
/** Solar mass [g] (IAU 2015 nominal GM☉ / G, CODATA 2018 G; astropy `M_sun`). */
export const M_SUN_G = 1.988409870698051e33;
/** Parsec [cm] (IAU 2015 definition, 648000/π au). */
export const PC_CM = 3.0856775814913673e18;
export const KPC_CM = PC_CM * 1e3;
export const MPC_CM = PC_CM * 1e6;
/** 1 km s⁻¹ Mpc⁻¹ in s⁻¹. */
export const KM_S_MPC_IN_S = 1e5 / MPC_CM;
/** Julian year [s] and gigayear [s] (IAU). */
export const YEAR_S = 365.25 * 86400;
export const GYR_S = YEAR_S * 1e9;
/** Boltzmann constant [erg K⁻¹] (exact, SI 2019). */
export const K_B_CGS = 1.380649e-16;
/** Electron-volt [erg] (exact). */
export const EV_ERG = 1.602176634e-12;

export const DEG = Math.PI / 180;
export const ARCSEC = DEG / 3600;
export const ARCMIN = DEG / 60;

/** 1 M☉ kpc⁻³ in g cm⁻³. */
export const MSUN_PER_KPC3_IN_G_CM3 = M_SUN_G / KPC_CM ** 3;
