import type { PreparedGalaxy } from './prepare.js';
import type { SightlineWarning } from './schemas.js';
import type { SearchShell } from './search.js';

/** The scientific cautions every result carries, plus those the particular sightline triggers. */
export function sightlineWarnings(input: {
  galaxies: readonly PreparedGalaxy[];
  shells: readonly SearchShell[];
  rowsWithoutMass: number;
  hostId: string | undefined;
  hostSeen: boolean;
  maxSearchDeg: number;
}): SightlineWarning[] {
  const w: SightlineWarning[] = [
    {
      code: 'model_dependence',
      message:
        'Foreground-halo DM depends strongly on the assumed hot-gas profile, f_hot, truncation radius and SHMR; ' +
        'the quoted intervals include only the sampled scatters (stellar mass, SHMR, concentration, photo-z, ' +
        'source z, f_hot prior), not the choice of model. Compare models before drawing conclusions.',
    },
    {
      code: 'cosmic_double_counting',
      message:
        'The mean cosmic DM (Macquart relation with f_d ≈ 0.84) already contains the average halo gas; ' +
        'adding these haloes on top of the full mean counts them twice on average (see cosmic_mode in the budget).',
    },
  ];
  const shmr = input.galaxies.filter((g) => g.mode === 'shmr');
  if (shmr.length > 0) {
    w.push({
      code: 'central_galaxy_relation',
      message:
        'Halo masses come from a stellar-to-halo mass relation calibrated on central galaxies; a satellite ' +
        'is given the halo of a central of the same stellar mass (too large).',
    });
  }
  if (shmr.some((g) => g.logMstar >= 10.8)) {
    w.push({
      code: 'eddington_bias',
      message:
        'Some galaxies have M* ≳ 10^10.8 M☉ where the SHMR is flat: the inverse of the mean relation is not ' +
        '⟨M_h | M*⟩ and scatter maps to a wide halo-mass range (σ_h = σ*/slope); their halo masses are uncertain ' +
        'and capped at the mass ceiling.',
    });
  }
  const outside = input.galaxies.filter((g) =>
    g.flags.some((f) => f.includes('range') || f.includes('ceiling')),
  );
  if (outside.length > 0) {
    w.push({
      code: 'outside_validity',
      message: `${outside.length} galaxies lie outside a relation's fitted range or hit the mass ceiling: ${outside
        .slice(0, 10)
        .map((g) => g.cand.row.objectId)
        .join(', ')}${outside.length > 10 ? ', …' : ''} (see their flags).`,
    });
  }
  if (input.galaxies.some((g) => g.isPhoto)) {
    w.push({
      code: 'photo_z',
      message:
        'Photometric redshifts are treated as Gaussian (truncated at z > 0); catastrophic outliers are not ' +
        'modelled, and the search only reaches z ± min(kσ, w(1+z)) of a photometric redshift.',
    });
  }
  if (input.shells.some((s) => s.capped)) {
    w.push({
      code: 'search_angle_capped',
      message: `The search cone was capped at ${input.maxSearchDeg}° for the lowest-redshift shells; very nearby massive haloes further out are not considered.`,
    });
  }
  if (input.rowsWithoutMass > 0) {
    w.push({
      code: 'rows_without_mass',
      message: `${input.rowsWithoutMass} catalogue rows near the sightline have neither a stellar nor a halo mass and were skipped.`,
    });
  }
  if (input.hostId !== undefined && !input.hostSeen) {
    w.push({
      code: 'host_not_found',
      message: `host_id '${input.hostId}' was not among the galaxies near the sightline; nothing was excluded as host.`,
    });
  }
  return w;
}
