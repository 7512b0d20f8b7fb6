/**
 * Rows copied from a spreadsheet and pasted as text → checkup rows for the screen.
 *
 * Cells are separated by tabs (what spreadsheets put on the clipboard), semicolons or commas —
 * whichever the first line uses, tried in that order; CSV quoting is understood (papaparse).
 * Empty cells mean a missing test.
 *
 * Which cell is which:
 * - A first line that does not start with a digit is a header. Its cells are matched by name
 *   ({@link findPasteColumns}): case, accents, spacing and punctuation do not matter, so
 *   "Date", "HbA1c (%)", "FPG mmol/L", "Glycémie à jeun" and "Unité" are all understood. A unit
 *   may sit in the header ("HbA1c (%)"), in its own column (a "Unit" column belongs to the value
 *   column before it), or in the cell ("6.1%", "104 mg/dL"). Columns that name none of these
 *   (a note, an id) are left out and listed.
 * - Without a header, or with a header in that same order, the columns are read in the order
 *   {@link PASTE_COLUMNS}.
 *
 * Cells are tidied, not judged: units are matched ignoring case ("mg/dl", "MMOL/L"); a decimal
 * comma inside a number cell ("6,1") becomes a point; dates in DD.MM.YYYY become YYYY-MM-DD
 * (dot-separated dates are day-first by convention; slashed dates are ambiguous and left as
 * typed). Values and dates are then validated with every other row (./schema.ts), so a bad
 * value shows as an error on its row. Only what cannot be put in a row — an unknown unit, a value
 * without a unit, too many cells — is reported here, naming the real cause, and that line is not
 * added. Cell text quoted in a message is cut to {@link QUOTE_CHARS} characters, and at most
 * {@link MAX_PASTE_PROBLEMS} lines are listed, so a page of garbage gives a short report.
 *
 * A paste of more than {@link MAX_CHECKUPS} data lines is refused whole before any line is read
 * (code `too-many`): a history holds at most that many checkups.
 *
 * Headers are folded and their units found by the rule every header reader shares
 * (lib/text/headers.ts, also used by the workforce file reader); the names below are the paste
 * box's own.
 */
import Papa from 'papaparse';
import { foldHeader as foldText, unitInHeader } from '../text/headers';
import type { Issue } from '../result';
import type { CriteriaSet } from './exposure';
import { emptyDraft, type CheckupDraft } from './draft';
import { GLUCOSE_UNITS, type GlucoseUnit } from './glucose';
import { HBA1C_UNITS, type Hba1cUnit } from './hba1c';
import { MAX_CHECKUPS } from './schema';

export interface PasteResult {
  readonly rows: readonly CheckupDraft[];
  /**
   * Lines that could not become rows; path ["lines", index] (0-based), message with the 1-based
   * line number. Code `paste-line`; `too-many-problems` for the last line when some were left
   * out; `paste-header` when the header cannot be read and `too-many` when the paste holds more
   * lines than a history takes (for these two, no rows at all).
   */
  readonly issues: readonly Issue[];
  /** True when the first line was taken as a header (and so not added as a row). */
  readonly headerSkipped: boolean;
  /** Header cells that name no column this reader uses, as written (cut to a readable length); absent when none. */
  readonly ignoredColumns?: readonly string[];
  /** How many problem lines were left out of `issues` (over {@link MAX_PASTE_PROBLEMS}); absent when none. */
  readonly moreProblems?: number;
}

export const PASTE_COLUMNS = ['date', 'HbA1c', 'HbA1c unit', 'fasting glucose', 'glucose unit'] as const;

/** Longest piece of a cell quoted in a message; longer text is cut with "…". */
export const QUOTE_CHARS = 24;
/** Most problem lines listed for one paste; the rest are counted in one last line. */
export const MAX_PASTE_PROBLEMS = 20;

