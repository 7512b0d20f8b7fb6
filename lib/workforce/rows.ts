/**
 * One row of cells → one checkup row, or the problems that skip it. The same for every format:
 * CSV/TSV give text cells, a workbook gives typed cells (numbers, dates), FHIR gives readings.
 *
 * Each value passes the same checks as a typed checkup (lib/glycaemia/schema.ts: plausible bounds
 * per unit with a hint at the other unit, real calendar days, not after today). A problem names
 * the row (the file's line) and the column; a row with any problem is skipped whole, so a
 * half-read row never enters a history. Messages never repeat a value from a column that could
 * identify a person.
 */
import { checkupDateSchema, fpgReadingSchema, hba1cReadingSchema, type FpgReading, type Hba1cReading, type HistoryOptions } from '../glycaemia/schema';
import { parseIsoDate } from '../glycaemia/dates';
import { atFileDigits } from '../text/significant';
import { headerUnit, normaliseHeader } from './columns';
import type { CellValue, CheckupRow, ColumnAssignment, ColumnMapping, FpgUnitName, Hba1cUnitName, RowProblem } from './types';

/** Longest worker id accepted, in characters: pseudonymous ids are short (common practice). */
export const MAX_WORKER_ID = 64;

export interface RowOptions extends HistoryOptions {
  /** The file writes decimals with a comma ("6,1"): detected from the file (./reader.ts). */
  readonly decimalComma?: boolean;
}

/** A mapping prepared for reading many rows: each field's column looked up once. */
export interface PreparedMapping {
  readonly worker: ColumnAssignment | undefined;
  readonly date: ColumnAssignment | undefined;
  readonly hba1c: ColumnAssignment | undefined;
  readonly hba1cUnit: ColumnAssignment | undefined;
  readonly fpg: ColumnAssignment | undefined;
  readonly fpgUnit: ColumnAssignment | undefined;
  readonly age: ColumnAssignment | undefined;
  readonly birthYear: ColumnAssignment | undefined;
  readonly birthDate: ColumnAssignment | undefined;
  readonly sex: ColumnAssignment | undefined;
  readonly strata: readonly ColumnAssignment[];
}

export function prepareMapping(mapping: ColumnMapping): PreparedMapping {
  const find = (field: ColumnAssignment['field']) => mapping.columns.find((c) => c.field === field);
  return {
    worker: find('worker'),
    date: find('date'),
    hba1c: find('hba1c'),
    hba1cUnit: find('hba1c-unit'),
    fpg: find('fpg'),
    fpgUnit: find('fpg-unit'),
    age: find('age'),
    birthYear: find('birth-year'),
    birthDate: find('birth-date'),
    sex: find('sex'),
    strata: mapping.columns.filter((c) => c.field === 'stratum' && c.stratum !== null),
  };
}

const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

/** A cell as trimmed text ("" for an empty cell). Dates as YYYY-MM-DD (UTC day, as workbooks store them). */
export function cellText(cell: CellValue | undefined): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'string') return cell.trim();
  if (cell instanceof Date) return Number.isNaN(cell.getTime()) ? '' : cell.toISOString().slice(0, 10);
  return String(cell);
}

/**
 * A number cell: a number, or why it is not one. Read at 15 significant digits (lib/text
 * `atFileDigits`): a value a formula wrote with binary noise (6.1000000000000005) is the value
 * the spreadsheet shows (6.1); a number with 15 digits or fewer is read exactly as written.
 */
export function readNumberCell(cell: CellValue | undefined, decimalComma: boolean): number | { readonly code: string; readonly message: string } {
  if (typeof cell === 'number') return Number.isFinite(cell) ? atFileDigits(cell) : { code: 'not-a-number', message: 'is not a number' };
  const text = cellText(cell);
  if (PLAIN_NUMBER.test(text)) return atFileDigits(Number(text));
  if (DECIMAL_COMMA.test(text)) {
    if (decimalComma) return atFileDigits(Number(text.replace(',', '.')));
    return { code: 'decimal-comma', message: `"${text}" has a comma inside a number, but this file writes decimals with a point; write ${text.replace(',', '.')}` };
  }
  if (/^[+-]?[\d.,]+\s*%$/.test(text)) return { code: 'percent', message: `"${text}" has a % sign; put the unit in the header or the unit column and write the plain number` };
  if (/^[<>≤≥]/.test(text)) return { code: 'not-a-number', message: `"${text}" is a limit, not a measured result` };
  return { code: 'not-a-number', message: `"${text.length > 40 ? `${text.slice(0, 37)}…` : text}" is not a number` };
}

/**
 * A date cell as YYYY-MM-DD: ISO dates (a time part is dropped), DD.MM.YYYY, and workbook dates.
 * Slashed dates are refused: 02/03/2021 is 2 March in one country and 3 February in another.
 */
