/**
 * Last line of defence for error bodies: absolute file-system paths (a spool file, the database)
 * never reach a client, even if a message from deeper code mentions one.
 */
const ABSOLUTE_PATH = /(?<![\w.])(?:[A-Za-z]:)?(?:[\\/](?!v1\b)[\w.@+-]+){2,}[\\/]?/g;

export function redactPaths(text: string): string {
  return text.replace(ABSOLUTE_PATH, '[path]');
}

/** Copies a JSON-like value with every string passed through redactPaths. */
export function redactDeep(value: unknown, depth = 0): unknown {
  if (typeof value === 'string') return redactPaths(value);
  if (depth > 6 || value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map((v) => redactDeep(v, depth + 1));
  return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, redactDeep(v, depth + 1)]));
}