/** Where each part of a checkup is found in a line; null when it is not there. */
export interface PasteColumns {
  readonly date: number | null;
  readonly hba1c: number | null;
  readonly hba1cUnit: number | null;
  readonly fpg: number | null;
  readonly fpgUnit: number | null;
  /** A unit written in the value column's header ("HbA1c (%)"). */
  readonly hba1cHeaderUnit: Hba1cUnit | null;
  readonly fpgHeaderUnit: GlucoseUnit | null;
  /** True when the columns are the fixed order of {@link PASTE_COLUMNS} (no header, or a header in that order). */
  readonly inOrder: boolean;
  /** Header cells naming nothing used here. */
  readonly ignored: readonly string[];
}

const IN_ORDER: PasteColumns = {
  date: 0,
  hba1c: 1,
  hba1cUnit: 2,
  fpg: 3,
  fpgUnit: 4,
  hba1cHeaderUnit: null,
  fpgHeaderUnit: null,
  inOrder: true,
  ignored: [],
};

/** "Glycémie à jeun (mg/dL)" → "glycemie a jeun (mg/dl)": no accents, lower case, single spaces (lib/text/headers.ts). */
export function foldHeader(cell: string): string {
  return foldText(cell);
}

/** A unit named in folded header text, or null (lib/text/headers.ts: the same units the workforce reader finds). */
function headerUnit(folded: string): Hba1cUnit | GlucoseUnit | null {
  return unitInHeader(folded).unit;
}

