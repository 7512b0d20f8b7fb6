/**
 * What kind of file the user gave, from its first bytes ("magic numbers"), so an import that
 * expects text (a CSV or JSON file) can answer a workbook, a PDF or a picture with one sentence
 * instead of a list of garbled problems.
 *
 * Signatures (from the formats' own specifications, from memory): zip local file header
 * `50 4B 03 04` ("PK\3\4"; an .xlsx workbook is a zip holding `xl/…` parts, ECMA-376 Part 2);
 * PDF `%PDF-` (ISO 32000); PNG `89 50 4E 47 0D 0A 1A 0A` (PNG specification §5.2); JPEG
 * `FF D8 FF` (JFIF/Exif start of image); GIF `GIF87a` / `GIF89a`; UTF-16 byte-order marks
 * `FF FE` (little-endian) and `FE FF` (big-endian) (Unicode Standard §23.8); text never holds
 * NUL bytes, so a NUL early in the file means binary data (or UTF-16 without a mark, when every
 * other byte is NUL).
 *
 * Two entry points: {@link sniffBytes} for the raw bytes (a page reads the file's first
 * {@link SNIFF_BYTES} bytes), and {@link sniffText} for a file already decoded as UTF-8 (the
 * command line and the CSV reader), where the same signatures show through the decoding.
 */

export type FileKind = 'text' | 'empty' | 'xlsx' | 'zip' | 'pdf' | 'png' | 'jpeg' | 'gif' | 'utf16' | 'binary';

/** Bytes to read for {@link sniffBytes}: enough to see a workbook's `xl/` part names. */
export const SNIFF_BYTES = 4096;

function startsWithBytes(bytes: Uint8Array, prefix: readonly number[]): boolean {
  return prefix.length <= bytes.length && prefix.every((b, i) => bytes[i] === b);
}

function containsAscii(bytes: Uint8Array, text: string): boolean {
  outer: for (let i = 0; i + text.length <= bytes.length; i++) {
    for (let j = 0; j < text.length; j++) if (bytes[i + j] !== text.charCodeAt(j)) continue outer;
    return true;
  }
  return false;
}

/** Share of NULs at odd or even positions: UTF-16 text without a mark has one in every pair. */
function looksUtf16(nulAt: (i: number) => boolean, length: number): boolean {
  const n = Math.min(length, 512);
  if (n < 4) return false;
  let even = 0;
  let odd = 0;
  for (let i = 0; i < n; i++) if (nulAt(i)) (i % 2 === 0 ? even++ : odd++);
  const pairs = Math.floor(n / 2);
  return Math.max(even, odd) >= pairs * 0.75 && Math.min(even, odd) <= pairs * 0.1;
}

/**
 * The kind of a file from its first bytes.
 *
 * @example
 * sniffBytes(new TextEncoder().encode('sex,age_from\n')) //=> 'text'
 * sniffBytes(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d])) //=> 'pdf'
 */
