import { describe, expect, it } from 'vitest';
import {
  cosmologySpecSchema,
  createCosmology,
  PLANCK18_PARAMS,
  resolveCosmologyParams,
} from '../../src/cosmology/index.js';
import { InputError } from '../../src/errors.js';

describe('cosmology parameters', () => {
  it('names Planck 2018 with its table and the astropy realisation', () => {
    expect(PLANCK18_PARAMS).toMatchObject({
      H0: 67.66,
      Om0: 0.30966,
      Ob0: 0.04897,
      Tcmb0: 2.7255,
      Neff: 3.046,
    });
    expect(PLANCK18_PARAMS.m_nu).toEqual([0, 0, 0.06]);
    expect(PLANCK18_PARAMS.reference).toMatch(/A&A 641, A6, Table 2/);
    expect(createCosmology('planck18').params).toBe(PLANCK18_PARAMS);
  });

  it('freezes the parameters so nobody can change a cosmology after construction', () => {
    const c = createCosmology({ H0: 70, Om0: 0.3, Ob0: 0.05 });
    expect(Object.isFrozen(c.params)).toBe(true);
    expect(Object.isFrozen(c.params.m_nu)).toBe(true);
    expect(Object.isFrozen(c)).toBe(true);
  });

  it('gives a custom set no radiation unless Tcmb0 is given', () => {
    const c = createCosmology({ H0: 70, Om0: 0.3, Ob0: 0.05 });
    expect(c.params.name).toBe('custom');
    expect(c.params.Tcmb0).toBe(0);
    expect(c.Ogamma0).toBe(0);
    expect(c.Onu0).toBe(0);
    expect(c.Ode0).toBeCloseTo(0.7, 15);
    const warm = createCosmology({ H0: 70, Om0: 0.3, Ob0: 0.05, Tcmb0: 2.7255 });
    expect(warm.Ogamma0).toBeGreaterThan(0);
    expect(warm.Ode0).toBeLessThan(0.7);
  });

  it.each([
    [{ H0: 0, Om0: 0.3, Ob0: 0.05 }, /H0: H0 must be > 0/],
    [{ H0: 70, Om0: 0.3, Ob0: 0.4 }, /Ob0: Ob0 must not exceed Om0/],
    [{ H0: 70, Om0: 1.2, Ob0: 0.05 }, /Om0: Om0 must be ≤ 1/],
    [{ H0: 70, Om0: 0.3, Ob0: 0 }, /Ob0: Ob0 must be > 0/],
    [{ H0: 70, Om0: 0.3, Ob0: 0.05, Tcmb0: -1 }, /Tcmb0: Tcmb0 must be ≥ 0/],
    [{ H0: 70, Om0: 0.3, Ob0: 0.05, Tcmb0: 2.7, m_nu: [0.1, 0.1] }, /m_nu: .*floor\(Neff\)/],
    [{ H0: 70, Om0: 0.3, Ob0: 0.05, Om: 0.3 }, /Unrecognized key/i],
    [{ H0: Number.NaN, Om0: 0.3, Ob0: 0.05 }, /H0/],
  ])('rejects %j with an input error naming the field', (spec, message) => {
    expect(() => resolveCosmologyParams(spec as never)).toThrow(InputError);
    expect(() => resolveCosmologyParams(spec as never)).toThrow(message);
  });

  it('rejects a flat model whose matter plus radiation exceeds 1', () => {
    expect(() => createCosmology({ H0: 70, Om0: 1, Ob0: 0.05, Tcmb0: 2.7255 })).toThrow(/ΩΛ < 0/);
  });

  it('offers one zod schema that accepts the named set and a custom set with defaults', () => {
    expect(cosmologySpecSchema.parse('planck18')).toBe('planck18');
    expect(cosmologySpecSchema.parse({ H0: 70, Om0: 0.3, Ob0: 0.05 })).toEqual({
      H0: 70,
      Om0: 0.3,
      Ob0: 0.05,
      Tcmb0: 0,
      Neff: 3.046,
      m_nu: 0,
    });
    expect(cosmologySpecSchema.safeParse('wmap9').success).toBe(false);
  });
});
