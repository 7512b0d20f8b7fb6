/** Reading one cell of a population-table CSV file: a plain number, or why it is not one. */
import type { NumericColumn } from './csvFormat';

const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?[\d.]*\d,\d[\d.,]*$/;
const PERCENT = /^[+-]?[\d.,]+\s*%$/;

/** A cell's value as a number, or the code and message saying why it is not a plain number. */
export function readNumber(cell: string, column: string): number | { code: string; message: string } {
  if (NUMBER.test(cell)) return Number(cell);
  if (COMMA_NUMBER.test(cell)) {
    return {
      code: 'decimal-comma',
      message: `"${cell}" has a comma inside a number; write numbers with a decimal point and no thousands separator (e.g. 0.08, 1000). In a spreadsheet, set the decimal separator to "." before saving as CSV`,
    };
  }
  if (PERCENT.test(cell)) {
    return column === 'risk' || column === 'exposure_prevalence'
      ? { code: 'percent', message: `"${cell}" is a percentage; ${column === 'risk' ? 'risks are fractions: for 8% write 0.08' : 'the prevalence is a fraction: for 30% write 0.3'}` }
      : { code: 'percent', message: `"${cell}" has a % sign; write the plain number` };
  }
  if (/^\d+\s*\+$/.test(cell) && column === 'age_to') {
    return { code: 'not-a-number', message: `"${cell}" is not a number; write an open top band ("80 and over") as 120` };
  }
  return { code: 'not-a-number', message: `"${cell}" is not a number` };
}

/** A cell's text, trimmed; "" when the row is short of it. */
export function cellAt(cells: readonly string[], index: number | undefined): string {
  return index === undefined ? '' : (cells[index] ?? '').trim();
}

/** What a number column holds, in words for messages. */
export function describeColumn(column: NumericColumn): string {
  switch (column) {
    case 'age_from':
      return 'the band start age';
    case 'age_to':
      return 'the band end age';
    case 'risk':
      return 'the risk';
    case 'rate':
      return 'the rate';
    case 'person_years':
      return 'the person-years';
    case 'exposure_prevalence':
      return 'the exposure prevalence';
  }
}
