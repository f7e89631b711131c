import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { dmRestExact } from '../../src/dm/index.js';
import { InputError } from '../../src/errors.js';
import { createGasProfile } from '../../src/gas/index.js';
import { haloFromStellarMass } from '../../src/halo/index.js';
import {
  type CatalogRow,
  runParsedSightline,
  runSightline,
  type SightlineResponse,
  sightlineRequestSchema,
} from '../../src/sightline/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { bruteCone } from './helpers/brute-cone.js';
import { galaxyAtImpact } from './helpers/field.js';
import { offsetPoint } from './helpers/sky-offset.js';

const planck18 = createCosmology('planck18');
const SIGHT = { raDeg: 150, decDeg: 2 };
const run = (rows: CatalogRow[], request: Record<string, unknown>): SightlineResponse =>
  runSightline({ coneSearch: bruteCone(rows) }, { ra: SIGHT.raDeg, dec: SIGHT.decDeg, ...request });
const NO_SCATTER = { scatter: { shmr_dex: 0, concentration_dex: 0 } };

describe('runSightline: one galaxy against the core packages', () => {
  it('gives a dm_central equal to the exact line-of-sight integral for the same halo', () => {
    const row = galaxyAtImpact(SIGHT, { id: 'A', z: 0.2, bKpc: 80, logMstar: 10.7 });
    const res = run([row], { z_source: 0.6 });
    expect(res.galaxies).toHaveLength(1);
    const g = res.galaxies[0];
    const halo = haloFromStellarMass(10.7, 0.2, planck18, {
      shmr: 'moster2013',
      massDefinition: '200c',
      concentrationRelation: 'dutton-maccio-2014',
    });
    const profile = createGasProfile({ kind: 'mnfw', alpha: 2, y0: 2 }, halo, {
      fHot: 0.75,
      baryonFraction: planck18.baryonFraction,
      muE: 8 / 7,
      extent: 1,
    });
    // Source: src/dm dmRestExact (the project's exact integrator), observer frame ÷ (1+z) (physics.md §6).
    expectClose(g.b_kpc, 80, { rtol: 1e-9 });
    expectClose(g.log_mhalo, Math.log10(halo.massMsun), { rtol: 1e-12 });
    expectClose(g.r_halo_kpc, halo.radiusKpc, { rtol: 1e-9 });
    expectClose(g.concentration, halo.concentration, { rtol: 1e-12 });
    expectClose(g.dm_central, dmRestExact(profile, g.b_kpc) / 1.2, { rtol: 1e-9 });
  });

  it('reports b = θ·D_A: (150°, +2°) to (150.01°, +2.01°) at z = 0.1 is 97.03286 kpc', () => {
    // Source: physics.md §1 check value computed with astropy 5.2 Planck18 (θ = 50.896106″).
    const row: CatalogRow = {
      catalog: 'test',
      objectId: 'B',
      raDeg: 150.01,
      decDeg: 2.01,
      z: 0.1,
      zErr: 0.0002,
      zKind: 'spec',
      logMstar: 11,
      logMstarErr: 0.1,
    };
    const g = run([row], { z_source: 0.5 }).galaxies[0];
    expectClose(g.sep_arcsec, 50.896106, { rtol: 2e-8 });
    // Tolerance 1e-6: astropy's D_A vs our tabulated comoving distance (physics.md suggests 1e-6 for quadrature).
    expectClose(g.b_kpc, 97.03286, { rtol: 1e-6 });
  });

  it('reproduces the end-to-end chain of physics.md §6.4 (Moster13 → DM14 200c → mNFW and NFW, r_max = R200)', () => {
    // Source: physics.md §6.4 [calc] (python3 + scipy 1.10 + astropy 5.2). Tolerance 1e-4: constant choices (§0).
    const cases = [
      { logMstar: 10.5, z: 0.1, b: 50, logMh: 11.9684, c: 8.1365, r: 199.325, mnfw: 76.0228, nfw: 86.416 },
      {
        logMstar: 11.0,
        z: 0.3,
        b: 150,
        logMh: 13.0292,
        c: 5.9339,
        r: 418.352,
        mnfw: 120.9322,
        nfw: 110.9329,
      },
      { logMstar: 10.0, z: 0.05, b: 30, logMh: 11.5276, c: 9.1777, r: 144.51, mnfw: 64.5877, nfw: 83.1075 },
    ];
    for (const k of cases) {
      const row = galaxyAtImpact(SIGHT, { id: 'C', z: k.z, bKpc: k.b, logMstar: k.logMstar });
      const m = run([row], { z_source: 1, model: NO_SCATTER }).galaxies[0];
      expectClose(m.log_mhalo, k.logMh, { rtol: 1e-5 });
      expectClose(m.concentration, k.c, { rtol: 1e-4 });
      expectClose(m.r_halo_kpc, k.r, { rtol: 1e-4 });
      expectClose(m.dm_central, k.mnfw, { rtol: 1e-4 });
      const n = run([row], { z_source: 1, model: { ...NO_SCATTER, profile: { kind: 'nfw' } } }).galaxies[0];
      expectClose(n.dm_central, k.nfw, { rtol: 1e-4 });
    }
  });

  it('gives a Milky-Way-mass galaxy at b ≈ 0.3 r_halo, z ≈ 0.1 a few tens of pc cm⁻³', () => {
    // Common practice: an L* halo adds of order tens of pc cm⁻³ at a fraction of its virial radius.
    const probe = galaxyAtImpact(SIGHT, { id: 'MW', z: 0.1, bKpc: 60, logMstar: 10.7 });
    const r = run([probe], { z_source: 0.5 }).galaxies[0].r_halo_kpc;
    const row = galaxyAtImpact(SIGHT, { id: 'MW', z: 0.1, bKpc: 0.3 * r, logMstar: 10.7 });
    const g = run([row], { z_source: 0.5 }).galaxies[0];
    expect(g.log_mhalo).toBeGreaterThan(11.9);
    expect(g.log_mhalo).toBeLessThan(12.4);
    expectClose(g.b_over_rhalo, 0.3, { rtol: 1e-6 });
    expect(g.dm_central).toBeGreaterThan(20);
    expect(g.dm_central).toBeLessThan(100);
  });

  it('has a Monte Carlo mean equal to dm_central for a spectroscopic galaxy with zero scatter', () => {
    const row = galaxyAtImpact(SIGHT, { id: 'D', z: 0.15, bKpc: 70, logMstar: 10.6, logMstarErr: 0 });
    for (const profile of [{ kind: 'mnfw' }, { kind: 'nfw' }, { kind: 'mb04' }]) {
      const res = run([row], { z_source: 0.5, model: { ...NO_SCATTER, profile, draws: 200 } });
      const g = res.galaxies[0];
      expect(g.dm_central).toBeGreaterThan(0);
      // Tolerance 1e-5: the Monte Carlo uses src/dm's fast table (4-point Lagrange), dm_central the exact path.
      expectClose(g.dm.mean, g.dm_central, { rtol: 1e-5 });
      expectClose(g.dm.p2_5, g.dm_central, { rtol: 1e-5 });
      expectClose(res.totals.dm_halos.p97_5, g.dm_central, { rtol: 1e-5 });
      expect(g.p_contributes).toBe(1);
    }
  });
});

