/**
 * Stellar mass from g − i colour and i-band absolute magnitude:
 * Taylor et al. 2011, MNRAS 418, 1587, eq. 8 (GAMA; Chabrier IMF; rest-frame AB magnitudes):
 *   log10(M* / M☉) = 1.15 + 0.70 (g − i) − 0.4 M_i.
 * Cautions, also written into every load report that uses it:
 * - calibrated on GAMA galaxies at z ≲ 0.4 with H0 = 70 km s⁻¹ Mpc⁻¹ (from memory);
 * - forehalo applies no k-correction (observed g − i and i stand in for rest-frame ones), which
 *   biases masses increasingly with redshift;
 * - the paper quotes ≲ 0.1 dex (1σ) accuracy in M/L; forehalo gives estimated masses an error floor.
 */
export const TAYLOR2011 = Object.freeze({
  /** eq. 8 intercept, colour slope and absolute-magnitude slope. */
  a: 1.15,
  b: 0.7,
  c: -0.4,
  reference: 'Taylor et al. 2011, MNRAS 418, 1587, eq. 8',
  /** Redshift up to which the calibration sample extends (from memory). */
  zMaxCalibrated: 0.4,
});

/**
 * Error floor [dex] for estimated masses: Taylor 2011's ~0.1 dex M/L accuracy plus photometric and
 * missing-k-correction terms of similar size (team choice, not a published number).
 */
export const ESTIMATED_LOG_MSTAR_ERR_FLOOR = 0.2;

/** Absolute magnitude M = m − 5 log10(D_L / 10 pc), D_L in Mpc (no k-correction). */
export function absoluteMagnitude(apparentMag: number, luminosityDistanceMpc: number): number {
  return apparentMag - 5 * Math.log10(luminosityDistanceMpc * 1e5);
}

/** Taylor et al. 2011 eq. 8: log10(M* / M☉) from (g − i) and M_i. */
export function logMstarTaylor2011(gMinusI: number, absMagI: number): number {
  return TAYLOR2011.a + TAYLOR2011.b * gMinusI + TAYLOR2011.c * absMagI;
}
