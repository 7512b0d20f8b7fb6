import { describe, expect, it } from 'vitest';
import { DB_VERSION, STORES, UPGRADE_STEPS, upgradeStepsBetween, type UpgradeStep } from '@/lib/storage/schema';
import {
  migrateRecord,
  readStoredEvidence,
  readStoredTable,
  readTableSummary,
  RECORD_VERSION,
  summariseStoredTable,
  toStoredEvidence,
  toStoredTable,
  type RecordMigration,
} from '@/lib/storage/records';
import { DEMO_HEART_FAILURE_10Y, DEMO_STROKE_5Y } from '@/lib/tables/demo';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { idFromTitle, uniqueId } from '@/lib/tables/ids';

const NOW = new Date('2025-03-01T10:00:00.000Z');
const LATER = new Date('2025-03-02T11:30:00.000Z');

describe('database layout', () => {
  it('version 1 creates the three stores, each keyed by id', () => {
    // Versions 2 (revisions and tombstones), 3 (templates) and 4 (saved checkups sessions) were
    // added after this test was written; version 1 is unchanged.
    expect(DB_VERSION).toBe(4);
    expect(upgradeStepsBetween(0, 1)).toEqual([
      {
        version: 1,
        createStores: [
          { name: STORES.tables, keyPath: 'table.id' },
          { name: STORES.tableSummaries, keyPath: 'id' },
          { name: STORES.evidence, keyPath: 'entry.id' },
        ],
        deleteStores: [],
      },
    ]);
    expect(upgradeStepsBetween(1, 1)).toEqual([]);
  });

  it('version 2 adds the tombstone store, keyed by store and id', () => {
    expect(upgradeStepsBetween(1, 2)).toEqual([{ version: 2, createStores: [{ name: STORES.tombstones, keyPath: 'key' }], deleteStores: [] }]);
  });

  it('the real steps are versions 1, 2, 3, 4 in order', () => {
    // Version 4 (saved checkups sessions) was added after this test was written.
    expect(UPGRADE_STEPS.map((s) => s.version)).toEqual([1, 2, 3, 4]);
  });

  it('version 4 adds the checkups session stores and touches nothing else', () => {
    expect(upgradeStepsBetween(3, 4)).toEqual([
      {
        version: 4,
        createStores: [
          { name: 'checkup-sessions', keyPath: 'session.id' },
          { name: 'checkup-session-rows', keyPath: 'id' },
        ],
        deleteStores: [],
      },
    ]);
  });

  it('version 3 adds the handout template store, keyed by id', () => {
    expect(upgradeStepsBetween(2, 3)).toEqual([{ version: 3, createStores: [{ name: STORES.templates, keyPath: 'id' }], deleteStores: [] }]);
  });

  it('applies only the steps between two versions, oldest first', () => {
    // Made-up steps 1 to 4 (not the real ones, which grow), listed out of order.
    const steps: UpgradeStep[] = [
      { version: 4, createStores: [], deleteStores: [] },
      { version: 2, createStores: [], deleteStores: [] },
      { version: 1, createStores: [], deleteStores: [] },
      { version: 3, createStores: [], deleteStores: [] },
    ];
    expect(upgradeStepsBetween(2, 4, steps).map((s) => s.version)).toEqual([3, 4]);
    expect(upgradeStepsBetween(0, 3, steps).map((s) => s.version)).toEqual([1, 2, 3]);
  });
});

