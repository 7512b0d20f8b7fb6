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
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import { fail, ok, type Issue, type Result } from '@/lib/result';
import { DB_NAME, DB_VERSION, STORES, upgradeStepsBetween } from '@/lib/storage/schema';
import {
  readStoredEvidence,
  readStoredTable,
  readTableSummary,
  summariseStoredTable,
  toStoredEvidence,
  toStoredTable,
  type StoredEvidence,
  type StoredTable,
  type TableSummary,
} from '@/lib/storage/records';
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
import { toIssues } from '@/lib/scenario/issues';

interface LibrarySchema extends DBSchema {
  tables: { key: string; value: StoredTable };
  'table-summaries': { key: string; value: TableSummary };
  evidence: { key: string; value: StoredEvidence };
}

type Db = IDBPDatabase<LibrarySchema>;

/** Ids starting with this are kept for the bundled demo tables and entries. */
export const RESERVED_ID_PREFIX = 'demo-';

export interface Listing<T> {
  readonly items: readonly T[];
  /** Records that could not be read (damaged, or saved by a newer version); they are left untouched. */
  readonly problems: readonly Issue[];
}

export interface SaveOptions {
  /** Overwrite a saved record with the same id (an edit). Without it, a taken id is refused. */
  readonly replace?: boolean;
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
      : `The browser's storage refused the change (${name || String(error)}); nothing was changed`;
  return [{ code: 'storage-failed', path: [], message }];
}

async function guarded<T>(work: () => Promise<Result<T>>): Promise<Result<T>> {
  try {
    return await work();
  } catch (error) {
    return fail(storageFailure(error));
  }
}

function notFound(what: string, id: string): Issue[] {
  return [{ code: 'not-found', path: ['id'], message: `No saved ${what} has the id "${id}"; it may have been deleted in another tab` }];
}

