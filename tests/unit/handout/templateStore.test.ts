import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { createTemplateStore, LEGACY_TEMPLATE_KEY, moveLegacyTemplates, type LegacyStorage, type TemplateStore } from '@/app/handout/templateStore';
import { openLibrary, type Library } from '@/app/storage/library';
import { DEFAULT_BLOCKS, exportTemplateFile, type HandoutTemplate } from '@/lib/handout';
import type { Result } from '@/lib/result';

// Templates are invented (illustrative). Two stores on one database name are two tabs.
const A: HandoutTemplate = { name: 'Diabetes clinic', blocks: DEFAULT_BLOCKS, clinic: { name: 'North Street Practice' } };
const B: HandoutTemplate = { name: 'Heart clinic', blocks: { ...DEFAULT_BLOCKS, title: 'Your heart and what changes it' }, clinic: {} };

let counter = 0;
const open: Library[] = [];
async function library(name: string): Promise<Library> {
  const opened = await openLibrary({ name });
  if (!opened.ok) throw new Error('could not open');
  open.push(opened.value);
  return opened.value;
}
/** One store, or two on the same database (two tabs); ids are numbered so tests can name them. */
async function stores(n: 1 | 2 = 1): Promise<TemplateStore[]> {
  const name = `templates-${++counter}`;
  let next = 0;
  const newId = () => `t${++next}`;
  const out: TemplateStore[] = [];
  for (let i = 0; i < n; i++) out.push(createTemplateStore(await library(name), newId));
  return out;
}
afterEach(() => {
  for (const l of open.splice(0)) l.close();
});
function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value;
}
async function names(store: TemplateStore): Promise<string[]> {
  return value(await store.list()).records.map((r) => r.template.name);
}

class FakeLocalStorage implements LegacyStorage {
  readonly data = new Map<string, string>();
  getItem(key: string): string | null {
    return this.data.get(key) ?? null;
  }
  removeItem(key: string): void {
    this.data.delete(key);
  }
}

describe('template store in the browser library', () => {
  it('starts empty and saves, renames, deletes', async () => {
    const [store] = await stores();
    expect(value(await store!.list())).toEqual({ records: [], problems: [] });
    const saved = value(await store!.save(undefined, A));
    expect(saved).toEqual({ id: 't1', revision: 1, template: A });
    expect(value(await store!.rename(undefined, 't1', 'Diabetes')).template.name).toBe('Diabetes');
    expect(await names(store!)).toEqual(['Diabetes']);
    expect((await store!.remove('t1')).ok).toBe(true);
    expect(await names(store!)).toEqual([]);
  });

  it('exports the same file format as before (lists by name)', async () => {
    const [store] = await stores();
    await store!.save(undefined, B);
    await store!.save(undefined, A);
    expect(await store!.exportFile()).toEqual({ ok: true, value: exportTemplateFile([A, B]) });
  });

  it('saving under a listed name replaces that template (one record, next revision)', async () => {
    const [store] = await stores();
    await store!.save(undefined, A);
    const again = value(await store!.save(undefined, { ...A, name: 'diabetes CLINIC', clinic: {} }));
    expect(again.id).toBe('t1');
    expect(again.revision).toBe(2);
    expect(await names(store!)).toEqual(['diabetes CLINIC']);
  });

  it('a bad import changes nothing saved', async () => {
    const [store] = await stores();
    await store!.save(undefined, A);
    const r = await store!.importFile('{"format":"hundredfold-handout-templates","version":1,"templates":[{"name":"X"}]}');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.message).toMatch(/^Template 1 \("X"\): /);
    expect(value(await store!.list()).records).toEqual([{ id: 't1', revision: 1, template: A }]);
  });

  it('a good import adds, renaming taken names', async () => {
    const [store] = await stores();
    await store!.save(undefined, A);
    const r = value(await store!.importFile(exportTemplateFile([A, B])));
    expect(r.renamed).toEqual([{ from: 'Diabetes clinic', to: 'Diabetes clinic (2)' }]);
    expect(await names(store!)).toEqual(['Diabetes clinic', 'Diabetes clinic (2)', 'Heart clinic']);
  });
});

