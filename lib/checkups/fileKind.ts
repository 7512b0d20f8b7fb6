/**
 * Which kind of checkup file the physician opened, from its name and first bytes, before the
 * whole file is read: CSV/TSV text, an .xlsx workbook, FHIR bulk NDJSON, or one clear sentence
 * refusing anything else (a PDF, an image, a zip that is not a workbook, a file over 100 MB).
 *
 * Magic numbers (common practice; from memory): PDF starts "%PDF", PNG 89 50 4E 47, JPEG FF D8 FF,
 * GIF "GIF8", zip (and so .xlsx) "PK\x03\x04". An .xlsx is a zip whose name ends .xlsx; the
 * workbook reader (lib/workforce readXlsxSheet) refuses a zip that holds no workbook.
 */

/** Largest file read (issue 10: "a file over 100 MB is refused before it is read"). */
export const MAX_CHECKUP_FILE_BYTES = 100 * 1024 * 1024;

export type CheckupFileKind =
  | { readonly kind: 'delimited' }
  | { readonly kind: 'xlsx' }
  | { readonly kind: 'fhir-ndjson' }
  | { readonly kind: 'refused'; readonly code: 'too-large' | 'pdf' | 'image' | 'zip' | 'binary' | 'empty'; readonly message: string };

const ALLOWED = 'open a CSV or TSV file, an Excel workbook (.xlsx) or a FHIR bulk export (.ndjson)';

function startsWith(bytes: Uint8Array, prefix: readonly number[]): boolean {
  return prefix.every((b, i) => bytes[i] === b);
}

/**
 * @param name the file's name (only its ending is used)
 * @param size its size in bytes
 * @param head its first bytes (up to a few hundred)
 * @example
 * checkupFileKind('checkups.csv', 1200, new TextEncoder().encode('%PDF-1.7'))
 * //=> { kind: 'refused', code: 'pdf', message: 'This file is a PDF document, not a table of checkups: open a CSV or TSV file, …' }
 */
export function checkupFileKind(name: string, size: number, head: Uint8Array): CheckupFileKind {
  if (size > MAX_CHECKUP_FILE_BYTES) {
    return { kind: 'refused', code: 'too-large', message: `This file is ${Math.ceil(size / (1024 * 1024))} MB; files up to 100 MB can be opened: split the export by year or site` };
  }
  if (size === 0 || head.length === 0) return { kind: 'refused', code: 'empty', message: `This file is empty: ${ALLOWED}` };
  const lower = name.toLowerCase();
  if (startsWith(head, [0x25, 0x50, 0x44, 0x46])) return { kind: 'refused', code: 'pdf', message: `This file is a PDF document, not a table of checkups: ${ALLOWED}` };
  if (startsWith(head, [0x89, 0x50, 0x4e, 0x47]) || startsWith(head, [0xff, 0xd8, 0xff]) || startsWith(head, [0x47, 0x49, 0x46, 0x38])) {
    return { kind: 'refused', code: 'image', message: `This file is an image, not a table of checkups: ${ALLOWED}` };
  }
  if (startsWith(head, [0x50, 0x4b, 0x03, 0x04])) {
    if (lower.endsWith('.xlsx')) return { kind: 'xlsx' };
    return { kind: 'refused', code: 'zip', message: `This file is a zip archive that is not an Excel workbook (.xlsx): ${ALLOWED}` };
  }
  if (head.some((b) => b === 0)) return { kind: 'refused', code: 'binary', message: `This file is not text: ${ALLOWED}` };
  if (lower.endsWith('.ndjson') || lower.endsWith('.jsonl')) return { kind: 'fhir-ndjson' };
  const text = new TextDecoder().decode(head).replace(/^\uFEFF/, '').trimStart();
  if (text.startsWith('{') && text.includes('"resourceType"')) return { kind: 'fhir-ndjson' };
  return { kind: 'delimited' };
}
