/**
 * Reading a workbook (.xlsx): the first sheet or a named one, as rows of typed cells for
 * ./reader.ts `readCheckupTable`.
 *
 * The workbook is read by `read-excel-file` (its `universal` entry: an ArrayBuffer or a Blob in,
 * in Node, a browser page or a Web Worker alike; unzipping by fflate, XML by saxen — no
 * hand-written zip or XML reader here). The library is imported only when this function runs
 * (`await import(…)`), so a bundler splits it off and the screen loads it only when an .xlsx
 * is opened; the command line bundles it in.
 *
 * Nothing throws for a bad file: a file that is not a workbook, or a sheet that does not exist,
 * is a refusal with one clear message.
 */
import type { CellValue } from './types';
import type { ReadRefusal } from './reader';

export interface XlsxSheet {
  readonly sheet: string;
  readonly sheets: readonly string[];
  readonly rows: readonly (readonly CellValue[])[];
}

/** Largest workbook accepted, in bytes (the screen refuses files over 100 MB before reading them). */
export const MAX_XLSX_BYTES = 100 * 1024 * 1024;

function refusal(message: string): ReadRefusal {
  return { refused: true, code: 'unreadable', message, problems: [] };
}

function sizeOf(data: ArrayBuffer | Blob): number {
  return data instanceof ArrayBuffer ? data.byteLength : data.size;
}

/**
 * Reads one sheet of a workbook.
 *
 * @param data - the file's bytes (an ArrayBuffer; in a page, a File or Blob)
 * @param sheet - the sheet's name; default: the first sheet
 * @example
 * await readXlsxSheet(await readFile('checkups.xlsx').then((b) => b.buffer))
 * //=> { sheet: 'Checkups', sheets: ['Checkups'], rows: [['Worker', 'Date', 'HbA1c (%)', …], ['W001', Date(2021-03-02), 5.4, …], …] }
 */
export async function readXlsxSheet(data: ArrayBuffer | Blob, sheet?: string): Promise<XlsxSheet | ReadRefusal> {
  if (sizeOf(data) > MAX_XLSX_BYTES) return refusal(`The workbook is larger than ${MAX_XLSX_BYTES / 1024 / 1024} MB, the most accepted`);
  let sheets: { sheet: string; data: unknown[][] }[];
  try {
    const { default: readXlsxFile } = await import('read-excel-file/universal');
    sheets = (await readXlsxFile(data)) as unknown as { sheet: string; data: unknown[][] }[];
  } catch {
    return refusal('The file cannot be read as an Excel workbook (.xlsx); save it again as .xlsx, or export it as CSV');
  }
  const names = sheets.map((s) => s.sheet);
  const chosen = sheet === undefined ? sheets[0] : sheets.find((s) => s.sheet === sheet) ?? sheets.find((s) => s.sheet.toLowerCase() === sheet.toLowerCase());
  if (!chosen) {
    return refusal(sheet === undefined ? 'The workbook has no sheets' : `The workbook has no sheet "${sheet}"; its sheets are ${names.map((n) => `"${n}"`).join(', ')}`);
  }
  const rows = chosen.data.map((row) =>
    row.map((cell): CellValue => (cell === null || cell === undefined ? null : typeof cell === 'string' || typeof cell === 'number' || typeof cell === 'boolean' || cell instanceof Date ? cell : String(cell))),
  );
  return { sheet: chosen.sheet, sheets: names, rows };
}