describe('records', () => {
  it('stores a table with its version and times; an update keeps the first save time', () => {
    const first = toStoredTable(DEMO_HEART_FAILURE_10Y, NOW);
    // Records gained a revision (issue 14 item 1): the first save is revision 1.
    expect(first).toEqual({ recordVersion: RECORD_VERSION, table: DEMO_HEART_FAILURE_10Y, revision: 1, savedAt: '2025-03-01T10:00:00.000Z', updatedAt: '2025-03-01T10:00:00.000Z' });
    const second = toStoredTable(DEMO_HEART_FAILURE_10Y, LATER, first);
    expect([second.savedAt, second.updatedAt]).toEqual(['2025-03-01T10:00:00.000Z', '2025-03-02T11:30:00.000Z']);
    expect(second.revision).toBe(2);
    expect(readStoredTable(first)).toEqual({ ok: true, value: first });
  });

  it('summarises a table for the list (counts hand-checked against lib/tables/demo.ts)', () => {
    const summary = summariseStoredTable(toStoredTable(DEMO_HEART_FAILURE_10Y, NOW));
    expect(summary).toMatchObject({ id: 'demo-heart-failure-10y', form: 'risk', strataCount: 10, sexes: ['female', 'male'], ageFrom: 30, ageTo: 79, extraStrata: [], horizonYears: 10 });
    expect(readTableSummary(summary).ok).toBe(true);
    expect(summariseStoredTable(toStoredTable(DEMO_STROKE_5Y, NOW))).toMatchObject({ sexes: ['any'], ageFrom: 40, ageTo: 120, strataCount: 5 });
  });

  it('stores an evidence entry', () => {
    const stored = toStoredEvidence(DEMO_EVIDENCE[0]!, NOW);
    expect(readStoredEvidence(stored)).toEqual({ ok: true, value: stored });
  });

  it('reports a damaged record without throwing', () => {
    const stored = toStoredTable(DEMO_HEART_FAILURE_10Y, NOW);
    const damaged = { ...stored, table: { ...stored.table, strata: [{ sex: 'female', ageFrom: 30, ageTo: 39, risk: 7 }] } };
    const r = readStoredTable(damaged);
    expect(!r.ok && r.issues[0]).toMatchObject({ code: 'damaged-record', path: ['table', 'strata', 0, 'risk'] });
    expect(!r.ok && r.issues[0]?.message).toMatch(/^The saved table is damaged: The risk must be less than 1/);
    for (const bad of [null, 'x', [], {}, { recordVersion: 0 }, { recordVersion: 1.5 }]) {
      const read = readStoredTable(bad);
      expect(!read.ok && read.issues[0]?.code).toBe('damaged-record');
    }
    expect(readStoredEvidence({ ...toStoredEvidence(DEMO_EVIDENCE[0]!, NOW), savedAt: 'yesterday' }).ok).toBe(false);
  });

  it('refuses a record from a newer version and says why', () => {
    const r = readStoredTable({ ...toStoredTable(DEMO_HEART_FAILURE_10Y, NOW), recordVersion: RECORD_VERSION + 1 });
    expect(!r.ok && r.issues[0]).toMatchObject({ code: 'newer-record' });
  });
});

describe('records saved before revisions (format 1)', () => {
  it('still read, as revision 1, with everything else unchanged', () => {
    const { revision: _r, ...v2 } = toStoredTable(DEMO_HEART_FAILURE_10Y, NOW);
    const v1 = { ...v2, recordVersion: 1 };
    expect(readStoredTable(v1)).toEqual({ ok: true, value: { ...v1, recordVersion: 2, revision: 1 } });
    const { revision: _e, ...e2 } = toStoredEvidence(DEMO_EVIDENCE[0]!, NOW);
    expect(readStoredEvidence({ ...e2, recordVersion: 1 })).toEqual({ ok: true, value: { ...e2, recordVersion: 2, revision: 1 } });
    const { revision: _s, ...s2 } = summariseStoredTable(toStoredTable(DEMO_STROKE_5Y, NOW));
    expect(readTableSummary({ ...s2, recordVersion: 1 })).toMatchObject({ ok: true, value: { recordVersion: 2, revision: 1, id: DEMO_STROKE_5Y.id } });
  });
});

describe('migration path', () => {
  // A made-up history for the test: format 1 had "name" where format 2 has "title", and format 3 added "tags".
  const migrations: Record<number, RecordMigration> = {
    1: ({ name, ...rest }) => ({ ...rest, title: name }),
    2: (record) => ({ ...record, tags: [] }),
  };

  it('applies each step in turn up to the current version', () => {
    expect(migrateRecord({ recordVersion: 1, name: 'A' }, migrations, 3)).toEqual({ ok: true, value: { recordVersion: 3, title: 'A', tags: [] } });
    expect(migrateRecord({ recordVersion: 2, title: 'B' }, migrations, 3)).toEqual({ ok: true, value: { recordVersion: 3, title: 'B', tags: [] } });
    expect(migrateRecord({ recordVersion: 3, title: 'C', tags: ['x'] }, migrations, 3)).toEqual({ ok: true, value: { recordVersion: 3, title: 'C', tags: ['x'] } });
  });

  it('refuses when a step is missing, and leaves the input unchanged', () => {
    const input = { recordVersion: 1, name: 'A' };
    expect(migrateRecord(input, { 2: migrations[2]! }, 3)).toMatchObject({ ok: false, issues: [{ code: 'no-migration' }] });
    expect(migrateRecord(input, migrations, 3).ok).toBe(true);
    expect(input).toEqual({ recordVersion: 1, name: 'A' });
  });
});

describe('ids', () => {
  it('makes ids from titles and keeps them unique', () => {
    expect(idFromTitle('Heart failure (10 y), Région Nord')).toBe('heart-failure-10-y-region-nord');
    expect(idFromTitle('***', 'entry')).toBe('entry');
    expect(uniqueId('hf', new Set())).toBe('hf');
    expect(uniqueId('hf', new Set(['hf', 'hf-2']))).toBe('hf-3');
  });
});