/** The folded header without its unit and punctuation: "hba1c (%)" → "hba1c". */
function headerName(folded: string): string {
  return unitInHeader(folded)
    .rest.replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

type HeaderKind = 'date' | 'hba1c' | 'fpg' | 'unit' | 'not-fasting' | null;

/** Names each column may go by (English, with a few common European ones); accents already folded. */
const NAMES: readonly (readonly [Exclude<HeaderKind, null>, RegExp])[] = [
  ['unit', /^(unit|units|unite|unites|einheit|unidad|unidades|unita|eenheid|uom)$/],
  ['hba1c', /\b(hba1c|hb a1c|hba 1c|a1c|glycated ha?emoglobin|glycosylated ha?emoglobin|hemoglobine glyquee|glykohamoglobin)\b/],
  ['not-fasting', /(gluc|glyc|sugar|zucker).*(\b2 ?h\b|two hour|ogtt|random|casual|post|tolerance|after|load|pp\b)|(\b2 ?h\b|two hour|ogtt|random|casual|post).*(gluc|glyc|sugar)/],
  ['fpg', /\b(fpg|fbg|fbs|fasting glucose|fasting plasma glucose|fasting blood glucose|fasting sugar|glucose|plasma glucose|glycemie|glycaemia|glycemia|glucemia|glukose|nuchternglukose|blutzucker|blood sugar)\b/],
  ['date', /\b(date|day|datum|fecha|data|jour|taken|collected|sampled)\b/],
];

function headerKind(name: string): HeaderKind {
  for (const [kind, pattern] of NAMES) if (pattern.test(name)) return kind;
  return null;
}

/** Cell text for a message: trimmed and cut to {@link QUOTE_CHARS} characters. */
export function quoteCell(cell: string): string {
  const trimmed = cell.trim().replace(/\s+/g, ' ');
  return `"${trimmed.length > QUOTE_CHARS ? `${trimmed.slice(0, QUOTE_CHARS - 1)}…` : trimmed}"`;
}

/**
 * The columns a header line names. A header whose named columns all sit where the fixed order
 * has them (e.g. "Date, HbA1c, Unit, FPG, Unit") keeps the fixed order; any other header is read
 * by name; a header naming none of the columns is skipped and the fixed order used. Issues (code
 * `paste-header`, path ["lines", line]) when the date or both tests are missing, a name is used
 * twice, or a unit column follows no value column.
 *
 * @example
 * findPasteColumns(['Datum', 'FPG (mmol/L)', 'HbA1c (%)'], 0).columns
 * //=> { date: 0, fpg: 1, fpgHeaderUnit: 'mmol/L', hba1c: 2, hba1cHeaderUnit: '%', hba1cUnit: null, fpgUnit: null, inOrder: false, ignored: [] }
 */
export function findPasteColumns(header: readonly string[], line = 0): { readonly columns: PasteColumns; readonly issues: readonly Issue[] } {
  const found: { date: number | null; hba1c: number | null; hba1cUnit: number | null; fpg: number | null; fpgUnit: number | null } = {
    date: null,
    hba1c: null,
    hba1cUnit: null,
    fpg: null,
    fpgUnit: null,
  };
  let hba1cHeaderUnit: Hba1cUnit | null = null;
  let fpgHeaderUnit: GlucoseUnit | null = null;
  const ignored: string[] = [];
  const problems: string[] = [];
  let lastValue: 'hba1c' | 'fpg' | null = null;
  const take = (slot: keyof typeof found, index: number, cell: string) => {
    const before = found[slot];
    if (before !== null) problems.push(`columns ${before + 1} and ${index + 1} are both read as the ${slotWords(slot)} (${quoteCell(header[before] ?? '')} and ${quoteCell(cell)}): keep one`);
    else found[slot] = index;
  };
  header.forEach((cell, index) => {
    const folded = foldHeader(cell);
    if (folded === '') return;
    const kind = headerKind(headerName(folded));
    const unit = headerUnit(folded);
    switch (kind) {
      case 'date':
        take('date', index, cell);
        break;
      case 'hba1c':
        take('hba1c', index, cell);
        lastValue = 'hba1c';
        if (unit === '%' || unit === 'mmol/mol') hba1cHeaderUnit = unit;
        else if (unit !== null) problems.push(`${quoteCell(cell)} gives ${unit}, which is not an HbA1c unit (% or mmol/mol)`);
        break;
      case 'fpg':
        take('fpg', index, cell);
        lastValue = 'fpg';
        if (unit === 'mg/dL' || unit === 'mmol/L') fpgHeaderUnit = unit;
        else if (unit !== null) problems.push(`${quoteCell(cell)} gives ${unit}, which is not a glucose unit (mg/dL or mmol/L)`);
        break;
      case 'unit':
        if (lastValue === null) problems.push(`the unit column ${index + 1} (${quoteCell(cell)}) comes before any HbA1c or glucose column; a unit column belongs to the value column just before it`);
        else take(lastValue === 'hba1c' ? 'hba1cUnit' : 'fpgUnit', index, cell);
        lastValue = null;
        break;
      case 'not-fasting':
      case null:
        ignored.push(quoteCell(cell).slice(1, -1));
        lastValue = null;
        break;
    }
  });
  // A first line naming nothing known is taken as a header in the fixed order (as before names were read).
  if (Object.values(found).every((v) => v === null)) return { columns: IN_ORDER, issues: [] };
  if (found.date === null) problems.push('no column is named as the date (for example "Date")');
  if (found.hba1c === null && found.fpg === null) problems.push('no column is named as the HbA1c or the fasting glucose (for example "HbA1c (%)" or "Fasting glucose (mmol/L)")');
  // The fixed order when every named cell is where that order has it, and none is left out.
  const named = (Object.keys(found) as (keyof typeof found)[]).filter((slot) => found[slot] !== null);
  const inOrder = ignored.length === 0 && named.every((slot) => found[slot] === IN_ORDER[slot]);
  const columns: PasteColumns = inOrder ? { ...IN_ORDER, hba1cHeaderUnit, fpgHeaderUnit, ignored } : { ...found, hba1cHeaderUnit, fpgHeaderUnit, inOrder, ignored };
  const issues = problems.map((p) => ({ code: 'paste-header', path: ['lines', line], message: `Line ${line + 1} (the header): ${p}` }) satisfies Issue);
  return { columns, issues };
}

function slotWords(slot: 'date' | 'hba1c' | 'hba1cUnit' | 'fpg' | 'fpgUnit'): string {
  return { date: 'date', hba1c: 'HbA1c', hba1cUnit: 'HbA1c unit', fpg: 'fasting glucose', fpgUnit: 'glucose unit' }[slot];
}

function unitFrom<U extends string>(cell: string, units: readonly U[]): U | null {
  const wanted = cell.trim().toLowerCase();
  return units.find((u) => u.toLowerCase() === wanted) ?? null;
}

function tidyNumber(cell: string): string {
  const trimmed = cell.trim();
  return /^[+-]?\d+,\d+$/.test(trimmed) ? trimmed.replace(',', '.') : trimmed;
}

/** "6.1%" / "104 mg/dL" → the number and the unit text; null when the cell is not a number followed by text. */
function splitInlineUnit(cell: string): { readonly value: string; readonly unit: string } | null {
  const match = /^\s*([+-]?\d+(?:[.,]\d+)?)\s*([%a-zA-Z][a-zA-Z/]*)\s*$/.exec(cell);
  return match ? { value: match[1] ?? '', unit: match[2] ?? '' } : null;
}

const looksNumeric = (cell: string) => /^\s*[+-]?\d+(?:[.,]\d+)?\s*$/.test(cell);

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

interface TestSpec<U extends string> {
  readonly name: string;
  readonly units: readonly U[];
  readonly unitsText: string;
  readonly valueColumn: number | null;
  readonly unitColumn: number | null;
  readonly headerUnit: U | null;
  readonly fallback: U;
}

/** One test's value and unit from a line's cells: the value text and unit, or a message naming the cause. */
function readTest<U extends string>(cells: readonly string[], spec: TestSpec<U>, inOrder: boolean): { value: string; unit: U } | string {
  const { name, units, unitsText } = spec;
  const raw = spec.valueColumn === null ? '' : (cells[spec.valueColumn] ?? '');
  const unitCell = spec.unitColumn === null ? '' : (cells[spec.unitColumn] ?? '').trim();
  let value = raw.trim();
  let inline: U | null = null;
  const split = splitInlineUnit(raw);
  if (split) {
    inline = unitFrom(split.unit, units);
    if (inline === null) return `the ${name} ${quoteCell(raw)} ends in ${quoteCell(split.unit)}, which is not an ${name === 'HbA1c' ? 'HbA1c' : 'glucose'} unit (${unitsText})`;
    value = split.value;
  }
  let fromColumn: U | null = null;
  if (unitCell !== '') {
    fromColumn = unitFrom(unitCell, units);
    if (fromColumn === null) {
      if (looksNumeric(unitCell)) {
        const where = inOrder
          ? `without a header line the columns are read in the order ${PASTE_COLUMNS.join(', ')}, so the cell after the ${name} must be its unit`
          : `the header puts the ${name} unit in column ${(spec.unitColumn ?? 0) + 1}`;
        return `the ${name} unit cell holds the number ${quoteCell(unitCell)}, not a unit (${unitsText}): ${where}. Add a header line naming the columns (for example Date, HbA1c (%), Fasting glucose (mmol/L)) or write the unit after each value`;
      }
      return `${quoteCell(unitCell)} is not ${name === 'HbA1c' ? 'an HbA1c' : 'a glucose'} unit (${unitsText})`;
    }
  }
  if (value === '') return { value: '', unit: fromColumn ?? inline ?? spec.headerUnit ?? spec.fallback };
  const given = [inline, fromColumn, spec.headerUnit].filter((u): u is U => u !== null);
  const first = given[0];
  if (first === undefined) return `the ${name} has no unit (${unitsText})`;
  const other = given.find((u) => u !== first);
  if (other !== undefined) return `the ${name} is given in ${first} here but in ${other} ${spec.headerUnit === other ? 'by the header' : 'by the unit column'}: use one`;
  return { value: tidyNumber(value), unit: first };
}

/**
 * @example
 * parsePastedRows('Date\tHbA1c\tunit\tFPG\tunit\n2023-03-01\t6,1\t%\t5.9\tmmol/l', 'ADA')
 * //=> { rows: [{ date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '5.9', fpgUnit: 'mmol/L' }], issues: [], headerSkipped: true, ignoredColumns: [] }
 * parsePastedRows('FPG mmol/L;Datum;HbA1c (%)\n5,9;01.03.2023;6,1', 'ADA').rows
 * //=> [{ date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '5.9', fpgUnit: 'mmol/L' }]
 */
export function parsePastedRows(text: string, criteria: CriteriaSet): PasteResult {
  const lines = text.split(/\r\n|\n|\r/);
  const firstIndex = lines.findIndex((l) => l.trim() !== '');
  if (firstIndex < 0) return { rows: [], issues: [], headerSkipped: false };
  const delimiter = delimiterOf(lines[firstIndex] ?? '');
  const cellsOf = (line: string): string[] => {
    const parsed = Papa.parse<string[]>(line, { delimiter, header: false });
    const cells = (parsed.data[0] ?? []).map((c) => String(c));
    while (cells.length > 0 && (cells[cells.length - 1] ?? '').trim() === '') cells.pop();
    return cells;
  };
  const firstCells = cellsOf(lines[firstIndex] ?? '');
  const headerSkipped = !/^\s*\d/.test(firstCells[0] ?? '');
  const dataLines = lines.filter((l) => l.trim() !== '').length - (headerSkipped ? 1 : 0);
  if (dataLines > MAX_CHECKUPS) {
    return {
      rows: [],
      issues: [{ code: 'too-many', path: ['lines'], message: `The paste has ${dataLines} lines of checkups; a history holds at most ${MAX_CHECKUPS}. Nothing was added: paste the most recent ${MAX_CHECKUPS} or fewer` }],
      headerSkipped,
    };
  }
  const header = headerSkipped ? findPasteColumns(firstCells, firstIndex) : { columns: IN_ORDER, issues: [] };
  const columns = header.columns;
  const ignoredColumns = columns.ignored.length > 0 ? { ignoredColumns: columns.ignored } : {};
  if (header.issues.length > 0) return { rows: [], issues: header.issues, headerSkipped, ...ignoredColumns };
  const blank = emptyDraft(criteria);
  const rows: CheckupDraft[] = [];
  const issues: Issue[] = [];
  let problems = 0;

  lines.forEach((line, index) => {
    if (line.trim() === '' || (headerSkipped && index === firstIndex)) return;
    const cells = cellsOf(line);
    const problem = (message: string): void => {
      problems += 1;
      if (issues.length < MAX_PASTE_PROBLEMS) issues.push({ code: 'paste-line', path: ['lines', index], message: `Line ${index + 1}: ${message}; the line was not added` });
    };
    if (columns.inOrder && cells.length > PASTE_COLUMNS.length) {
      return problem(`${cells.length} cells, but at most ${PASTE_COLUMNS.length} are read (${PASTE_COLUMNS.join(', ')})`);
    }
    const hba1c = readTest(
      cells,
      { name: 'HbA1c', units: HBA1C_UNITS, unitsText: '% or mmol/mol', valueColumn: columns.hba1c, unitColumn: columns.hba1cUnit, headerUnit: columns.hba1cHeaderUnit, fallback: blank.hba1cUnit },
      columns.inOrder,
    );
    if (typeof hba1c === 'string') return problem(hba1c);
    const fpg = readTest(
      cells,
      { name: 'fasting glucose', units: GLUCOSE_UNITS, unitsText: 'mg/dL or mmol/L', valueColumn: columns.fpg, unitColumn: columns.fpgUnit, headerUnit: columns.fpgHeaderUnit, fallback: blank.fpgUnit },
      columns.inOrder,
    );
    if (typeof fpg === 'string') return problem(fpg);
    const date = columns.date === null ? '' : (cells[columns.date] ?? '');
    rows.push({ date: tidyDate(date), hba1cValue: hba1c.value, hba1cUnit: hba1c.unit, fpgValue: fpg.value, fpgUnit: fpg.unit });
  });
  const more = problems - issues.length;
  if (more > 0) issues.push({ code: 'too-many-problems', path: ['lines'], message: `… and ${more} more line${more === 1 ? '' : 's'} not added, not listed here` });
  return { rows, issues, headerSkipped, ...ignoredColumns, ...(more > 0 ? { moreProblems: more } : {}) };
}

/**
 * What a paste did, in one sentence for the screen.
 *
 * @example
 * pasteSummary({ rows: [r1, r2], issues: [i1], headerSkipped: true }) //=> 'Added 2 rows (header line skipped). 1 line was not added:'
 * pasteSummary({ rows: [r1], issues: [], headerSkipped: true, ignoredColumns: ['Note'] })  //=> 'Added 1 row (header line skipped; column "Note" not used).'
 */
export function pasteSummary(result: PasteResult): string {
  const n = result.rows.length;
  if (result.issues[0]?.code === 'too-many') return result.issues[0].message;
  if (result.issues[0]?.code === 'paste-header') return 'Nothing was added: the header line cannot be read:';
  const ignored = (result.ignoredColumns ?? []).map((c) => `"${c}"`);
  const notes = [
    ...(result.headerSkipped ? ['header line skipped'] : []),
    ...(ignored.length > 0 ? [`${ignored.length === 1 ? 'column' : 'columns'} ${ignored.join(', ')} not used`] : []),
  ];
  const parts = [`Added ${n} row${n === 1 ? '' : 's'}${notes.length > 0 ? ` (${notes.join('; ')})` : ''}.`];
  const bad = result.issues.filter((i) => i.code === 'paste-line').length + (result.moreProblems ?? 0);
  if (bad > 0) parts.push(`${bad} line${bad === 1 ? ' was' : 's were'} not added:`);
  return parts.join(' ');
}


/**
 * Whether rows coming in from a paste or a file fit in one history, checked before anything is
 * added: with `keptRows` (the filled rows that stay, 0 when replacing) plus `incoming`, at most
 * {@link MAX_CHECKUPS}. Null when they fit; otherwise an issue (code `too-many`) naming both
 * counts, and nothing is to be added.
 *
 * @example
 * importLimitIssue(12, 28095, 'The file') //=> { code: 'too-many', path: [], message: 'The file has 28,095 checkups; with the 12 rows already here that makes 28,107, more than the 500 a history holds. Nothing was added.' }
 * importLimitIssue(0, 500, 'The paste')   //=> null
 */
export function importLimitIssue(keptRows: number, incoming: number, source: string): Issue | null {
  const total = keptRows + incoming;
  if (total <= MAX_CHECKUPS) return null;
  const n = (x: number) => x.toLocaleString('en');
  const what = `${source} has ${n(incoming)} checkup${incoming === 1 ? '' : 's'}`;
  const message =
    keptRows > 0 && incoming <= MAX_CHECKUPS
      ? `${what}; with the ${n(keptRows)} row${keptRows === 1 ? '' : 's'} already here that makes ${n(total)}, more than the ${MAX_CHECKUPS} a history holds. Nothing was added: replace the rows instead, or remove some first.`
      : keptRows > 0
        ? `${what}; with the ${n(keptRows)} row${keptRows === 1 ? '' : 's'} already here that makes ${n(total)}, more than the ${MAX_CHECKUPS} a history holds. Nothing was added.`
        : `${what}, more than the ${MAX_CHECKUPS} a history holds. Nothing was added.`;
  return { code: 'too-many', path: [], message };
}

/** Longest report line shown; longer lines are cut with "…" so a report never runs on. */
export const REPORT_LINE_CHARS = 240;

/**
 * Lines of a read report (problems, skipped resources) for the screen: each cut to
 * {@link REPORT_LINE_CHARS} characters, at most {@link MAX_PASTE_PROBLEMS} of them, then one line
 * counting the rest.
 *
 * @example
 * readableLines(['a', 'b'], 1) //=> ['a', '… and 1 more not listed here']
 */
export function readableLines(lines: readonly string[], max: number = MAX_PASTE_PROBLEMS): string[] {
  const shown = lines.slice(0, max).map((line) => (line.length > REPORT_LINE_CHARS ? `${line.slice(0, REPORT_LINE_CHARS - 1)}…` : line));
  if (lines.length > max) shown.push(`… and ${(lines.length - max).toLocaleString('en')} more not listed here`);
  return shown;
}
