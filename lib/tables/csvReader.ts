/**
 * Reading a population-table CSV file (docs/table-format.md) into a checked table.
 *
 * Every problem is reported with its row (the file's line number, as a spreadsheet numbers
 * rows) and column, and a file with any problem yields no table. Reading works in blocks of
 * lines: {@link parseTableCsvInChunks} drives the same steps as {@link parseTableCsv}, pausing
 * between them so a page stays responsive.
 */
import Papa from 'papaparse';
import { unguardTextCell } from '../export/spreadsheetCell';
import { fileKindCode, fileKindSentence, sniffText } from '../files/kind';
import { toIssues } from '../scenario/issues';
import { StrataLayout } from './bands';
import { cellAt, describeColumn, readNumber } from './csvCells';
import {
  BASE_COLUMNS,
  blocksOf,
  COLUMN_FIELD,
  DEFAULT_CHUNK_CHARS,
  DETAIL_FIELD,
  DETAIL_KEYS,
  FIELD_COLUMN,
  guessDelimiter,
  isBlankLine,
  isDetailLine,
  leadingLines,
  MAX_TABLE_FILE_BYTES,
  MAX_TABLE_ROWS,
  normaliseName,
  PREVIEW_ROWS,
  REQUIRED_DETAILS,
  splitLineChecked,
  STRATUM_COLUMN_PREFIX,
  utf8Length,
  type BaseColumn,
  type DetailKey,
  type NumericColumn,
} from './csvFormat';
import { issueAt, Problems, type TableFileIssue } from './csvProblems';
import { idFromTitle } from './ids';
import { checkStratum, populationTableSchema, STRATUM_KEY_PATTERN, stratumFieldsSchema, type PopulationTable, type Stratum, type TableForm } from './schema';

/** What the file holds, shown before anything is saved. */
export interface TableCsvPreview {
  readonly delimiter: string;
  readonly details: readonly { readonly key: string; readonly value: string; readonly line: number }[];
  readonly columns: readonly string[];
  /** The first {@link PREVIEW_ROWS} stratum rows, as cells. */
  readonly rows: readonly { readonly line: number; readonly cells: readonly string[] }[];
  /** Stratum rows read (blank lines not counted). */
  readonly rowCount: number;
}

export type TableCsvResult =
  | { readonly ok: true; readonly value: PopulationTable; readonly preview: TableCsvPreview }
  | { readonly ok: false; readonly issues: readonly TableFileIssue[]; readonly preview: TableCsvPreview | undefined };

/** How far a chunked read has got. */
export interface TableCsvProgress {
  readonly charsDone: number;
  readonly charsTotal: number;
  readonly rowsDone: number;
}

export interface ChunkedOptions {
  /** Characters per block (cut at the next line end outside quotes). */
  readonly chunkChars?: number;
  readonly onProgress?: (progress: TableCsvProgress) => void;
  /** Awaited between blocks; a page passes e.g. `() => new Promise((r) => setTimeout(r, 0))` to stay responsive. */
  readonly pause?: () => Promise<void>;
  /** Stops the read; the result is then a `cancelled` problem and no table. */
  readonly signal?: AbortSignal;
}

interface Columns {
  readonly names: string[];
  readonly index: Partial<Record<BaseColumn, number>>;
  readonly extras: { key: string; index: number }[];
  readonly form: TableForm | undefined;
  /** The number columns every row must fill: the ages, then risk or rate and person_years. */
  readonly numeric: readonly NumericColumn[];
  /** Rows can be read: sex, both ages and one baseline form are present. */
  readonly usable: boolean;
}

interface RowStratum {
  readonly line: number;
  readonly stratum: Partial<Stratum>;
  /** Sex, ages and extra values all valid: the row takes part in the band checks. */
  readonly placed: boolean;
  readonly valid: boolean;
}

