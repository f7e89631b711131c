// Number formatting shared by the charts, table and tooltips.

/** Fixed decimals, or an en dash for missing values. */
export function fmt(value, digits = 2) {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return value.toFixed(digits);
}

/** A median with its 16th–84th percentile offsets, e.g. 42.1 +10.3 −7.9. */
export function fmtInterval(summary, digits = 1) {
  if (!summary) return '–';
  return `${fmt(summary.p50, digits)} +${fmt(summary.p84 - summary.p50, digits)} −${fmt(summary.p50 - summary.p16, digits)}`;
}

/** Escapes text for safe insertion into HTML. */
export function escapeHtml(text) {
  return String(text).replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c],
  );
}
