/**
 * Rows copied from a spreadsheet and pasted as text → checkup rows for the screen.
 *
 * Columns, in order: date, HbA1c, HbA1c unit, fasting glucose, glucose unit. Cells are separated
 * by tabs (what spreadsheets put on the clipboard), semicolons or commas — whichever the first
 * line uses, tried in that order; CSV quoting is understood (papaparse). A first line that does not
 * start with a digit is a header and is skipped. Empty cells mean a missing test.
 *
 * Cells are tidied, not judged: units are matched ignoring case ("mg/dl", "MMOL/L"); a decimal
 * comma inside a number cell ("6,1") becomes a point; dates in DD.MM.YYYY become YYYY-MM-DD
 * (dot-separated dates are day-first by convention; slashed dates are ambiguous and left as
 * typed). Values and dates are then validated with every other row (./schema.ts), so a bad
 * value shows as an error on its row. Only what cannot be put in a row — an unknown unit, a value
 * without a unit, too many cells — is reported here, and that line is not added.
 */
import Papa from 'papaparse';
import type { Issue } from '../result';
import type { CriteriaSet } from './exposure';
import { emptyDraft, type CheckupDraft } from './draft';
import { GLUCOSE_UNITS, type GlucoseUnit } from './glucose';
import { HBA1C_UNITS, type Hba1cUnit } from './hba1c';

export interface PasteResult {
  readonly rows: readonly CheckupDraft[];
  /** Lines that could not become rows; path ["lines", index] (0-based), message with the 1-based line number. */
  readonly issues: readonly Issue[];
  /** True when the first line was taken as a header and skipped. */
  readonly headerSkipped: boolean;
}

export const PASTE_COLUMNS = ['date', 'HbA1c', 'HbA1c unit', 'fasting glucose', 'glucose unit'] as const;

function unitFrom<U extends string>(cell: string, units: readonly U[]): U | null {
  const wanted = cell.trim().toLowerCase();
  return units.find((u) => u.toLowerCase() === wanted) ?? null;
}

function tidyNumber(cell: string): string {
  const trimmed = cell.trim();
  return /^[+-]?\d+,\d+$/.test(trimmed) ? trimmed.replace(',', '.') : trimmed;
}

function tidyDate(cell: string): string {
  const trimmed = cell.trim();
  const dotted = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/.exec(trimmed);
  if (!dotted) return trimmed;
  return `${dotted[3]}-${(dotted[2] ?? '').padStart(2, '0')}-${(dotted[1] ?? '').padStart(2, '0')}`;
}

function delimiterOf(line: string): string {
  if (line.includes('\t')) return '\t';
  if (line.includes(';')) return ';';
  return ',';
}

/**
 * @example
 * parsePastedRows('Date\tHbA1c\tunit\tFPG\tunit\n2023-03-01\t6,1\t%\t5.9\tmmol/l', 'ADA')
 * //=> { rows: [{ date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '5.9', fpgUnit: 'mmol/L' }], issues: [], headerSkipped: true }
 */
export function parsePastedRows(text: string, criteria: CriteriaSet): PasteResult {
  const lines = text.split(/\r\n|\n|\r/);
  const firstIndex = lines.findIndex((l) => l.trim() !== '');
  if (firstIndex < 0) return { rows: [], issues: [], headerSkipped: false };
  const delimiter = delimiterOf(lines[firstIndex] ?? '');
  const blank = emptyDraft(criteria);
  const rows: CheckupDraft[] = [];
  const issues: Issue[] = [];
  let headerSkipped = false;

  lines.forEach((line, index) => {
    if (line.trim() === '') return;
    const parsed = Papa.parse<string[]>(line, { delimiter, header: false });
    const cells = (parsed.data[0] ?? []).map((c) => String(c));
    while (cells.length > 0 && (cells[cells.length - 1] ?? '').trim() === '') cells.pop();
    if (index === firstIndex && !/^\s*\d/.test(cells[0] ?? '')) {
      headerSkipped = true;
      return;
    }
    const problem = (message: string): void => {
      issues.push({ code: 'paste-line', path: ['lines', index], message: `Line ${index + 1}: ${message}; the line was not added` });
    };
    if (cells.length > PASTE_COLUMNS.length) {
      problem(`${cells.length} cells, but at most ${PASTE_COLUMNS.length} are read (${PASTE_COLUMNS.join(', ')})`);
      return;
    }
    const [date = '', hba1c = '', hba1cUnitCell = '', fpg = '', fpgUnitCell = ''] = cells;
    let hba1cUnit: Hba1cUnit = blank.hba1cUnit;
    let fpgUnit: GlucoseUnit = blank.fpgUnit;
    if (hba1cUnitCell.trim() !== '') {
      const unit = unitFrom(hba1cUnitCell, HBA1C_UNITS);
      if (!unit) return problem(`"${hba1cUnitCell.trim()}" is not an HbA1c unit (% or mmol/mol)`);
      hba1cUnit = unit;
    } else if (hba1c.trim() !== '') {
      return problem('the HbA1c has no unit (% or mmol/mol)');
    }
    if (fpgUnitCell.trim() !== '') {
      const unit = unitFrom(fpgUnitCell, GLUCOSE_UNITS);
      if (!unit) return problem(`"${fpgUnitCell.trim()}" is not a glucose unit (mg/dL or mmol/L)`);
      fpgUnit = unit;
    } else if (fpg.trim() !== '') {
      return problem('the fasting glucose has no unit (mg/dL or mmol/L)');
    }
    rows.push({ date: tidyDate(date), hba1cValue: tidyNumber(hba1c), hba1cUnit, fpgValue: tidyNumber(fpg), fpgUnit });
  });
  return { rows, issues, headerSkipped };
}

/**
 * What a paste did, in one sentence for the screen.
 *
 * @example
 * pasteSummary({ rows: [r1, r2], issues: [i1], headerSkipped: true }) //=> 'Added 2 rows (header line skipped). 1 line was not added:'
 */
export function pasteSummary(result: PasteResult): string {
  const n = result.rows.length;
  const parts = [`Added ${n} row${n === 1 ? '' : 's'}${result.headerSkipped ? ' (header line skipped)' : ''}.`];
  const bad = result.issues.length;
  if (bad > 0) parts.push(`${bad} line${bad === 1 ? ' was' : 's were'} not added:`);
  return parts.join(' ');
}
