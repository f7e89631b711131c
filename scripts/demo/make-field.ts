/**
 * Writes the invented demo field used by `forehalo demo`, the README and the browser test.
 *
 * Everything here is fiction: the "Kestrel Deep Field", its surveys and the burst "Osprey" do not exist.
 * The generator is seeded, so the committed files are reproducible: `npx tsx scripts/demo/make-field.ts`.
 *
 * Files (fixtures/demo/):
 * - kestrel_spec.csv   — a spectroscopic follow-up list (z_err ≈ 2e-4, masses from SED fits, ±0.1 dex),
 *                        including the members of one foreground group and the candidate host.
 * - kestrel_photo.csv  — a photometric-redshift survey of the field (σ_z ≈ 0.03(1+z), masses ±0.2 dex);
 *                        about one spectroscopic galaxy in three appears here too, offset by < 0.3″, so
 *                        cross-catalogue duplicates are exercised.
 * - kestrel_groups.csv — a group catalogue with one foreground group whose halo mass is catalogued.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_BURST } from '../../src/cli/demo/scenario.js';
import { createRng, type Rng } from '../../src/math/random.js';

export { DEMO_BURST };

const FIELD_RADIUS_DEG = 0.22;
const here = dirname(fileURLToPath(import.meta.url));
const outDir = join(here, '../../fixtures/demo');

interface Galaxy {
  id: string;
  raDeg: number;
  decDeg: number;
  z: number;
  logMstar: number;
  groupId?: string;
}

/** Point at separation `sepArcsec` and position angle `paDeg` from the burst (small-angle, fine at < 1°). */
function offset(sepArcsec: number, paDeg: number): { raDeg: number; decDeg: number } {
  const pa = (paDeg * Math.PI) / 180;
  const dDec = (sepArcsec / 3600) * Math.cos(pa);
  const dRa = (sepArcsec / 3600) * Math.sin(pa);
  const decDeg = DEMO_BURST.decDeg + dDec;
  const raDeg = DEMO_BURST.raDeg + dRa / Math.cos((DEMO_BURST.decDeg * Math.PI) / 180);
  return { raDeg, decDeg };
}

/** Redshift from p(z) ∝ z² exp(−(z/0.32)^1.5) on (0.01, 1.3) by rejection (a smooth survey-like shape). */
function drawZ(rng: Rng): number {
  for (;;) {
    const z = 0.01 + 1.29 * rng.uniform();
    const p = (z / 0.4) ** 2 * Math.exp(-((z / 0.32) ** 1.5) + (0.4 / 0.32) ** 1.5);
    if (rng.uniform() * 1.05 < p) return z;
  }
}

/**
 * log M* from a Schechter (1976) stellar mass function, Φ ∝ 10^((α+1)(x − x*)) exp(−10^(x − x*)), with
 * x* = 10.8 and α = −1.3 (values typical of low-redshift fits; from memory, for invented data only),
 * between 8.3 and 11.6, by rejection against a uniform envelope.
 */
function drawLogMstar(rng: Rng): number {
  const xStar = 10.8;
  const alpha = -1.3;
  const lo = 8.3;
  const hi = 11.6;
  const phi = (x: number) => 10 ** ((alpha + 1) * (x - xStar)) * Math.exp(-(10 ** (x - xStar)));
  const peak = phi(lo);
  for (;;) {
    const x = lo + (hi - lo) * rng.uniform();
    if (rng.uniform() * peak < phi(x)) return x;
  }
}

function randomInField(rng: Rng): { raDeg: number; decDeg: number } {
  const r = FIELD_RADIUS_DEG * 3600 * Math.sqrt(rng.uniform());
  return offset(r, 360 * rng.uniform());
}

function fmt(x: number, digits: number): string {
  return x.toFixed(digits);
}

