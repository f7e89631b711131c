import { DomainError } from '../errors.js';
import { normalQuantile, quantileSorted } from '../math/index.js';
import { cosmicPdf } from './cosmic-pdf-cache.js';
import { type RedshiftFreeInput, redshiftFreeTrailer, residualDraws } from './residuals.js';
import { cosmicMeanInForce } from './resolve.js';

export interface RedshiftPosteriorInput extends RedshiftFreeInput {
  /** Redshift grid: explicit increasing values > 0, or {min, max, n} (default 0.01–3, 150 points). */
  zGrid?: readonly number[] | { min: number; max: number; n: number };
  /** Quantile nodes representing the residual draws in the likelihood (default 200). */
  residualNodes?: number;
  /** Prior on z: 'flat' (default) or 'comoving_volume' (∝ D_C² / E, no rate evolution). */
  zPrior?: 'flat' | 'comoving_volume';
  /** Quantile nodes of the log-normal host prior (default 160). */
  hostNodes?: number;
}

export interface RedshiftPosterior {
  z: number[];
  /** Posterior density on the grid, normalised by the trapezoid rule. */
  posterior: number[];
  median: number;
  /** 68 % central interval (16th, 84th percentiles). */
  interval68: [number, number];
  mode: number;
  prior: string;
  host_prior: { median_pc_cm3: number; sigma_ln: number; frame: string };
  draws: number;
  seed: number;
  cosmic_mode: 'diffuse' | 'full';
  conventions: string[];
  warnings: string[];
  cautions: readonly string[];
}

function gridFrom(spec: RedshiftPosteriorInput['zGrid']): number[] {
  const g = spec ?? { min: 0.01, max: 3, n: 150 };
  let zs: number[];
  if (Array.isArray(g)) zs = [...g];
  else {
    const { min, max, n } = g as { min: number; max: number; n: number };
    if (!(Number.isInteger(n) && n >= 3 && n <= 2000))
      throw new DomainError('z_grid_invalid', `zGrid.n must be an integer in [3, 2000], got ${n}`);
    zs = Array.from({ length: n }, (_, i) => min + ((max - min) * i) / (n - 1));
  }
  if (zs.length < 3) throw new DomainError('z_grid_invalid', 'zGrid needs at least 3 redshifts');
  zs.forEach((z, i) => {
    if (!(Number.isFinite(z) && z > 0 && z <= 20))
      throw new DomainError('z_grid_invalid', `zGrid[${i}] must be in (0, 20], got ${z}`);
    if (i > 0 && !(z > zs[i - 1]))
      throw new DomainError('z_grid_invalid', `zGrid[${i}] must exceed zGrid[${i - 1}]`);
  });
  return zs;
}

/** Linear interpolation of the z where a cumulative array reaches p. */
function cdfCrossing(z: number[], cdf: number[], p: number): number {
  for (let i = 1; i < z.length; i++) {
    if (cdf[i] >= p) {
      const t = (p - cdf[i - 1]) / (cdf[i] - cdf[i - 1] || 1);
      return z[i - 1] + t * (z[i] - z[i - 1]);
    }
  }
  return z[z.length - 1];
}

/**
 * Posterior of the source redshift without a measured z_s:
 *   p(z | DM_obs) ∝ π(z) ∫∫ p(R) p_host,rest(h) p_Δ((R − h/(1+z)) / ⟨DM⟩(z) | z) / ⟨DM⟩(z) dh dR,
 * i.e. the density of DM_cosmic at what the other terms leave, averaged over R = DM_obs − MW terms −
 * caller-given haloes (Monte Carlo draws, entered through their quantile mid-points) and over the
 * log-normal rest-frame host prior (its quantile mid-points, so any prior width is resolved), with a
 * flat (default) or comoving-volume prior π(z) on the grid.
 */