function reserved(id: string, what: string): Issue[] {
  return [{ code: 'reserved-id', path: ['id'], message: `Ids starting with "${RESERVED_ID_PREFIX}" are kept for the bundled demo ${what}; choose another id (e.g. "${id.slice(RESERVED_ID_PREFIX.length) || 'my-id'}")` }];
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
  if (typeof indexedDB === 'undefined') {
    return fail([{ code: 'storage-unavailable', path: [], message: 'This browser offers no local storage for the library (IndexedDB); tables and entries cannot be saved here' }]);
  }
  let db: Db;
  try {
    db = await openDB<LibrarySchema>(options.name ?? DB_NAME, DB_VERSION, {
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
    return fail([{ code: 'storage-unavailable', path: [], message: `The library could not be opened (${error instanceof Error ? error.name : String(error)}); nothing can be saved in this browser for now` }]);
  }
  return ok(createLibrary(db));
}

function createLibrary(db: Db): Library {
  const demoTableIds = new Set(DEMO_TABLES.map((t) => t.id));
  const demoEvidenceIds = new Set(DEMO_EVIDENCE.map((e) => e.id));

  async function putTable(table: PopulationTable, options: SaveOptions): Promise<Result<StoredTable>> {
    if (table.id.startsWith(RESERVED_ID_PREFIX)) return fail(reserved(table.id, 'tables'));
    const tx = db.transaction([STORES.tables, STORES.tableSummaries], 'readwrite');
    const tables = tx.objectStore(STORES.tables);
    const previous = await tables.get(table.id);
    if (previous && !options.replace) {
      await tx.done;
      return fail([{ code: 'id-taken', path: ['id'], message: `A saved table already has the id "${table.id}" ("${previous.table?.title ?? ''}"); replace it, or give this table another id` }]);
    }
    const stored = toStoredTable(table, options.now ?? new Date(), previous);
    await tables.put(stored);
    await tx.objectStore(STORES.tableSummaries).put(summariseStoredTable(stored));
    await tx.done;
    return ok(stored);
  }

  async function putEvidence(entry: EvidenceEntry, options: SaveOptions): Promise<Result<StoredEvidence>> {
    if (entry.id.startsWith(RESERVED_ID_PREFIX)) return fail(reserved(entry.id, 'entries'));
    const tx = db.transaction(STORES.evidence, 'readwrite');
    const previous = await tx.store.get(entry.id);
    if (previous && !options.replace) {
      await tx.done;
      return fail([{ code: 'id-taken', path: ['id'], message: `A saved entry already has the id "${entry.id}" ("${previous.entry?.title ?? ''}"); replace it, or give this entry another id` }]);
    }
    const stored = toStoredEvidence(entry, options.now ?? new Date(), previous);
    await tx.store.put(stored);
    await tx.done;
    return ok(stored);
  }

  async function takenTableIds(): Promise<Set<string>> {
    const keys = await db.getAllKeys(STORES.tables);
    return new Set([...keys, ...demoTableIds]);
  }

  const library: Library = {
    listTables: () =>
      guarded(async () => {
        const raws: unknown[] = await db.getAll(STORES.tableSummaries);
        const items: TableSummary[] = [];
        const problems: Issue[] = [];
        raws.forEach((raw, i) => {
          const read = readTableSummary(raw);
          if (read.ok) items.push(read.value);
          else problems.push(...read.issues.map((issue) => ({ ...issue, path: [STORES.tableSummaries, i, ...issue.path] })));
        });
        items.sort(byTitle((t) => t.title, (t) => t.id));
        return ok({ items, problems });
      }),

    getTable: (id) =>
      guarded(async () => {
        const raw: unknown = await db.get(STORES.tables, id);
        if (raw === undefined) return fail(notFound('table', id));
        return readStoredTable(raw);
      }),

    saveTable: (input, options = {}) =>
      guarded(async () => {
        const parsed = parseTable(input);
        if (!parsed.ok) return parsed;
        return putTable(parsed.value, options);
      }),

    saveImportedTable: (table, hadIdLine, options = {}) =>
      guarded(async () => {
        let toSave = table;
        if (!hadIdLine) {
          const free = await library.freeTableId(table.title);
          if (!free.ok) return free;
          toSave = { ...table, id: free.value };
        }
        return putTable(toSave, options);
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
        const tx = db.transaction([STORES.tables, STORES.tableSummaries], 'readwrite');
        const raw: unknown = await tx.objectStore(STORES.tables).get(id);
        if (raw === undefined) {
          await tx.done;
          return fail(notFound('table', id));
        }
        const read = readStoredTable(raw);
        if (!read.ok) {
          await tx.done;
          return read;
        }
        const stored = toStoredTable({ ...read.value.table, title: checked.value }, options.now ?? new Date(), read.value);
        await tx.objectStore(STORES.tables).put(stored);
        await tx.objectStore(STORES.tableSummaries).put(summariseStoredTable(stored));
        await tx.done;
        return ok(stored);
      }),

    deleteTable: (id) =>
      guarded(async () => {
        const tx = db.transaction([STORES.tables, STORES.tableSummaries], 'readwrite');
        const exists = (await tx.objectStore(STORES.tables).getKey(id)) !== undefined || (await tx.objectStore(STORES.tableSummaries).getKey(id)) !== undefined;
        if (!exists) {
          await tx.done;
          return fail(notFound('table', id));
        }
        await tx.objectStore(STORES.tables).delete(id);
        await tx.objectStore(STORES.tableSummaries).delete(id);
        await tx.done;
        return ok(undefined);
      }),

    exportTable: async (id) => {
      const got = await library.getTable(id);
      return got.ok ? ok(exportTableCsv(got.value.table)) : got;
    },

    freeTableId: (title) => guarded(async () => ok(uniqueId(idFromTitle(title).replace(/^demo-/, ''), await takenTableIds()))),

    listEvidence: () =>
      guarded(async () => {
        const raws: unknown[] = await db.getAll(STORES.evidence);
        const items: StoredEvidence[] = [];
        const problems: Issue[] = [];
        raws.forEach((raw, i) => {
          const read = readStoredEvidence(raw);
          if (read.ok) items.push(read.value);
          else problems.push(...read.issues.map((issue) => ({ ...issue, path: [STORES.evidence, i, ...issue.path] })));
        });
        items.sort(byTitle((e) => e.entry.title, (e) => e.entry.id));
        return ok({ items, problems });
      }),

    getEvidence: (id) =>
      guarded(async () => {
        const raw: unknown = await db.get(STORES.evidence, id);
        if (raw === undefined) return fail(notFound('entry', id));
        return readStoredEvidence(raw);
      }),

    saveEvidence: (input, options = {}) =>
      guarded(async () => {
        const parsed = parseEvidenceEntry(input);
        if (!parsed.ok) return parsed;
        return putEvidence(parsed.value, options);
      }),

    renameEvidence: (id, title, options = {}) =>
      guarded(async () => {
        const checked = checkEvidenceTitle(title);
        if (!checked.ok) return checked;
        const tx = db.transaction(STORES.evidence, 'readwrite');
        const raw: unknown = await tx.store.get(id);
        if (raw === undefined) {
          await tx.done;
          return fail(notFound('entry', id));
        }
        const read = readStoredEvidence(raw);
        if (!read.ok) {
          await tx.done;
          return read;
        }
        const stored = toStoredEvidence({ ...read.value.entry, title: checked.value }, options.now ?? new Date(), read.value);
        await tx.store.put(stored);
        await tx.done;
        return ok(stored);
      }),

    deleteEvidence: (id) =>
      guarded(async () => {
        const tx = db.transaction(STORES.evidence, 'readwrite');
        if ((await tx.store.getKey(id)) === undefined) {
          await tx.done;
          return fail(notFound('entry', id));
        }
        await tx.store.delete(id);
        await tx.done;
        return ok(undefined);
      }),

    importEvidenceJson: (text, options = {}) =>
      guarded(async () => {
        const parsed = parseEvidenceJson(text);
        if (!parsed.ok) return parsed;
        const entries = parsed.value;
        const reservedIssues = entries.flatMap((e, i) =>
          e.id.startsWith(RESERVED_ID_PREFIX) && !demoEvidenceIds.has(e.id) ? reserved(e.id, 'entries').map((issue) => ({ ...issue, path: ['entries', i, 'id'] })) : [],
        );
        // Bundled demo entries in an exported file are skipped, not stored: they ship with the app.
        const own = entries.filter((e) => !demoEvidenceIds.has(e.id));
        if (reservedIssues.length > 0) return fail(reservedIssues);
        const tx = db.transaction(STORES.evidence, 'readwrite');
        const previous = await Promise.all(own.map((e) => tx.store.get(e.id)));
        const taken = own.filter((_, i) => previous[i] !== undefined);
        if (taken.length > 0 && !options.replace) {
          await tx.done;
          const list = taken.map((e) => `"${e.id}"`).join(', ');
          return fail([
            {
              code: 'id-taken',
              path: ['entries'],
              message: `${taken.length === 1 ? 'An entry in the file has an id' : `${taken.length} entries in the file have ids`} already in the library (${list}); nothing was imported. Import again choosing "replace" to overwrite them`,
            },
          ]);
        }
        const now = options.now ?? new Date();
        await Promise.all(own.map((e, i) => tx.store.put(toStoredEvidence(e, now, previous[i]))));
        await tx.done;
        return ok({
          added: own.filter((_, i) => previous[i] === undefined).map((e) => e.id),
          replaced: taken.map((e) => e.id),
          skipped: entries.filter((e) => demoEvidenceIds.has(e.id)).map((e) => e.id),
        });
      }),

    exportEvidence: (ids) =>
      guarded(async () => {
        const listing = await library.listEvidence();
        if (!listing.ok) return listing;
        const wanted = ids ? new Set(ids) : undefined;
        const entries = listing.value.items.map((s) => s.entry).filter((e) => !wanted || wanted.has(e.id));
        if (wanted) {
          const missing = [...wanted].filter((id) => !entries.some((e) => e.id === id));
          if (missing.length > 0) return fail(missing.flatMap((id) => notFound('entry', id)));
        }
        return ok(exportEvidenceJson(entries));
      }),

    freeEvidenceId: (title) =>
      guarded(async () => {
        const keys = await db.getAllKeys(STORES.evidence);
        return ok(uniqueId(idFromTitle(title, 'entry').replace(/^demo-/, ''), new Set([...keys, ...demoEvidenceIds])));
      }),

    close: () => db.close(),
  };
  return library;
}