export function makeField(seed = 20261201) {
  const rng = createRng(seed);
  const spec: Galaxy[] = [];
  const photo: Galaxy[] = [];

  // The candidate host, 0.8″ from the burst position.
  spec.push({ id: DEMO_BURST.hostId, ...offset(0.8, 40), z: DEMO_BURST.zSource, logMstar: 10.31 });
  // Two massive galaxies close to the sightline.
  spec.push({ id: 'KDF-S-0002', ...offset(17.5, 118), z: 0.1812, logMstar: 11.02 });
  spec.push({ id: 'KDF-S-0003', ...offset(21.0, 251), z: 0.3094, logMstar: 10.64 });
  // A foreground group at z ≈ 0.214, centred 95″ from the sightline, with seven members.
  const groupCentre = offset(95, 300);
  const groupZ = 0.2138;
  for (let m = 0; m < 7; m++) {
    const pos = offset(95 + 40 * rng.normal(), 300 + 8 * rng.normal());
    spec.push({
      id: `KDF-S-G${m + 1}`,
      ...pos,
      z: groupZ + 0.0015 * rng.normal(),
      logMstar: m === 0 ? 10.95 : 9.4 + 1.2 * rng.uniform(),
      groupId: 'KDF-GRP-01',
    });
  }
  // Environment of the burst: two companions of the host within the velocity window.
  spec.push({ id: 'KDF-S-0004', ...offset(48, 160), z: DEMO_BURST.zSource + 0.0011, logMstar: 9.7 });
  spec.push({ id: 'KDF-S-0005', ...offset(75, 20), z: DEMO_BURST.zSource - 0.0019, logMstar: 9.2 });
  // The rest of the spectroscopic list: brighter (more massive) galaxies scattered over the field.
  for (let i = 6; spec.length < 420; i++) {
    const logMstar = Math.max(drawLogMstar(rng), 9.3 + 0.8 * rng.uniform());
    spec.push({ id: `KDF-S-${String(i).padStart(4, '0')}`, ...randomInField(rng), z: drawZ(rng), logMstar });
  }
  // Photometric survey: about a third of the spectroscopic galaxies again (not the host), plus 2800 others.
  let n = 1;
  for (const g of spec.slice(1)) {
    if (rng.uniform() < 0.34 || g.id === 'KDF-S-0003') {
      const dRa = (0.25 * rng.normal()) / 3600 / Math.cos((g.decDeg * Math.PI) / 180);
      const dDec = (0.25 * rng.normal()) / 3600;
      const zPhot = Math.max(0.005, g.z + 0.03 * (1 + g.z) * rng.normal());
      photo.push({
        id: `KP${String(n++).padStart(6, '0')}`,
        raDeg: g.raDeg + dRa,
        decDeg: g.decDeg + dDec,
        z: zPhot,
        logMstar: g.logMstar + 0.15 * rng.normal(),
      });
    }
  }
  // Three photometric galaxies right next to the sightline: the ones a spectrograph should visit first.
  photo.push({ id: `KP${String(n++).padStart(6, '0')}`, ...offset(12.0, 35), z: 0.262, logMstar: 10.45 });
  photo.push({ id: `KP${String(n++).padStart(6, '0')}`, ...offset(31.0, 200), z: 0.395, logMstar: 10.2 });
  photo.push({ id: `KP${String(n++).padStart(6, '0')}`, ...offset(26.0, 80), z: 0.148, logMstar: 9.85 });
  while (photo.length < 3200) {
    photo.push({
      id: `KP${String(n++).padStart(6, '0')}`,
      ...randomInField(rng),
      z: drawZ(rng),
      logMstar: drawLogMstar(rng),
    });
  }

  const specCsv = [
    '# Kestrel Deep Field spectroscopic list (invented demo data; see scripts/demo/make-field.ts)',
    'id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err,group_id',
    ...spec.map((g) =>
      [
        g.id,
        fmt(g.raDeg, 6),
        fmt(g.decDeg, 6),
        fmt(g.z, 5),
        '0.0002',
        'spec',
        fmt(g.logMstar, 2),
        '0.10',
        g.groupId ?? '',
      ].join(','),
    ),
  ];
  const photoCsv = [
    '# Kestrel Deep Field photometric-redshift survey (invented demo data; see scripts/demo/make-field.ts)',
    'id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err',
    ...photo.map((g) =>
      [
        g.id,
        fmt(g.raDeg, 6),
        fmt(g.decDeg, 6),
        fmt(g.z, 4),
        fmt(0.03 * (1 + g.z), 4),
        'photo',
        fmt(g.logMstar, 2),
        '0.20',
      ].join(','),
    ),
  ];
  const groupsCsv = [
    '# Kestrel Deep Field group catalogue (invented demo data); halo masses from member dynamics',
    'id,ra,dec,z,z_err,z_kind,log_mhalo,mhalo_def,log_mhalo_err',
    [
      'KDF-GRP-01',
      fmt(groupCentre.raDeg, 6),
      fmt(groupCentre.decDeg, 6),
      fmt(groupZ, 5),
      '0.0003',
      'spec',
      '13.35',
      '200c',
      '0.20',
    ].join(','),
  ];
  return {
    spec: specCsv.join('\n') + '\n',
    photo: photoCsv.join('\n') + '\n',
    groups: groupsCsv.join('\n') + '\n',
  };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const field = makeField();
  mkdirSync(outDir, { recursive: true });
  writeFileSync(join(outDir, 'kestrel_spec.csv'), field.spec);
  writeFileSync(join(outDir, 'kestrel_photo.csv'), field.photo);
  writeFileSync(join(outDir, 'kestrel_groups.csv'), field.groups);
  console.log(`wrote ${outDir}/kestrel_{spec,photo,groups}.csv`);
}
