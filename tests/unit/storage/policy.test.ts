import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decideDelete, decideSave, EVIDENCE_WORDS, nextRevision, planImport, readLibraryChange, TABLE_WORDS } from '@/lib/storage/policy';

const HF = { revision: 3, title: 'North heart failure' };

describe('decideSave', () => {
  it('a first save is revision 1; an edit from the stored revision is one more', () => {
    expect(decideSave('hf', TABLE_WORDS, { kind: 'new' }, undefined, undefined)).toEqual({ ok: true, value: { revision: 1 } });
    expect(decideSave('hf', TABLE_WORDS, { kind: 'edit', revision: 3 }, HF, undefined)).toEqual({ ok: true, value: { revision: 4 } });
  });

  it('refuses an edit made from an older revision, naming the record', () => {
    const r = decideSave('hf', TABLE_WORDS, { kind: 'edit', revision: 2 }, HF, undefined);
    expect(r).toMatchObject({ ok: false, issues: [{ code: 'stale-revision' }] });
    expect(!r.ok && r.issues[0]?.message).toMatch(/^Not saved: “North heart failure” was changed in another tab or window/);
  });

  it('never brings back a deleted record from a stale edit', () => {
    const r = decideSave('hf', EVIDENCE_WORDS, { kind: 'edit', revision: 3 }, undefined, { revision: 3 });
    expect(r).toMatchObject({ ok: false, issues: [{ code: 'deleted-elsewhere' }] });
    expect(!r.ok && r.issues[0]?.message).toMatch(/deleted in another tab or window.*stays deleted/);
  });

  it('a new record under a deleted id starts above the tombstone', () => {
    expect(decideSave('hf', TABLE_WORDS, { kind: 'new' }, undefined, { revision: 7 })).toEqual({ ok: true, value: { revision: 8 } });
  });

  it('refuses a taken id for a new record; replace overwrites', () => {
    expect(decideSave('hf', TABLE_WORDS, { kind: 'new' }, HF, undefined)).toMatchObject({ ok: false, issues: [{ code: 'id-taken' }] });
    expect(decideSave('hf', TABLE_WORDS, { kind: 'replace' }, HF, undefined)).toEqual({ ok: true, value: { revision: 4 } });
  });

  it('refuses reserved ids whatever the mode', () => {
    for (const mode of [{ kind: 'new' }, { kind: 'replace' }, { kind: 'edit', revision: 1 }] as const) {
      expect(decideSave('demo-x', TABLE_WORDS, mode, undefined, undefined)).toMatchObject({ ok: false, issues: [{ code: 'reserved-id' }] });
    }
  });

  it('property: an edit succeeds exactly when its revision is the stored one, and the new revision is above every earlier one', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1000 }),
        fc.option(fc.integer({ min: 1, max: 1000 }), { nil: undefined }),
        fc.option(fc.integer({ min: 1, max: 1000 }), { nil: undefined }),
        (read, stored, dead) => {
          const current = stored === undefined ? undefined : { revision: stored, title: 't' };
          const tombstone = dead === undefined ? undefined : { revision: dead };
          const r = decideSave('x', TABLE_WORDS, { kind: 'edit', revision: read }, current, tombstone);
          expect(r.ok).toBe(stored !== undefined && stored === read);
          if (r.ok) expect(r.value.revision).toBeGreaterThan(Math.max(stored ?? 0, dead ?? 0));
        },
      ),
    );
  });
});

describe('decideDelete and nextRevision', () => {
  it('keeps the last revision in the tombstone; nothing to delete is not-found', () => {
    expect(decideDelete('hf', TABLE_WORDS, HF)).toEqual({ ok: true, value: { revision: 3 } });
    expect(decideDelete('hf', TABLE_WORDS, undefined)).toMatchObject({ ok: false, issues: [{ code: 'not-found' }] });
    expect(nextRevision(undefined, undefined)).toBe(1);
    expect(nextRevision({ revision: 2, title: '' }, { revision: 5 })).toBe(6);
  });
});

describe('planImport', () => {
  const demo = new Set(['demo-a']);
  it('adds new ids, skips demo ids, refuses taken ids unless replacing', () => {
    expect(planImport(['a', 'demo-a', 'b'], new Set(['b']), demo, true, EVIDENCE_WORDS)).toEqual({ ok: true, value: { added: ['a'], replaced: ['b'], skipped: ['demo-a'] } });
    const refused = planImport(['a', 'b'], new Set(['b']), demo, false, EVIDENCE_WORDS);
    expect(!refused.ok && refused.issues[0]?.message).toBe('An entry in the file has an id already in the library ("b"); nothing was imported. Import again choosing "replace" to overwrite them');
  });

  it('refuses other reserved ids, naming where they are', () => {
    expect(planImport(['a', 'demo-mine'], new Set(), demo, true, EVIDENCE_WORDS)).toMatchObject({ ok: false, issues: [{ code: 'reserved-id', path: ['entries', 1, 'id'] }] });
  });
});

describe('change messages', () => {
  it('reads its own messages and nothing else', () => {
    expect(readLibraryChange({ kind: 'evidence', id: 'x', change: 'deleted', nonce: 'n' })).toEqual({ kind: 'evidence', id: 'x', change: 'deleted', nonce: 'n' });
    for (const other of [null, 'x', { kind: 'secrets', id: 'x', change: 'saved', nonce: 'n' }, { kind: 'tables', id: 1, change: 'saved', nonce: 'n' }]) expect(readLibraryChange(other)).toBeUndefined();
  });
});
