/**
 * A saved checkups session: what the physician chose to keep, under a name of their own, in this
 * browser's storage (app/storage/sessions.ts) — the set-up (the evidence entry and population
 * table as they were, the criteria set, the horizon), the column mapping they confirmed, and the
 * checkup rows the engine read (lib/workforce `CheckupRow`: pseudonymous worker id, date,
 * readings, age or birth year, sex, groups), with the row problems and counts of that reading.
 *
 * Never the file itself: no column the engine left out (names, national identifiers) and no
 * sample of the file's cells is kept; a row holds only `CheckupRow`'s own fields (the schema is
 * strict). Reopening a session runs the same engine on the same rows, so the figures are the
 * same as when it was saved.
 *
 * The name is the physician's own label: it is shown in the list of saved sessions and nowhere
 * else (never in a URL, a page title or a file name). The record's id is random.
 *
 * Formats: `sessionVersion` says which shape the session has. One written by a newer program is
 * refused with a message and left in storage as it was (`newer-record`), never guessed at.
 */
import { z } from '../zod';
import { fail, ok, type Issue, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { evidenceEntrySchema, type EvidenceEntry } from '../evidence/schema';
import { populationTableSchema, type PopulationTable } from '../tables/schema';
import { criteriaSchema, fpgReadingSchema, hba1cReadingSchema } from '../glycaemia/schema';
import { GLUCOSE_UNITS } from '../glycaemia/glucose';
import { HBA1C_UNITS } from '../glycaemia/hba1c';
import { CHECKUP_FIELDS, type CheckupRow, type ColumnMapping, type RowCounts, type RowProblem } from '../workforce/types';
import { migrateRecord, RECORD_VERSION } from '../storage/records';

/** The session format this program writes and reads. */
export const SESSION_VERSION = 1;
/** Longest session name, in characters. */
export const MAX_SESSION_NAME = 120;

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'A date must be written YYYY-MM-DD' });
const count = z.number().int().nonnegative();

export const sessionNameSchema = z
  .string({ error: (iss) => (iss.input === undefined ? 'The session needs a name' : 'The session name must be text') })
  .trim()
  .min(1, { error: 'Give the session a name of your own (e.g. "Site visits, spring")' })
  .max(MAX_SESSION_NAME, { error: `The session name must be at most ${MAX_SESSION_NAME} characters` });

const checkupRowSchema = z.strictObject({
  line: z.number().int().positive(),
  worker: z.string().min(1),
  date: isoDate,
  hba1c: hba1cReadingSchema.exactOptional(),
  fpg: fpgReadingSchema.exactOptional(),
  age: z.number().int().min(0).max(130).exactOptional(),
  birthYear: z.number().int().exactOptional(),
  birthDate: isoDate.exactOptional(),
  sex: z.enum(['female', 'male']).exactOptional(),
  strata: z.record(z.string(), z.string()),
}) satisfies z.ZodType<CheckupRow>;

const columnMappingSchema = z.strictObject({
  columns: z.array(
    z.strictObject({
      index: count,
      header: z.string(),
      field: z.enum(CHECKUP_FIELDS).nullable(),
      unit: z.enum([...HBA1C_UNITS, ...GLUCOSE_UNITS]).nullable(),
      stratum: z.string().nullable(),
      identifying: z.boolean(),
    }),
  ),
}) satisfies z.ZodType<ColumnMapping>;

const rowProblemSchema = z.strictObject({
  line: count,
  file: z.string().exactOptional(),
  column: z.string().nullable(),
  code: z.string(),
  message: z.string(),
}) satisfies z.ZodType<RowProblem>;

export const sessionIdSchema = z.string().regex(/^session-[a-z0-9-]{1,64}$/, { error: 'A session id is "session-" followed by letters, digits and "-"' });

