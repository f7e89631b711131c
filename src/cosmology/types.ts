/**
 * The cosmology contract every other science module codes against. Implemented by
 * `createCosmology` in this folder. Distances are comoving Mpc unless the name says proper;
 * densities are physical M☉ kpc⁻³.
 */
export interface CosmologyParams {
  /** 'planck18' for the named set, 'custom' otherwise. */
  readonly name: string;
  /** Hubble constant [km s⁻¹ Mpc⁻¹]. */
  readonly H0: number;
  /** Matter density today (CDM + baryons; massive neutrinos are carried separately, astropy convention). */
  readonly Om0: number;
  /** Baryon density today. */
  readonly Ob0: number;
  /** CMB temperature today [K]; 0 switches photons and neutrinos off. */
  readonly Tcmb0: number;
  /** Effective number of neutrino species. */
  readonly Neff: number;
  /** Neutrino masses [eV]. */
  readonly m_nu: readonly number[];
  /** Where the numbers come from (paper, table). */
  readonly reference: string;
}

export interface Cosmology {
  readonly params: CosmologyParams;
  /** Dimensionless Hubble parameter h = H0 / 100. */
  readonly h: number;
  /** Dimensionless expansion rate E(z) = H(z)/H0. */
  E(z: number): number;
  /** Hubble distance c/H0 [Mpc]. */
  readonly hubbleDistanceMpc: number;
  comovingDistanceMpc(z: number): number;
  angularDiameterDistanceMpc(z: number): number;
  luminosityDistanceMpc(z: number): number;
  /** Critical density ρc(z) = 3H(z)²/(8πG) [M☉ kpc⁻³, physical]. */
  criticalDensityMsunKpc3(z: number): number;
  /** Ωm(z) = Om0 (1+z)³ / E(z)² (matter without neutrinos, astropy `Om(z)`). */
  omegaM(z: number): number;
  /** Baryon fraction Ob0/Om0 used to normalise halo gas. */
  readonly baryonFraction: number;
  lookbackTimeGyr(z: number): number;
  /** Proper kpc subtended by one arcsecond at redshift z. */
  kpcProperPerArcsec(z: number): number;
  /** Inverse of comovingDistanceMpc. */
  zAtComovingDistance(dMpc: number): number;
}
