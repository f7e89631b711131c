/**
 * The invented demo scenario: the fictional "Kestrel Deep Field" and its burst "Osprey". Nothing here
 * is a real burst, survey or galaxy. The catalogues in fixtures/demo are generated around this position
 * by scripts/demo/make-field.ts; the DM numbers are made up to be plausible for such a sightline.
 */
export const DEMO_BURST = {
  name: 'Osprey',
  field: 'Kestrel Deep Field',
  raDeg: 162.71834,
  decDeg: 31.40862,
  zSource: 0.4275,
  hostId: 'KDF-S-0001',
  /** Observed DM and its error [pc cm⁻³] (invented). */
  dmObs: 1187.4,
  dmObsErr: 0.5,
  /** Milky Way ISM DM as a user's Galactic model might give it [pc cm⁻³] (invented). */
  dmIsm: 38.6,
  dmIsmErr: 7.7,
} as const;

export const DEMO_CATALOGS = [
  { name: 'kestrel-spec', file: 'kestrel_spec.csv', description: 'Kestrel spectroscopic list (invented)' },
  {
    name: 'kestrel-photo',
    file: 'kestrel_photo.csv',
    description: 'Kestrel photometric-redshift survey (invented)',
  },
  { name: 'kestrel-groups', file: 'kestrel_groups.csv', description: 'Kestrel group catalogue (invented)' },
] as const;