export function readDateCell(cell: CellValue | undefined): string | { readonly code: string; readonly message: string } {
  if (cell instanceof Date) {
    const text = cellText(cell);
    return text === '' ? { code: 'invalid-date', message: 'is not a date' } : text;
  }
  const text = cellText(cell);
  const iso = /^(\d{4}-\d{2}-\d{2})(?:[T ].*)?$/.exec(text);
  if (iso?.[1]) return iso[1];
  const dotted = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/.exec(text);
  if (dotted) return `${dotted[3]}-${dotted[2]?.padStart(2, '0')}-${dotted[1]?.padStart(2, '0')}`;
  if (/^\d{1,4}[/]\d{1,2}[/]\d{1,4}$/.test(text)) {
    return { code: 'ambiguous-date', message: `"${text}" could be read day-first or month-first; write dates as YYYY-MM-DD` };
  }
  return { code: 'invalid-date', message: `"${text.length > 40 ? `${text.slice(0, 37)}…` : text}" is not a date; write YYYY-MM-DD` };
}

const SEX_WORDS: Readonly<Record<string, 'female' | 'male'>> = {
  female: 'female',
  f: 'female',
  woman: 'female',
  women: 'female',
  w: 'female',
  feminin: 'female',
  femenino: 'female',
  weiblich: 'female',
  male: 'male',
  m: 'male',
  man: 'male',
  men: 'male',
  masculin: 'male',
  masculino: 'male',
  mannlich: 'male',
  maennlich: 'male',
};

/** A sex cell: female or male (the tables' strata); another value is a row problem. */
export function readSexCell(cell: CellValue | undefined): 'female' | 'male' | { readonly code: string; readonly message: string } {
  const text = normaliseHeader(cellText(cell));
  const sex = SEX_WORDS[text];
  if (sex) return sex;
  return { code: 'invalid-choice', message: `"${cellText(cell).slice(0, 20)}" is not a sex the population tables use; write female or male (F or M)` };
}

function unitCell(cell: CellValue | undefined, test: 'hba1c' | 'fpg'): Hba1cUnitName | FpgUnitName | null {
  const { unit } = headerUnit(normaliseHeader(cellText(cell)));
  if (unit === null) return null;
  return (test === 'hba1c' ? unit === '%' || unit === 'mmol/mol' : unit === 'mg/dL' || unit === 'mmol/L') ? unit : null;
}

/** Looks like a person's name: letters only, two or more words. Never echoed in a message. */
export function looksLikeName(text: string): boolean {
  return /^\p{L}[\p{L}'’-]*(?:[ ,]+\p{L}[\p{L}'’.-]*)+$/u.test(text);
}

export type RowOutcome =
  | { readonly ok: true; readonly row: CheckupRow }
  | { readonly ok: false; readonly problems: readonly RowProblem[] }
  | { readonly ok: 'blank' };

/** Date checks are zod schemas built per `today`: build them once per reader. */
export interface RowReader {
  readonly read: (cells: readonly CellValue[], line: number) => RowOutcome;
}

/** Why a cell is not usable, without the row and column (added where the row is known). */
interface CellProblem {
  readonly code: string;
  readonly message: string;
}

/** Most distinct texts a {@link TextMemo} keeps before it starts again: memory stays flat. */
export const MEMO_LIMIT = 4096;

/**
 * Remembers a pure function's answer per text. A file repeats the same few hundred dates, values
 * and codes on every row, so each is checked once (with the same zod schema, giving the same
 * answer) instead of once a row. Bounded: past {@link MEMO_LIMIT} texts it forgets and starts over.
 */
export class TextMemo<T> {
  private readonly answers = new Map<string, T>();
  constructor(private readonly compute: (text: string) => T) {}

  get(text: string): T {
    const known = this.answers.get(text);
    if (known !== undefined || this.answers.has(text)) return known as T;
    const answer = this.compute(text);
    if (this.answers.size >= MEMO_LIMIT) this.answers.clear();
    this.answers.set(text, answer);
    return answer;
  }
}

type Reading<U> = { readonly value: number; readonly unit: U };

/**
 * A reader of rows for one mapping.
 *
 * Every check is a pure function of the cell's text (and of the reader's `today` and decimal
 * comma), so its answer is remembered per text ({@link TextMemo}); the rows and problems are the
 * same as checking every cell afresh (tests/unit/workforce/rows.test.ts compares the two).
 *
 * @example
 * createRowReader(mapping, { today: '2025-01-01' }).read(['W001', '2024-03-01', '6.1', '5.9', '52', 'F', 'North'], 2)
 * //=> { ok: true, row: { line: 2, worker: 'W001', date: '2024-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.9, unit: 'mmol/L' }, age: 52, sex: 'female', strata: { site: 'North' } } }
 */
