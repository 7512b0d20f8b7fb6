/**
 * The library's rules for saved records, the same for tables, evidence entries and handout
 * templates, kept pure so they are tested without a browser:
 * - ids starting with "demo-" are kept for the bundled demo records;
 * - every stored record carries a revision, one more on each save; a save made from a
 *   revision that is no longer the stored one (another tab saved in between) is refused;
 * - a deleted record leaves a tombstone with its last revision, so a stale save from a tab
 *   that still shows it cannot bring it back, and a record later saved under the same id
 *   starts above that revision;
 * - an import merges by id: new ids are added; ids already saved are refused unless the
 *   clinician chose to replace them; bundled demo records are skipped.
 * The IndexedDB adapter (app/storage/recordStore.ts) reads the current record and tombstone
 * in the same transaction, asks {@link decideSave} / {@link decideDelete}, and writes what it
 * says. Other tabs learn of each change through {@link LibraryChange} messages.
 */
import { fail, ok, type Issue, type Result } from '../result';

/** Ids starting with this are kept for the bundled demo tables and entries. */
export const RESERVED_ID_PREFIX = 'demo-';

/** How a kind of record is named in messages. */
export interface RecordWords {
  /** "table", "entry", "template". */
  readonly one: string;
  /** "tables", "entries", "templates". */
  readonly many: string;
}

export const TABLE_WORDS: RecordWords = { one: 'table', many: 'tables' };
export const EVIDENCE_WORDS: RecordWords = { one: 'entry', many: 'entries' };
export const TEMPLATE_WORDS: RecordWords = { one: 'template', many: 'templates' };
export const SESSION_WORDS: RecordWords = { one: 'session', many: 'sessions' };

export function isReservedId(id: string): boolean {
  return id.startsWith(RESERVED_ID_PREFIX);
}

export function reservedIdIssue(id: string, what: RecordWords): Issue {
  return {
    code: 'reserved-id',
    path: ['id'],
    message: `Ids starting with "${RESERVED_ID_PREFIX}" are kept for the bundled demo ${what.many}; choose another id (e.g. "${id.slice(RESERVED_ID_PREFIX.length) || 'my-id'}")`,
  };
}

export function notFoundIssue(id: string, what: RecordWords): Issue {
  return { code: 'not-found', path: ['id'], message: `No saved ${what.one} has the id "${id}"; it may have been deleted in another tab` };
}

/**
 * How a save was asked for:
 * - `new`: a record that should not exist yet (a first save, an import without "replace");
 * - `edit`: a change to the record as it was at `revision` (what the editing tab read);
 * - `replace`: overwrite whatever is saved under the id, as the clinician chose (an import
 *   with "replace", or saving again after being told another tab changed it).
 */
export type SaveMode = { readonly kind: 'new' } | { readonly kind: 'edit'; readonly revision: number } | { readonly kind: 'replace' };

/** The stored record's revision and its title (for messages), when one is saved. */
export interface CurrentRecord {
  readonly revision: number;
  readonly title: string;
}

/** What is left of a deleted record. */
export interface Tombstone {
  readonly revision: number;
}

/** The revision a new write gets: one above both the stored record and any tombstone. */
export function nextRevision(current: CurrentRecord | undefined, tombstone: Tombstone | undefined): number {
  return Math.max(current?.revision ?? 0, tombstone?.revision ?? 0) + 1;
}

/**
 * Whether a save may go ahead, and the revision it writes.
 *
 * @example
 * decideSave('hf', TABLE_WORDS, { kind: 'edit', revision: 3 }, { revision: 3, title: 'HF' }, undefined) //=> { ok: true, value: { revision: 4 } }
 * decideSave('hf', TABLE_WORDS, { kind: 'edit', revision: 3 }, { revision: 4, title: 'HF' }, undefined) //=> refused: 'stale-revision'
 * decideSave('hf', TABLE_WORDS, { kind: 'edit', revision: 3 }, undefined, { revision: 3 })              //=> refused: 'deleted-elsewhere'
 */
