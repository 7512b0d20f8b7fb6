/**
 * How the library screen reads a table file: in blocks of this many characters, pausing
 * between blocks so the page can respond. At about 50 bytes a row, 16 k characters is about
 * 650 rows a block; bench/table-import.bench.ts measures the longest stretch without a pause
 * against the 50 ms long-task threshold.
 */
export const LIBRARY_IMPORT_CHUNK_CHARS = 16 * 1024;
