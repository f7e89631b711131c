/** One reason a source row cannot be stored. */
export interface RowProblem {
  /** Line (CSV/TSV) or row (FITS/VOTable) number, 1-based. */
  readonly position: number;
  readonly positionKind: 'line' | 'row';
  /** File column name, or the stored field when the column is not the point (e.g. 'z'). */
  readonly column: string;
  readonly value: string;
  readonly reason: string;
}

/** First problems kept in error details and stored reports. */
export const MAX_REPORTED_PROBLEMS = 100;

/** Collects problems: counts all, keeps the first MAX_REPORTED_PROBLEMS. */
export class ProblemLog {
  readonly problems: RowProblem[] = [];
  count = 0;
  /** Rows with at least one problem. */
  badRows = 0;

  add(p: RowProblem): void {
    this.count++;
    if (this.problems.length < MAX_REPORTED_PROBLEMS) this.problems.push(p);
  }

  static format(p: RowProblem): string {
    return `${p.positionKind} ${p.position}, column ${p.column}: ${p.reason} (value '${p.value}')`;
  }
}
