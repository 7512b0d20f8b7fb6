/**
 * The clinic's library in the browser: population tables and evidence entries kept in
 * IndexedDB (through idb), listed, viewed, renamed, deleted, imported and exported.
 *
 * Browser-only. The layout, record formats and migrations are pure and tested in
 * lib/storage/; this file only moves validated records in and out of transactions.
 * Every write is one transaction and is checked completely before it starts, so a refused
 * or failed change leaves the library as it was. Nothing here throws: every operation
 * resolves to a {@link Result}.
 */
import { openDB } from 'idb';
import { fail, ok, type Issue, type Result } from '@/lib/result';
import { DB_NAME, DB_VERSION, STORES, upgradeStepsBetween } from '@/lib/storage/schema';
import {
  readStoredEvidence,
  readStoredTable,
  readStoredTemplate,
  toStoredTemplate,
  type StoredTemplate,
  readTableSummary,
  summariseStoredTable,
  toStoredEvidence,
  toStoredTable,
  type StoredEvidence,
  type StoredTable,
  type TableSummary,
} from '@/lib/storage/records';
import { EVIDENCE_WORDS, TABLE_WORDS, TEMPLATE_WORDS, type ImportPlan, type SaveMode } from '@/lib/storage/policy';
import type { TemplateWrite } from '@/lib/handout/templateRecords';
import { parseTable } from '@/lib/tables/parse';
import { populationTableSchema, type PopulationTable } from '@/lib/tables/schema';
import { DEMO_TABLES } from '@/lib/tables/demo';
import { idFromTitle, uniqueId } from '@/lib/tables/ids';
import { parseTableCsvInChunks, type ChunkedOptions, type TableCsvResult } from '@/lib/tables/csvReader';
import { exportTableCsv } from '@/lib/tables/csvWriter';
import { parseEvidenceEntry } from '@/lib/evidence/parse';
import { evidenceEntrySchema, type EvidenceEntry } from '@/lib/evidence/schema';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { exportEvidenceJson, parseEvidenceJson } from '@/lib/evidence/file';
import { toIssues } from '@/lib/validation/issues';
import { deleteRecord, getRecord, importRecords, listRecords, saveRecord, updateRecord, type Db, type Listing, type RecordSpec } from './recordStore';

export { RESERVED_ID_PREFIX } from '@/lib/storage/policy';
export type { Db, Listing } from './recordStore';

export interface SaveOptions {
  /** Overwrite whatever is saved with the same id (an import with "replace"). Without it (and without `revision`), a taken id is refused. */
  readonly replace?: boolean;
  /**
   * An edit of the record as read at this revision: refused when another tab saved it since
   * (`stale-revision`) or deleted it (`deleted-elsewhere`) — lib/storage/policy.ts.
   */
  readonly revision?: number;
  /** The time to record; defaults to now (tests pass a fixed time). */
  readonly now?: Date;
}

export interface EvidenceImportSummary {
  readonly added: readonly string[];
  readonly replaced: readonly string[];
  /** Bundled demo entries found in the file: not stored, since they ship with the app. */
  readonly skipped: readonly string[];
}

export interface Library {
  listTables(): Promise<Result<Listing<TableSummary>>>;
  getTable(id: string): Promise<Result<StoredTable>>;
  saveTable(table: unknown, options?: SaveOptions): Promise<Result<StoredTable>>;
  /**
   * Saves a table read from a CSV file (after its preview was shown). A file without an
   * `# id:` line gets a free id made from its title.
   */
  saveImportedTable(table: PopulationTable, hadIdLine: boolean, options?: SaveOptions): Promise<Result<StoredTable>>;
  /** Reads a CSV file in blocks (see parseTableCsvInChunks) and saves the table only when it has no problem. */
  importTableCsv(text: string, options?: SaveOptions & ChunkedOptions): Promise<TableCsvResult & { readonly saved?: StoredTable }>;
  renameTable(id: string, title: string, options?: Pick<SaveOptions, 'now'>): Promise<Result<StoredTable>>;
  deleteTable(id: string): Promise<Result<void>>;
  exportTable(id: string): Promise<Result<string>>;
  /** An id not yet used by a saved or demo table, made from `title`. */
  freeTableId(title: string): Promise<Result<string>>;