export function sniffBytes(bytes: Uint8Array): FileKind {
  if (bytes.length === 0) return 'empty';
  if (startsWithBytes(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWithBytes(bytes, [0x50, 0x4b, 0x05, 0x06])) return containsAscii(bytes, 'xl/') ? 'xlsx' : 'zip';
  if (startsWithBytes(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return 'pdf';
  if (startsWithBytes(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'png';
  if (startsWithBytes(bytes, [0xff, 0xd8, 0xff])) return 'jpeg';
  if (containsAscii(bytes.subarray(0, 6), 'GIF87a') || containsAscii(bytes.subarray(0, 6), 'GIF89a')) return 'gif';
  if (startsWithBytes(bytes, [0xff, 0xfe]) || startsWithBytes(bytes, [0xfe, 0xff])) return 'utf16';
  if (looksUtf16((i) => bytes[i] === 0, bytes.length)) return 'utf16';
  if (bytes.subarray(0, SNIFF_BYTES).includes(0)) return 'binary';
  return 'text';
}

/**
 * The kind of a file that was decoded as UTF-8 text (bytes that are not UTF-8 become U+FFFD).
 *
 * @example
 * sniffText('PK\u0003\u0004…xl/workbook.xml…') //=> 'xlsx'
 * sniffText('\uFFFD\uFFFDs\u0000e\u0000x\u0000') //=> 'utf16'
 */
export function sniffText(text: string): FileKind {
  const head = text.slice(0, SNIFF_BYTES);
  if (head.length === 0) return 'empty';
  if (head.startsWith('PK\u0003\u0004') || head.startsWith('PK\u0005\u0006')) return head.includes('xl/') ? 'xlsx' : 'zip';
  if (head.startsWith('%PDF-')) return 'pdf';
  if (head.startsWith('\uFFFDPNG\r\n\u001a\n')) return 'png';
  // FF FE / FE FF are not UTF-8: each became U+FFFD; the text then has a NUL in every pair.
  if (looksUtf16((i) => head.charCodeAt(i) === 0, head.length)) return 'utf16';
  if (head.startsWith('\uFFFD\uFFFD\uFFFD')) return 'jpeg';
  if (head.startsWith('GIF87a') || head.startsWith('GIF89a')) return 'gif';
  if (head.startsWith('\uFFFD\uFFFD') && head.includes('\u0000')) return 'utf16';
  if (head.includes('\u0000')) return 'binary';
  return 'text';
}

const WHAT: Record<Exclude<FileKind, 'text' | 'empty'>, string> = {
  xlsx: 'This is a spreadsheet workbook (.xlsx), not a CSV file',
  zip: 'This is a zip archive (or an office document), not a CSV file',
  pdf: 'This is a PDF document, not a CSV file',
  png: 'This is a PNG picture, not a CSV file',
  jpeg: 'This is a JPEG picture, not a CSV file',
  gif: 'This is a GIF picture, not a CSV file',
  utf16: 'This file is saved as UTF-16 ("Unicode text"), which this import does not read',
  binary: 'This file holds binary data, not text',
};

const FIX: Record<Exclude<FileKind, 'text' | 'empty'>, string> = {
  xlsx: 'open it in the spreadsheet program and save it as CSV (UTF-8), then choose the CSV file',
  zip: 'choose the CSV file itself (unpack the archive first, or save the document as CSV UTF-8)',
  pdf: 'choose the CSV file the figures came from, or type them into a spreadsheet and save it as CSV (UTF-8)',
  png: 'choose the CSV file the figures came from, or type them into a spreadsheet and save it as CSV (UTF-8)',
  jpeg: 'choose the CSV file the figures came from, or type them into a spreadsheet and save it as CSV (UTF-8)',
  gif: 'choose the CSV file the figures came from, or type them into a spreadsheet and save it as CSV (UTF-8)',
  utf16: 'save it again as "CSV UTF-8" (in a spreadsheet: Save as, then CSV UTF-8) and choose it again',
  binary: 'choose a CSV file saved as text (UTF-8)',
};

/** The one code for each kind a text import refuses. */
export function fileKindCode(kind: FileKind): 'wrong-encoding' | 'not-a-text-file' | undefined {
  if (kind === 'text' || kind === 'empty') return undefined;
  return kind === 'utf16' ? 'wrong-encoding' : 'not-a-text-file';
}

/**
 * The one sentence a text import shows for a file of this kind, or undefined when it is text
 * (or empty, which the import explains itself). `expected` names the text format asked for.
 *
 * @example
 * fileKindSentence('xlsx') //=> 'This is a spreadsheet workbook (.xlsx), not a CSV file; open it in the spreadsheet program and save it as CSV (UTF-8), then choose the CSV file'
 */
export function fileKindSentence(kind: FileKind, expected = 'a CSV file'): string | undefined {
  if (kind === 'text' || kind === 'empty') return undefined;
  return `${WHAT[kind].replace('a CSV file', expected)}; ${FIX[kind].replace(/the CSV file/g, expected.replace(/^an? /, 'the '))}`;
}
