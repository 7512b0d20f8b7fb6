/**
 * Saved checkups sessions in the browser library's database (the generic record store,
 * ./recordStore.ts): the session without its rows in one store (what the list reads), its rows
 * and row problems in a companion store under the same id, written and deleted in the same
 * transaction. Formats and checks: lib/checkups/session.ts.
 *
 * Works on the page and in the checkups Web Worker (which saves and opens sessions, so the
 * rows never cross to the page). Nothing here throws: every operation resolves to a Result.
 */
import { fail, ok, type Result } from '@/lib/result';
import { SESSION_WORDS } from '@/lib/storage/policy';
import { STORES } from '@/lib/storage/schema';
import { joinSession, readStoredSession, toStoredSession, type CheckupSession, type SessionBody, type SessionHead, type StoredSession } from '@/lib/checkups/session';
import { guarded, openLibraryDb, type OpenOptions } from './library';
import { deleteRecord, getRecord, listRecords, saveRecord, type Db, type Listing, type RecordSpec } from './recordStore';

export interface SessionStore {
  /** Every saved session's list line, newest first; unreadable ones (newer, damaged) as problems, left as they are. */
  list(): Promise<Result<Listing<StoredSession>>>;
  /** A whole session, rows included, checked. */
  open(id: string): Promise<Result<CheckupSession>>;
  /** Saves a new session (its id must be new). */
  save(session: CheckupSession, now?: Date): Promise<Result<StoredSession>>;
  delete(id: string): Promise<Result<void>>;
  close(): void;
}

/** What is saved: the whole session, or (read back for the store's checks) its head only. */
type SessionValue = { readonly head: SessionHead; readonly body?: SessionBody };

const SESSION_SPEC: RecordSpec<StoredSession, SessionValue> = {
  kind: 'sessions',
  store: STORES.checkupSessions,
  words: SESSION_WORDS,
  companions: [STORES.checkupSessionRows],
  idOf: (v) => v.head.id,
  titleOf: (v) => v.head.name,
  read: readStoredSession,
  valueOf: (s) => ({ head: s.session }),
  build: (value, now, previous, revision) => {
    const time = now.toISOString();
    const session = { ...value.head, rows: value.body?.rows ?? [], problems: value.body?.problems ?? [] } as CheckupSession;
    const { stored } = toStoredSession(session, now, previous, revision);
    return { ...stored, updatedAt: time };
  },
  writeCompanions: async (tx, _stored, value) => {
    if (value.body) await tx.objectStore(STORES.checkupSessionRows).put(value.body);
  },
};

function createSessionStore(db: Db): SessionStore {
  return {
    list: () =>
      guarded(async () => {
        const { items, problems } = await listRecords(db, STORES.checkupSessions, readStoredSession);
        return ok({ items: [...items].sort((a, b) => (a.updatedAt < b.updatedAt ? 1 : a.updatedAt > b.updatedAt ? -1 : 0)), problems });
      }),
    open: (id) =>
      guarded(async () => {
        const stored = await getRecord(db, SESSION_SPEC, id);
        if (!stored.ok) return stored;
        const body: unknown = await db.get(STORES.checkupSessionRows, id);
        return joinSession(stored.value, body);
      }),
    save: (session, now = new Date()) =>
      guarded(async () => {
        const { rows, problems, ...head } = session;
        return saveRecord(db, SESSION_SPEC, { head, body: { id: session.id, rows, problems } }, { kind: 'new' }, now);
      }),
    delete: (id) => guarded(() => deleteRecord(db, SESSION_SPEC, id, new Date())),
    close: () => db.close(),
  };
}

/** Opens the saved sessions (the library's database, upgraded when needed). */
export async function openSessionStore(options: OpenOptions = {}): Promise<Result<SessionStore>> {
  const opened = await guarded(() => openLibraryDb(options));
  return opened.ok ? ok(createSessionStore(opened.value)) : fail(opened.issues);
}