export function createRowReader(mapping: ColumnMapping, options: RowOptions): RowReader {
  const m = prepareMapping(mapping);
  const dateSchema = checkupDateSchema(options);
  const decimalComma = options.decimalComma ?? false;
  const todayYear = Number(options.today.slice(0, 4));

  /** A worker id → its problem, or null when it is usable. */
  const workerCheck = (worker: string): CellProblem | null => {
    if (worker === '') return { code: 'required', message: 'the worker id is empty' };
    if (worker.length > MAX_WORKER_ID) return { code: 'too-long', message: `the worker id is longer than ${MAX_WORKER_ID} characters; use a short pseudonymous id` };
    if (looksLikeName(worker)) return { code: 'looks-like-name', message: 'the worker id looks like a person’s name; use pseudonymous ids only (the value is not repeated here)' };
    return null;
  };
  let lastWorker: string | null = null;
  let lastWorkerProblem: CellProblem | null = null;

  const checkDate = (dateCell: CellValue | undefined): string | CellProblem => {
    if (cellText(dateCell) === '') return { code: 'required', message: 'the checkup date is empty' };
    const read = readDateCell(dateCell);
    if (typeof read !== 'string') return read;
    const checked = dateSchema.safeParse(read);
    if (checked.success) return read;
    return { code: 'invalid-date', message: checked.error.issues[0]?.message ?? `${read} is not a usable date` };
  };
  const dates = new TextMemo<string | CellProblem>(checkDate);
  const numbers = new TextMemo<number | CellProblem>((text) => readNumberCell(text, decimalComma));
  const sexes = new TextMemo((text) => readSexCell(text));
  const units = { hba1c: new TextMemo((text) => unitCell(text, 'hba1c')), fpg: new TextMemo((text) => unitCell(text, 'fpg')) };
  /** A value cell in a known unit → the reading, or why not (not a number, or out of range for the unit). */
  const checkReading = (test: 'hba1c' | 'fpg', cell: CellValue | undefined, unit: Hba1cUnitName | FpgUnitName): Reading<Hba1cUnitName | FpgUnitName> | CellProblem => {
    const value = readNumberCell(cell, decimalComma);
    if (typeof value !== 'number') return value;
    const parsed = (test === 'hba1c' ? hba1cReadingSchema : fpgReadingSchema).safeParse({ value, unit });
    if (!parsed.success) return { code: 'out-of-range', message: parsed.error.issues[0]?.message ?? 'the value is not usable' };
    return parsed.data;
  };
  /** One memo per test and unit, keyed by the cell's text. */
  const readingMemos: Record<'hba1c' | 'fpg', Partial<Record<Hba1cUnitName | FpgUnitName, TextMemo<Reading<Hba1cUnitName | FpgUnitName> | CellProblem>>>> = { hba1c: {}, fpg: {} };
  const readingOf = (test: 'hba1c' | 'fpg', cell: CellValue | undefined, unit: Hba1cUnitName | FpgUnitName) => {
    if (typeof cell !== 'string') return checkReading(test, cell, unit);
    let memo = readingMemos[test][unit];
    if (!memo) {
      memo = new TextMemo((text) => checkReading(test, text, unit));
      readingMemos[test][unit] = memo;
    }
    return memo.get(cell);
  };
  const numberOf = (cell: CellValue | undefined): number | CellProblem => (typeof cell === 'string' ? numbers.get(cell) : readNumberCell(cell, decimalComma));

  // The row being read: its line and its problems so far (one list, reused: a good row allocates none).
  let line = 0;
  const problems: RowProblem[] = [];
  const problem = (column: ColumnAssignment | undefined, code: string, message: string) => {
    problems.push({ line, column: column?.header ?? null, code, message });
  };

  /** A test's value cell (and unit cell) → the reading; undefined when empty or with a problem (added). */
  function reading(cells: readonly CellValue[], test: 'hba1c' | 'fpg', column: ColumnAssignment | undefined, unitColumn: ColumnAssignment | undefined): Reading<Hba1cUnitName | FpgUnitName> | undefined {
    if (!column) return undefined;
    const cell = cells[column.index];
    if (cellText(cell) === '') return undefined;
    let unit = column.unit;
    if (unit === null) {
      const unitCellValue = cells[unitColumn?.index ?? -1];
      unit = typeof unitCellValue === 'string' ? units[test].get(unitCellValue) : unitCell(unitCellValue, test);
      if (unit === null) {
        // A value that is not a number is reported as such before its missing unit.
        const value = numberOf(cell);
        if (typeof value !== 'number') {
          problem(column, value.code, value.message);
          return undefined;
        }
        const allowed = test === 'hba1c' ? '% or mmol/mol' : 'mmol/L or mg/dL';
        const text = cellText(unitCellValue);
        problem(unitColumn ?? column, 'unit-unknown', text === '' ? `the unit is empty; write ${allowed}` : `"${text.slice(0, 20)}" is not a unit of this test; write ${allowed}`);
        return undefined;
      }
    }
    const checked = readingOf(test, cell, unit);
    if ('code' in checked) {
      problem(column, checked.code, checked.message);
      return undefined;
    }
    return checked;
  }

  function read(cells: readonly CellValue[], rowLine: number): RowOutcome {
    if (isBlankRow(cells)) return { ok: 'blank' };
    line = rowLine;
    problems.length = 0;

    const worker = cellText(cells[m.worker?.index ?? -1]);
    if (worker !== lastWorker) {
      lastWorker = worker;
      lastWorkerProblem = workerCheck(worker);
    }
    if (lastWorkerProblem) problem(m.worker, lastWorkerProblem.code, lastWorkerProblem.message);

    let date = '';
    const dateCell = cells[m.date?.index ?? -1];
    const checkedDate = typeof dateCell === 'string' ? dates.get(dateCell) : checkDate(dateCell);
    if (typeof checkedDate === 'string') date = checkedDate;
    else problem(m.date, checkedDate.code, checkedDate.message);

    const hba1c = reading(cells, 'hba1c', m.hba1c, m.hba1cUnit) as Reading<Hba1cReading['unit']> | undefined;
    const fpg = reading(cells, 'fpg', m.fpg, m.fpgUnit) as Reading<FpgReading['unit']> | undefined;
    if (hba1c === undefined && fpg === undefined && problems.length === 0) {
      problem(m.hba1c ?? m.fpg, 'required', 'the row has neither an HbA1c nor a fasting glucose');
    }

    let age: number | undefined;
    if (m.age && cellText(cells[m.age.index]) !== '') {
      const value = numberOf(cells[m.age.index]);
      if (typeof value !== 'number') problem(m.age, value.code, value.message);
      else if (!Number.isInteger(value) || value < 0 || value > 120) problem(m.age, 'out-of-range', `the age must be a whole number of years from 0 to 120 (got ${value})`);
      else age = value;
    }
    let birthYear: number | undefined;
    if (m.birthYear && cellText(cells[m.birthYear.index]) !== '') {
      const value = readNumberCell(cells[m.birthYear.index], false);
      if (typeof value !== 'number') problem(m.birthYear, value.code, value.message);
      else if (!Number.isInteger(value) || value < 1900 || value > todayYear) problem(m.birthYear, 'out-of-range', `the birth year must be a year from 1900 to ${todayYear} (got ${value})`);
      else birthYear = value;
    }
    let birthDate: string | undefined;
    if (m.birthDate && cellText(cells[m.birthDate.index]) !== '') {
      const value = readDateCell(cells[m.birthDate.index]);
      if (typeof value !== 'string') problem(m.birthDate, value.code, 'is not a date; write YYYY-MM-DD');
      else if (!parseIsoDate(value) || value < '1900-01-01' || value > options.today) problem(m.birthDate, 'invalid-date', `the birth date must be a real day from 1900-01-01 to ${options.today}`);
      else birthDate = value;
    }
    let sex: 'female' | 'male' | undefined;
    if (m.sex) {
      const sexCell = cells[m.sex.index];
      if (cellText(sexCell) !== '') {
        const value = typeof sexCell === 'string' ? sexes.get(sexCell) : readSexCell(sexCell);
        if (typeof value !== 'string') problem(m.sex, value.code, value.message);
        else sex = value;
      }
    }
    if (problems.length > 0) return { ok: false, problems: problems.slice() };

    const strata: Record<string, string> = {};
    for (const column of m.strata) {
      const value = cellText(cells[column.index]);
      if (value !== '' && column.stratum !== null) strata[column.stratum] = value.slice(0, 100);
    }
    // Built key by key (no spreads): one object a row, keys in the order the contract lists them.
    const row = { line: rowLine, worker, date } as { -readonly [K in keyof CheckupRow]: CheckupRow[K] };
    if (hba1c) row.hba1c = hba1c;
    if (fpg) row.fpg = fpg;
    if (age !== undefined) row.age = age;
    if (birthYear !== undefined) row.birthYear = birthYear;
    if (birthDate !== undefined) row.birthDate = birthDate;
    if (sex !== undefined) row.sex = sex;
    row.strata = strata;
    return { ok: true, row };
  }
  return { read };
}

/** True when every cell is empty or blank. */
function isBlankRow(cells: readonly CellValue[]): boolean {
  for (let i = 0; i < cells.length; i++) if (cellText(cells[i]) !== '') return false;
  return true;
}
