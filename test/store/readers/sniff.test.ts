import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { sniffFormat } from '../../../src/store/readers/sniff.js';
import { fixturePath } from './formats-truth.js';

const head = (name: string) => readFileSync(fixturePath(name)).subarray(0, 4096);

describe('format sniffing', () => {
  it('recognises FITS, VOTable (TABLEDATA and BINARY2) and CSV by content', () => {
    expect(sniffFormat(head('field.fits'), 'field.fits')).toBe('fits');
    expect(sniffFormat(head('field.vot'))).toBe('votable');
    expect(sniffFormat(head('field_binary2.vot'))).toBe('votable');
    expect(sniffFormat(head('field.csv'))).toBe('csv');
  });

  it('says a CSV named .fits is CSV, so the loader can point out the mismatch', () => {
    expect(sniffFormat(head('csv_named.fits'), 'csv_named.fits')).toBe('csv');
  });

  it('tells TSV from CSV, ignores a BOM and comment lines, and calls non-VOTable XML and binary data unknown', () => {
    expect(sniffFormat(Buffer.from('# note\nid\tra\tdec\n1\t2\t3\n'))).toBe('tsv');
    expect(sniffFormat(Buffer.from('\uFEFFid,ra,dec\n'))).toBe('csv');
    expect(sniffFormat(head('notvotable.xml'))).toBe('unknown');
    expect(sniffFormat(Buffer.from('<?xml version="1.0"?>\n<!-- c -->\n<vo:VOTABLE version="1.4">'))).toBe(
      'votable',
    );
    expect(sniffFormat(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 1, 2]))).toBe('unknown');
    expect(sniffFormat(Buffer.alloc(0))).toBe('unknown');
  });
});
