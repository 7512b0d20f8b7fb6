/**
 * Reading a checkup file — CSV/TSV text in chunks, or a workbook's rows — into checkup rows and
 * row problems, incrementally: {@link createCheckupTextReader} takes text chunks of any size (a
 * Web Worker feeds it slices of the file and reports progress between them; the command feeds it
 * a file stream), and each `push` returns the rows and problems completed so far.
 *
 * The header: leading blank lines and lines starting with "#" (a note such as "# Illustrative
 * data") are skipped; the next line is the header. The delimiter is the one of comma, semicolon
 * and tab that occurs most in it. Decimal commas ("6,1") are detected from the first
 * {@link SNIFF_ROWS} data rows: in a file delimited by semicolons or tabs, a value cell written
 * with a comma means the file writes decimals with a comma (a comma-delimited file cannot: its
 * "6,1" would be two cells). In a comma-delimited file a quoted "6,1" is a row problem, as the
 * table import treats it.
 *
 * Refusals (the whole file, one clear message): no header, an unsettled mapping (./columns.ts).
 * A file with no usable row is refused by the caller once the read is done ({@link noUsableRows}).
 */
import type { HistoryOptions } from '../glycaemia/schema';
import { proposeMapping, type MappingProposal } from './columns';
import { DelimitedSplitter, guessDelimiter, type CellLine, type Delimiter } from './delimited';
import { createRowReader, type RowReader } from './rows';
import type { CellValue, CheckupRow, ColumnMapping, MappingOverrides, MappingProblem, ReadStep, RowCounts, RowProblem } from './types';

/** Data rows looked at to detect a decimal comma before any row is read. */
export const SNIFF_ROWS = 50;

export interface CheckupReaderOptions extends HistoryOptions {
  /** --map overrides (header text → field). Ignored when `mapping` is given. */
  readonly overrides?: MappingOverrides;
  /** A mapping already settled (the screen's, after the physician confirmed it). */
  readonly mapping?: ColumnMapping;
}

/** What the reader found about the file once its header was read. */
export interface HeaderInfo {
  readonly headerLine: number;
  readonly headers: readonly string[];
  readonly delimiter: Delimiter;
  readonly decimalComma: boolean;
  readonly proposal: MappingProposal;
  /** The first few data rows as text cells, for the screen's column preview. */
  readonly sample: readonly (readonly string[])[];
}

/** The whole file is refused: one clear message (and the mapping problems, when that is the reason). */
export interface ReadRefusal {
  readonly refused: true;
  readonly code: 'no-header' | 'mapping' | 'empty-file' | 'no-usable-rows' | 'unreadable';
  readonly message: string;
  readonly problems: readonly MappingProblem[];
}

export type ReadOutcome = ReadStep | ReadRefusal;

export function isRefusal<T extends object>(outcome: T | ReadRefusal): outcome is ReadRefusal {
  return (outcome as { refused?: unknown }).refused === true;
}

export interface CheckupTextReader {
  /** Feed the next chunk of text; returns the rows and problems it completed (or the refusal). */
  push(chunk: string): ReadOutcome;
  /** No more text: returns the last rows (or the refusal, e.g. a file with no header). */
  end(): ReadOutcome;
  /** Set once the header and the sniffed rows have been read. */
  readonly header: HeaderInfo | null;
  /** Rows read, used and skipped so far. */
  counts(): RowCounts;
}

/** The one-line refusal for an unsettled mapping: every problem, joined. */
export function mappingRefusal(problems: readonly MappingProblem[]): ReadRefusal {
  return { refused: true, code: 'mapping', message: `The columns cannot be settled: ${problems.map((p) => p.message).join('; ')}`, problems };
}

/** The refusal for a file whose rows were all skipped (or that had none). */
export function noUsableRows(counts: RowCounts): ReadRefusal | null {
  if (counts.used > 0) return null;
  const message =
    counts.read === 0
      ? 'The file has a header but no data rows'
      : `None of the file's ${counts.read} data row${counts.read === 1 ? '' : 's'} could be used (see the row problems)`;
  return { refused: true, code: 'no-usable-rows', message, problems: [] };
}

const DECIMAL_COMMA_CELL = /^[+-]?\d+,\d+$/;

