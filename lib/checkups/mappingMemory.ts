/**
 * Remembering the physician's column corrections for a set of headers: the key is made from the
 * headers only (normalised by lib/workforce `normaliseHeader`, in file order), the value is the
 * field chosen for each column. No cell value is ever part of either.
 */
import { normaliseHeader } from '../workforce/columns';
import { CHECKUP_FIELDS, type CheckupField } from '../workforce/types';

/** localStorage key prefix. */
export const MAPPING_MEMORY_PREFIX = 'hundredfold.checkups.columns.';

/** The storage key for a set of headers. */
export function mappingMemoryKey(headers: readonly string[]): string {
  return MAPPING_MEMORY_PREFIX + JSON.stringify(headers.map(normaliseHeader));
}

/** What is stored: one field (or null: not used) per column. */
export function encodeMappingMemory(fields: readonly (CheckupField | null)[]): string {
  return JSON.stringify(fields);
}

/** The stored fields, or null when the text is not a list of known fields of the right length. */
export function decodeMappingMemory(text: string | null, columns: number): (CheckupField | null)[] | null {
  if (text === null) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    return null;
  }
  if (!Array.isArray(parsed) || parsed.length !== columns) return null;
  const known = new Set<string>(CHECKUP_FIELDS);
  const fields: (CheckupField | null)[] = [];
  for (const v of parsed) {
    if (v === null) fields.push(null);
    else if (typeof v === 'string' && known.has(v)) fields.push(v as CheckupField);
    else return null;
  }
  return fields;
}
