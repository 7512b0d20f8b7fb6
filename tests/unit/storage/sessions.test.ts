import 'fake-indexeddb/auto';
import { readFileSync } from 'node:fs';
import { openDB } from 'idb';
import { afterEach, describe, expect, it } from 'vitest';
import { openLibrary } from '@/app/storage/library';
import { openSessionStore, type SessionStore } from '@/app/storage/sessions';
import { STORES, upgradeStepsBetween } from '@/lib/storage/schema';
import { toStoredEvidence, toStoredTable, summariseStoredTable } from '@/lib/storage/records';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { SESSION_VERSION, type CheckupSession } from '@/lib/checkups/session';
import { createCheckupTextReader, isRefusal } from '@/lib/workforce';
import type { Result } from '@/lib/result';

// The demo entry and table with new ids, and the illustrative demo checkup file's rows.
const ENTRY = { ...DEMO_EVIDENCE[0]!, id: 'workforce-hf', title: 'Workforce cohort' };
const TABLE = { ...DEMO_HEART_FAILURE_10Y, id: 'north-hf', title: 'North heart failure' };
const NOW = new Date('2026-01-02T10:00:00.000Z');

function demoSession(id = 'session-aaaaaaaaaaaaaaaaaaaaaaaa', name = 'North site, spring'): CheckupSession {
  const reader = createCheckupTextReader({ today: '2026-01-01' });
  const first = reader.push(readFileSync('demo/checkups/checkups.csv', 'utf8'));
  const last = reader.end();
  if (isRefusal(first) || isRefusal(last)) throw new Error('the demo file must read');
  return {
    sessionVersion: SESSION_VERSION,
    id,
    name,
    setup: { evidence: DEMO_EVIDENCE[0]!, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA', horizonYears: 10 },
    today: '2026-01-01',
    kind: 'delimited',
    mapping: null,
    rows: [...first.rows, ...last.rows],
    rowCounts: reader.counts(),
    problems: [...first.problems, ...last.problems],
  };
}

function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(`expected ok, got ${JSON.stringify(r.issues)}`);
  return r.value;
}

let counter = 0;
const open: SessionStore[] = [];
async function fresh(name = `sessions-${++counter}`): Promise<SessionStore> {
  const store = value(await openSessionStore({ name }));
  open.push(store);
  return store;
}
afterEach(() => {
  for (const s of open.splice(0)) s.close();
});

describe('saved checkups sessions in the browser library', () => {
  it('saves, lists, opens (the same session back) and deletes a session with its rows', async () => {
    const store = await fresh();
    const session = demoSession();
    value(await store.save(session, NOW));
    const listed = value(await store.list());
    expect(listed.problems).toEqual([]);
    expect(listed.items.map((s) => [s.summary.name, s.summary.workers, s.revision, s.savedAt])).toEqual([['North site, spring', 40, 1, NOW.toISOString()]]);
    expect(value(await store.open(session.id))).toEqual(session);
    value(await store.delete(session.id));
    expect(value(await store.list()).items).toEqual([]);
    expect(await store.open(session.id)).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
  });

  it('keeps the rows apart: the list reads no rows, and deleting a session deletes its rows', async () => {
    const name = `sessions-${++counter}`;
    const store = await fresh(name);
    const session = demoSession();
    value(await store.save(session, NOW));
    const db = await openDB(name);
    const head = (await db.get(STORES.checkupSessions, session.id)) as { session: Record<string, unknown> };
    expect(Object.keys(head.session)).not.toContain('rows');
    expect(Object.keys(head.session)).not.toContain('problems');
    expect(((await db.get(STORES.checkupSessionRows, session.id)) as { rows: unknown[] }).rows).toHaveLength(session.rows.length);
    db.close();
    value(await store.delete(session.id));
    const after = await openDB(name);
    expect(await after.get(STORES.checkupSessionRows, session.id)).toBeUndefined();
    after.close();
  });

  it('refuses a session saved by a newer version, lists why, and leaves it as it was', async () => {
    const name = `sessions-${++counter}`;
    const store = await fresh(name);
    const session = demoSession();
    value(await store.save(session, NOW));
    // A later program wrote format 2: simulate it by changing the stored records' versions.
    const db = await openDB(name);
    const head = (await db.get(STORES.checkupSessions, session.id)) as { session: Record<string, unknown>; summary: Record<string, unknown> };
    const future = { ...head, session: { ...head.session, sessionVersion: SESSION_VERSION + 1 }, summary: { ...head.summary, sessionVersion: SESSION_VERSION + 1 } };
    await db.put(STORES.checkupSessions, future);
    db.close();
    const listed = value(await store.list());
    expect(listed.items).toEqual([]);
    expect(listed.problems).toMatchObject([{ code: 'newer-record', message: expect.stringContaining('newer version of Hundredfold') }]);
    expect(await store.open(session.id)).toMatchObject({ ok: false, issues: [{ code: 'newer-record' }] });
    const again = await openDB(name);
    expect(await again.get(STORES.checkupSessions, session.id)).toEqual(future);
    expect(((await again.get(STORES.checkupSessionRows, session.id)) as { rows: unknown[] }).rows).toHaveLength(session.rows.length);
    again.close();
  });

  it('refuses a second save under the same id', async () => {
    const store = await fresh();
    value(await store.save(demoSession(), NOW));
    expect(await store.save(demoSession(), NOW)).toMatchObject({ ok: false, issues: [{ code: 'id-taken' }] });
  });
});

describe('database version 4', () => {
  it('upgrades a version 3 library and keeps its tables and entries', async () => {
    const name = `upgrade-${++counter}`;
    const v3old = await openDB(name, 3, {
      upgrade(database, oldVersion) {
        for (const step of upgradeStepsBetween(oldVersion, 3)) for (const spec of step.createStores) database.createObjectStore(spec.name, { keyPath: spec.keyPath });
      },
    });
    const storedTable = toStoredTable(TABLE, NOW, undefined, 3);
    await v3old.put(STORES.tables, storedTable);
    await v3old.put(STORES.tableSummaries, summariseStoredTable(storedTable));
    await v3old.put(STORES.evidence, toStoredEvidence(ENTRY, NOW, undefined, 2));
    expect([...v3old.objectStoreNames].sort()).toEqual(['evidence', 'table-summaries', 'tables', 'templates', 'tombstones']);
    v3old.close();

    const library = value(await openLibrary({ name }));
    expect(value(await library.listTables()).items.map((t) => [t.id, t.revision])).toEqual([['north-hf', 3]]);
    expect(value(await library.getTable('north-hf')).table).toEqual(TABLE);
    expect(value(await library.listEvidence()).items.map((e) => [e.entry, e.revision])).toEqual([[ENTRY, 2]]);
    library.close();
    const store = await fresh(name);
    expect(value(await store.list()).items).toEqual([]);
    const v4 = await openDB(name);
    expect(v4.version).toBe(4);
    expect([...v4.objectStoreNames].sort()).toEqual(['checkup-session-rows', 'checkup-sessions', 'evidence', 'table-summaries', 'tables', 'templates', 'tombstones']);
    v4.close();
  });
});