describe('runSightline: Monte Carlo bookkeeping', () => {
  const field = (): CatalogRow[] => [
    galaxyAtImpact(SIGHT, { id: 'S1', z: 0.12, bKpc: 90, logMstar: 10.8 }),
    galaxyAtImpact(SIGHT, { id: 'S2', z: 0.3, bKpc: 200, logMstar: 11.1, paDeg: 200 }),
    {
      ...galaxyAtImpact(SIGHT, { id: 'P1', z: 0.25, bKpc: 120, logMstar: 10.4, paDeg: 100 }),
      zKind: 'photo',
      zErr: 0.05,
    },
    {
      ...galaxyAtImpact(SIGHT, { id: 'P2', z: 0.44, bKpc: 100, logMstar: 10.9, paDeg: 300 }),
      zKind: 'photo',
      zErr: 0.06,
    },
  ];

  it('sums the galaxies draw by draw: the mean of the per-draw totals is the total mean', () => {
    const res = run(field(), { z_source: 0.45, include_draws: true });
    const draws = res.draws_dm!;
    expect(draws).toHaveLength(1000);
    const mean = draws.reduce((a, b) => a + b, 0) / draws.length;
    expectClose(res.totals.dm_halos.mean, mean, { rtol: 1e-12 });
    const sumOfMeans = res.galaxies.reduce((a, g) => a + g.dm.mean, 0);
    expectClose(res.totals.dm_halos.mean, sumOfMeans, { rtol: 1e-12 });
    expect(res.totals.n_candidates).toBe(4);
  });

  it('returns identical output for the same seed and different draws for another seed', () => {
    const a = run(field(), { z_source: 0.45, model: { seed: 7 } });
    const b = run(field(), { z_source: 0.45, model: { seed: 7 } });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    const c = run(field(), { z_source: 0.45, model: { seed: 8 } });
    expect(c.totals.dm_halos.mean).not.toBe(a.totals.dm_halos.mean);
    expect(a.totals.seed).toBe(7);
  });

  it('gives the same totals when the catalogue is split into two catalogues in another order', () => {
    const rows = field();
    const split = rows.map((r, i) => ({ ...r, catalog: i % 2 ? 'north' : 'south' })).reverse();
    const a = run(rows, { z_source: 0.45, include_draws: true });
    const b = run(split, { z_source: 0.45, include_draws: true });
    expect(b.totals).toEqual(a.totals);
    expect(b.draws_dm).toEqual(a.draws_dm);
  });

  it('changes nothing when the same configuration is moved across RA 0 or next to a pole', () => {
    const offsets = [
      { id: 'S1', z: 0.12, sep: 0.01, pa: 80, m: 10.8 },
      { id: 'S2', z: 0.2, sep: 0.02, pa: 260, m: 11.0 },
      { id: 'S3', z: 0.33, sep: 0.012, pa: 10, m: 10.6 },
    ];
    const build = (ra: number, dec: number): CatalogRow[] =>
      offsets.map((o) => {
        const [r, d] = offsetPoint(ra, dec, o.sep, o.pa);
        return {
          catalog: 't',
          objectId: o.id,
          raDeg: r,
          decDeg: d,
          z: o.z,
          zErr: 0.0002,
          zKind: 'spec',
          logMstar: o.m,
          logMstarErr: 0.1,
        };
      });
    const at = (ra: number, dec: number) =>
      runSightline({ coneSearch: bruteCone(build(ra, dec)) }, { ra, dec, z_source: 0.5 });
    const ref = at(120, 10);
    for (const [ra, dec] of [
      [0.001, 10],
      [359.999, 10],
      [45, 89.995],
      [300, -89.995],
    ]) {
      const other = at(ra, dec);
      expect(other.galaxies.map((g) => g.id)).toEqual(ref.galaxies.map((g) => g.id));
      other.galaxies.forEach((g, i) => {
        expectClose(g.b_kpc, ref.galaxies[i].b_kpc, { rtol: 1e-7 });
        expectClose(g.dm_central, ref.galaxies[i].dm_central, { rtol: 1e-6, atol: 1e-9 });
      });
      expectClose(other.totals.dm_halos.mean, ref.totals.dm_halos.mean, { rtol: 1e-6 });
    }
    // RA 0 is crossed: the galaxies of the RA-0.001 configuration lie on both sides of 0/360.
    const ras = build(0.001, 10).map((r) => r.raDeg);
    expect(ras.some((r) => r > 359)).toBe(true);
    expect(ras.some((r) => r < 1)).toBe(true);
  });
});

