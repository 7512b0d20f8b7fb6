/**
 * Handout templates in the browser library (IndexedDB, app/storage/library.ts): one record per
 * template, with a revision, through the same generic record store as the tables and evidence
 * entries, so two tabs cannot overwrite each other's change or bring back a deleted template
 * (lib/storage/policy.ts). What each save, rename or import writes is planned purely by
 * lib/handout/templateRecords.ts; this file reads the current list, asks it, and writes.
 *
 * Templates kept by earlier versions under one localStorage key are moved into the library once
 * ({@link moveLegacyTemplates}); the key is removed only after they were all written.
 * Nothing here throws: every operation resolves to a {@link Result}.
 */
import {
  exportTemplateFile,
  parseTemplateFile,
  planTemplateImport,
  planTemplateRename,
  planTemplateSave,
  sortTemplateRecords,
  type Clinic,
  type HandoutBlocks,
  type ImportOutcome,
  type TakenTemplate,
  type TemplateRecord,
} from '@/lib/handout';
import { fail, ok, type Issue, type Result } from '@/lib/result';
import type { Library } from '@/app/storage/library';
import type { StoredTemplate } from '@/lib/storage/records';
import { onLibraryChange } from '@/app/storage/changes';

/** Calls `listener` whenever any tab changes the saved templates; returns the unsubscribe function. */
export function onTemplatesChanged(listener: () => void): () => void {
  return onLibraryChange((change) => {
    if (change.kind === 'templates') listener();
  });
}

/** Where versions before the library kept templates (one JSON file's text under one key). */
export const LEGACY_TEMPLATE_KEY = 'hundredfold.handout-templates';

/** The part of the Web Storage API the move from localStorage uses. */
export interface LegacyStorage {
  getItem(key: string): string | null;
  removeItem(key: string): void;
}

export interface TemplateListing {
  readonly records: readonly TemplateRecord[];
  /** Saved templates that could not be read (damaged, or from a newer version); left untouched. */
  readonly problems: readonly Issue[];
}

export interface TemplateStore {
  list(): Promise<Result<TemplateListing>>;
  /** Saves the editor's blocks under a name; `taken` is the template last taken up with "Use template". */
  save(taken: TakenTemplate | undefined, input: { name: string; blocks: HandoutBlocks; clinic: Clinic }): Promise<Result<TemplateRecord>>;
  rename(taken: TakenTemplate | undefined, id: string, to: string): Promise<Result<TemplateRecord>>;
  remove(id: string): Promise<Result<void>>;
  importFile(text: string): Promise<Result<Pick<ImportOutcome, 'added' | 'renamed'>>>;
  /** The saved templates as an export file's text (the same format as before). */
  exportFile(): Promise<Result<string>>;
}

/** A fresh record id: random, so two tabs never pick the same one. */
export function newTemplateId(): string {
  const bytes = new Uint8Array(8);
  crypto.getRandomValues(bytes);
  return `template-${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}`;
}

export function createTemplateStore(library: Library, newId: () => string = newTemplateId): TemplateStore {
  async function list(): Promise<Result<TemplateListing>> {
    const listed = await library.listTemplates();
    if (!listed.ok) return listed;
    const records = sortTemplateRecords(listed.value.items.map((s) => ({ id: s.id, revision: s.revision, template: s.template })));
    return ok({ records, problems: listed.value.problems });
  }

  function asRecord(written: Result<StoredTemplate>): Result<TemplateRecord> {
    return written.ok ? ok({ id: written.value.id, revision: written.value.revision, template: written.value.template }) : written;
  }

  return {
    list,
    save: async (taken, input) => {
      const current = await list();
      if (!current.ok) return current;
      const planned = planTemplateSave(current.value.records, taken, input, newId());
      return planned.ok ? asRecord(await library.writeTemplate(planned.value)) : planned;
    },
    rename: async (taken, id, to) => {
      const current = await list();
      if (!current.ok) return current;
      const planned = planTemplateRename(current.value.records, taken, id, to);
      return planned.ok ? asRecord(await library.writeTemplate(planned.value)) : planned;
    },
    remove: (id) => library.deleteTemplate(id),
    importFile: async (text) => {
      const current = await list();
      if (!current.ok) return current;
      const planned = planTemplateImport(current.value.records, text, newId);
      if (!planned.ok) return planned;
      const written = await library.importTemplates(planned.value.writes);
      return written.ok ? ok(planned.value.outcome) : written;
    },
    exportFile: async () => {
      const current = await list();
      return current.ok ? ok(exportTemplateFile(current.value.records.map((r) => r.template))) : current;
    },
  };
}

/**
 * Moves templates an earlier version kept in localStorage into the library, once: they are
 * imported as new records (a name already taken gets " (2)"), and the old key is removed only
 * when all were written. Unreadable old templates are left where they were, with an issue.
 * Resolves to how many were moved (0 when there was nothing to move).
 */
export async function moveLegacyTemplates(store: TemplateStore, storage: LegacyStorage): Promise<Result<number>> {
  let text: string | null;
  try {
    text = storage.getItem(LEGACY_TEMPLATE_KEY);
  } catch {
    return ok(0);
  }
  if (text === null) return ok(0);
  const parsed = parseTemplateFile(text);
  if (!parsed.ok) {
    return fail([
      {
        code: 'legacy-templates-unreadable',
        path: [],
        message: `Templates saved by an earlier version of Hundredfold could not be read, so they were left as they were: ${parsed.issues[0]?.message ?? 'unknown problem'}`,
      },
    ]);
  }
  if (parsed.value.length > 0) {
    const imported = await store.importFile(text);
    if (!imported.ok) return imported;
  }
  try {
    storage.removeItem(LEGACY_TEMPLATE_KEY);
  } catch {
    // The old copy stays, so the next visit would import it again: say so.
    return fail([{ code: 'storage-failed', path: [], message: 'The templates were moved into the library, but the old copy could not be removed; they may appear twice' }]);
  }
  return ok(parsed.value.length);
}
