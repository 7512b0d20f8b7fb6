/**
 * The population-table CSV format (docs/table-format.md): its limits, detail keys and columns,
 * and how the file's lines are told apart (blank, detail, header) and cut into blocks.
 *
 * `# key: value` lines give the table's details, then one header row, then one row per stratum:
 *
 *     # title: Heart failure needing hospital care within 10 years
 *     # outcome: a first hospital admission for heart failure
 *     # horizon_years: 10
 *     # population: Adults aged 30 to 79 registered in the district
 *     # source: District health report, table 4
 *     # year: 2024
 *     sex,age_from,age_to,risk
 *     female,30,39,0.002
 *
 * Cells are split by papaparse (RFC 4180 quoting).
 */
import Papa from 'papaparse';
import { MAX_STRATA, type PopulationTable } from './schema';

/** Largest file accepted, in bytes of UTF-8: 10 MiB, about 20 times a full national table by single year of age. */
export const MAX_TABLE_FILE_BYTES = 10 * 1024 * 1024;
/** Most stratum rows accepted in one file (the schema's limit on strata). */
export const MAX_TABLE_ROWS = MAX_STRATA;
/** Stratum rows kept for the import preview. */
export const PREVIEW_ROWS = 10;
/** Characters read per block by the chunked reader unless told otherwise (about 256 kB). */
export const DEFAULT_CHUNK_CHARS = 256 * 1024;

/** The detail keys, in the order the export writes them. */
export const DETAIL_KEYS = ['id', 'title', 'outcome', 'horizon_years', 'population', 'source', 'year', 'illustrative', 'exposure_prevalence'] as const;
export type DetailKey = (typeof DETAIL_KEYS)[number];
/** The details every file must give. */
export const REQUIRED_DETAILS: readonly DetailKey[] = ['title', 'outcome', 'population', 'source', 'year'];

/** An extra stratum `region` is the column `stratum_region`. */
export const STRATUM_COLUMN_PREFIX = 'stratum_';

/** `exposure_prevalence` is optional: a stratum's own prevalence of the exposure (issue 11 item 3). */
export type BaseColumn = 'sex' | 'age_from' | 'age_to' | 'risk' | 'rate' | 'person_years' | 'exposure_prevalence';
export const BASE_COLUMNS: readonly BaseColumn[] = ['sex', 'age_from', 'age_to', 'risk', 'rate', 'person_years', 'exposure_prevalence'];
/** The stratum field each base column fills. */
export const COLUMN_FIELD = {
  sex: 'sex',
  age_from: 'ageFrom',
  age_to: 'ageTo',
  risk: 'risk',
  rate: 'rate',
  person_years: 'perPersonYears',
  exposure_prevalence: 'exposurePrevalence',
} as const;
export type NumericColumn = Exclude<BaseColumn, 'sex'>;
/** The column that holds each stratum field (the reverse of {@link COLUMN_FIELD}). */
export const FIELD_COLUMN: Readonly<Record<string, BaseColumn>> = {
  sex: 'sex',
  ageFrom: 'age_from',
  ageTo: 'age_to',
  risk: 'risk',
  rate: 'rate',
  perPersonYears: 'person_years',
  exposurePrevalence: 'exposure_prevalence',
};
/** The table field each detail key fills. */
export const DETAIL_FIELD = {
  id: 'id',
  title: 'title',
  outcome: 'outcome',
  horizon_years: 'horizonYears',
  population: 'population',
  source: 'source',
  year: 'year',
  illustrative: 'illustrative',
  exposure_prevalence: 'exposurePrevalence',
} as const satisfies Record<DetailKey, keyof PopulationTable>;

/** Bytes of `text` encoded as UTF-8, without allocating the encoding. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

/** A header name or detail key as the reader compares it: trimmed, lower case, spaces and "-" as "_". */
export function normaliseName(name: string): string {
  return name.trim().toLowerCase().replace(/[\s-]+/g, '_');
}

/** The file's lines up to and including the first that is neither blank nor a detail (the header), with 1-based numbers. */
export function leadingLines(text: string): { line: number; text: string; end: number }[] {
  const out: { line: number; text: string; end: number }[] = [];
  const re = /\r\n|\n|\r/g;
  let start = 0;
  let line = 1;
  for (;;) {
    const m = re.exec(text);
    const end = m ? m.index : text.length;
    const next = m ? m.index + m[0].length : text.length;
    const content = text.slice(start, end);
    out.push({ line, text: content, end: next });
    // Stop at the first line that is neither blank nor a detail line: the header.
    if (!isBlankLine(content) && !isDetailLine(content)) break;
    if (!m) break;
    start = next;
    line++;
  }
  return out;
}

/** Blank, or only empty cells as a spreadsheet writes them (",,,", ";;;"). */
export function isBlankLine(line: string): boolean {
  return /^[\s,;"]*$/.test(line);
}

/** A `# key: value` line (a spreadsheet may have quoted it). */
export function isDetailLine(line: string): boolean {
  return /^\s*"?#/.test(line);
}

/** The delimiter the header uses most: comma, semicolon or tab (comma when none). */
export function guessDelimiter(header: string): string {
  const counts = [',', ';', '\t'].map((d) => [d, header.split(d).length - 1] as const);
  counts.sort((a, b) => b[1] - a[1]);
  const best = counts[0];
  return best && best[1] > 0 ? best[0] : ',';
}

/** One line's cells, and whether its quotation marks are broken (unclosed, or a stray one after a closing mark): then the cells are papaparse's guess, not the line. */
export function splitLineChecked(line: string, delimiter: string): { cells: string[]; brokenQuotes: boolean } {
  const parsed = Papa.parse<string[]>(line, { delimiter, header: false });
  return { cells: parsed.data[0] ?? [], brokenQuotes: parsed.errors.some((e) => e.type === 'Quotes') };
}

/**
 * Cuts `body` into blocks of about `size` characters, each ending at a line break outside
 * quotes (an even count of quotation marks so far), so no row is split between blocks.
 */
export function* blocksOf(body: string, size: number): Generator<{ text: string; firstLine: number; end: number }> {
  let start = 0;
  let line = 0;
  const step = Math.max(1, Math.floor(size));
  while (start < body.length) {
    let end = Math.min(body.length, start + step);
    let quotes = countChar(body, '"', start, end);
    while (end < body.length && (quotes % 2 === 1 || body.charCodeAt(end - 1) !== 10)) {
      const nl = body.indexOf('\n', end);
      const next = nl < 0 ? body.length : nl + 1;
      quotes += countChar(body, '"', end, next);
      end = next;
    }
    const text = body.slice(start, end);
    yield { text, firstLine: line, end };
    line += countChar(text, '\n', 0, text.length);
    start = end;
  }
}

function countChar(text: string, char: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf(char, from); i >= 0 && i < to; i = text.indexOf(char, i + 1)) n++;
  return n;
}