export const checkupSessionSchema = z.strictObject({
  sessionVersion: z.literal(SESSION_VERSION),
  id: sessionIdSchema,
  name: sessionNameSchema,
  setup: z.strictObject({
    evidence: evidenceEntrySchema,
    table: populationTableSchema,
    criteria: criteriaSchema,
    horizonYears: z.number().positive().max(100).nullable(),
  }),
  /** The day the rows were read (future dates were refused against it). */
  today: isoDate,
  kind: z.enum(['delimited', 'xlsx', 'fhir-ndjson']),
  /** The mapping the physician confirmed (null for a FHIR export, which has no columns). */
  mapping: columnMappingSchema.nullable(),
  rows: z.array(checkupRowSchema),
  /** The reader's counts (rows read, used, skipped), as when the file was read. */
  rowCounts: z.strictObject({ read: count, used: count, skipped: count }) satisfies z.ZodType<RowCounts>,
  problems: z.array(rowProblemSchema),
});
export type CheckupSession = z.infer<typeof checkupSessionSchema>;

export interface SessionSetup {
  readonly evidence: EvidenceEntry;
  readonly table: PopulationTable;
  readonly criteria: CheckupSession['setup']['criteria'];
  readonly horizonYears: number | null;
}

/** What the list of saved sessions shows, kept beside each session so the list never reads the rows. */
export const sessionSummarySchema = z.strictObject({
  sessionVersion: z.literal(SESSION_VERSION),
  id: sessionIdSchema,
  name: sessionNameSchema,
  workers: count,
  rows: count,
  evidenceTitle: z.string(),
  tableTitle: z.string(),
  criteria: criteriaSchema,
});
export type SessionSummary = z.infer<typeof sessionSummarySchema>;

/** A new random session id ("session-" and 24 hex digits). */
export function newSessionId(random: () => number = Math.random): string {
  let hex = '';
  for (let i = 0; i < 24; i++) hex += Math.floor(random() * 16).toString(16);
  return `session-${hex}`;
}

/** The list line of a session: its name, how many workers and rows, the evidence, table and criteria. */
export function summariseSession(session: CheckupSession): SessionSummary {
  const workers = new Set<string>();
  for (const row of session.rows) workers.add(row.worker);
  return {
    sessionVersion: SESSION_VERSION,
    id: session.id,
    name: session.name,
    workers: workers.size,
    rows: session.rows.length,
    evidenceTitle: session.setup.evidence.title,
    tableTitle: session.setup.table.title,
    criteria: session.setup.criteria,
  };
}

/**
 * Checks the format version before anything else: a session from a newer program is refused
 * (`newer-record`), one with no version is damaged.
 */
function checkVersion(raw: unknown, what: string): Result<Record<string, unknown>> {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return fail([{ code: 'damaged-record', path: [], message: `The saved ${what} is not an object; it may be damaged` }]);
  }
  const record = raw as Record<string, unknown>;
  const version = record.sessionVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return fail([{ code: 'damaged-record', path: ['sessionVersion'], message: `The saved ${what} has no format version; it may be damaged` }]);
  }
  if (version > SESSION_VERSION) {
    const name = typeof record.name === 'string' ? ` “${record.name}”` : '';
    return fail([
      {
        code: 'newer-record',
        path: ['sessionVersion'],
        message: `The saved session${name} was saved by a newer version of Hundredfold (session format ${version}; this one reads ${SESSION_VERSION}): it is kept as it is; update the program to open it`,
      },
    ]);
  }
  return ok(record);
}

function parseWith<T>(schema: z.ZodType<T>, raw: Record<string, unknown>, what: string): Result<T> {
  const parsed = schema.safeParse(raw, { reportInput: true });
  if (parsed.success) return ok(parsed.data);
  const issues: Issue[] = toIssues(parsed.error.issues).map((i) => ({ ...i, code: 'damaged-record', message: `The saved ${what} is damaged: ${i.message}` }));
  return fail(issues);
}

/**
 * Reads a stored session (from storage, or any unknown input).
 *
 * @example
 * readSession({ ...session, sessionVersion: 2 }) //=> { ok: false, issues: [{ code: 'newer-record', … }] }
 */