describe('two tabs (issue 14 item 1, for templates)', () => {
  it('a save of a template taken up before another tab changed it is refused, and the change is kept', async () => {
    const [a, b] = await stores(2);
    const first = value(await a!.save(undefined, A));
    const taken = { id: first.id, revision: first.revision, name: A.name };
    // Both tabs took it up at revision 1; tab A saves a change first.
    value(await a!.save(taken, { ...A, clinic: { name: 'Changed in tab A' } }));
    const stale = await b!.save(taken, { ...A, clinic: { name: 'Changed in tab B' } });
    expect(stale.ok).toBe(false);
    if (!stale.ok) expect(stale.issues.map((i) => i.code)).toEqual(['stale-revision']);
    expect(value(await b!.list()).records[0]?.template.clinic).toEqual({ name: 'Changed in tab A' });
  });

  it('a template deleted in one tab cannot come back from a stale save in the other', async () => {
    const [a, b] = await stores(2);
    const first = value(await a!.save(undefined, A));
    const taken = { id: first.id, revision: first.revision, name: A.name };
    value(await a!.remove(first.id));
    const stale = await b!.save(taken, A);
    expect(stale.ok).toBe(false);
    if (!stale.ok) expect(stale.issues.map((i) => i.code)).toEqual(['deleted-elsewhere']);
    expect(await names(b!)).toEqual([]);
    // Saved without taking it up, it is a new template with a new id.
    expect(value(await b!.save(undefined, A)).id).not.toBe(first.id);
  });

  it('a rename from a stale listing is refused', async () => {
    const [a, b] = await stores(2);
    const first = value(await a!.save(undefined, A));
    const taken = { id: first.id, revision: first.revision, name: A.name };
    value(await a!.save(taken, { ...A, clinic: { name: 'Changed' } }));
    const stale = await b!.rename(taken, first.id, 'Renamed in tab B');
    expect(stale.ok).toBe(false);
    if (!stale.ok) expect(stale.issues.map((i) => i.code)).toEqual(['stale-revision']);
  });
});

describe('moving templates kept in localStorage by earlier versions', () => {
  it('moves them into the library once and removes the old key', async () => {
    const [store] = await stores();
    const local = new FakeLocalStorage();
    local.data.set(LEGACY_TEMPLATE_KEY, exportTemplateFile([A, B]));
    expect(await moveLegacyTemplates(store!, local)).toEqual({ ok: true, value: 2 });
    expect(local.data.has(LEGACY_TEMPLATE_KEY)).toBe(false);
    expect(await names(store!)).toEqual(['Diabetes clinic', 'Heart clinic']);
    // A second visit has nothing left to move.
    expect(await moveLegacyTemplates(store!, local)).toEqual({ ok: true, value: 0 });
    expect(await names(store!)).toEqual(['Diabetes clinic', 'Heart clinic']);
  });

  it('leaves unreadable old templates where they were, with an issue', async () => {
    const [store] = await stores();
    const local = new FakeLocalStorage();
    local.data.set(LEGACY_TEMPLATE_KEY, '{broken');
    const moved = await moveLegacyTemplates(store!, local);
    expect(moved.ok).toBe(false);
    if (!moved.ok) expect(moved.issues[0]?.code).toBe('legacy-templates-unreadable');
    expect(local.data.get(LEGACY_TEMPLATE_KEY)).toBe('{broken');
    expect(await names(store!)).toEqual([]);
  });

  it('a blocked localStorage moves nothing and is no error', async () => {
    const [store] = await stores();
    const blocked: LegacyStorage = {
      getItem: () => {
        throw new Error('SecurityError');
      },
      removeItem: () => undefined,
    };
    expect(await moveLegacyTemplates(store!, blocked)).toEqual({ ok: true, value: 0 });
  });
});