/** One file being read: details and header first, then rows block by block, then the whole-table checks. */
class TableCsvReader {
  readonly problems = new Problems();
  readonly details: { key: string; value: string; line: number }[] = [];
  readonly rows: RowStratum[] = [];
  readonly previewRows: { line: number; cells: string[] }[] = [];
  rowCount = 0;
  stopped = false;
  delimiter = ',';
  columns: Columns | undefined;
  body = '';
  bodyFirstLine = 1;
  private readonly table: Partial<Record<keyof PopulationTable, unknown>> = {};
  /** Age-band and sex-scheme checks, fed row by row; strata are named by their row. */
  private readonly layout = new StrataLayout((i) => `row ${this.rows[i]?.line ?? '?'}`);
  private readonly layoutReport = (path: (string | number)[], code: string, message: string) => {
    const index = Number(path[0]);
    const field = String(path[1]);
    const line = this.rows[index]?.line;
    // The location prefix already names this row: "Row 10, column age_from: This row (…) overlaps row 9".
    const own = `Row ${line} `;
    const text = message.startsWith(own) ? `This row ${message.slice(own.length)}` : message;
    this.problems.add(issueAt(code, line, FIELD_COLUMN[field] ?? field, text, ['strata', index, field]));
  };

  constructor(readonly text: string) {}

  /** Reads the details and the header. False when the file cannot be read further. */
  open(): boolean {
    const bytes = utf8Length(this.text);
    if (bytes > MAX_TABLE_FILE_BYTES) {
      this.problems.add(
        issueAt('file-too-large', undefined, undefined, `The file is ${(bytes / 1024 / 1024).toFixed(1)} MB; the largest accepted is ${MAX_TABLE_FILE_BYTES / 1024 / 1024} MB. Split the table into smaller tables`),
      );
      return false;
    }
    // A workbook, a PDF, a picture or a UTF-16 file read as text: one sentence, not a list of garbled rows.
    const kind = sniffText(this.text);
    const kindCode = fileKindCode(kind);
    if (kindCode) {
      this.problems.add(issueAt(kindCode, undefined, undefined, fileKindSentence(kind) ?? ''));
      return false;
    }
    const text = this.text.startsWith('\uFEFF') ? this.text.slice(1) : this.text;
    if (text.trim() === '') {
      this.problems.add(issueAt('empty-file', undefined, undefined, 'The file is empty; a table file needs its details, a header row and at least one stratum row (see docs/table-format.md)'));
      return false;
    }
    const lines = leadingLines(text);
    const headerLine = lines[lines.length - 1];
    const isHeader = headerLine !== undefined && !isBlankLine(headerLine.text) && !isDetailLine(headerLine.text);
    this.delimiter = isHeader ? guessDelimiter(headerLine.text) : ',';
    for (const l of isHeader ? lines.slice(0, -1) : lines) this.readDetailLine(l.text, l.line);
    if (!isHeader || headerLine === undefined) {
      this.problems.add(issueAt('no-header', undefined, undefined, 'The file has no column header: after the "# key: value" details, a row must name the columns (e.g. sex,age_from,age_to,risk)'));
      return false;
    }
    const header = splitLineChecked(headerLine.text, this.delimiter);
    if (header.brokenQuotes) {
      this.problems.add(issueAt('csv-syntax', headerLine.line, undefined, 'The column header has a quotation mark that is not closed, or a stray one; check the quotation marks'));
    }
    this.columns = this.readHeader(header.cells, headerLine.line);
    this.body = text.slice(headerLine.end);
    this.bodyFirstLine = headerLine.line + 1;
    return true;
  }