describe('runSightline: source-redshift error and f_hot prior', () => {
  it('lets a spectroscopic galaxy near z_s contribute in the fraction of draws where it is in front', () => {
    const row = galaxyAtImpact(SIGHT, { id: 'NEAR', z: 0.39, bKpc: 40, logMstar: 10.5, logMstarErr: 0 });
    const res = run([row], { z_source: 0.4, z_source_err: 0.01, model: { ...NO_SCATTER, draws: 4000 } });
    const g = res.galaxies[0];
    // P(z < z_s − Δz) with z_s ~ N(0.4, 0.01): Φ((T(0.4) − 0.39)/(0.01 (1 − β))) (physics.md §9, σ_T).
    expect(g.p_fg).toBeGreaterThan(0.1);
    expect(g.p_fg).toBeLessThan(0.9);
    const se = Math.sqrt((g.p_fg * (1 - g.p_fg)) / 4000);
    expect(Math.abs(g.p_contributes - g.p_fg)).toBeLessThan(4 * se);
  });

  it('scales the DM linearly with a uniform f_hot prior (gas mass ∝ f_hot, physics.md §5)', () => {
    const row = galaxyAtImpact(SIGHT, { id: 'F', z: 0.15, bKpc: 70, logMstar: 10.6, logMstarErr: 0 });
    const res = run([row], {
      z_source: 0.5,
      model: { ...NO_SCATTER, draws: 4000, f_hot_prior: { kind: 'uniform', min: 0.5, max: 1 } },
    });
    const g = res.galaxies[0];
    const perUnitFHot = g.dm_central / 0.75;
    // Uniform on [0.5, 1]: percentiles at 0.5 + 0.5 q; 2 % covers sampling of 4000 draws.
    expectClose(g.dm.p2_5, perUnitFHot * (0.5 + 0.5 * 0.025), { rtol: 0.02 });
    expectClose(g.dm.p50, perUnitFHot * 0.75, { rtol: 0.02 });
    expectClose(g.dm.p97_5, perUnitFHot * (0.5 + 0.5 * 0.975), { rtol: 0.02 });
  });
});

