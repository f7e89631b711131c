import { describe, expect, it } from 'vitest';
import { parseSexagesimalDecDeg, parseSexagesimalRaDeg } from '../../../src/store/ingest/sexagesimal.js';
import { expectClose } from '../../helpers/expect-close.js';

// Sexagesimal conventions (RA in hours × 15, Dec in degrees, the sign on the whole angle): common practice.
describe('sexagesimal angles', () => {
  it('reads RA hh:mm:ss.s in the colon, space and h/m/s spellings', () => {
    for (const t of ['14:09:36.2', '14 09 36.2', '14h09m36.2s']) {
      expectClose(parseSexagesimalRaDeg(t), 15 * (14 + 9 / 60 + 36.2 / 3600), { rtol: 1e-14 });
    }
  });

  it('applies a Dec sign to the whole angle, also when degrees are zero', () => {
    expectClose(parseSexagesimalDecDeg('-08:54:12'), -(8 + 54 / 60 + 12 / 3600), { rtol: 1e-14 });
    expectClose(parseSexagesimalDecDeg('-00:30:00'), -0.5, { rtol: 1e-14 });
    expectClose(parseSexagesimalDecDeg('+45d30m'), 45.5, { rtol: 1e-14 });
  });

  it('rejects out-of-range parts and non-sexagesimal text', () => {
    expect(parseSexagesimalRaDeg('24:00:00')).toBeNaN();
    expect(parseSexagesimalRaDeg('-01:00:00')).toBeNaN();
    expect(parseSexagesimalRaDeg('12:60:00')).toBeNaN();
    expect(parseSexagesimalDecDeg('91:00:00')).toBeNaN();
    expect(parseSexagesimalDecDeg('north')).toBeNaN();
  });
});
