import { InputError } from '../errors.js';
import { electronsPerCm3PerMsunKpc3, MU_E_DEFAULT } from './electrons.js';
import { type ProfileShape, profileShape } from './shapes.js';
import type { ProfileSpec } from './spec.js';

/** Fraction of the cosmic baryon share of the halo mass that is hot gas (fiducial, common practice). */
export const F_HOT_DEFAULT = 0.75;
/** Truncation radius in units of R_Δ (common practice: r_max = R_Δ). */
export const EXTENT_DEFAULT = 1;

export interface GasHalo {
  /** Halo mass M_Δ [M☉]. */
  readonly massMsun: number;
  /** Halo radius R_Δ [proper kpc]. */
  readonly radiusKpc: number;
  /** c = R_Δ / r_s in the same definition. */
  readonly concentration: number;
}

export interface GasOptions {
  /** Hot fraction f_hot (default 0.75). */
  readonly fHot?: number;
  /** Ω_b/Ω_m (take it from the cosmology's baryonFraction). */
  readonly baryonFraction: number;
  /** Mean mass per electron in m_p (default 8/7). */
  readonly muE?: number;
  /** Truncation r_max = extent · R_Δ (default 1). */
  readonly extent?: number;
}

/**
 * A hot-gas halo: ρ_gas(r) = A s(r/r_s), normalised so that the gas mass inside R_Δ is
 * f_hot (Ω_b/Ω_m) M_Δ; the same profile continues out to r_max = extent·R_Δ and is 0 beyond.
 */
export interface GasProfile {
  readonly spec: Required<ProfileSpec>;
  readonly shape: ProfileShape;
  readonly halo: GasHalo;
  readonly rsKpc: number;
  readonly rMaxKpc: number;
  readonly fHot: number;
  readonly muE: number;
  /** Gas mass inside R_Δ [M☉]. */
  readonly gasMassMsun: number;
  /** Density scale A [M☉ kpc⁻³]. */
  readonly densityScaleMsunKpc3: number;
  /** Electron density scale A/(μ_e m_p) [cm⁻³]. */
  readonly electronScaleCm3: number;
  gasDensityMsunKpc3(rKpc: number): number;
  electronDensityCm3(rKpc: number): number;
  /** Gas mass inside the sphere of radius r (r ≤ r_max; the profile is cut there) [M☉]. */
  gasMassWithinMsun(rKpc: number): number;
}

function positive(name: string, value: number): number {
  if (!(Number.isFinite(value) && value > 0)) {
    throw new InputError(`gas.${name}`, `${name} must be a finite positive number, got ${value}`);
  }
  return value;
}

export function createGasProfile(spec: ProfileSpec, halo: GasHalo, opts: GasOptions): GasProfile {
  const shape = profileShape(spec);
  const massMsun = positive('massMsun', halo.massMsun);
  const radiusKpc = positive('radiusKpc', halo.radiusKpc);
  const c = positive('concentration', halo.concentration);
  const fHot = opts.fHot ?? F_HOT_DEFAULT;
  if (!(fHot >= 0 && fHot <= 1)) throw new InputError('gas.fHot', `fHot must lie in [0, 1], got ${fHot}`);
  const fb = positive('baryonFraction', opts.baryonFraction);
  const muE = positive('muE', opts.muE ?? MU_E_DEFAULT);
  const extent = positive('extent', opts.extent ?? EXTENT_DEFAULT);
  const rsKpc = radiusKpc / c;
  const gasMassMsun = fHot * fb * massMsun;
  const A = gasMassMsun / (4 * Math.PI * rsKpc ** 3 * shape.enclosed(c, c));
  const toNe = electronsPerCm3PerMsunKpc3(muE);
  const rMaxKpc = extent * radiusKpc;
  const rho = (r: number) => (r > rMaxKpc ? 0 : A * shape.density(r / rsKpc, c));
  return {
    spec: shape.spec,
    shape,
    halo: { massMsun, radiusKpc, concentration: c },
    rsKpc,
    rMaxKpc,
    fHot,
    muE,
    gasMassMsun,
    densityScaleMsunKpc3: A,
    electronScaleCm3: A * toNe,
    gasDensityMsunKpc3: rho,
    electronDensityCm3: (r) => rho(r) * toNe,
    gasMassWithinMsun: (r) => 4 * Math.PI * rsKpc ** 3 * A * shape.enclosed(Math.min(r, rMaxKpc) / rsKpc, c),
  };
}
