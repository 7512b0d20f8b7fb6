import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { openLibrary, type Library } from '@/app/storage/library';
import { exportTableCsv } from '@/lib/tables/csv';
import { DEMO_CORONARY_RATE, DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { exportEvidenceJson } from '@/lib/evidence/file';
import type { PopulationTable } from '@/lib/tables/schema';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { Result } from '@/lib/result';

// Tables and entries below are the demo ones with new ids: illustrative numbers, not from a real population or study.
const TABLE: PopulationTable = { ...DEMO_HEART_FAILURE_10Y, id: 'north-hf', illustrative: false, title: 'North heart failure' };
const RATES: PopulationTable = { ...DEMO_CORONARY_RATE, id: 'north-coronary', title: 'North coronary' };
const ENTRY: EvidenceEntry = { ...DEMO_EVIDENCE[0]!, id: 'workforce-hf', title: 'Workforce cohort' };
const ENTRY2: EvidenceEntry = { ...DEMO_EVIDENCE[1]!, id: 'nested-cc', title: 'Nested case-control' };
const NOW = new Date('2025-03-01T10:00:00.000Z');

let counter = 0;
const open: Library[] = [];
async function fresh(name = `test-${++counter}`): Promise<Library> {
  const r = await openLibrary({ name });
  if (!r.ok) throw new Error(r.issues[0]?.message);
  open.push(r.value);
  return r.value;
}
afterEach(() => {
  for (const l of open.splice(0)) l.close();
});

function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(`expected ok, got ${JSON.stringify(r.issues)}`);
  return r.value;
}

async function snapshot(lib: Library) {
  return { tables: value(await lib.listTables()), evidence: value(await lib.listEvidence()) };
}

describe('tables in the browser library', () => {
  it('saves, lists, views, renames and deletes a table', async () => {
    const lib = await fresh();
    expect(value(await lib.listTables()).items).toEqual([]);
    const saved = value(await lib.saveTable(TABLE, { now: NOW }));
    expect(saved.table).toEqual(TABLE);
    expect(value(await lib.getTable('north-hf')).table).toEqual(TABLE);
    value(await lib.saveTable(RATES, { now: NOW }));
    expect(value(await lib.listTables()).items.map((t) => [t.id, t.title, t.strataCount])).toEqual([
      ['north-coronary', 'North coronary', 10],
      ['north-hf', 'North heart failure', 10],
    ]);
    const renamed = value(await lib.renameTable('north-hf', '  Heart failure, north district  ', { now: new Date('2025-04-01T00:00:00.000Z') }));
    expect(renamed.table.title).toBe('Heart failure, north district');
    expect([renamed.savedAt, renamed.updatedAt]).toEqual(['2025-03-01T10:00:00.000Z', '2025-04-01T00:00:00.000Z']);
    expect(value(await lib.listTables()).items.find((t) => t.id === 'north-hf')?.title).toBe('Heart failure, north district');
    value(await lib.deleteTable('north-hf'));
    expect(value(await lib.listTables()).items.map((t) => t.id)).toEqual(['north-coronary']);
    expect(await lib.getTable('north-hf')).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(await lib.deleteTable('north-hf')).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
  });

  it('keeps what was saved when the library is opened again (as after a reload)', async () => {
    const first = await fresh('reopen');
    value(await first.saveTable(TABLE));
    first.close();
    const again = await fresh('reopen');
    expect(value(await again.getTable('north-hf')).table).toEqual(TABLE);
  });

  it('refuses a taken id unless replacing, a reserved id, and an invalid table, changing nothing', async () => {
    const lib = await fresh();
    value(await lib.saveTable(TABLE, { now: NOW }));
    const before = await snapshot(lib);
    expect(await lib.saveTable({ ...TABLE, title: 'Other' })).toMatchObject({ ok: false, issues: [{ code: 'id-taken' }] });
    expect(await lib.saveTable(DEMO_HEART_FAILURE_10Y)).toMatchObject({ ok: false, issues: [{ code: 'reserved-id' }] });
    expect(await lib.saveTable({ ...TABLE, id: 'x', strata: [] })).toMatchObject({ ok: false });
    expect(await lib.renameTable('north-hf', '')).toMatchObject({ ok: false, issues: [{ path: ['title'] }] });
    expect(await lib.renameTable('nope', 'T')).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(await snapshot(lib)).toEqual(before);
    const replaced = value(await lib.saveTable({ ...TABLE, title: 'Other' }, { replace: true }));
    expect(replaced.table.title).toBe('Other');
  });

  it('imports a CSV only when it has no problem, and exports it back identically', async () => {
    const lib = await fresh();
    const bad = exportTableCsv(TABLE).replace('0.006', '0,006');
    const refused = await lib.importTableCsv(bad, { chunkChars: 64 });
    expect(refused.ok).toBe(false);
    // 8 detail lines, the header on line 9, so the female 40–49 row is line 11; unquoted, "0,006" splits into two cells.
    expect(!refused.ok && refused.issues[0]).toMatchObject({ code: 'cell-count', line: 11 });
    expect(refused.preview?.rowCount).toBe(10);
    expect(value(await lib.listTables()).items).toEqual([]);

    const progress: number[] = [];
    const imported = await lib.importTableCsv(exportTableCsv(TABLE), { chunkChars: 64, onProgress: (p) => progress.push(p.rowsDone) });
    expect(imported.ok && imported.saved?.table).toEqual(TABLE);
    expect(progress.at(-1)).toBe(10);
    expect(value(await lib.exportTable('north-hf'))).toBe(exportTableCsv(TABLE));
  });

  it('gives a CSV without an id a free id made from its title', async () => {
    const lib = await fresh();
    const withoutId = exportTableCsv(TABLE).replace('# id: north-hf\n', '');
    const a = await lib.importTableCsv(withoutId);
    const b = await lib.importTableCsv(withoutId);
    expect([a.ok && a.value.id, b.ok && b.value.id]).toEqual(['north-heart-failure', 'north-heart-failure-2']);
    expect(value(await lib.freeTableId('Heart failure needing hospital care within 10 years (demo)'))).toBe('heart-failure-needing-hospital-care-within-10-years-demo');
  });

  it('lists a damaged record as a problem and keeps listing the rest', async () => {
    const lib = await fresh('damaged');
    value(await lib.saveTable(TABLE));
    lib.close();
    // Damage the summary directly, as a browser extension or a bug might.
    await new Promise<void>((resolve, reject) => {
      const req = indexedDB.open('damaged');
      req.onsuccess = () => {
        const db = req.result;
        const tx = db.transaction('table-summaries', 'readwrite');
        tx.objectStore('table-summaries').put({ id: 'broken', recordVersion: 1 });
        tx.oncomplete = () => {
          db.close();
          resolve();
        };
        tx.onerror = () => reject(tx.error);
      };
      req.onerror = () => reject(req.error);
    });
    const again = await fresh('damaged');
    const listing = value(await again.listTables());
    expect(listing.items.map((t) => t.id)).toEqual(['north-hf']);
    expect(listing.problems[0]).toMatchObject({ code: 'damaged-record' });
  });
});

