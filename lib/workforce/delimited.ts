/**
 * CSV and TSV text, given in chunks of any size, → rows of cells with their line numbers.
 *
 * Rows are cut at line ends outside quotes, so a chunk may end anywhere (mid-line, mid-quote):
 * the unfinished part waits for the next chunk. A block with no quotation mark is split on the
 * delimiter directly (for such text RFC 4180 splitting is exactly that); a block with quotes is
 * split by papaparse, as the table import does (lib/tables/csv.ts). Line numbers count the file's
 * physical lines from 1, so a quoted cell holding a line break moves the next row's number on.
 */
import Papa from 'papaparse';

export type Delimiter = ',' | ';' | '\t';

export interface CellLine {
  /** The file line the row starts on (1-based). */
  readonly line: number;
  readonly cells: readonly string[];
}

/**
 * The delimiter of a header line: the one of comma, semicolon and tab that occurs most (a comma
 * when none occurs), as the table import guesses it.
 */
export function guessDelimiter(header: string): Delimiter {
  const counts = ([',', ';', '\t'] as const).map((d) => [d, header.split(d).length - 1] as const);
  let best: readonly [Delimiter, number] = [',', 0];
  for (const c of counts) if (c[1] > best[1]) best = c;
  return best[0];
}

/** Index just past the last line end outside quotes, or -1. A lone "\r" at the very end waits for a possible "\n". */
function lastLineEnd(text: string, hasQuote: boolean): number {
  if (!hasQuote) {
    const n = text.lastIndexOf('\n');
    const r = text.lastIndexOf('\r');
    if (r > n && r < text.length - 1) return r + 1;
    return n >= 0 ? n + 1 : r >= 0 && r < text.length - 1 ? r + 1 : -1;
  }
  let inQuote = false;
  let last = -1;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 34) inQuote = !inQuote;
    else if (!inQuote && c === 10) last = i + 1;
    else if (!inQuote && c === 13 && text.charCodeAt(i + 1) !== 10 && i < text.length - 1) last = i + 1;
  }
  return last;
}

function countBreaks(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) n++;
    else if (c === 13 && text.charCodeAt(i + 1) !== 10) n++;
  }
  return n;
}

/** Splits text in chunks into rows of cells. Feed with {@link DelimitedSplitter.push}, finish with {@link DelimitedSplitter.end}. */
export class DelimitedSplitter {
  private carry = '';
  private nextLine: number;

  /** @param firstLine - the file line the first text pushed starts on (1 unless lines were read before) */
  constructor(
    readonly delimiter: Delimiter,
    firstLine = 1,
  ) {
    this.nextLine = firstLine;
  }

  /** The rows completed by this chunk. */
  push(chunk: string): CellLine[] {
    const text = this.carry + chunk;
    const hasQuote = text.includes('"');
    const cut = lastLineEnd(text, hasQuote);
    if (cut < 0) {
      this.carry = text;
      return [];
    }
    this.carry = text.slice(cut);
    return this.split(text.slice(0, cut), hasQuote);
  }

  /** The last row, when the text does not end with a line break. */
  end(): CellLine[] {
    const rest = this.carry;
    this.carry = '';
    if (rest === '') return [];
    return this.split(`${rest}\n`, rest.includes('"'));
  }

  /** Rows of a block that ends with a line break. */
  private split(block: string, hasQuote: boolean): CellLine[] {
    const out: CellLine[] = [];
    if (!hasQuote) {
      // Most files end lines with "\n" alone: a plain split is much faster than the pattern.
      const lines = block.includes('\r') ? block.split(/\r\n|\n|\r/) : block.split('\n');
      lines.pop(); // after the final line break
      const delimiter = this.delimiter;
      let line = this.nextLine;
      for (let i = 0; i < lines.length; i++) out.push({ line: line++, cells: (lines[i] as string).split(delimiter) });
      this.nextLine = line;
      return out;
    }
    const body = block.replace(/(\r\n|\n|\r)$/, '');
    // papaparse gives no row at all for empty text: a lone blank line is still a line.
    if (body === '') return [{ line: this.nextLine++, cells: [''] }];
    const parsed = Papa.parse<string[]>(body, { delimiter: this.delimiter, header: false, skipEmptyLines: false });
    for (const cells of parsed.data) {
      const line = this.nextLine;
      let breaks = 0;
      for (const cell of cells) if (cell.includes('\n') || cell.includes('\r')) breaks += countBreaks(cell);
      this.nextLine += 1 + breaks;
      out.push({ line, cells });
    }
    return out;
  }
}