export function decideSave(
  id: string,
  what: RecordWords,
  mode: SaveMode,
  current: CurrentRecord | undefined,
  tombstone: Tombstone | undefined,
): Result<{ readonly revision: number }> {
  if (isReservedId(id)) return fail([reservedIdIssue(id, what)]);
  const revision = nextRevision(current, tombstone);
  switch (mode.kind) {
    case 'new':
      if (current) {
        return fail([
          {
            code: 'id-taken',
            path: ['id'],
            message: `A saved ${what.one} already has the id "${id}" ("${current.title}"); replace it, or give this ${what.one} another id`,
          },
        ]);
      }
      return ok({ revision });
    case 'replace':
      return ok({ revision });
    case 'edit':
      if (!current) {
        return fail([
          tombstone
            ? {
                code: 'deleted-elsewhere',
                path: ['id'],
                message: `Not saved: this ${what.one} was deleted in another tab or window after you opened it, so your changes were not saved and it stays deleted. To keep your changes, save them as a new ${what.one}`,
              }
            : notFoundIssue(id, what),
        ]);
      }
      if (current.revision !== mode.revision) {
        return fail([
          {
            code: 'stale-revision',
            path: ['id'],
            message: `Not saved: “${current.title}” was changed in another tab or window after you opened it, and saving would overwrite that change. The saved version is shown now; save again to replace it with yours, or cancel to keep it`,
          },
        ]);
      }
      return ok({ revision });
  }
}

/** A delete goes ahead when the record exists; its tombstone keeps the last revision. */
export function decideDelete(id: string, what: RecordWords, current: CurrentRecord | undefined): Result<Tombstone> {
  if (!current) return fail([notFoundIssue(id, what)]);
  return ok({ revision: current.revision });
}

/** What an import will do, id by id. */
export interface ImportPlan {
  readonly added: readonly string[];
  readonly replaced: readonly string[];
  /** Bundled demo records found in the file: not stored, since they ship with the app. */
  readonly skipped: readonly string[];
}

/**
 * How an import merges into the library: demo ids skipped, other reserved ids refused, taken
 * ids refused (naming them) unless `replace`. All or nothing: any refusal imports nothing.
 */
export function planImport(ids: readonly string[], taken: ReadonlySet<string>, demoIds: ReadonlySet<string>, replace: boolean, what: RecordWords): Result<ImportPlan> {
  const reservedIssues = ids.flatMap((id, i) => (isReservedId(id) && !demoIds.has(id) ? [{ ...reservedIdIssue(id, what), path: ['entries', i, 'id'] }] : []));
  if (reservedIssues.length > 0) return fail(reservedIssues);
  const own = ids.filter((id) => !demoIds.has(id));
  const clash = own.filter((id) => taken.has(id));
  if (clash.length > 0 && !replace) {
    const list = clash.map((id) => `"${id}"`).join(', ');
    return fail([
      {
        code: 'id-taken',
        path: ['entries'],
        message: `${clash.length === 1 ? `${/^[aeiou]/.test(what.one) ? 'An' : 'A'} ${what.one} in the file has an id` : `${clash.length} ${what.many} in the file have ids`} already in the library (${list}); nothing was imported. Import again choosing "replace" to overwrite them`,
      },
    ]);
  }
  return ok({ added: own.filter((id) => !taken.has(id)), replaced: clash, skipped: ids.filter((id) => demoIds.has(id)) });
}

// ---------------------------------------------------------------------------------------------
// Telling other tabs

/** The BroadcastChannel name (and localStorage key for browsers without one) for library changes. */
export const LIBRARY_CHANGE_CHANNEL = 'hundredfold.library-change';

export type RecordKind = 'tables' | 'evidence' | 'templates' | 'sessions';

/** One change, as announced to other tabs: which kind of record, and which id. No content is sent. */
export interface LibraryChange {
  readonly kind: RecordKind;
  readonly id: string;
  readonly change: 'saved' | 'deleted';
  /** Random per message, so the storage event fires even for the same change twice. */
  readonly nonce: string;
}

/** A change message read back, or undefined when it is not one (another program's message). */
export function readLibraryChange(data: unknown): LibraryChange | undefined {
  if (typeof data !== 'object' || data === null) return undefined;
  const d = data as Record<string, unknown>;
  if ((d.kind !== 'tables' && d.kind !== 'evidence' && d.kind !== 'templates' && d.kind !== 'sessions') || typeof d.id !== 'string' || (d.change !== 'saved' && d.change !== 'deleted') || typeof d.nonce !== 'string') {
    return undefined;
  }
  return { kind: d.kind, id: d.id, change: d.change, nonce: d.nonce };
}