describe('evidence entries in the browser library', () => {
  it('saves, finds, edits, renames, deletes and exports entries', async () => {
    const lib = await fresh();
    value(await lib.saveEvidence(ENTRY, { now: NOW }));
    value(await lib.saveEvidence(ENTRY2, { now: NOW }));
    expect(value(await lib.listEvidence()).items.map((e) => e.entry.id)).toEqual(['nested-cc', 'workforce-hf']);
    const edited = value(await lib.saveEvidence({ ...ENTRY, effect: { ...ENTRY.effect, estimate: 1.5 } }, { replace: true }));
    expect(edited.entry.effect.estimate).toBe(1.5);
    expect(value(await lib.renameEvidence('workforce-hf', 'Workforce cohort, HF')).entry.title).toBe('Workforce cohort, HF');
    const file = value(await lib.exportEvidence());
    // Version 2: the demo entries' exposure definitions now name their test and comparison group (lib/evidence/file.ts).
    expect(JSON.parse(file)).toMatchObject({ format: 'hundredfold-evidence', version: 2, entries: [{ id: 'nested-cc' }, { id: 'workforce-hf', title: 'Workforce cohort, HF' }] });
    value(await lib.deleteEvidence('nested-cc'));
    expect(value(await lib.listEvidence()).items.map((e) => e.entry.id)).toEqual(['workforce-hf']);
    expect(await lib.getEvidence('nested-cc')).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(await lib.exportEvidence(['nested-cc'])).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(value(await lib.freeEvidenceId('Workforce HF'))).toBe('workforce-hf-2');
  });

  it('export then import into an empty library gives identical entries', async () => {
    const source = await fresh();
    value(await source.saveEvidence(ENTRY));
    value(await source.saveEvidence(ENTRY2));
    const file = value(await source.exportEvidence());
    const target = await fresh();
    expect(value(await target.importEvidenceJson(file))).toEqual({ added: ['nested-cc', 'workforce-hf'], replaced: [], skipped: [] });
    expect(value(await target.listEvidence()).items.map((e) => e.entry)).toEqual(value(await source.listEvidence()).items.map((e) => e.entry));
  });

  it('a failed import changes nothing: a bad entry, a taken id, bad JSON', async () => {
    const lib = await fresh();
    value(await lib.saveEvidence(ENTRY, { now: NOW }));
    const before = await snapshot(lib);
    const badEntry = exportEvidenceJson([ENTRY2, { ...ENTRY2, id: 'third', effect: { ...ENTRY2.effect, upper: 0.5 } }]);
    const bad = await lib.importEvidenceJson(badEntry);
    expect(!bad.ok && bad.issues[0]?.message).toMatch(/^Entry 2 \("Nested case-control"\), effect\.lower: /);
    const taken = await lib.importEvidenceJson(exportEvidenceJson([ENTRY2, { ...ENTRY, title: 'Changed' }]));
    expect(!taken.ok && taken.issues[0]).toMatchObject({ code: 'id-taken' });
    expect(!taken.ok && taken.issues[0]?.message).toMatch(/"workforce-hf"/);
    expect(await lib.importEvidenceJson('{')).toMatchObject({ ok: false, issues: [{ code: 'invalid-json' }] });
    expect(await lib.saveEvidence({ ...ENTRY, id: 'demo-mine' })).toMatchObject({ ok: false, issues: [{ code: 'reserved-id' }] });
    expect(await snapshot(lib)).toEqual(before);
    // With replace, the same file goes in whole.
    expect(value(await lib.importEvidenceJson(exportEvidenceJson([ENTRY2, { ...ENTRY, title: 'Changed' }]), { replace: true }))).toEqual({
      added: ['nested-cc'],
      replaced: ['workforce-hf'],
      skipped: [],
    });
    expect(value(await lib.getEvidence('workforce-hf')).entry.title).toBe('Changed');
    expect(value(await lib.getEvidence('workforce-hf')).savedAt).toBe(NOW.toISOString());
  });

  it('skips bundled demo entries found in a file', async () => {
    const lib = await fresh();
    expect(value(await lib.importEvidenceJson(exportEvidenceJson([...DEMO_EVIDENCE, ENTRY])))).toEqual({ added: ['workforce-hf'], replaced: [], skipped: DEMO_EVIDENCE.map((e) => e.id) });
  });
});
