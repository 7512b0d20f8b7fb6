/**
 * One generic record store over IndexedDB for every kind of saved record (tables, evidence
 * entries, handout templates): list, get, save with a revision check, change in place, delete
 * leaving a tombstone, import merging by id. The rules are lib/storage/policy.ts; this file
 * reads the current record and tombstone in the same transaction as the write, asks the
 * policy, writes what it allows, and announces the change to other tabs (./changes.ts).
 *
 * Browser-only. Nothing here throws for a refused change: every operation resolves to a
 * {@link Result}; a failure of the storage itself is the caller's `storage-failed` issue.
 */
import type { IDBPDatabase, IDBPTransaction } from 'idb';
import { fail, ok, type Issue, type Result } from '@/lib/result';
import {
  decideDelete,
  decideSave,
  nextRevision,
  notFoundIssue,
  planImport,
  type CurrentRecord,
  type ImportPlan,
  type RecordKind,
  type RecordWords,
  type SaveMode,
  type Tombstone,
} from '@/lib/storage/policy';
import { tombstoneKey, type StoredTombstone } from '@/lib/storage/records';
import { STORES, type StoreName } from '@/lib/storage/schema';
import { announceLibraryChange } from './changes';

// Records are validated by `read` whenever they come out, so the database itself is untyped.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Db = IDBPDatabase<any>;
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Tx = IDBPTransaction<any, StoreName[], 'readwrite'>;

/** What every stored record carries (lib/storage/records.ts). */
type Saved = { readonly revision: number; readonly savedAt: string };

/** What the generic store needs to know about one kind of record. */
export interface RecordSpec<S extends Saved, V> {
  readonly kind: RecordKind;
  readonly store: StoreName;
  readonly words: RecordWords;
  /** Stores written and deleted together with the record (e.g. the table summaries). */
  readonly companions: readonly StoreName[];
  readonly idOf: (value: V) => string;
  readonly titleOf: (value: V) => string;
  /** Reads (and migrates) a raw stored record; a damaged one is an issue. */
  readonly read: (raw: unknown) => Result<S>;
  readonly valueOf: (stored: S) => V;
  readonly build: (value: V, now: Date, previous: S | undefined, revision: number) => S;
  /** Writes the companion stores; `value` is what was given to save (it may hold more than `stored`, e.g. a session's rows). */
  readonly writeCompanions?: (tx: Tx, stored: S, value: V) => Promise<void>;
}

export interface Listing<T> {
  readonly items: readonly T[];
  /** Records that could not be read (damaged, or saved by a newer version); they are left untouched. */
  readonly problems: readonly Issue[];
}

async function currentOf<S extends Saved, V>(
  tx: Tx,
  spec: RecordSpec<S, V>,
  id: string,
): Promise<{ raw: unknown; stored: S | undefined; current: CurrentRecord | undefined; tombstone: Tombstone | undefined }> {
  const raw: unknown = await tx.objectStore(spec.store).get(id);
  const deadRaw: unknown = await tx.objectStore(STORES.tombstones).get(tombstoneKey(spec.store, id));
  const dead = deadRaw as Partial<StoredTombstone> | undefined;
  const tombstone = dead && typeof dead.revision === 'number' ? { revision: dead.revision } : undefined;
  if (raw === undefined) return { raw, stored: undefined, current: undefined, tombstone };
  const read = spec.read(raw);
  if (read.ok) return { raw, stored: read.value, current: { revision: read.value.revision, title: spec.titleOf(spec.valueOf(read.value)) }, tombstone };
  // An unreadable record still occupies its id; its revision, when it has one, still counts.
  const r = (raw as { revision?: unknown }).revision;
  return { raw, stored: undefined, current: { revision: typeof r === 'number' && Number.isInteger(r) && r > 0 ? r : 1, title: id }, tombstone };
}

function stores<S extends Saved, V>(spec: RecordSpec<S, V>): StoreName[] {
  return [spec.store, STORES.tombstones, ...spec.companions];
}

/** Every readable record of a kind, with the unreadable ones as problems. */
export async function listRecords<S>(db: Db, store: StoreName, read: (raw: unknown) => Result<S>): Promise<Listing<S>> {
  const raws: unknown[] = await db.getAll(store);
  const items: S[] = [];
  const problems: Issue[] = [];
  raws.forEach((raw, i) => {
    const r = read(raw);
    if (r.ok) items.push(r.value);
    else problems.push(...r.issues.map((issue) => ({ ...issue, path: [store, i, ...issue.path] })));
  });
  return { items, problems };
}

export async function getRecord<S extends Saved, V>(db: Db, spec: RecordSpec<S, V>, id: string): Promise<Result<S>> {
  const raw: unknown = await db.get(spec.store, id);
  if (raw === undefined) return fail([notFoundIssue(id, spec.words)]);
  return spec.read(raw);
}

