import { readFileSync } from 'node:fs';

/** fixtures/formats/field.csv (invented galaxies) parsed by hand: the truth the binary readers must match. */
export const FORMATS_DIR = new URL('../../../fixtures/formats/', import.meta.url);

export function fixturePath(name: string): string {
  return new URL(name, FORMATS_DIR).pathname;
}

export interface TruthTable {
  header: string[];
  rows: string[][];
}

export function readTruth(): TruthTable {
  const lines = readFileSync(fixturePath('field.csv'), 'utf8').trim().split('\n');
  return { header: lines[0].split(','), rows: lines.slice(1).map((l) => l.split(',')) };
}
