/** Problems found in a population-table file: where they are, and how many are listed. */
import { cutText, MAX_LISTED_PROBLEMS, moreProblems } from '../files/problems';
import type { Issue } from '../result';

/** Most problems listed for one file; beyond it one last problem says how many more there were (the same cap as every file import). */
export const MAX_REPORTED_PROBLEMS = MAX_LISTED_PROBLEMS;

/** A problem in a table file: an {@link Issue} plus where it is (row = line of the file, column = header name or detail key). */
export interface TableFileIssue extends Issue {
  readonly line?: number;
  readonly column?: string;
}

/** Collects problems up to {@link MAX_REPORTED_PROBLEMS}, counting the rest. */
export class Problems {
  readonly list: TableFileIssue[] = [];
  total = 0;
  add(issue: TableFileIssue): void {
    this.total++;
    if (this.list.length < MAX_REPORTED_PROBLEMS) this.list.push(issue);
  }
  /** The listed problems by row, then one line counting those not listed. */
  result(): TableFileIssue[] {
    const sorted = [...this.list].sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
    if (this.total > this.list.length) sorted.push(moreProblems(this.total - this.list.length));
    return sorted;
  }
}

function where(line: number | undefined, column: string | undefined, detail: boolean): string {
  if (line !== undefined && column !== undefined) return `Row ${line}, ${detail ? 'detail' : 'column'} ${column}: `;
  if (line !== undefined) return `Row ${line}: `;
  return '';
}

/** A problem whose message starts with where it is: "Row 7, column risk: …", cut to a readable length. */
export function issueAt(code: string, line: number | undefined, column: string | undefined, message: string, path: (string | number)[] = [], detail = false): TableFileIssue {
  return {
    code,
    path,
    message: cutText(`${where(line, column, detail)}${message}`),
    ...(line !== undefined ? { line } : {}),
    ...(column !== undefined ? { column } : {}),
  };
}
