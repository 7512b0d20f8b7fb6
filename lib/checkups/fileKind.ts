/**
 * Which kind of checkup file the physician opened, before the whole file is read: CSV/TSV text,
 * an .xlsx workbook, FHIR bulk NDJSON, or one clear sentence refusing anything else (a PDF, an
 * image, a zip that is not a workbook, a file over 100 MB). The bytes are sniffed by lib/files
 * `sniffBytes` (its signatures and their sources are there); this module only picks the reader
 * and words the sentence for the checkups screen.
 */
import { sniffBytes, SNIFF_BYTES } from '../files/kind';

/** Largest file read (issue 10: "a file over 100 MB is refused before it is read"). */
export const MAX_CHECKUP_FILE_BYTES = 100 * 1024 * 1024;

/** Bytes the screen reads from the start of the file for {@link checkupFileKind}. */
export const CHECKUP_SNIFF_BYTES = SNIFF_BYTES;

export type CheckupFileKind =
  | { readonly kind: 'delimited' }
  | { readonly kind: 'xlsx' }
  | { readonly kind: 'fhir-ndjson' }
  | { readonly kind: 'refused'; readonly code: 'too-large' | 'pdf' | 'image' | 'zip' | 'binary' | 'empty'; readonly message: string };

const ALLOWED = 'open a CSV or TSV file, an Excel workbook (.xlsx) or a FHIR bulk export (.ndjson)';

/**
 * @param name the file's name (only its ending is used)
 * @param size its size in bytes
 * @param head its first {@link CHECKUP_SNIFF_BYTES} bytes
 * @example
 * checkupFileKind('checkups.csv', 1200, new TextEncoder().encode('%PDF-1.7'))
 * //=> { kind: 'refused', code: 'pdf', message: 'This file is a PDF document, not a table of checkups: open a CSV or TSV file, …' }
 */
export function checkupFileKind(name: string, size: number, head: Uint8Array): CheckupFileKind {
  if (size > MAX_CHECKUP_FILE_BYTES) {
    return { kind: 'refused', code: 'too-large', message: `This file is ${Math.ceil(size / (1024 * 1024))} MB; files up to 100 MB can be opened: split the export by year or site` };
  }
  const lower = name.toLowerCase();
  const sniffed = size === 0 ? 'empty' : sniffBytes(head);
  switch (sniffed) {
    case 'empty':
      return { kind: 'refused', code: 'empty', message: `This file is empty: ${ALLOWED}` };
    case 'pdf':
      return { kind: 'refused', code: 'pdf', message: `This file is a PDF document, not a table of checkups: ${ALLOWED}` };
    case 'png':
    case 'jpeg':
    case 'gif':
      return { kind: 'refused', code: 'image', message: `This file is an image, not a table of checkups: ${ALLOWED}` };
    case 'xlsx':
      return { kind: 'xlsx' };
    case 'zip':
      // A workbook whose `xl/` parts lie beyond the first bytes: the workbook reader refuses it if it is not one.
      if (lower.endsWith('.xlsx')) return { kind: 'xlsx' };
      return { kind: 'refused', code: 'zip', message: `This file is a zip archive that is not an Excel workbook (.xlsx): ${ALLOWED}` };
    case 'utf16':
    case 'binary':
      return { kind: 'refused', code: 'binary', message: `This file is not UTF-8 text: save it as CSV (UTF-8), or ${ALLOWED}` };
    case 'text':
      break;
  }
  if (lower.endsWith('.ndjson') || lower.endsWith('.jsonl')) return { kind: 'fhir-ndjson' };
  const text = new TextDecoder().decode(head.subarray(0, 1024)).replace(/^\uFEFF/, '').trimStart();
  if (text.startsWith('{') && text.includes('"resourceType"')) return { kind: 'fhir-ndjson' };
  return { kind: 'delimited' };
}
