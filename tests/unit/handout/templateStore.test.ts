import { describe, expect, it } from 'vitest';
import { createTemplateStore, TEMPLATE_STORAGE_KEY, type StorageLike } from '@/app/handout/templateStore';
import { DEFAULT_BLOCKS, exportTemplateFile, type HandoutTemplate } from '@/lib/handout';

class FakeStorage implements StorageLike {
  readonly data = new Map<string, string>();
  writes = 0;
  failWrites = false;
  getItem(key: string): string | null {
    return this.data.get(key) ?? null;
  }
  setItem(key: string, value: string): void {
    if (this.failWrites) throw new Error('QuotaExceededError');
    this.writes += 1;
    this.data.set(key, value);
  }
}

const A: HandoutTemplate = { name: 'Diabetes clinic', blocks: DEFAULT_BLOCKS, clinic: { name: 'North Street Practice' } };

describe('template store over a fake storage', () => {
  it('starts empty and saves, renames, deletes', () => {
    const storage = new FakeStorage();
    const store = createTemplateStore(storage);
    expect(store.load()).toEqual({ ok: true, value: [] });
    expect(store.save(A).ok).toBe(true);
    expect(store.load()).toEqual({ ok: true, value: [A] });
    expect(store.rename('Diabetes clinic', 'Diabetes').ok).toBe(true);
    expect(store.load()).toEqual({ ok: true, value: [{ ...A, name: 'Diabetes' }] });
    expect(store.remove('Diabetes')).toEqual({ ok: true, value: [] });
    expect(storage.data.get(TEMPLATE_STORAGE_KEY)).toBe(exportTemplateFile([]));
  });

  it('stores the export format itself', () => {
    const storage = new FakeStorage();
    const store = createTemplateStore(storage);
    store.save(A);
    expect(storage.data.get(TEMPLATE_STORAGE_KEY)).toBe(exportTemplateFile([A]));
    expect(store.exportFile()).toEqual({ ok: true, value: exportTemplateFile([A]) });
  });

  it('a bad import changes nothing saved and writes nothing', () => {
    const storage = new FakeStorage();
    const store = createTemplateStore(storage);
    store.save(A);
    const before = storage.data.get(TEMPLATE_STORAGE_KEY);
    const writes = storage.writes;
    const r = store.importFile('{"format":"hundredfold-handout-templates","version":1,"templates":[{"name":"X"}]}');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.message).toMatch(/^Template 1 \("X"\): /);
    expect(storage.data.get(TEMPLATE_STORAGE_KEY)).toBe(before);
    expect(storage.writes).toBe(writes);
  });

  it('a good import adds, renaming taken names', () => {
    const storage = new FakeStorage();
    const store = createTemplateStore(storage);
    store.save(A);
    const r = store.importFile(exportTemplateFile([A]));
    expect(r.ok && r.value.renamed).toEqual([{ from: 'Diabetes clinic', to: 'Diabetes clinic (2)' }]);
    expect(store.load().ok && (store.load() as { value: HandoutTemplate[] }).value.length).toBe(2);
  });

  it('refuses to change unreadable storage and reports it', () => {
    const storage = new FakeStorage();
    storage.data.set(TEMPLATE_STORAGE_KEY, '{broken');
    const store = createTemplateStore(storage);
    const loaded = store.load();
    expect(loaded.ok).toBe(false);
    if (!loaded.ok) expect(loaded.issues[0]?.code).toBe('storage-unreadable');
    expect(store.save(A).ok).toBe(false);
    expect(storage.data.get(TEMPLATE_STORAGE_KEY)).toBe('{broken');
    expect(storage.writes).toBe(0);
  });

  it('reports a full or blocked storage as an issue, not an exception', () => {
    const storage = new FakeStorage();
    storage.failWrites = true;
    const r = createTemplateStore(storage).save(A);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('storage-full');
    const blocked: StorageLike = {
      getItem: () => {
        throw new Error('SecurityError');
      },
      setItem: () => undefined,
    };
    const b = createTemplateStore(blocked).load();
    expect(b.ok).toBe(false);
    if (!b.ok) expect(b.issues[0]?.code).toBe('storage-unavailable');
  });
});