  listEvidence(): Promise<Result<Listing<StoredEvidence>>>;
  getEvidence(id: string): Promise<Result<StoredEvidence>>;
  saveEvidence(entry: unknown, options?: SaveOptions): Promise<Result<StoredEvidence>>;
  renameEvidence(id: string, title: string, options?: Pick<SaveOptions, 'now'>): Promise<Result<StoredEvidence>>;
  deleteEvidence(id: string): Promise<Result<void>>;
  /** Validates the whole file first; with `replace`, entries whose id is taken overwrite the saved ones, otherwise the file is refused. */
  importEvidenceJson(text: string, options?: SaveOptions): Promise<Result<EvidenceImportSummary>>;
  /** Every saved entry (or those with the given ids), as an evidence file. */
  exportEvidence(ids?: readonly string[]): Promise<Result<string>>;
  freeEvidenceId(title: string): Promise<Result<string>>;

  close(): void;
  /** Saved handout templates (lib/handout/templateRecords.ts plans every write). */
  listTemplates(): Promise<Result<Listing<StoredTemplate>>>;
  writeTemplate(write: TemplateWrite, options?: Pick<SaveOptions, 'now'>): Promise<Result<StoredTemplate>>;
  deleteTemplate(id: string): Promise<Result<void>>;
  /** New templates only (an import), all in one transaction: one refusal writes none. */
  importTemplates(writes: readonly TemplateWrite[], options?: Pick<SaveOptions, 'now'>): Promise<Result<ImportPlan>>;
}

export interface OpenOptions {
  /** Database name; tests give each case its own. */
  readonly name?: string;
}

function storageFailure(error: unknown): Issue[] {
  const name = error instanceof DOMException || error instanceof Error ? error.name : '';
  const message =
    name === 'QuotaExceededError'
      ? "The browser's storage is full; nothing was changed. Delete tables or entries you no longer need, or allow this site more storage"
      : "The browser's storage refused the change; nothing was changed. Try again, or reload the page";
  return [{ code: 'storage-failed', path: [], message }];
}

export async function guarded<T>(work: () => Promise<Result<T>>): Promise<Result<T>> {
  try {
    return await work();
  } catch (error) {
    return fail(storageFailure(error));
  }
}

function byTitle<T>(title: (t: T) => string, id: (t: T) => string) {
  return (a: T, b: T) => title(a).localeCompare(title(b), 'en', { sensitivity: 'base' }) || (id(a) < id(b) ? -1 : id(a) > id(b) ? 1 : 0);
}

function checkTitle(title: string): Result<string> {
  const parsed = populationTableSchema.shape.title.safeParse(title, { reportInput: true });
  return parsed.success ? ok(parsed.data) : fail(toIssues(parsed.error.issues).map((i) => ({ ...i, path: ['title'] })));
}

function checkEvidenceTitle(title: string): Result<string> {
  const parsed = evidenceEntrySchema.shape.title.safeParse(title, { reportInput: true });
  return parsed.success ? ok(parsed.data) : fail(toIssues(parsed.error.issues).map((i) => ({ ...i, path: ['title'] })));
}

/**
 * Open (and, when needed, create or upgrade) the library. Resolves to an issue when the
 * browser offers no IndexedDB (some private modes) or refuses it.
 */
export async function openLibrary(options: OpenOptions = {}): Promise<Result<Library>> {
  const opened = await openLibraryDb(options);
  return opened.ok ? ok(createLibrary(opened.value)) : opened;
}

/**
 * Opens (creating or upgrading) the library's database itself, for the other record kinds kept
 * in it (saved checkups sessions, ./sessions.ts). Works in a Web Worker too.
 */
