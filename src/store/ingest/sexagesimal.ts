/**
 * Sexagesimal angles as catalogues write them: '14:09:36.2', '14 09 36.2', '14h09m36.2s' for right
 * ascension (hours, common practice) and '-08:54:12', '-08d54m12s', '−08°54′12″' for declination
 * (degrees). Returns NaN when the text is not sexagesimal or a part is out of range.
 */
const PATTERN =
  /^\s*([+\-−]?)\s*(\d{1,3})(?:\s*[:hd°\s]\s*)(\d{1,2})(?:(?:\s*[:m′'\s]\s*)(\d{1,2}(?:\.\d*)?))?\s*[sm″"′']?\s*$/i;

function parts(text: string): { sign: number; a: number; b: number; c: number } | null {
  const m = PATTERN.exec(text);
  if (!m) return null;
  const a = Number(m[2]);
  const b = Number(m[3]);
  const c = m[4] === undefined ? 0 : Number(m[4]);
  if (b >= 60 || c >= 60) return null;
  return { sign: m[1] === '-' || m[1] === '−' ? -1 : 1, a, b, c };
}

/** Right ascension 'hh:mm:ss.s' → degrees (×15). Hours must be < 24 and unsigned. */
export function parseSexagesimalRaDeg(text: string): number {
  const p = parts(text);
  if (!p || p.sign < 0 || p.a >= 24) return Number.NaN;
  return 15 * (p.a + p.b / 60 + p.c / 3600);
}

/** Declination '±dd:mm:ss.s' → degrees. The sign applies to the whole angle (so '-00:30:00' = −0.5°). */
export function parseSexagesimalDecDeg(text: string): number {
  const p = parts(text);
  if (!p || p.a > 90) return Number.NaN;
  return p.sign * (p.a + p.b / 60 + p.c / 3600);
}