export function redshiftPosterior(input: RedshiftPosteriorInput): RedshiftPosterior {
  const zs = gridFrom(input.zGrid);
  const { model, residual, warnings } = residualDraws(input);
  const nR = input.residualNodes ?? 200;
  if (!(Number.isInteger(nR) && nR >= 16 && nR <= 100_000)) {
    throw new DomainError(
      'residual_nodes_invalid',
      `residualNodes must be an integer in [16, 100000], got ${nR}`,
    );
  }
  const J = input.hostNodes ?? 160;
  if (!(Number.isInteger(J) && J >= 16 && J <= 5000)) {
    throw new DomainError('host_nodes_invalid', `hostNodes must be an integer in [16, 5000], got ${J}`);
  }
  // The residual draws enter through nR quantile mid-points of their sorted sample.
  const sorted = Float64Array.from(residual).sort();
  const R = Float64Array.from({ length: nR }, (_, k) => quantileSorted(sorted, (k + 0.5) / nR));
  const zPrior = input.zPrior ?? 'flat';
  const prior = (z: number) => {
    if (zPrior === 'flat') return 1;
    const d = input.cosmology.comovingDistanceMpc(z);
    return (d * d) / input.cosmology.E(z);
  };
  const mean = cosmicMeanInForce(input.cosmology, model);
  // Host rest-frame DMs at the quantile mid-points of the log-normal prior.
  const host = Float64Array.from(
    { length: J },
    (_, j) => model.host.median_pc_cm3 * Math.exp(model.host.sigma_ln * normalQuantile((j + 0.5) / J)),
  );
  const like = zs.map((z) => {
    const pdf = cosmicPdf(model.F, z);
    const m = mean.meanDmPcCm3(z);
    let s = 0;
    for (let j = 0; j < J; j++) {
      const hostObs = host[j] / (1 + z);
      for (let i = 0; i < nR; i++) s += pdf.density((R[i] - hostObs) / m);
    }
    return (prior(z) * s) / (m * J * nR);
  });
  const area = like.reduce(
    (acc, v, i) => (i === 0 ? 0 : acc + 0.5 * (v + like[i - 1]) * (zs[i] - zs[i - 1])),
    0,
  );
  if (!(area > 0)) {
    throw new DomainError(
      'posterior_empty',
      'the likelihood vanishes on the whole redshift grid: no redshift leaves a positive host DM; check the inputs or widen zGrid',
    );
  }
  const posterior = like.map((v) => v / area);
  const cdf = [0];
  for (let i = 1; i < zs.length; i++)
    cdf.push(cdf[i - 1] + 0.5 * (posterior[i] + posterior[i - 1]) * (zs[i] - zs[i - 1]));
  let iMode = 0;
  posterior.forEach((p, i) => {
    if (p > posterior[iMode]) iMode = i;
  });
  const peak = posterior[iMode];
  if (posterior[posterior.length - 1] > 1e-3 * peak) {
    warnings.push('the posterior is not negligible at the upper end of the redshift grid; widen zGrid');
  }
  if (zs[0] > 0.01 && posterior[0] > 1e-3 * peak) {
    warnings.push(
      'the posterior is not negligible at the lower end of the redshift grid; start zGrid nearer 0',
    );
  }
  return {
    z: zs,
    posterior,
    median: cdfCrossing(zs, cdf, 0.5),
    interval68: [cdfCrossing(zs, cdf, 0.16), cdfCrossing(zs, cdf, 0.84)],
    mode: zs[iMode],
    prior:
      zPrior === 'flat'
        ? 'flat in z over the grid (an assumption; a volume-weighted prior would favour higher z)'
        : 'comoving volume, ∝ D_C(z)² / E(z), no burst-rate evolution (an assumption)',
    host_prior: {
      median_pc_cm3: model.host.median_pc_cm3,
      sigma_ln: model.host.sigma_ln,
      frame: 'host rest frame, log-normal (team assumption)',
    },
    draws: residual.length,
    ...redshiftFreeTrailer(model, warnings),
  };
}
