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
      const lines = block.split(/\r\n|\n|\r/);
      lines.pop(); // after the final line break
      for (const line of lines) out.push({ line: this.nextLine++, cells: line.split(this.delimiter) });
      return out;
    }
    const parsed = Papa.parse<string[]>(block.replace(/(\r\n|\n|\r)$/, ''), { delimiter: this.delimiter, header: false, skipEmptyLines: false });
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