export function readSession(raw: unknown): Result<CheckupSession> {
  const checked = checkVersion(raw, 'session');
  return checked.ok ? parseWith(checkupSessionSchema, checked.value, 'session') : checked;
}

/** Reads a stored session's list line. */
export function readSessionSummary(raw: unknown): Result<SessionSummary> {
  const checked = checkVersion(raw, 'session');
  return checked.ok ? parseWith(sessionSummarySchema, checked.value, 'session summary') : checked;
}

/** Checks a name typed for a session. */
export function checkSessionName(name: string): Result<string> {
  const parsed = sessionNameSchema.safeParse(name, { reportInput: true });
  return parsed.success ? ok(parsed.data) : fail(toIssues(parsed.error.issues).map((i) => ({ ...i, path: ['name'] })));
}

/** What is kept and where, in one line (shown beside the save button and the list). */
export const SESSION_STORAGE_LINE =
  'A saved session keeps the set-up, the columns you confirmed and the checkup rows read from the file (pseudonymous ids, dates, results, age, sex, groups; never the file itself or any column left out) in this browser’s storage on this computer; nothing is sent anywhere. Delete it when you are done.';

// ---------------------------------------------------------------------------------------------
// As stored (app/storage/sessions.ts): the session without its rows, with its list line, in one
// store; its rows and row problems in a second store under the same id, written and deleted in
// the same transaction. The list reads only the first.

/** The session without its rows and row problems. */
export type SessionHead = Omit<CheckupSession, 'rows' | 'problems'>;

/** A session's rows and row problems, stored apart under the session's id. */
export interface SessionBody {
  readonly id: string;
  readonly rows: readonly CheckupRow[];
  readonly problems: readonly RowProblem[];
}

export interface StoredSession {
  readonly recordVersion: typeof RECORD_VERSION;
  /** The session's head as saved; checked whole, with the rows, when the session is opened. */
  readonly session: SessionHead;
  readonly summary: SessionSummary;
  readonly revision: number;
  readonly savedAt: string;
  readonly updatedAt: string;
}

const storedEnvelopeSchema = z.strictObject({
  recordVersion: z.literal(RECORD_VERSION),
  session: z.looseObject({ id: sessionIdSchema }),
  summary: z.unknown(),
  revision: z.number().int().positive(),
  savedAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});

/** Splits a session into what is stored in each store. */
export function toStoredSession(session: CheckupSession, now: Date, previous: Pick<StoredSession, 'savedAt'> | undefined, revision: number): { stored: StoredSession; body: SessionBody } {
  const { rows, problems, ...head } = session;
  const time = now.toISOString();
  return {
    stored: { recordVersion: RECORD_VERSION, session: head, summary: summariseSession(session), revision, savedAt: previous?.savedAt ?? time, updatedAt: time },
    body: { id: session.id, rows, problems },
  };
}

/** Reads a stored session's envelope and list line (not its rows); a newer or damaged one is an issue. */
export function readStoredSession(raw: unknown): Result<StoredSession> {
  const migrated = migrateRecord(raw, {});
  if (!migrated.ok) return migrated;
  const summary = readSessionSummary(migrated.value.summary);
  if (!summary.ok) return summary;
  const envelope = parseWith(storedEnvelopeSchema, migrated.value, 'session');
  if (!envelope.ok) return envelope;
  return ok({ ...envelope.value, session: envelope.value.session as unknown as SessionHead, summary: summary.value });
}

/** Joins a stored head and its rows back into a session, checking the whole of it. */
export function joinSession(stored: StoredSession, body: unknown): Result<CheckupSession> {
  if (typeof body !== 'object' || body === null) return fail([{ code: 'damaged-record', path: ['rows'], message: 'The saved session’s checkup rows are missing; it may be damaged' }]);
  const { rows, problems } = body as { rows?: unknown; problems?: unknown };
  return readSession({ ...stored.session, rows, problems });
}