describe('runSightline: foreground, environment, host, groups', () => {
  it('gives photometric galaxies p_fg from the truncated normal CDF (physics.md §9 table)', () => {
    // Source: physics.md §9 [calc] (scipy 1.10): (z_p, z_s, σ₀) → P_fg (truncated at z > 0). No velocity window.
    const cases = [
      { zp: 0.3, zs: 0.35, s0: 0.03, p: 0.900088 },
      { zp: 0.3, zs: 0.3, s0: 0.03, p: 0.5 },
      { zp: 0.5, zs: 0.4, s0: 0.05, p: 0.091211 },
      { zp: 0.05, zs: 0.1, s0: 0.05, p: 0.794524 },
    ];
    for (const k of cases) {
      const row = galaxyAtImpact(SIGHT, { id: 'P', z: k.zp, bKpc: 50, logMstar: 10.5 });
      const photo = { ...row, zKind: 'photo' as const, zErr: k.s0 * (1 + k.zp) };
      const res = run([photo], { z_source: k.zs, model: { velocity_window_kms: 0 } });
      const g = res.galaxies[0];
      // The table quotes six decimals: tolerance half a unit in the last place.
      expectClose(g.p_fg, k.p, { rtol: 0, atol: 5e-7 });
      // The draws agree: p_contributes ≈ p_fg within 4 binomial standard errors (the halo is always hit).
      const se = Math.sqrt((k.p * (1 - k.p)) / 1000);
      expect(Math.abs(g.p_contributes - k.p)).toBeLessThanOrEqual(4 * se + 0.02);
    }
  });

  it('lists the host and galaxies within ±1000 km/s of the burst as environment, not foreground', () => {
    const zs = 0.4;
    const dz = ((1 + zs) * 1000) / 299792.458;
    const rows = [
      galaxyAtImpact(SIGHT, { id: 'HOST', z: zs, bKpc: 3, logMstar: 10.2 }),
      galaxyAtImpact(SIGHT, { id: 'NEIGH', z: zs - 0.5 * dz, bKpc: 80, logMstar: 10.4, paDeg: 120 }),
      galaxyAtImpact(SIGHT, { id: 'FG', z: zs - 2 * dz, bKpc: 80, logMstar: 10.4, paDeg: 220 }),
    ];
    const res = run(rows, { z_source: zs, host_id: 'HOST' });
    expect(res.galaxies.map((g) => g.id)).toEqual(['FG']);
    expect(res.environment.map((e) => [e.id, e.is_host]).sort()).toEqual([
      ['HOST', true],
      ['NEIGH', false],
    ]);
    const neigh = res.environment.find((e) => e.id === 'NEIGH')!;
    expectClose(neigh.dv_kms, -500, { rtol: 1e-9 });
    expect(res.warnings.map((w) => w.code)).not.toContain('host_not_found');
  });

  it('gives the same result however the store queries are grouped', () => {
    // A small field of spectroscopic and photometric galaxies at several redshifts and separations.
    const rows: CatalogRow[] = [];
    for (let i = 0; i < 24; i++) {
      const z = 0.03 + 0.03 * i;
      const g = galaxyAtImpact(SIGHT, {
        id: `F${i}`,
        z,
        bKpc: 20 + 15 * i,
        logMstar: 9.5 + (i % 5) * 0.4,
        paDeg: 15 * i,
      });
      rows.push(i % 3 === 0 ? g : { ...g, zKind: 'photo', zErr: 0.03 * (1 + z) });
    }
    const request = { ra: SIGHT.raDeg, dec: SIGHT.decDeg, z_source: 0.5, model: { draws: 300, seed: 5 } };
    const calls: unknown[][] = [[], [], []];
    const results = [0, 30, 1e12].map((queryCostRows, k) =>
      runSightline({ coneSearch: bruteCone(rows, calls[k] as never), queryCostRows }, request),
    );
    // Only the diagnostic count of rows returned by the store may differ.
    const strip = (r: SightlineResponse) => ({ ...r, sightline: { ...r.sightline, rows_scanned: 0 } });
    expect(strip(results[1])).toEqual(strip(results[0]));
    expect(strip(results[2])).toEqual(strip(results[0]));
    expect(results[0].galaxies.length).toBeGreaterThan(5);
    expect(calls[2].length).toBeLessThan(calls[0].length);
  });

  it('gives the same result from an already parsed request (the server path) as from a raw one', () => {
    const rows = [
      galaxyAtImpact(SIGHT, { id: 'A', z: 0.2, bKpc: 80, logMstar: 10.7 }),
      {
        ...galaxyAtImpact(SIGHT, { id: 'B', z: 0.35, bKpc: 60, logMstar: 10.2 }),
        zKind: 'photo' as const,
        zErr: 0.04,
      },
    ];
    for (const request of [
      { ra: SIGHT.raDeg, dec: SIGHT.decDeg, z_source: 0.5 },
      {
        ra: SIGHT.raDeg,
        dec: SIGHT.decDeg,
        z_source: 0.5,
        model: { draws: 400, seed: 9, profile: { kind: 'nfw' } },
      },
    ]) {
      const deps = { coneSearch: bruteCone(rows) };
      const parsed = runParsedSightline(deps, sightlineRequestSchema.parse(request));
      expect(parsed).toEqual(runSightline(deps, request));
      expect(parsed.galaxies.length).toBe(2);
    }
  });

  it('counts members of a catalogued group halo only through the group', () => {
    const group: CatalogRow = {
      ...galaxyAtImpact(SIGHT, { id: 'GRP', z: 0.2, bKpc: 150, logMstar: 0 }),
      logMstar: null,
      logMhalo: 13.4,
      mhaloDef: '200c',
      logMhaloErr: 0.2,
    };
    const member = {
      ...galaxyAtImpact(SIGHT, { id: 'M1', z: 0.2003, bKpc: 60, logMstar: 10.9, paDeg: 90 }),
      groupId: 'GRP',
    };
    const res = run([group, member], { z_source: 0.6 });
    const m = res.galaxies.find((g) => g.id === 'M1')!;
    expect(m.flags).toContain('member_of_catalogued_group_halo');
    expect(m.dm.mean).toBe(0);
    expect(m.dm_central).toBe(0);
    const grp = res.galaxies.find((g) => g.id === 'GRP')!;
    expectClose(grp.log_mhalo, 13.4, { rtol: 1e-12 });
    expect(grp.dm.mean).toBeGreaterThan(0);
    // Alone, the member would contribute.
    const alone = run([{ ...member, groupId: null }], { z_source: 0.6 });
    expect(alone.galaxies[0].dm.mean).toBeGreaterThan(0);
  });

  it('ranks a photometric galaxy straddling the burst redshift as the first spectroscopy priority', () => {
    const rows: CatalogRow[] = [
      galaxyAtImpact(SIGHT, { id: 'SPEC', z: 0.2, bKpc: 60, logMstar: 10.6 }),
      {
        ...galaxyAtImpact(SIGHT, { id: 'STRADDLE', z: 0.4, bKpc: 40, logMstar: 10.9, paDeg: 100 }),
        zKind: 'photo',
        zErr: 0.05,
      },
      {
        ...galaxyAtImpact(SIGHT, { id: 'SAFE', z: 0.1, bKpc: 900, logMstar: 9.5, paDeg: 200 }),
        zKind: 'photo',
        zErr: 0.03,
      },
    ];
    const res = run(rows, { z_source: 0.4 });
    expect(res.priorities[0].id).toBe('STRADDLE');
    expect(res.priorities[0].var_fraction).toBeGreaterThan(0.3);
    expect(res.priorities.map((p) => p.id)).not.toContain('SPEC');
  });

  it('flags a galaxy beyond the relation and carries the matching cautions', () => {
    const row = galaxyAtImpact(SIGHT, { id: 'BIG', z: 0.2, bKpc: 300, logMstar: 12.3 });
    const res = run([row], { z_source: 0.6 });
    const g = res.galaxies[0];
    expect(g.flags).toContain('mhalo_capped_at_ceiling');
    expectClose(g.log_mhalo, 15.5, { rtol: 1e-12 });
    const codes = res.warnings.map((w) => w.code);
    for (const c of [
      'model_dependence',
      'cosmic_double_counting',
      'central_galaxy_relation',
      'eddington_bias',
      'outside_validity',
    ]) {
      expect(codes).toContain(c);
    }
    expect(res.model).toMatchObject({ shmr: 'moster2013', draws: 1000, seed: 1 });
  });

  it('rejects a bad request with an error naming the field', () => {
    expect(() => run([], { z_source: -1 })).toThrow(/z_source/);
    expect(() => runSightline({ coneSearch: bruteCone([]) }, { ra: 400, dec: 0, z_source: 0.3 })).toThrow(
      /ra/,
    );
    expect(() => run([], { z_source: 0.3, model: { shmr: 'nope' } })).toThrow(InputError);
    expect(() => run([], { z_source: 0.3, model: { shmr: 'nope' } })).toThrow(/model\.shmr/);
  });
});
