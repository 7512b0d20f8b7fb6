import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { openLibrary, type Library } from '@/app/storage/library';
import { onLibraryChange } from '@/app/storage/changes';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { LibraryChange } from '@/lib/storage/policy';
import type { Result } from '@/lib/result';

// Two tabs are two connections to one database. Entries are the demo ones with new ids (illustrative).
const ENTRY: EvidenceEntry = { ...DEMO_EVIDENCE[0]!, id: 'workforce-hf', title: 'Workforce cohort' };

let counter = 0;
const open: Library[] = [];
async function tabs(): Promise<[Library, Library]> {
  const name = `two-tabs-${++counter}`;
  const a = await openLibrary({ name });
  const b = await openLibrary({ name });
  if (!a.ok || !b.ok) throw new Error('could not open');
  open.push(a.value, b.value);
  return [a.value, b.value];
}
afterEach(() => {
  for (const l of open.splice(0)) l.close();
});
function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value;
}

describe('two tabs editing one library', () => {
  it('refuses the second of two edits made from the same revision, and keeps the first', async () => {
    const [a, b] = await tabs();
    const saved = value(await a.saveEvidence(ENTRY));
    expect(saved.revision).toBe(1);
    // Both tabs opened the entry at revision 1.
    const first = value(await a.saveEvidence({ ...ENTRY, title: 'Changed in tab A' }, { revision: 1 }));
    expect(first.revision).toBe(2);
    const second = await b.saveEvidence({ ...ENTRY, title: 'Changed in tab B' }, { revision: 1 });
    expect(second).toMatchObject({ ok: false, issues: [{ code: 'stale-revision' }] });
    expect(!second.ok && second.issues[0]?.message).toMatch(/“Changed in tab A” was changed in another tab/);
    expect(value(await b.getEvidence('workforce-hf')).entry.title).toBe('Changed in tab A');
    // Told, tab B may save again from the fresh revision.
    expect(value(await b.saveEvidence({ ...ENTRY, title: 'Changed in tab B' }, { revision: 2 })).revision).toBe(3);
  });

  it('a stale save cannot bring back an entry deleted in the other tab', async () => {
    const [a, b] = await tabs();
    value(await a.saveEvidence(ENTRY));
    value(await a.deleteEvidence('workforce-hf'));
    const stale = await b.saveEvidence({ ...ENTRY, title: 'Edited in tab B' }, { revision: 1 });
    expect(stale).toMatchObject({ ok: false, issues: [{ code: 'deleted-elsewhere' }] });
    expect(value(await b.listEvidence()).items).toEqual([]);
    // A deliberate new save under the id starts above the deleted revision.
    expect(value(await b.saveEvidence(ENTRY)).revision).toBe(2);
  });

  it('a table deleted in one tab cannot be renamed back by the other', async () => {
    const [a, b] = await tabs();
    const table = { ...DEMO_HEART_FAILURE_10Y, id: 'north-hf', title: 'North' };
    value(await a.saveTable(table));
    value(await a.deleteTable('north-hf'));
    expect(await b.renameTable('north-hf', 'Back again')).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(value(await b.listTables()).items).toEqual([]);
  });

  it('announces every change to the other tabs', async () => {
    const [a] = await tabs();
    const heard: LibraryChange[] = [];
    const stop = onLibraryChange((c) => heard.push(c));
    try {
      value(await a.saveEvidence(ENTRY));
      value(await a.deleteEvidence('workforce-hf'));
      await new Promise((resolve) => setTimeout(resolve, 50));
      expect(heard.map((c) => [c.kind, c.id, c.change])).toEqual([
        ['evidence', 'workforce-hf', 'saved'],
        ['evidence', 'workforce-hf', 'deleted'],
      ]);
    } finally {
      stop();
    }
  });
});