export async function openLibraryDb(options: OpenOptions = {}): Promise<Result<Db>> {
  if (typeof indexedDB === 'undefined') {
    return fail([{ code: 'storage-unavailable', path: [], message: 'This browser does not let the library keep anything (some private or locked-down modes do this); tables and entries cannot be saved here' }]);
  }
  let db: Db;
  try {
    db = await openDB(options.name ?? DB_NAME, DB_VERSION, {
      upgrade(database, oldVersion, newVersion) {
        for (const step of upgradeStepsBetween(oldVersion, newVersion ?? DB_VERSION)) {
          for (const name of step.deleteStores) if (database.objectStoreNames.contains(name)) database.deleteObjectStore(name);
          for (const spec of step.createStores) if (!database.objectStoreNames.contains(spec.name)) database.createObjectStore(spec.name, { keyPath: spec.keyPath });
        }
      },
      blocking() {
        // A newer version of the app opened in another tab: let it upgrade.
        db.close();
      },
    });
  } catch (error) {
    return fail([{ code: 'storage-unavailable', path: [], message: `The library could not be opened${error instanceof Error && error.name === 'VersionError' ? ' (a newer version of the app is open in another tab; reload this page)' : ''}; nothing can be saved in this browser for now` }]);
  }
  return ok(db);
}

function saveMode(options: SaveOptions): SaveMode {
  if (options.revision !== undefined) return { kind: 'edit', revision: options.revision };
  return options.replace ? { kind: 'replace' } : { kind: 'new' };
}

const TABLE_SPEC: RecordSpec<StoredTable, PopulationTable> = {
  kind: 'tables',
  store: STORES.tables,
  words: TABLE_WORDS,
  companions: [STORES.tableSummaries],
  idOf: (t) => t.id,
  titleOf: (t) => t.title,
  read: (raw) => readStoredTable(raw),
  valueOf: (s) => s.table,
  build: (table, now, previous, revision) => toStoredTable(table, now, previous, revision),
  writeCompanions: async (tx, stored) => {
    await tx.objectStore(STORES.tableSummaries).put(summariseStoredTable(stored));
  },
};

const EVIDENCE_SPEC: RecordSpec<StoredEvidence, EvidenceEntry> = {
  kind: 'evidence',
  store: STORES.evidence,
  words: EVIDENCE_WORDS,
  companions: [],
  idOf: (e) => e.id,
  titleOf: (e) => e.title,
  read: (raw) => readStoredEvidence(raw),
  valueOf: (s) => s.entry,
  build: (entry, now, previous, revision) => toStoredEvidence(entry, now, previous, revision),
};

const TEMPLATE_SPEC: RecordSpec<StoredTemplate, { readonly id: string; readonly template: StoredTemplate['template'] }> = {
  kind: 'templates',
  store: STORES.templates,
  words: TEMPLATE_WORDS,
  companions: [],
  idOf: (r) => r.id,
  titleOf: (r) => r.template.name,
  read: (raw) => readStoredTemplate(raw),
  valueOf: (s) => ({ id: s.id, template: s.template }),
  build: (record, now, previous, revision) => toStoredTemplate(record, now, previous, revision),
};

