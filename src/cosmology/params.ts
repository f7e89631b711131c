import { z } from 'zod';
import { InputError } from '../errors.js';
import type { CosmologyParams } from './types.js';

/**
 * Planck 2018 (Planck Collaboration 2020, A&A 641, A6, Table 2, column "TT,TE,EE+lowE+lensing+BAO")
 * as astropy's `Planck18` realises it: the massive neutrino is not in Om0 but in the
 * radiation-like term (physics.md §1).
 */
export const PLANCK18_PARAMS: CosmologyParams = Object.freeze({
  name: 'planck18',
  H0: 67.66,
  Om0: 0.30966,
  Ob0: 0.04897,
  Tcmb0: 2.7255,
  Neff: 3.046,
  m_nu: Object.freeze([0, 0, 0.06]),
  reference:
    'Planck Collaboration 2020, A&A 641, A6, Table 2 (TT,TE,EE+lowE+lensing+BAO), as realised by astropy Planck18; flat ΛCDM',
});

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite();

/** A custom flat ΛCDM set. Without Tcmb0 there is no radiation (Tcmb0 = 0). */
export const customCosmologySchema = z
  .strictObject({
    H0: finite('H0 [km s⁻¹ Mpc⁻¹]').gt(0, 'H0 must be > 0 km s⁻¹ Mpc⁻¹').lt(1000, 'H0 must be < 1000'),
    Om0: finite('Om0').gt(0, 'Om0 must be > 0').lte(1, 'Om0 must be ≤ 1 (flat ΛCDM, ΩΛ ≥ 0)'),
    Ob0: finite('Ob0').gt(0, 'Ob0 must be > 0'),
    Tcmb0: finite('Tcmb0 [K]').gte(0, 'Tcmb0 must be ≥ 0 K').lt(100, 'Tcmb0 must be < 100 K').default(0),
    Neff: finite('Neff').gte(0, 'Neff must be ≥ 0').lte(20, 'Neff must be ≤ 20').default(3.046),
    m_nu: z
      .union([
        finite('m_nu [eV]').gte(0, 'neutrino masses must be ≥ 0 eV'),
        z.array(finite('m_nu [eV]').gte(0, 'neutrino masses must be ≥ 0 eV')),
      ])
      .default(0),
  })
  .refine((p) => p.Ob0 <= p.Om0, { message: 'Ob0 must not exceed Om0', path: ['Ob0'] })
  .refine((p) => !Array.isArray(p.m_nu) || p.m_nu.length === Math.floor(p.Neff), {
    message: 'm_nu as a list needs one mass per neutrino species, floor(Neff) entries',
    path: ['m_nu'],
  });

/** The cosmology accepted everywhere: the named set 'planck18' or a custom flat ΛCDM set. */
export const cosmologySpecSchema = z.union([z.literal('planck18'), customCosmologySchema]);

export type CosmologySpec = z.input<typeof cosmologySpecSchema>;

/** Validate a spec and return frozen parameters; throws InputError naming the field and reason. */
export function resolveCosmologyParams(spec: CosmologySpec): CosmologyParams {
  if (spec === 'planck18') return PLANCK18_PARAMS;
  const parsed = customCosmologySchema.safeParse(spec);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.') || 'cosmology'}: ${i.message}`);
    throw new InputError('cosmology_invalid', `invalid cosmology: ${issues.join('; ')}`, {
      issues: parsed.error.issues,
    });
  }
  const p = parsed.data;
  const nNu = Math.floor(p.Neff);
  const masses = Array.isArray(p.m_nu) ? p.m_nu : new Array<number>(nNu).fill(p.m_nu);
  return Object.freeze({
    name: 'custom',
    H0: p.H0,
    Om0: p.Om0,
    Ob0: p.Ob0,
    Tcmb0: p.Tcmb0,
    Neff: p.Neff,
    m_nu: Object.freeze([...masses]),
    reference: `custom flat ΛCDM (H0=${p.H0}, Om0=${p.Om0}, Ob0=${p.Ob0}, Tcmb0=${p.Tcmb0} K)`,
  });
}