/** Save `value` as `mode` allows (lib/storage/policy.ts `decideSave`), in one transaction. */
export async function saveRecord<S extends Saved, V>(
  db: Db,
  spec: RecordSpec<S, V>,
  value: V,
  mode: SaveMode,
  now: Date,
): Promise<Result<S>> {
  const id = spec.idOf(value);
  const tx = db.transaction(stores(spec), 'readwrite') as Tx;
  const { stored: previous, current, tombstone } = await currentOf(tx, spec, id);
  const decided = decideSave(id, spec.words, mode, current, tombstone);
  if (!decided.ok) {
    await tx.done;
    return decided;
  }
  return writeRecord(tx, spec, id, value, spec.build(value, now, previous, decided.value.revision), tombstone !== undefined);
}

/** Writes one built record (and its companions), clears its tombstone, ends the transaction and tells the other tabs. */
async function writeRecord<S extends Saved, V>(tx: Tx, spec: RecordSpec<S, V>, id: string, value: V, stored: S, hadTombstone: boolean): Promise<Result<S>> {
  await tx.objectStore(spec.store).put(stored);
  if (hadTombstone) await tx.objectStore(STORES.tombstones).delete(tombstoneKey(spec.store, id));
  await spec.writeCompanions?.(tx, stored, value);
  await tx.done;
  announceLibraryChange(spec.kind, id, 'saved');
  return ok(stored);
}

/** Change a saved record in place (e.g. its title), reading and writing in one transaction. */
export async function updateRecord<S extends Saved, V>(
  db: Db,
  spec: RecordSpec<S, V>,
  id: string,
  change: (value: V) => V,
  now: Date,
): Promise<Result<S>> {
  const tx = db.transaction(stores(spec), 'readwrite') as Tx;
  const { raw, stored: previous, current, tombstone } = await currentOf(tx, spec, id);
  if (raw === undefined || !previous || !current) {
    await tx.done;
    return raw === undefined ? fail([notFoundIssue(id, spec.words)]) : spec.read(raw);
  }
  const changed = change(spec.valueOf(previous));
  return writeRecord(tx, spec, id, changed, spec.build(changed, now, previous, nextRevision(current, tombstone)), false);
}

/** Delete a record, leaving a tombstone with its last revision. */
export async function deleteRecord<S extends Saved, V>(db: Db, spec: RecordSpec<S, V>, id: string, now: Date): Promise<Result<void>> {
  const tx = db.transaction(stores(spec), 'readwrite') as Tx;
  let { current } = await currentOf(tx, spec, id);
  if (!current) {
    // A companion left without its record (e.g. a summary) is still cleared away.
    for (const name of spec.companions) if ((await tx.objectStore(name).getKey(id)) !== undefined) current = { revision: 1, title: id };
  }
  const decided = decideDelete(id, spec.words, current);
  if (!decided.ok) {
    await tx.done;
    return decided;
  }
  const tombstone: StoredTombstone = { key: tombstoneKey(spec.store, id), store: spec.store, id, revision: decided.value.revision, deletedAt: now.toISOString() };
  await tx.objectStore(STORES.tombstones).put(tombstone);
  await tx.objectStore(spec.store).delete(id);
  for (const name of spec.companions) await tx.objectStore(name).delete(id);
  await tx.done;
  announceLibraryChange(spec.kind, id, 'deleted');
  return ok(undefined);
}

/**
 * Import `values` whole (lib/storage/policy.ts `planImport`): demo ids skipped, taken ids
 * refused unless `replace`; one transaction, so a refusal changes nothing.
 */
export async function importRecords<S extends Saved, V>(
  db: Db,
  spec: RecordSpec<S, V>,
  values: readonly V[],
  options: { readonly replace: boolean; readonly demoIds: ReadonlySet<string>; readonly now: Date },
): Promise<Result<ImportPlan>> {
  const tx = db.transaction(stores(spec), 'readwrite') as Tx;
  const ids = values.map(spec.idOf);
  const found = await Promise.all(ids.map((id) => currentOf(tx, spec, id)));
  const taken = new Set(ids.filter((_, i) => found[i]?.current !== undefined));
  const plan = planImport(ids, taken, options.demoIds, options.replace, spec.words);
  if (!plan.ok) {
    await tx.done;
    return plan;
  }
  const writes: Promise<unknown>[] = [];
  values.forEach((value, i) => {
    const id = ids[i]!;
    if (options.demoIds.has(id)) return;
    const f = found[i]!;
    const stored = spec.build(value, options.now, f.stored, nextRevision(f.current, f.tombstone));
    writes.push(tx.objectStore(spec.store).put(stored));
    if (f.tombstone) writes.push(tx.objectStore(STORES.tombstones).delete(tombstoneKey(spec.store, id)));
    if (spec.writeCompanions) writes.push(spec.writeCompanions(tx, stored, value));
  });
  await Promise.all(writes);
  await tx.done;
  const changed = [...plan.value.added, ...plan.value.replaced];
  // One message for the whole import ("*": several records), not one per record.
  if (changed.length > 0) announceLibraryChange(spec.kind, changed.length === 1 ? changed[0]! : '*', 'saved');
  return plan;
}