/** Whether value cells of a semicolon- or tab-delimited file are written with a decimal comma. */
export function detectDecimalComma(delimiter: Delimiter, rows: readonly (readonly CellValue[])[], valueColumns: readonly number[]): boolean {
  if (delimiter === ',') return false;
  return rows.some((cells) => valueColumns.some((i) => typeof cells[i] === 'string' && DECIMAL_COMMA_CELL.test((cells[i] as string).trim())));
}

class Counter {
  read = 0;
  used = 0;
  skipped = 0;
  snapshot(): RowCounts {
    return { read: this.read, used: this.used, skipped: this.skipped };
  }
}

/** Reads rows of cells through one row reader, counting. */
function readRows(lines: readonly { line: number; cells: readonly CellValue[] }[], reader: RowReader, counter: Counter): ReadStep {
  const rows: CheckupRow[] = [];
  const problems: RowProblem[] = [];
  for (const { line, cells } of lines) {
    const outcome = reader.read(cells, line);
    if (outcome.ok === 'blank') continue;
    counter.read++;
    if (outcome.ok) {
      counter.used++;
      rows.push(outcome.row);
    } else {
      counter.skipped++;
      problems.push(...outcome.problems);
    }
  }
  return { rows, problems };
}

function isSkippedLeadingLine(cells: readonly string[]): boolean {
  const first = (cells[0] ?? '').trim();
  return first.startsWith('#') || cells.every((c) => c.trim() === '');
}

/**
 * A reader of CSV/TSV text in chunks.
 *
 * @example
 * const reader = createCheckupTextReader({ today: '2025-01-01' });
 * reader.push('worker,date,HbA1c (%)\nW1,2024-03-01,6.1\nW1,2024-');
 * //=> { rows: [{ line: 2, worker: 'W1', date: '2024-03-01', hba1c: { value: 6.1, unit: '%' }, strata: {} }], problems: [] }
 * reader.push('03-01,x\n'); reader.end();
 * //=> { rows: [], problems: [{ line: 3, column: 'HbA1c (%)', code: 'not-a-number', message: '"x" is not a number' }] }
 */
export function createCheckupTextReader(options: CheckupReaderOptions): CheckupTextReader {
  let splitter: DelimitedSplitter | null = null;
  let preamble = '';
  let header: HeaderInfo | null = null;
  let rowReader: RowReader | null = null;
  let refusal: ReadRefusal | null = null;
  let headerCells: CellLine | null = null;
  const pending: CellLine[] = [];
  const counter = new Counter();
  let sawText = false;

  /**
   * Before the delimiter is known: collect text until the header line (the first that is not
   * blank and not a "#" note) is complete, then split everything from it on.
   */
  function findHeader(final: boolean): CellLine[] {
    let start = 0;
    let line = 1;
    for (;;) {
      const rest = preamble.slice(start);
      const m = /\r\n|\n|\r/.exec(rest);
      if (!final && (!m || (m[0] === '\r' && m.index === rest.length - 1))) return [];
      const content = m ? rest.slice(0, m.index) : rest;
      const trimmed = content.trim();
      if (trimmed !== '' && !trimmed.startsWith('#') && !/^[,;\t\s]*$/.test(trimmed)) {
        splitter = new DelimitedSplitter(guessDelimiter(content), line);
        preamble = '';
        return [...splitter.push(rest), ...(final ? splitter.end() : [])];
      }
      if (!m) {
        preamble = '';
        return [];
      }
      start += m.index + m[0].length;
      line++;
    }
  }

  function settleHeader(final: boolean): ReadOutcome | null {
    if (!headerCells || !splitter) return null;
    if (pending.length < SNIFF_ROWS && !final) return null;
    const headers = headerCells.cells.map((c) => c.trim());
    const proposal = options.mapping ? { mapping: options.mapping, problems: [], notes: [] } : proposeMapping(headers, options.overrides);
    const valueColumns = proposal.mapping.columns.filter((c) => c.field === 'hba1c' || c.field === 'fpg' || c.field === 'age').map((c) => c.index);
    const decimalComma = detectDecimalComma(splitter.delimiter, pending.map((p) => p.cells), valueColumns);
    header = {
      headerLine: headerCells.line,
      headers,
      delimiter: splitter.delimiter,
      decimalComma,
      proposal,
      sample: pending.slice(0, 5).map((p) => p.cells),
    };
    if (proposal.problems.length > 0) {
      refusal = mappingRefusal(proposal.problems);
      return refusal;
    }
    rowReader = createRowReader(proposal.mapping, { ...options, decimalComma });
    const step = readRows(pending, rowReader, counter);
    pending.length = 0;
    return step;
  }

  function take(lines: CellLine[], final: boolean): ReadOutcome {
    if (refusal) return refusal;
    if (rowReader) return readRows(lines, rowReader, counter);
    for (const l of lines) {
      if (!headerCells) {
        if (isSkippedLeadingLine(l.cells)) continue;
        headerCells = l;
      } else pending.push(l);
    }
    return settleHeader(final) ?? { rows: [], problems: [] };
  }

  return {
    push(chunk: string): ReadOutcome {
      if (refusal) return refusal;
      if (!splitter) {
        if (!sawText && /\S/.test(chunk.replace(/^\uFEFF/, ''))) sawText = true;
        preamble += preamble === '' && chunk.charCodeAt(0) === 0xfeff ? chunk.slice(1) : chunk;
        const first = findHeader(false);
        return splitter ? take(first, false) : { rows: [], problems: [] };
      }
      return take(splitter.push(chunk), false);
    },
    end(): ReadOutcome {
      if (refusal) return refusal;
      if (!splitter) {
        const first = findHeader(true);
        if (!splitter) {
          refusal = { refused: true, code: sawText ? 'no-header' : 'empty-file', message: 'The file is empty or has no header row (a first row naming the columns: worker, date, HbA1c …)', problems: [] };
          return refusal;
        }
        return take(first, true);
      }
      const step = take(splitter.end(), true);
      if (isRefusal(step)) return step;
      if (!headerCells) {
        refusal = { refused: true, code: 'no-header', message: 'The file is empty or has no header row (a first row naming the columns: worker, date, HbA1c …)', problems: [] };
        return refusal;
      }
      if (!rowReader) {
        const settled = settleHeader(true);
        if (settled && isRefusal(settled)) return settled;
        if (settled) return { rows: [...step.rows, ...settled.rows], problems: [...step.problems, ...settled.problems] };
      }
      return step;
    },
    get header() {
      return header;
    },
    counts: () => counter.snapshot(),
  };
}

