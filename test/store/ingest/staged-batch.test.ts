import { describe, expect, it } from 'vitest';
import { createPartWriter } from '../../../src/store/ingest/part-writer.js';
import type { StagedRow } from '../../../src/store/ingest/row-converter.js';
import { createBatchBuilder } from '../../../src/store/ingest/staged-batch.js';
import { useTmp } from '../tmp.js';
import { photoRow } from './staged-rows.js';

describe('staged batches', () => {
  const tmp = useTmp();

  it('carry every value of a row, including NULLs, codes and ids, into the galaxy table unchanged', () => {
    const rows: StagedRow[] = [
      [
        123456789,
        'a,1',
        10.5,
        -20.25,
        0.1,
        null,
        'spec',
        10.2,
        0.1,
        0,
        null,
        null,
        null,
        null,
        null,
        null,
        2,
      ],
      [5, 'b', 359.999999, 90, 0, 0.03, 'photo', null, null, 1, 21.5, 20.1, 13.2, '200m', 0.2, 'grp-7', 3],
      [0, 'c', 0, -90, 1.5, 0.001, 'spec', 9, 0.3, 0, 18, 17, 14.5, 'vir', null, 'c', 805306367],
    ];
    const builder = createBatchBuilder(4);
    for (const r of rows) builder.push(r);
    const batch = builder.take();
    expect(batch.length).toBe(3);
    expect(builder.length).toBe(0);
    const store = tmp.store();
    const catalogId = Number(
      store.statements.insertCatalog.run('t', '', 't.csv', '0'.repeat(64), 'csv', 3, 0, 'now', '{}', '{}')
        .lastInsertRowid,
    );
    createPartWriter(store.db).write(catalogId, 4, batch);
    const back = store.db
      .prepare(
        `SELECT hpx, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err, mass_estimated,
           g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position
         FROM galaxy WHERE catalog_id = ? AND run = 4 ORDER BY source_position`,
      )
      .raw(true)
      .all(catalogId);
    expect(back).toEqual(rows.map((r) => [...r]));
  });

  it('refuse a row beyond their capacity', () => {
    const builder = createBatchBuilder(1);
    const row = photoRow(1, 'x', 2);
    builder.push(row);
    expect(() => builder.push(row)).toThrow(/full/);
  });

  it('refuses a part with more than 2^18 − 1 rows in one storage pixel, naming it, before writing anything', () => {
    const n = 2 ** 18 + 1;
    const builder = createBatchBuilder(n);
    for (let i = 0; i < n; i++) builder.push(photoRow(4242, `P${i}`, i + 2));
    const store = tmp.store();
    expect(() => createPartWriter(store.db).write(1, 0, builder.take())).toThrow(
      /more than 262143 rows fall in one 25\.8″ HEALPix pixel \(nested index 4242 at order 13\)/,
    );
    expect(store.db.prepare('SELECT COUNT(*) FROM galaxy').pluck().get()).toBe(0);
  });
});
