import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { defaultModel, parseModel } from '../../src/model/index.js';

describe('the model object', () => {
  it('fills every default the brief names when nothing is sent', () => {
    const m = defaultModel();
    expect(m.cosmology).toBe('planck18');
    expect(m.shmr).toBe('moster2013');
    expect(m.mass_definition).toBe('200c');
    expect(m.concentration).toBe('dutton-maccio-2014');
    // Mathews & Prochaska 2017 modified NFW with α = 2, y₀ = 2 (physics.md §5.2).
    expect(m.profile).toEqual({ kind: 'mnfw', alpha: 2, y0: 2 });
    expect(m.f_hot).toBe(0.75);
    expect(m.extent).toBe(1);
    expect(m.search).toBe(2);
    // μ_e = 8/7 for X = 0.75, Y = 0.25 (physics.md §5.4).
    expect(m.mu_e).toBeCloseTo(8 / 7, 15);
    expect(m.velocity_window_kms).toBe(1000);
    expect(m.draws).toBe(1000);
    expect(m.seed).toBe(1);
    expect(m.scatter).toEqual({ shmr_dex: 'published', concentration_dex: 'published' });
  });

  it('fills the mNFW shape parameters when only the kind is sent', () => {
    expect(parseModel({ profile: { kind: 'mnfw', alpha: 1 } }).profile).toEqual({
      kind: 'mnfw',
      alpha: 1,
      y0: 2,
    });
    expect(parseModel({ profile: { kind: 'nfw' } }).profile).toEqual({ kind: 'nfw' });
  });

  it('accepts a custom cosmology object', () => {
    const m = parseModel({ cosmology: { H0: 70, Om0: 0.3, Ob0: 0.05 } });
    expect(typeof m.cosmology).toBe('object');
  });

  it('names the key of an unknown model name in the error', () => {
    expect(() => parseModel({ shmr: 'nonesuch' })).toThrow(/model\.shmr/);
    expect(() => parseModel({ concentration: 'x' })).toThrow(/model\.concentration/);
    expect(() => parseModel({ mass_definition: '500c' })).toThrow(/model\.mass_definition/);
    expect(() => parseModel({ profile: { kind: 'beta' } })).toThrow(/model\.profile\.kind/);
    try {
      parseModel({ shmr: 'nonesuch' });
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).code).toBe('bad_model');
    }
  });

  it('rejects unknown keys, too many draws and a search radius inside the gas extent', () => {
    expect(() => parseModel({ bogus: 1 })).toThrow(/bogus/);
    expect(() => parseModel({ draws: 100_001 })).toThrow(/model\.draws/);
    expect(() => parseModel({ draws: 100_000 })).not.toThrow();
    expect(() => parseModel({ extent: 3 })).toThrow(/model\.search/);
    expect(() => parseModel({ f_hot_prior: { kind: 'uniform', min: 0.8, max: 0.2 } })).toThrow(/f_hot_prior/);
  });
});
