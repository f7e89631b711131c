import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// The science packages do no I/O and know nothing of HTTP or SQL (DEVELOPERS.md, "Layout").
const SCIENCE = [
  'math',
  'cosmology',
  'sky',
  'halo',
  'gas',
  'dm',
  'model',
  'sightline',
  'budget',
  'budget-request',
];
const FORBIDDEN = [
  /from ['"]node:(fs|fs\/promises|net|http|https|child_process|worker_threads)['"]/,
  /from ['"](fs|http|https|net)['"]/,
  /from ['"]fastify/,
  /from ['"]better-sqlite3['"]/,
  /from ['"][./]+\/(store|cli)\//,
  /from ['"][./]+\/\.\.\/server\//,
  /process\.env/,
];

function tsFiles(dir: string): string[] {
  let out: string[] = [];
  let entries: string[];
  try {
    entries = readdirSync(dir);
  } catch {
    return out;
  }
  for (const e of entries) {
    const p = join(dir, e);
    if (statSync(p).isDirectory()) out = out.concat(tsFiles(p));
    else if (p.endsWith('.ts')) out.push(p);
  }
  return out;
}

describe('architecture', () => {
  it('science packages import no I/O, HTTP, SQL, store or CLI code', () => {
    const offenders: string[] = [];
    for (const pkg of SCIENCE) {
      for (const file of tsFiles(join('src', pkg))) {
        const text = readFileSync(file, 'utf8');
        for (const re of FORBIDDEN) if (re.test(text)) offenders.push(`${file}: ${re}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it('the store and the science never import the HTTP layer', () => {
    const offenders = tsFiles('src').filter((f) =>
      /from ['"][./]+\/(\.\.\/)*server\//.test(readFileSync(f, 'utf8')),
    );
    expect(offenders).toEqual([]);
  });
});
