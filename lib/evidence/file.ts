/**
 * The evidence library as a JSON file, for moving a clinic's entries between browsers and
 * keeping a copy:
 *
 *     { "format": "hundredfold-evidence", "version": 2, "entries": [ {…}, … ] }
 *
 * Versions:
 * - 1: entries whose exposure definition is `{category, criteria, minYears}`;
 * - 2: exposure definitions may also say which test decides, the longest gap and the comparison
 *   group's definition (lib/glycaemia/exposure.ts).
 * Both versions are read (leniently: a version-1 file that carries version-2 fields is read too).
 * A file is written with the lowest version that holds its entries, so a library that uses no
 * version-2 field still opens in a program that reads only version 1.
 *
 * Reading validates every entry and refuses the whole file on any problem, naming the entry
 * and the field; nothing is half-imported.
 */
import { z } from '../zod';
import { capProblems } from '../files/problems';
import { fail, ok, type Issue, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { evidenceEntrySchema, type EvidenceEntry } from './schema';

export const EVIDENCE_FILE_FORMAT = 'hundredfold-evidence';
/** The newest file version this program writes and reads. A newer file is refused with a plain reason. */
export const EVIDENCE_FILE_VERSION = 2;
/** Every version this program reads. */
export const EVIDENCE_FILE_VERSIONS = [1, 2] as const;
export type EvidenceFileVersion = (typeof EVIDENCE_FILE_VERSIONS)[number];
/** Most entries in one file: far above any clinic's library (common practice: bound every import). */
export const MAX_EVIDENCE_ENTRIES = 10_000;
/** Largest file accepted, in characters (about 20 MB of text at the entry limit would be absurd; 5 MB is ample). */
export const MAX_EVIDENCE_FILE_CHARS = 5 * 1024 * 1024;

export interface EvidenceFile {
  readonly format: typeof EVIDENCE_FILE_FORMAT;
  readonly version: EvidenceFileVersion;
  readonly entries: readonly EvidenceEntry[];
}

/** True when an entry uses a field that version 1 files do not have. */
export function needsVersion2(entry: EvidenceEntry): boolean {
  const d = entry.exposureDefinition;
  return d !== undefined && (d.test !== undefined || d.maxGapMonths !== undefined || d.comparison !== undefined);
}

/** The lowest file version that holds these entries. */
export function evidenceFileVersionFor(entries: readonly EvidenceEntry[]): EvidenceFileVersion {
  return entries.some(needsVersion2) ? 2 : 1;
}

/** Write entries as an evidence file (two-space indented JSON, one trailing newline), with the lowest version that holds them. */
export function exportEvidenceJson(entries: readonly EvidenceEntry[]): string {
  const file: EvidenceFile = { format: EVIDENCE_FILE_FORMAT, version: evidenceFileVersionFor(entries), entries };
  return `${JSON.stringify(file, null, 2)}\n`;
}

function describeEntry(index: number, raw: unknown): string {
  const title = typeof raw === 'object' && raw !== null && typeof (raw as { title?: unknown }).title === 'string' ? (raw as { title: string }).title : '';
  const short = title.length > 60 ? `${title.slice(0, 57)}…` : title;
  return short ? `Entry ${index + 1} ("${short}")` : `Entry ${index + 1}`;
}

function fieldName(path: readonly (string | number)[]): string {
  return path.length === 0 ? '' : `, ${path.map((p, i) => (typeof p === 'number' ? `[${p}]` : i === 0 ? p : `.${p}`)).join('')}`;
}

/**
 * Validate a parsed evidence file. Issues carry the path `["entries", i, …field]` and a
 * message starting "Entry 3 ("title"), effect.lower: …".
 */
export function parseEvidenceFile(input: unknown): Result<EvidenceEntry[]> {
  if (typeof input !== 'object' || input === null || Array.isArray(input)) {
    return fail([{ code: 'wrong-type', path: [], message: `This is not a Hundredfold evidence file: expected an object with "format": "${EVIDENCE_FILE_FORMAT}"` }]);
  }
  const file = input as Record<string, unknown>;
  if (file.format !== EVIDENCE_FILE_FORMAT) {
    return fail([{ code: 'wrong-format', path: ['format'], message: `This is not a Hundredfold evidence file: "format" must be "${EVIDENCE_FILE_FORMAT}"` }]);
  }
  if (typeof file.version !== 'number' || !Number.isInteger(file.version) || file.version < 1) {
    return fail([{ code: 'wrong-version', path: ['version'], message: `The file's "version" must be a whole number; this program reads versions ${EVIDENCE_FILE_VERSIONS.join(' and ')}` }]);
  }
  if (file.version > EVIDENCE_FILE_VERSION) {
    return fail([
      {
        code: 'newer-version',
        path: ['version'],
        message: `The file is version ${file.version}, written by a newer Hundredfold; this one reads versions ${EVIDENCE_FILE_VERSIONS.join(' and ')}. Update the program to import it`,
      },
    ]);
  }
  const issues: Issue[] = [];
  for (const key of Object.keys(file)) {
    if (key !== 'format' && key !== 'version' && key !== 'entries') {
      issues.push({ code: 'unknown-field', path: [key], message: `"${key}" is not a field of an evidence file; the fields are format, version and entries` });
    }
  }
  if (!Array.isArray(file.entries)) {
    issues.push({ code: file.entries === undefined ? 'required' : 'wrong-type', path: ['entries'], message: 'The file needs "entries": a list of evidence entries' });
    return fail(issues);
  }
  if (file.entries.length > MAX_EVIDENCE_ENTRIES) {
    issues.push({ code: 'out-of-range', path: ['entries'], message: `The file holds ${file.entries.length} entries; at most ${MAX_EVIDENCE_ENTRIES.toLocaleString('en-GB')} are accepted` });
    return fail(issues);
  }
  const entries: EvidenceEntry[] = [];
  const firstIndexOf = new Map<string, number>();
  file.entries.forEach((raw, index) => {
    const parsed = evidenceEntrySchema.safeParse(raw, { reportInput: true });
    if (!parsed.success) {
      for (const issue of toIssues(parsed.error.issues)) {
        issues.push({ code: issue.code, path: ['entries', index, ...issue.path], message: `${describeEntry(index, raw)}${fieldName(issue.path)}: ${issue.message}` });
      }
      return;
    }
    const earlier = firstIndexOf.get(parsed.data.id);
    if (earlier !== undefined) {
      issues.push({
        code: 'duplicate-id',
        path: ['entries', index, 'id'],
        message: `${describeEntry(index, raw)}, id: the id "${parsed.data.id}" is also used by entry ${earlier + 1}; each entry needs its own id`,
      });
      return;
    }
    firstIndexOf.set(parsed.data.id, index);
    entries.push(parsed.data);
  });
  // Listed as the table import lists them: at most 1,000, then how many more (lib/files/problems.ts).
  return issues.length > 0 ? fail(capProblems(issues)) : ok(entries);
}

/** Parse JSON text, then validate it as an evidence file. Malformed JSON is an issue, never a throw. */
export function parseEvidenceJson(text: string): Result<EvidenceEntry[]> {
  if (text.length > MAX_EVIDENCE_FILE_CHARS) {
    return fail([{ code: 'file-too-large', path: [], message: `The file is larger than ${MAX_EVIDENCE_FILE_CHARS / 1024 / 1024} MB, the most accepted for an evidence file` }]);
  }
  if (text.trim() === '') return fail([{ code: 'empty-file', path: [], message: 'The file is empty' }]);
  let value: unknown;
  try {
    value = JSON.parse(text.startsWith('\uFEFF') ? text.slice(1) : text);
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'unreadable';
    return fail([{ code: 'invalid-json', path: [], message: `The file is not valid JSON (${detail})` }]);
  }
  return parseEvidenceFile(value);
}

/** The file schema, for documentation and tools; {@link parseEvidenceFile} gives the better messages. */
export const evidenceFileSchema = z.strictObject({
  format: z.literal(EVIDENCE_FILE_FORMAT),
  version: z.union(EVIDENCE_FILE_VERSIONS.map((v) => z.literal(v))),
  entries: z.array(evidenceEntrySchema).max(MAX_EVIDENCE_ENTRIES),
});