/**
 * One column's cells of CSV/TSV text in chunks, with their line numbers: what a quick pass over
 * a large file needs (the worker ids, to see whether the file is grouped by worker). Lines are
 * cut with `indexOf` and only the cells up to the column are looked at; text with a quotation
 * mark or a lone "\r" line end goes through {@link DelimitedSplitter} instead, so the cells and
 * line numbers are the same as splitting every row.
 */
export class ColumnScanner {
  private carry = '';
  private line: number;
  private splitter: DelimitedSplitter | null = null;
  private stopped = false;
  /** The cell of the row before, when repeats are skipped and that row was past {@link repeatsSkippedAfter}. */
  private previous: string | null = null;
  private readonly repeatsSkippedAfter: number;

  /**
   * @param onCell - called with each row's cell (as written, "" when the row is shorter) and the
   *   row's line; return false to stop
   * @param options.repeatsSkippedAfter - past this line, a row whose cell is the same text as the
   *   row before's is not passed to `onCell` (nor sliced out of the text): for a caller that only
   *   looks at changes, e.g. where one worker's rows end (default: every row is passed)
   */
  constructor(
    readonly delimiter: Delimiter,
    private readonly column: number,
    private readonly onCell: (cell: string, line: number) => boolean,
    firstLine = 1,
    options: { readonly repeatsSkippedAfter?: number } = {},
  ) {
    this.line = firstLine;
    this.repeatsSkippedAfter = options.repeatsSkippedAfter ?? Number.POSITIVE_INFINITY;
  }

  /** Passes a row's cell on, unless it repeats the row before's (past the line given); false to stop. */
  private pass(cell: string, line: number): boolean {
    if (line > this.repeatsSkippedAfter) {
      if (cell === this.previous) return true;
      this.previous = cell;
    }
    return this.onCell(cell, line);
  }

  /** Feeds the next chunk; false once `onCell` has asked to stop. */
  push(chunk: string): boolean {
    if (this.stopped) return false;
    if (this.splitter) return this.feedRows(this.splitter.push(chunk));
    const text = this.carry + chunk;
    const cut = text.lastIndexOf('\n') + 1;
    const block = text.slice(0, cut);
    if (block.includes('"') || /\r(?!\n)/.test(block) || (cut === 0 && /["\r]/.test(text))) {
      this.carry = '';
      this.splitter = new DelimitedSplitter(this.delimiter, this.line);
      return this.feedRows(this.splitter.push(text));
    }
    this.carry = text.slice(cut);
    const { delimiter, column, repeatsSkippedAfter } = this;
    let start = 0;
    while (start < cut) {
      const end = text.indexOf('\n', start);
      let from = start;
      for (let k = 0; k < column && from >= 0; k++) {
        const at = text.indexOf(delimiter, from);
        from = at < 0 || at >= end ? -1 : at + 1;
      }
      let to = from;
      if (from >= 0) {
        const at = text.indexOf(delimiter, from);
        to = at < 0 || at > end ? end : at;
        if (to === end && to > from && text.charCodeAt(to - 1) === 13) to -= 1;
      }
      const line = this.line++;
      start = end + 1;
      // A repeat of the row before's cell, compared where it stands (nothing sliced out).
      const previous = this.previous;
      if (line > repeatsSkippedAfter && previous !== null && to - from === previous.length && (from < 0 || text.startsWith(previous, from))) continue;
      if (!this.pass(from >= 0 ? text.slice(from, to) : '', line)) {
        this.stopped = true;
        return false;
      }
    }
    return true;
  }

  /** The last row, when the text does not end with a line break. */
  end(): boolean {
    if (this.stopped) return false;
    if (!this.splitter) {
      const rest = this.carry;
      this.carry = '';
      if (rest !== '' && !this.push(`${rest}\n`)) return false;
      if (!this.splitter) return true;
    }
    return this.feedRows(this.splitter.end());
  }

  private feedRows(rows: readonly CellLine[]): boolean {
    for (const row of rows) {
      if (!this.pass(row.cells[this.column] ?? '', row.line)) {
        this.stopped = true;
        return false;
      }
    }
    return true;
  }
}
