/**
 * What the browser library stores, record by record, with a version on every record and a
 * migration path: a record written by an older program is brought up to date when read; one
 * written by a newer program, or damaged, is reported and left untouched, never guessed at.
 */
import { z } from '../zod';
import { fail, ok, type Issue, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { populationTableSchema, tableForm, type PopulationTable, type TableForm } from '../tables/schema';
import { evidenceEntrySchema, type EvidenceEntry } from '../evidence/schema';
import { handoutTemplateSchema, type HandoutTemplate } from '../handout/template';

/**
 * The record format this program writes. Format 2 added `revision` (see ./policy.ts); a
 * format 1 record reads as revision 1.
 */
export const RECORD_VERSION = 2;

/** A record's revision: 1 when first saved, one more on every save (./policy.ts). */
const revisionSchema = z.number().int().positive();

const isoTime = z.iso.datetime({ error: 'A saved time must be an ISO 8601 date and time (UTC)' });

export const storedTableSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  table: populationTableSchema,
  revision: revisionSchema,
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
  revision: revisionSchema,
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type TableSummary = z.infer<typeof tableSummarySchema>;

export const storedEvidenceSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  entry: evidenceEntrySchema,
  revision: revisionSchema,
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type StoredEvidence = z.infer<typeof storedEvidenceSchema>;

/**
 * A saved handout template (lib/handout/template.ts) under its own id. Templates were kept in
 * localStorage before this store existed; app/handout/templateStore.ts moves them here once.
 */
export const storedTemplateSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  id: z.string().min(1),
  template: handoutTemplateSchema,
  revision: revisionSchema,
  savedAt: isoTime,
  updatedAt: isoTime,
});
export type StoredTemplate = z.infer<typeof storedTemplateSchema>;

/** Upgrades a record from `from` to `from + 1`. */
export type RecordMigration = (record: Record<string, unknown>) => Record<string, unknown>;

/** Format 1 → 2: records gained a revision; what was saved before is revision 1. */
const addRevision: RecordMigration = (record) => ({ ...record, revision: 1 });

/**
 * Record migrations by the version they start from. The next format adds `2: (v2) => v3`
 * here and bumps {@link RECORD_VERSION}.
 */
export const TABLE_MIGRATIONS: Readonly<Record<number, RecordMigration>> = { 1: addRevision };
export const EVIDENCE_MIGRATIONS: Readonly<Record<number, RecordMigration>> = { 1: addRevision };
/** Templates were first stored at format 2, so there is nothing to migrate yet. */
export const TEMPLATE_MIGRATIONS: Readonly<Record<number, RecordMigration>> = {};
export const SUMMARY_MIGRATIONS: Readonly<Record<number, RecordMigration>> = { 1: addRevision };

/** What is left of a deleted record (./policy.ts): its store, id and last revision. */
export const tombstoneSchema = z.strictObject({
  /** `<store>/<id>`, the key. */
  key: z.string(),
  store: z.string(),
  id: z.string(),
  revision: revisionSchema,
  deletedAt: isoTime,
});
export type StoredTombstone = z.infer<typeof tombstoneSchema>;

/** The key of a record's tombstone. */
export function tombstoneKey(store: string, id: string): string {
  return `${store}/${id}`;
}

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

/** Read a table summary (summaries are rebuilt from the table, so they are only checked and given a revision). */
export function readTableSummary(raw: unknown): Result<TableSummary> {
  return readRecord(raw, SUMMARY_MIGRATIONS, tableSummarySchema, 'table summary');
}

/** Read a stored evidence entry, migrating it when older. */
export function readStoredEvidence(raw: unknown, migrations = EVIDENCE_MIGRATIONS): Result<StoredEvidence> {
  return readRecord(raw, migrations, storedEvidenceSchema, 'evidence entry');
}

/** Read a stored handout template. */
export function readStoredTemplate(raw: unknown, migrations = TEMPLATE_MIGRATIONS): Result<StoredTemplate> {
  return readRecord(raw, migrations, storedTemplateSchema, 'handout template');
}

/**
 * A new or updated table record; `savedAt` stays from the previous record when there is one.
 * The revision is the one ./policy.ts decided, or one above the previous record's.
 */
export function toStoredTable(table: PopulationTable, now: Date, previous?: Pick<StoredTable, 'savedAt'> & Partial<Pick<StoredTable, 'revision'>>, revision?: number): StoredTable {
  const time = now.toISOString();
  return { recordVersion: RECORD_VERSION, table, revision: revision ?? (previous?.revision ?? 0) + 1, savedAt: previous?.savedAt ?? time, updatedAt: time };
}

export function toStoredEvidence(entry: EvidenceEntry, now: Date, previous?: Pick<StoredEvidence, 'savedAt'> & Partial<Pick<StoredEvidence, 'revision'>>, revision?: number): StoredEvidence {
  const time = now.toISOString();
  return { recordVersion: RECORD_VERSION, entry, revision: revision ?? (previous?.revision ?? 0) + 1, savedAt: previous?.savedAt ?? time, updatedAt: time };
}

export function toStoredTemplate(
  record: { readonly id: string; readonly template: HandoutTemplate },
  now: Date,
  previous?: Pick<StoredTemplate, 'savedAt'> & Partial<Pick<StoredTemplate, 'revision'>>,
  revision?: number,
): StoredTemplate {
  const time = now.toISOString();
  return { recordVersion: RECORD_VERSION, id: record.id, template: record.template, revision: revision ?? (previous?.revision ?? 0) + 1, savedAt: previous?.savedAt ?? time, updatedAt: time };
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
    revision: stored.revision,
    savedAt: stored.savedAt,
    updatedAt: stored.updatedAt,
  };
}