/**
 * Reads rows already split into cells (a workbook's sheet: ./xlsx.ts): the first non-blank row
 * is the header, every later row a checkup. Line numbers are the sheet's row numbers (1-based).
 */
export function readCheckupTable(table: readonly (readonly CellValue[])[], options: CheckupReaderOptions): { readonly header: HeaderInfo; readonly step: ReadStep; readonly counts: RowCounts } | ReadRefusal {
  const headerIndex = table.findIndex((cells) => cells.some((c) => c !== null && String(c).trim() !== '' && !String(c).trim().startsWith('#')));
  const headerRow = table[headerIndex];
  if (headerIndex < 0 || !headerRow) {
    return { refused: true, code: 'no-header', message: 'The sheet is empty or has no header row (a first row naming the columns: worker, date, HbA1c …)', problems: [] };
  }
  const headers = headerRow.map((c) => (c === null ? '' : c instanceof Date ? c.toISOString().slice(0, 10) : String(c).trim()));
  const proposal = options.mapping ? { mapping: options.mapping, problems: [], notes: [] } : proposeMapping(headers, options.overrides);
  const body = table.slice(headerIndex + 1).map((cells, i) => ({ line: headerIndex + 2 + i, cells }));
  const header: HeaderInfo = {
    headerLine: headerIndex + 1,
    headers,
    delimiter: ',',
    decimalComma: false,
    proposal,
    sample: body.slice(0, 5).map((b) => b.cells.map((c) => (c === null ? '' : c instanceof Date ? c.toISOString().slice(0, 10) : String(c)))),
  };
  if (proposal.problems.length > 0) return mappingRefusal(proposal.problems);
  const valueColumns = proposal.mapping.columns.filter((c) => c.field === 'hba1c' || c.field === 'fpg' || c.field === 'age').map((c) => c.index);
  // A workbook keeps numbers as numbers; text cells written "6,1" mean a decimal comma.
  const decimalComma = detectDecimalComma(';', body.slice(0, SNIFF_ROWS).map((b) => b.cells), valueColumns);
  const counter = new Counter();
  const step = readRows(body, createRowReader(proposal.mapping, { ...options, decimalComma }), counter);
  return { header: { ...header, decimalComma }, step, counts: counter.snapshot() };
}
