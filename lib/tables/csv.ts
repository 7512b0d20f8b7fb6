/**
 * Population tables as CSV files a clinic can fill in a spreadsheet, and back
 * (docs/table-format.md). The work is split by job:
 * - csvFormat.ts: limits, detail keys, columns, lines and blocks;
 * - csvCells.ts: reading one cell;
 * - csvProblems.ts: problems with their row and column, and the cap on how many are listed;
 * - csvReader.ts: `parseTableCsv` and `parseTableCsvInChunks` (the same steps, paused);
 * - csvWriter.ts: `exportTableCsv`;
 * - bands.ts: the age-band tiling both the reader and the schema check.
 * This module gathers their public parts for existing importers.
 */
export {
  blocksOf,
  DEFAULT_CHUNK_CHARS,
  DETAIL_KEYS,
  MAX_TABLE_FILE_BYTES,
  MAX_TABLE_ROWS,
  PREVIEW_ROWS,
  STRATUM_COLUMN_PREFIX,
  utf8Length,
  type DetailKey,
} from './csvFormat';
export { MAX_REPORTED_PROBLEMS, type TableFileIssue } from './csvProblems';
export { parseTableCsv, parseTableCsvInChunks, type ChunkedOptions, type TableCsvPreview, type TableCsvProgress, type TableCsvResult } from './csvReader';
export { exportTableCsv } from './csvWriter';
export { idFromTitle } from './ids';
