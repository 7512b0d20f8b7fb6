/**
 * What the browser library stores, record by record, with a version on every record and a
 * migration path: a record written by an older program is brought up to date when read; one
 * written by a newer program, or damaged, is reported and left untouched, never guessed at.
 */
import { z } from 'zod';
import { fail, ok, type Issue, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { populationTableSchema, tableForm, type PopulationTable, type TableForm } from '../tables/schema';
import { evidenceEntrySchema, type EvidenceEntry } from '../evidence/schema';

/** The record format this program writes. */
export const RECORD_VERSION = 1;

const isoTime = z.iso.datetime({ error: 'A saved time must be an ISO 8601 date and time (UTC)' });

export const storedTableSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  table: populationTableSchema,
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type StoredTable = z.infer<typeof storedTableSchema>;

/** What the table list shows, kept beside each table so the list reads no strata. */
export const tableSummarySchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  id: z.string(),
  title: z.string(),
  outcome: z.string(),
  horizonYears: z.number().optional(),
  population: z.string(),
  source: z.string(),
  year: z.number(),
  illustrative: z.boolean(),
  form: z.enum(['risk', 'rate']),
  strataCount: z.number().int().nonnegative(),
  sexes: z.array(z.enum(['female', 'male', 'any'])),
  ageFrom: z.number(),
  ageTo: z.number(),
  extraStrata: z.array(z.string()),
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type TableSummary = z.infer<typeof tableSummarySchema>;

export const storedEvidenceSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  entry: evidenceEntrySchema,
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type StoredEvidence = z.infer<typeof storedEvidenceSchema>;

/** Upgrades a record from `from` to `from + 1`. */
export type RecordMigration = (record: Record<string, unknown>) => Record<string, unknown>;

/**
 * Record migrations by the version they start from. Empty while only version 1 exists; the
 * next format adds `1: (v1) => v2` here and bumps {@link RECORD_VERSION}.
 */
export const TABLE_MIGRATIONS: Readonly<Record<number, RecordMigration>> = {};
export const EVIDENCE_MIGRATIONS: Readonly<Record<number, RecordMigration>> = {};

/**
 * Brings a raw record up to `current` through `migrations`; refuses one that has no version,
 * is newer than this program, or lacks a step.
 */
export function migrateRecord(
  raw: unknown,
  migrations: Readonly<Record<number, RecordMigration>>,
  current: number = RECORD_VERSION,
): Result<Record<string, unknown>> {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return fail([{ code: 'damaged-record', path: [], message: 'The saved record is not an object; it may be damaged' }]);
  }
  let record = raw as Record<string, unknown>;
  const version = record.recordVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return fail([{ code: 'damaged-record', path: ['recordVersion'], message: 'The saved record has no format version; it may be damaged' }]);
  }
  if (version > current) {
    return fail([
      { code: 'newer-record', path: ['recordVersion'], message: `The record was saved by a newer version of Hundredfold (format ${version}; this one reads ${current}); update the program to open it` },
    ]);
  }
  for (let v = version; v < current; v++) {
    const step = migrations[v];
    if (!step) return fail([{ code: 'no-migration', path: ['recordVersion'], message: `No way to bring a format ${v} record up to date` }]);
    record = { ...step(record), recordVersion: v + 1 };
  }
  return ok(record);
}

function readRecord<T>(raw: unknown, migrations: Readonly<Record<number, RecordMigration>>, schema: z.ZodType<T>, what: string): Result<T> {
  const migrated = migrateRecord(raw, migrations);
  if (!migrated.ok) return migrated;
  const parsed = schema.safeParse(migrated.value, { reportInput: true });
  if (parsed.success) return ok(parsed.data);
  const issues: Issue[] = toIssues(parsed.error.issues).map((i) => ({ ...i, code: 'damaged-record', message: `The saved ${what} is damaged: ${i.message}` }));
  return fail(issues);
}

/** Read a stored table, migrating it when older; a damaged one is an issue, never a throw. */
export function readStoredTable(raw: unknown, migrations = TABLE_MIGRATIONS): Result<StoredTable> {
  return readRecord(raw, migrations, storedTableSchema, 'table');
}

/** Read a table summary (summaries are rebuilt from the table, so they are only checked). */
export function readTableSummary(raw: unknown): Result<TableSummary> {
  return readRecord(raw, {}, tableSummarySchema, 'table summary');
}

/** Read a stored evidence entry, migrating it when older. */
export function readStoredEvidence(raw: unknown, migrations = EVIDENCE_MIGRATIONS): Result<StoredEvidence> {
  return readRecord(raw, migrations, storedEvidenceSchema, 'evidence entry');
}

/** A new or updated table record; `savedAt` stays from the previous record when there is one. */
export function toStoredTable(table: PopulationTable, now: Date, previous?: Pick<StoredTable, 'savedAt'>): StoredTable {
  const time = now.toISOString();
  return { recordVersion: RECORD_VERSION, table, savedAt: previous?.savedAt ?? time, updatedAt: time };
}

export function toStoredEvidence(entry: EvidenceEntry, now: Date, previous?: Pick<StoredEvidence, 'savedAt'>): StoredEvidence {
  const time = now.toISOString();
  return { recordVersion: RECORD_VERSION, entry, savedAt: previous?.savedAt ?? time, updatedAt: time };
}

/** The list summary of a stored table. */
export function summariseStoredTable(stored: StoredTable): TableSummary {
  const { table } = stored;
  const form: TableForm = tableForm(table);
  let ageFrom = Infinity;
  let ageTo = -Infinity;
  const sexes = new Set<'female' | 'male' | 'any'>();
  for (const s of table.strata) {
    if (s.ageFrom < ageFrom) ageFrom = s.ageFrom;
    if (s.ageTo > ageTo) ageTo = s.ageTo;
    sexes.add(s.sex);
  }
  return {
    recordVersion: RECORD_VERSION,
    id: table.id,
    title: table.title,
    outcome: table.outcome,
    ...(table.horizonYears === undefined ? {} : { horizonYears: table.horizonYears }),
    population: table.population,
    source: table.source,
    year: table.year,
    illustrative: table.illustrative,
    form,
    strataCount: table.strata.length,
    sexes: [...sexes].sort(),
    ageFrom,
    ageTo,
    extraStrata: Object.keys(table.strata[0]?.extra ?? {}).sort(),
    savedAt: stored.savedAt,
    updatedAt: stored.updatedAt,
  };
}