  private readDetailLine(raw: string, line: number): void {
    if (isBlankLine(raw)) return;
    const { cells, brokenQuotes } = splitLineChecked(raw, this.delimiter);
    if (brokenQuotes) {
      // Read as papaparse guesses, the detail would be silently altered: refuse it instead.
      this.problems.add(issueAt('csv-syntax', line, undefined, `The detail line has a quotation mark that is not closed, or a stray one after a closing mark; put the whole line in quotation marks and write each quotation mark inside it twice (""), or leave quotation marks out. Found ${JSON.stringify(raw)}`));
      return;
    }
    let last = cells.length - 1;
    while (last > 0 && (cells[last] ?? '').trim() === '') last--;
    const joined = cells.slice(0, last + 1).join(this.delimiter).trim();
    const body = joined.replace(/^#\s*/, '');
    const colon = body.indexOf(':');
    if (colon < 0) {
      this.problems.add(issueAt('detail-format', line, undefined, `A detail line must read "# key: value", e.g. "# title: …"; found "${joined}"`));
      return;
    }
    const key = normaliseName(body.slice(0, colon));
    const value = body.slice(colon + 1).trim();
    if (!(DETAIL_KEYS as readonly string[]).includes(key)) {
      this.problems.add(issueAt('unknown-detail', line, key, `"${key}" is not a table detail; the details are ${DETAIL_KEYS.join(', ')}`, [], true));
      return;
    }
    if (this.details.some((d) => d.key === key)) {
      this.problems.add(issueAt('duplicate-detail', line, key, `"${key}" is given twice; give each detail once`, [], true));
      return;
    }
    this.details.push({ key, value, line });
    this.readDetail(key as DetailKey, value, line);
  }

  private readDetail(key: DetailKey, value: string, line: number): void {
    const field = DETAIL_FIELD[key];
    let input: unknown = value;
    if (key === 'horizon_years' || key === 'year' || key === 'exposure_prevalence') {
      if (value === '') {
        const what = key === 'year' ? 'year' : key === 'horizon_years' ? 'horizon' : 'exposure prevalence';
        this.problems.add(issueAt('required', line, key, `The ${what} is empty`, [field], true));
        return;
      }
      const n = readNumber(value, key);
      if (typeof n !== 'number') {
        this.problems.add(issueAt(n.code, line, key, n.message, [field], true));
        return;
      }
      input = n;
    } else if (key === 'illustrative') {
      const v = value.toLowerCase();
      if (v === 'true' || v === 'yes') input = true;
      else if (v === 'false' || v === 'no' || v === '') input = false;
      else {
        this.problems.add(issueAt('invalid-choice', line, key, `Illustrative must be true or false (yes or no); found "${value}"`, [field], true));
        return;
      }
    }
    const parsed = populationTableSchema.shape[field].safeParse(input, { reportInput: true });
    if (!parsed.success) {
      for (const issue of toIssues(parsed.error.issues)) this.problems.add(issueAt(issue.code, line, key, issue.message, [field], true));
      return;
    }
    this.table[field] = parsed.data;
  }

  private readHeader(cells: string[], line: number): Columns {
    let width = cells.length;
    while (width > 0 && (cells[width - 1] ?? '').trim() === '') width--;
    const names = cells.slice(0, width).map(normaliseName);
    const index: Partial<Record<BaseColumn, number>> = {};
    const extras: { key: string; index: number }[] = [];
    const seen = new Set<string>();
    names.forEach((name, i) => {
      if (name === '') {
        this.problems.add(issueAt('unknown-column', line, `#${i + 1}`, `Column ${i + 1} of the header has no name; name it or remove the column`));
        return;
      }
      if (seen.has(name)) {
        this.problems.add(issueAt('duplicate-column', line, name, `The column "${name}" appears twice; keep one`));
        return;
      }
      seen.add(name);
      if ((BASE_COLUMNS as readonly string[]).includes(name)) {
        index[name as BaseColumn] = i;
      } else if (name.startsWith(STRATUM_COLUMN_PREFIX)) {
        const key = name.slice(STRATUM_COLUMN_PREFIX.length);
        if (!STRATUM_KEY_PATTERN.test(key)) {
          this.problems.add(issueAt('unknown-column', line, name, `"${name}" is not a usable extra stratum: after "${STRATUM_COLUMN_PREFIX}" write a name starting with a letter, using letters, digits and "_" (e.g. stratum_region)`));
          return;
        }
        extras.push({ key, index: i });
      } else {
        this.problems.add(
          issueAt('unknown-column', line, name, `"${name}" is not a known column; the columns are ${BASE_COLUMNS.join(', ')}, and extra strata named ${STRATUM_COLUMN_PREFIX}<name> (e.g. stratum_region)`),
        );
      }
    });
    for (const required of ['sex', 'age_from', 'age_to'] as const) {
      if (index[required] === undefined) this.problems.add(issueAt('missing-column', line, required, `The column "${required}" is missing from the header`));
    }
    const hasRisk = index.risk !== undefined;
    const hasRate = index.rate !== undefined || index.person_years !== undefined;
    let form: TableForm | undefined;
    if (hasRisk && hasRate) {
      this.problems.add(issueAt('mixed-baseline-forms', line, 'risk', 'The header has both a risk column and rate columns; a table gives either risks (column risk) or rates (columns rate and person_years)'));
    } else if (hasRisk) {
      form = 'risk';
    } else if (hasRate) {
      if (index.rate === undefined) this.problems.add(issueAt('missing-column', line, 'rate', 'The column "rate" is missing: person_years needs a rate column beside it'));
      else if (index.person_years === undefined) this.problems.add(issueAt('missing-column', line, 'person_years', 'The column "person_years" is missing: a rate needs its person-years (e.g. 1000 for a rate per 1000 person-years)'));
      else form = 'rate';
    } else {
      this.problems.add(issueAt('missing-column', line, 'risk', 'The header needs either a risk column, or rate and person_years columns'));
    }
    if (names.length > 0 && !names.some((n) => (BASE_COLUMNS as readonly string[]).includes(n) || n.startsWith(STRATUM_COLUMN_PREFIX))) {
      this.problems.add(
        issueAt('no-header', line, undefined, `This row should be the column header (e.g. sex,age_from,age_to,risk) but names no known column; found "${cells.join(this.delimiter)}"`),
      );
    }
    const usable = index.sex !== undefined && index.age_from !== undefined && index.age_to !== undefined && form !== undefined;
    const numeric: NumericColumn[] = [
      'age_from',
      'age_to',
      ...(form === 'risk' ? (['risk'] as const) : (['rate', 'person_years'] as const)),
      ...(index.exposure_prevalence === undefined ? [] : (['exposure_prevalence'] as const)),
    ];
    return { names, index, extras, form, numeric, usable };
  }

  /** Reads one block of the body. False once reading must stop (too many rows). */
  feed(block: string, firstLine: number): boolean {
    if (this.stopped) return false;
    const parsed = Papa.parse<string[]>(block, { delimiter: this.delimiter, header: false, skipEmptyLines: false });
    for (const error of parsed.errors) {
      const line = firstLine + (error.row ?? 0);
      const message = error.type === 'Quotes' ? 'a quoted cell is not closed or has a stray quotation mark; check the quotation marks' : error.message;
      this.problems.add(issueAt('csv-syntax', line, undefined, message));
    }
    const rows = parsed.data;
    // A block ends after a line break, so its last "row" is the empty rest.
    const count = block.endsWith('\n') || block.endsWith('\r') ? rows.length - 1 : rows.length;
    for (let i = 0; i < count; i++) {
      const cells = rows[i] ?? [];
      if (cells.every((c) => c.trim() === '')) continue;
      this.rowCount++;
      if (this.rowCount > MAX_TABLE_ROWS) {
        this.problems.add(issueAt('too-many-rows', firstLine + i, undefined, `The file has more than ${MAX_TABLE_ROWS.toLocaleString('en-GB')} stratum rows, the most accepted; split the table into smaller tables`));
        this.stopped = true;
        return false;
      }
      if (this.previewRows.length < PREVIEW_ROWS) this.previewRows.push({ line: firstLine + i, cells });
      this.readRow(cells, firstLine + i);
    }
    return true;
  }

  /**
   * Cell texts already found valid, by column, with their values: ages, sexes and extra
   * values repeat on almost every row, so most cells skip the schema (a large file's cost is
   * mostly here). A pure memo: the result is the same with or without it.
   */
  private readonly known = new Map<string, Map<string, unknown>>();

  private remember(column: string, text: string, value: unknown): void {
    let memo = this.known.get(column);
    if (!memo) this.known.set(column, (memo = new Map()));
    if (memo.size < MEMO_LIMIT) memo.set(text, value);
  }

  private readRow(cells: string[], line: number): void {
    const columns = this.columns;
    if (!columns?.usable) return;
    const width = columns.names.length;
    if (cells.length > width && cells.slice(width).some((c) => c.trim() !== '')) {
      this.problems.add(issueAt('cell-count', line, undefined, this.cellCountMessage(cells, width)));
      this.rows.push({ line, stratum: {}, placed: false, valid: false });
      return;
    }
    const index = this.rows.length;
    const stratum: Partial<Record<keyof Stratum, unknown>> = {};
    const bad = new Set<string>();
    const problem = (code: string, column: string, message: string, field: string) => {
      bad.add(field);
      this.problems.add(issueAt(code, line, column, message, ['strata', index, field]));
    };

    const sex = cellAt(cells, columns.index.sex);
    const knownSex = this.known.get('sex')?.get(sex);
    if (knownSex !== undefined) stratum.sex = knownSex;
    else if (sex === '') problem('required', 'sex', 'The sex is empty; write female, male or any', 'sex');
    else {
      const parsed = stratumFieldsSchema.shape.sex.safeParse(sex.toLowerCase());
      if (parsed.success) {
        stratum.sex = parsed.data;
        this.remember('sex', sex, parsed.data);
      } else problem('invalid-choice', 'sex', `"${sex}" is not a sex here; write female, male or any`, 'sex');
    }

    for (const column of columns.numeric) {
      const field = COLUMN_FIELD[column];
      const value = cellAt(cells, columns.index[column]);
      const known = this.known.get(column)?.get(value);
      if (known !== undefined) {
        stratum[field] = known;
        continue;
      }
      if (value === '') {
        // An empty prevalence cell: this stratum takes the table's prevalence, if any.
        if (column === 'exposure_prevalence') continue;
        problem('required', column, `The cell is empty; ${describeColumn(column)} is required`, field);
        continue;
      }
      const n = readNumber(value, column);
      if (typeof n !== 'number') {
        problem(n.code, column, n.message, field);
        continue;
      }
      const parsed = stratumFieldsSchema.shape[field].safeParse(n, { reportInput: true });
      if (parsed.success) {
        stratum[field] = parsed.data;
        if (column === 'age_from' || column === 'age_to') this.remember(column, value, parsed.data);
      } else for (const issue of toIssues(parsed.error.issues)) problem(issue.code, column, issue.message, field);
    }

    if (columns.extras.length > 0) {
      const extra: Record<string, string> = {};
      for (const { key, index: at } of columns.extras) {
        // A cell the writer guarded against spreadsheet formulas ("'=x") reads back as written ("=x").
        const value = unguardTextCell(cellAt(cells, at));
        const column = `${STRATUM_COLUMN_PREFIX}${key}`;
        const known = this.known.get(column)?.get(value);
        if (typeof known === 'string') extra[key] = known;
        else if (value === '') problem('required', column, `The cell is empty; every row gives its ${key}`, 'extra');
        else {
          const parsed = stratumFieldsSchema.shape.extra.unwrap().valueType.safeParse(value);
          if (parsed.success) {
            extra[key] = parsed.data;
            this.remember(column, value, parsed.data);
          } else for (const issue of toIssues(parsed.error.issues)) problem(issue.code, column, issue.message, 'extra');
        }
      }
      stratum.extra = extra;
    }

    const placed = !bad.has('sex') && !bad.has('ageFrom') && !bad.has('ageTo') && !bad.has('extra');
    if (placed && bad.size === 0) {
      checkStratum(stratum as Stratum, (path, code, message) => {
        const field = String(path[0]);
        bad.add(field);
        this.problems.add(issueAt(code, line, FIELD_COLUMN[field] ?? field, message, ['strata', index, field]));
      });
    }
    const orderBad = bad.has('ageTo') && placed;
    this.rows.push({ line, stratum: stratum as Partial<Stratum>, placed: placed && !orderBad, valid: bad.size === 0 });
    if (placed && !orderBad) this.layout.add(stratum as Stratum, index, this.layoutReport);
  }

  private cellCountMessage(cells: string[], width: number): string {
    const base = `The row has ${cells.length} cells but the header names ${width} columns.`;
    // "0,08" in a comma-separated file arrives as the cells "0" and "08": digits on both sides.
    const looksSplit = cells.some((c, i) => i > 0 && /^\s*\d+\s*$/.test(c) && /^\s*[+-]?\d+\s*$/.test(cells[i - 1] ?? ''));
    return looksSplit && this.delimiter === ','
      ? `${base} A number written with a decimal comma (e.g. 0,08) splits into two cells in a comma-separated file: write numbers with a decimal point (0.08)`
      : `${base} Check for a stray "${this.delimiter === '\t' ? 'tab' : this.delimiter}" in a cell, or put quotation marks around a cell that contains one`;
  }

  /**
   * The whole read as steps: the details and header, each block of rows (yielding how far it
   * has got), then the whole-file checks (yielding now and then), returning the result. Both
   * readers drive these steps; only the chunked one pauses or stops between them.
   */
  *reading(chunkChars: number): Generator<TableCsvProgress | void, TableCsvResult> {
    if (!this.open()) return yield* this.finishing();
    const total = this.body.length;
    for (const block of blocksOf(this.body, chunkChars)) {
      const more = this.feed(block.text, this.bodyFirstLine + block.firstLine);
      yield { charsDone: block.end, charsTotal: total, rowsDone: this.rowCount };
      if (!more) break;
    }
    return yield* this.finishing();
  }

  /** The whole-file checks, then the table or the problems; yields now and then so a page can pause between them. */
  *finishing(): Generator<void, TableCsvResult> {
    const preview = this.preview();
    const columns = this.columns;
    if (columns) {
      for (const key of REQUIRED_DETAILS) {
        if (!this.details.some((d) => d.key === key)) {
          this.problems.add(issueAt('required', undefined, key, `The detail "${key}" is missing; add a line "# ${key}: …" above the column header`, [DETAIL_FIELD[key]]));
        }
      }
      if (columns.form === 'risk' && !this.details.some((d) => d.key === 'horizon_years')) {
        this.problems.add(issueAt('horizon-required', undefined, 'horizon_years', 'The detail "horizon_years" is missing: a table of risks must say over how many years the risks run ("# horizon_years: 10")', ['horizonYears']));
      }
      if (columns.usable && this.rowCount === 0 && !this.stopped) {
        this.problems.add(issueAt('no-rows', undefined, undefined, 'The file has a header but no stratum rows'));
      }
      yield* this.layout.checkBands(this.layoutReport);
    }
    if (this.problems.total > 0) return { ok: false, issues: this.problems.result(), preview };

    if (!preview) return { ok: false, issues: [issueAt('no-header', undefined, undefined, 'The file has no column header')], preview };
    // Every rule of populationTableSchema was checked above, field by field and row by row;
    // re-parsing 100,000 strata at the end would block a page for a second, so the table is
    // assembled directly (tests check that what comes out always passes parseTable).
    const title = typeof this.table.title === 'string' ? this.table.title : '';
    const table = {
      ...this.table,
      id: typeof this.table.id === 'string' ? this.table.id : idFromTitle(title),
      illustrative: this.table.illustrative === true,
      strata: this.rows.map((r) => r.stratum as Stratum),
    } as PopulationTable;
    return { ok: true, value: orderedTable(table), preview };
  }

  preview(): TableCsvPreview | undefined {
    if (!this.columns) return undefined;
    return { delimiter: this.delimiter, details: this.details, columns: this.columns.names, rows: this.previewRows, rowCount: this.rowCount };
  }
}

/** The table's fields in schema order, as parsing would give them (so results compare equal field for field). */
function orderedTable(t: PopulationTable): PopulationTable {
  return {
    id: t.id,
    title: t.title,
    outcome: t.outcome,
    ...(t.horizonYears === undefined ? {} : { horizonYears: t.horizonYears }),
    population: t.population,
    source: t.source,
    year: t.year,
    illustrative: t.illustrative,
    ...(t.exposurePrevalence === undefined ? {} : { exposurePrevalence: t.exposurePrevalence }),
    strata: t.strata,
  };
}

/** Most remembered cell texts per column (ages need 121; extra strata a few thousand). */
const MEMO_LIMIT = 10_000;

/**
 * Read a table file in one go (the command line, tests).
 *
 * @example
 * parseTableCsv('# title: T\n# outcome: O\n# horizon_years: 10\n# population: P\n# source: S\n# year: 2024\nsex,age_from,age_to,risk\nany,30,79,0.05\n')
 * //=> { ok: true, value: { id: 't', title: 'T', …, strata: [{ sex: 'any', ageFrom: 30, ageTo: 79, risk: 0.05 }] }, preview: … }
 */
export function parseTableCsv(text: string): TableCsvResult {
  const steps = new TableCsvReader(text).reading(DEFAULT_CHUNK_CHARS);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

/**
 * Read a table file block by block, awaiting `pause` between steps and reporting progress,
 * so a page stays responsive on a large file. The same steps as {@link parseTableCsv}, so the
 * same result, unless `signal` stops it first.
 */
export async function parseTableCsvInChunks(text: string, options: ChunkedOptions = {}): Promise<TableCsvResult> {
  const reader = new TableCsvReader(text);
  const steps = reader.reading(options.chunkChars ?? DEFAULT_CHUNK_CHARS);
  for (;;) {
    if (options.signal?.aborted) {
      return { ok: false, issues: [issueAt('cancelled', undefined, undefined, 'The import was cancelled; nothing was saved')], preview: reader.preview() };
    }
    const next = steps.next();
    if (next.done) return next.value;
    if (next.value) options.onProgress?.(next.value);
    if (options.pause) await options.pause();
  }
}
