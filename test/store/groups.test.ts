import { describe, expect, it } from 'vitest';
import { coneSearch, groupHaloRows, loadCatalog } from '../../src/store/index.js';
import { useTmp } from './tmp.js';

describe('group halo rows', () => {
  const tmp = useTmp();

  it('lets members find the one row that carries their group halo, in another catalogue', async () => {
    const store = tmp.store();
    await loadCatalog(store, {
      source: tmp.file(
        'groups.csv',
        'id,ra,dec,z,z_err,z_kind,log_mhalo,mhalo_def,log_mhalo_err\nGRP-7,30.0,-5.0,0.25,0.0003,spec,13.4,200c,0.2\n',
      ),
      name: 'groups',
    });
    await loadCatalog(store, {
      source: tmp.file(
        'members.csv',
        'id,ra,dec,z,z_err,z_kind,log_mstar,group_id\nm1,30.01,-5.0,0.251,0.0002,spec,10.6,GRP-7\nm2,29.99,-5.01,0.249,0.0002,spec,10.1,GRP-7\nf1,30.02,-4.99,0.4,0.0002,spec,10.0,\n',
      ),
      name: 'members',
    });
    const near = coneSearch(store, { raDeg: 30, decDeg: -5, radiusDeg: 0.1 });
    const groupIds = near.map((r) => r.groupId).filter((g): g is string => g !== null);
    expect(groupIds.sort()).toEqual(['GRP-7', 'GRP-7']);
    const halos = groupHaloRows(store, groupIds);
    expect(halos).toHaveLength(1);
    expect(halos[0]).toMatchObject({
      catalog: 'groups',
      objectId: 'GRP-7',
      logMhalo: 13.4,
      mhaloDef: '200c',
      logMhaloErr: 0.2,
    });
    expect(groupHaloRows(store, ['GRP-7'], ['members'])).toEqual([]);
    expect(groupHaloRows(store, ['no-such-group'])).toEqual([]);
  });

  it('requires a halo mass definition for a halo-mass column', async () => {
    const store = tmp.store();
    const csv = 'id,ra,dec,z,z_err,z_kind,log_mhalo\nG,30,-5,0.25,0.0003,spec,13.4\n';
    await expect(loadCatalog(store, { source: tmp.file('g.csv', csv), name: 'g' })).rejects.toThrow(
      /mhalo_def/,
    );
    const ok = await loadCatalog(store, {
      source: tmp.file('g.csv', csv),
      name: 'g',
      defaults: { mhaloDef: 'vir' },
    });
    expect(ok.rows).toBe(1);
  });
});
