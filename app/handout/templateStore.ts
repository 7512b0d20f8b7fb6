/**
 * Handout templates in the browser's localStorage, under one key, in the same versioned JSON
 * as the export file (lib/handout/template.ts). Every change reads the saved list, applies a
 * pure function from lib/handout and writes the result only when that succeeded, so a refused
 * change or a bad import leaves what is saved exactly as it was. Storage is passed in (a fake
 * in tests, `window.localStorage` in the page).
 *
 * Like the tables and evidence in the generic record store (app/storage/recordStore.ts), every
 * change is announced to the other open tabs on the library's change channel (kind
 * "templates"; app/storage/changes.ts); {@link onTemplatesChanged} lets a screen re-read.
 */
import {
  deleteTemplate,
  exportTemplateFile,
  importTemplates,
  parseTemplateFile,
  renameTemplate,
  saveTemplate,
  type Clinic,
  type HandoutBlocks,
  type HandoutTemplate,
  type ImportOutcome,
} from '@/lib/handout';
import { fail, ok, type Result } from '@/lib/result';
import { announceLibraryChange, onLibraryChange } from '@/app/storage/changes';

/** Calls `listener` whenever any tab changes the saved templates; returns the unsubscribe function. */
export function onTemplatesChanged(listener: () => void): () => void {
  return onLibraryChange((change) => {
    if (change.kind === 'templates') listener();
  });
}

export const TEMPLATE_STORAGE_KEY = 'hundredfold.handout-templates';

/** The part of the Web Storage API the store uses. */
export interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

export interface TemplateStore {
  /** The saved templates; an empty list when none were saved; issues when storage holds something unreadable. */
  load(): Result<HandoutTemplate[]>;
  save(template: { name: string; blocks: HandoutBlocks; clinic: Clinic }): Result<HandoutTemplate[]>;
  rename(from: string, to: string): Result<HandoutTemplate[]>;
  remove(name: string): Result<HandoutTemplate[]>;
  importFile(text: string): Result<ImportOutcome>;
  /** The saved templates as an export file's text. */
  exportFile(): Result<string>;
}

export function createTemplateStore(storage: StorageLike): TemplateStore {
  function load(): Result<HandoutTemplate[]> {
    let text: string | null;
    try {
      text = storage.getItem(TEMPLATE_STORAGE_KEY);
    } catch {
      return fail([{ code: 'storage-unavailable', path: [], message: 'The browser does not allow saved templates here (storage is blocked)' }]);
    }
    if (text === null) return ok([]);
    const parsed = parseTemplateFile(text);
    if (parsed.ok) return parsed;
    return fail([
      {
        code: 'storage-unreadable',
        path: [],
        message: `The saved templates in this browser cannot be read, so nothing will be changed: ${parsed.issues[0]?.message ?? 'unknown problem'}`,
      },
    ]);
  }

  function write(list: readonly HandoutTemplate[]): Result<null> {
    try {
      storage.setItem(TEMPLATE_STORAGE_KEY, exportTemplateFile(list));
      return ok(null);
    } catch {
      return fail([{ code: 'storage-full', path: [], message: 'The templates could not be saved: the browser\u2019s storage is full or blocked' }]);
    }
  }

  function change<T>(apply: (list: HandoutTemplate[]) => Result<T>, listOf: (value: T) => readonly HandoutTemplate[]): Result<T> {
    const current = load();
    if (!current.ok) return current;
    const next = apply(current.value);
    if (!next.ok) return next;
    const written = write(listOf(next.value));
    if (written.ok) announceLibraryChange('templates', '*', 'saved');
    return written.ok ? next : written;
  }

  return {
    load,
    save: (template) => change((list) => saveTemplate(list, template), (l) => l),
    rename: (from, to) => change((list) => renameTemplate(list, from, to), (l) => l),
    remove: (name) => change((list) => ok(deleteTemplate(list, name)), (l) => l),
    importFile: (text) => change((list) => importTemplates(list, text), (o) => o.templates),
    exportFile: () => {
      const current = load();
      return current.ok ? ok(exportTemplateFile(current.value)) : current;
    },
  };
}
