import { z } from 'zod';
import { catalogName, queryBoolean } from './primitives.js';

export const catalogParams = z.object({ name: catalogName });

/** "target=source" pairs separated by commas, e.g. `ra=RAJ2000,dec=DEJ2000,z=zspec`. */
const columnMap = z
  .string()
  .max(2000)
  .transform((text, ctx) => {
    const map: Record<string, string> = {};
    for (const pair of text.split(',')) {
      const [target, source, ...extra] = pair.split('=').map((s) => s.trim());
      if (!target || !source || extra.length > 0) {
        ctx.addIssue({ code: 'custom', message: `"${pair}" is not target=source` });
        return z.NEVER;
      }
      map[target] = source;
    }
    return map;
  })
  .describe('Column mapping as target=source pairs, comma-separated (e.g. ra=RAJ2000,z=zspec)');

export const loadQuery = z.object({
  format: z
    .enum(['csv', 'tsv', 'fits', 'votable'])
    .optional()
    .describe('File format; guessed from the content when omitted'),
  map: columnMap.optional(),
  file_name: z
    .string()
    .min(1)
    .max(200)
    .regex(/^[^/\\]+$/, 'a bare file name, without folders')
    .optional()
    .describe('Original file name to record with the catalogue (e.g. deep_field_spec.csv)'),
  skip_invalid: queryBoolean
    .optional()
    .describe('Skip rows that fail validation (they are counted and reported) instead of rejecting the file'),
  mode: z
    .enum(['create', 'replace', 'append'])
    .default('create')
    .describe('create: fail if the catalogue exists; replace: swap it atomically; append: add rows'),
});

/** Loose on purpose: the store owns the exact fields of its catalogue summaries and load reports. */
export const catalogSummary = z.record(z.string(), z.unknown()).describe('Catalogue summary from the store');
export const loadReport = z
  .record(z.string(), z.unknown())
  .describe('Load report: rows read, stored, skipped');