function createLibrary(db: Db): Library {
  const demoTableIds = new Set(DEMO_TABLES.map((t) => t.id));
  const demoEvidenceIds = new Set(DEMO_EVIDENCE.map((e) => e.id));

  async function takenTableIds(): Promise<Set<string>> {
    const keys = await db.getAllKeys(STORES.tables);
    return new Set([...keys.map(String), ...demoTableIds]);
  }

  const library: Library = {
    listTables: () =>
      guarded(async () => {
        const { items, problems } = await listRecords(db, STORES.tableSummaries, readTableSummary);
        return ok({ items: [...items].sort(byTitle((t) => t.title, (t) => t.id)), problems });
      }),

    getTable: (id) => guarded(() => getRecord(db, TABLE_SPEC, id)),

    saveTable: (input, options = {}) =>
      guarded(async () => {
        const parsed = parseTable(input);
        if (!parsed.ok) return parsed;
        return saveRecord(db, TABLE_SPEC, parsed.value, saveMode(options), options.now ?? new Date());
      }),

    saveImportedTable: (table, hadIdLine, options = {}) =>
      guarded(async () => {
        let toSave = table;
        if (!hadIdLine) {
          const free = await library.freeTableId(table.title);
          if (!free.ok) return free;
          toSave = { ...table, id: free.value };
        }
        return saveRecord(db, TABLE_SPEC, toSave, saveMode(options), options.now ?? new Date());
      }),

    importTableCsv: async (text, options = {}) => {
      const read = await parseTableCsvInChunks(text, options);
      if (!read.ok) return read;
      const hadIdLine = read.preview.details.some((d) => d.key === 'id');
      const saved = await library.saveImportedTable(read.value, hadIdLine, options);
      if (!saved.ok) return { ok: false, issues: saved.issues, preview: read.preview };
      return { ok: true, value: saved.value.table, preview: read.preview, saved: saved.value };
    },

    renameTable: (id, title, options = {}) =>
      guarded(async () => {
        const checked = checkTitle(title);
        if (!checked.ok) return checked;
        return updateRecord(db, TABLE_SPEC, id, (t) => ({ ...t, title: checked.value }), options.now ?? new Date());
      }),

    deleteTable: (id) => guarded(() => deleteRecord(db, TABLE_SPEC, id, new Date())),

    exportTable: async (id) => {
      const got = await library.getTable(id);
      return got.ok ? ok(exportTableCsv(got.value.table)) : got;
    },

    freeTableId: (title) => guarded(async () => ok(uniqueId(idFromTitle(title).replace(/^demo-/, ''), await takenTableIds()))),

    listEvidence: () =>
      guarded(async () => {
        const { items, problems } = await listRecords(db, STORES.evidence, (raw) => readStoredEvidence(raw));
        return ok({ items: [...items].sort(byTitle((e) => e.entry.title, (e) => e.entry.id)), problems });
      }),

    getEvidence: (id) => guarded(() => getRecord(db, EVIDENCE_SPEC, id)),

    saveEvidence: (input, options = {}) =>
      guarded(async () => {
        const parsed = parseEvidenceEntry(input);
        if (!parsed.ok) return parsed;
        return saveRecord(db, EVIDENCE_SPEC, parsed.value, saveMode(options), options.now ?? new Date());
      }),

    renameEvidence: (id, title, options = {}) =>
      guarded(async () => {
        const checked = checkEvidenceTitle(title);
        if (!checked.ok) return checked;
        return updateRecord(db, EVIDENCE_SPEC, id, (e) => ({ ...e, title: checked.value }), options.now ?? new Date());
      }),

    deleteEvidence: (id) => guarded(() => deleteRecord(db, EVIDENCE_SPEC, id, new Date())),

    importEvidenceJson: (text, options = {}) =>
      guarded(async () => {
        const parsed = parseEvidenceJson(text);
        if (!parsed.ok) return parsed;
        return importRecords(db, EVIDENCE_SPEC, parsed.value, { replace: options.replace === true, demoIds: demoEvidenceIds, now: options.now ?? new Date() });
      }),

    exportEvidence: (ids) =>
      guarded(async () => {
        const listing = await library.listEvidence();
        if (!listing.ok) return listing;
        const wanted = ids ? new Set(ids) : undefined;
        const entries = listing.value.items.map((s) => s.entry).filter((e) => !wanted || wanted.has(e.id));
        if (wanted) {
          const missing = [...wanted].filter((id) => !entries.some((e) => e.id === id));
          if (missing.length > 0) return fail(missing.map((id) => ({ code: 'not-found', path: ['id'], message: `No saved entry has the id "${id}"; it may have been deleted in another tab` })));
        }
        return ok(exportEvidenceJson(entries));
      }),

    freeEvidenceId: (title) =>
      guarded(async () => {
        const keys = await db.getAllKeys(STORES.evidence);
        return ok(uniqueId(idFromTitle(title, 'entry').replace(/^demo-/, ''), new Set([...keys.map(String), ...demoEvidenceIds])));
      }),

    listTemplates: () => guarded(() => listRecords(db, STORES.templates, (raw) => readStoredTemplate(raw)).then(ok)),

    writeTemplate: (write, options = {}) => guarded(() => saveRecord(db, TEMPLATE_SPEC, { id: write.id, template: write.template }, write.mode, options.now ?? new Date())),

    deleteTemplate: (id) => guarded(() => deleteRecord(db, TEMPLATE_SPEC, id, new Date())),

    importTemplates: (writes, options = {}) =>
      guarded(() =>
        importRecords(
          db,
          TEMPLATE_SPEC,
          writes.map((w) => ({ id: w.id, template: w.template })),
          { replace: false, demoIds: new Set(), now: options.now ?? new Date() },
        ),
      ),

    close: () => db.close(),
  };
  return library;
}
