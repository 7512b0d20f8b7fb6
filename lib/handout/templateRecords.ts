/**
 * Saved handout templates as library records: each template is one record with its own id and
 * revision in the browser library (the same generic record store as the tables and evidence
 * entries, app/storage/recordStore.ts, with the same rules, lib/storage/policy.ts). This module
 * decides, purely, what a save, rename or import writes; the storage only carries it out.
 *
 * The rules of names stay those of ./template.ts (checked there, never restated here): a name
 * is unique in the list ignoring case; saving under a taken name replaces that template; an
 * imported template whose name is taken is saved as "Name (2)".
 *
 * Revisions (lib/storage/policy.ts `decideSave`): a template the educator took up with "Use
 * template" is saved as an edit of the revision they took up, so a change saved meanwhile in
 * another tab is not overwritten (`stale-revision`), and a template deleted meanwhile stays
 * deleted (`deleted-elsewhere`). Saving over another listed template is an edit of the revision
 * this tab last listed.
 */
import { fail, ok, type Issue, type Result } from '../result';
import type { SaveMode } from '../storage/policy';
import type { HandoutBlocks } from './blocks';
import { importTemplates, renameTemplate, saveTemplate, type Clinic, type HandoutTemplate, type ImportOutcome } from './template';

/** A saved template as the screen lists it: the record's id and revision with the template. */
export interface TemplateRecord {
  readonly id: string;
  readonly revision: number;
  readonly template: HandoutTemplate;
}

/** The template the educator took up with "Use template": which record, at which revision. */
export interface TakenTemplate {
  readonly id: string;
  readonly revision: number;
  readonly name: string;
}

/** One record to write, and how (the policy's save mode). */
export interface TemplateWrite {
  readonly id: string;
  readonly template: HandoutTemplate;
  readonly mode: SaveMode;
}

function sameName(a: string, b: string): boolean {
  return a.trim().toLocaleLowerCase('en') === b.trim().toLocaleLowerCase('en');
}

/**
 * What saving the editor's blocks under `input.name` writes. The name and blocks are checked by
 * ./template.ts `saveTemplate` (its issues are returned unchanged). The record written:
 * - the taken-up template when the name is its name (an edit of the revision taken up, even when
 *   another tab has deleted it since, so the policy can refuse it);
 * - else the listed template with that name (an edit of the listed revision);
 * - else a new record with `newId`.
 *
 * @example
 * planTemplateSave([], undefined, { name: 'Clinic', blocks, clinic: {} }, 't1')
 * //=> { ok: true, value: { id: 't1', template: { name: 'Clinic', … }, mode: { kind: 'new' } } }
 */
export function planTemplateSave(
  records: readonly TemplateRecord[],
  taken: TakenTemplate | undefined,
  input: { readonly name: string; readonly blocks: HandoutBlocks; readonly clinic: Clinic },
  newId: string,
): Result<TemplateWrite> {
  // The list the name rules see: the listed templates, less the taken-up one when it is gone.
  const checked = saveTemplate(
    records.map((r) => r.template),
    input,
  );
  if (!checked.ok) return checked;
  const template = checked.value.find((t) => sameName(t.name, input.name));
  if (!template) return fail([{ code: 'not-saved', path: ['name'], message: 'The template could not be saved' }]);
  if (taken && sameName(taken.name, template.name)) return ok({ id: taken.id, template, mode: { kind: 'edit', revision: taken.revision } });
  const listed = records.find((r) => sameName(r.template.name, template.name));
  if (listed) return ok({ id: listed.id, template, mode: { kind: 'edit', revision: listed.revision } });
  return ok({ id: newId, template, mode: { kind: 'new' } });
}

/**
 * What renaming the listed template `id` to `to` writes: an edit of the revision listed (or of
 * the one taken up, when that is the template being renamed). Name rules from ./template.ts.
 */
export function planTemplateRename(records: readonly TemplateRecord[], taken: TakenTemplate | undefined, id: string, to: string): Result<TemplateWrite> {
  const record = records.find((r) => r.id === id);
  if (!record) return fail([{ code: 'not-found', path: ['name'], message: 'That template is no longer saved; it may have been deleted in another tab or window' }]);
  const renamed = renameTemplate(
    records.map((r) => r.template),
    record.template.name,
    to,
  );
  if (!renamed.ok) return renamed;
  const index = records.indexOf(record);
  const template = renamed.value[index];
  if (!template) return fail([{ code: 'not-saved', path: ['name'], message: 'The template could not be renamed' }]);
  const revision = taken && taken.id === id ? taken.revision : record.revision;
  return ok({ id, template, mode: { kind: 'edit', revision } });
}

/**
 * What importing a template file writes: every template in the file as a new record (ids from
 * `newId`), renamed as ./template.ts `importTemplates` renames them; a bad file writes nothing.
 */
export function planTemplateImport(
  records: readonly TemplateRecord[],
  fileText: string,
  newId: () => string,
): Result<{ readonly writes: readonly TemplateWrite[]; readonly outcome: Pick<ImportOutcome, 'added' | 'renamed'> }> {
  const imported = importTemplates(
    records.map((r) => r.template),
    fileText,
  );
  if (!imported.ok) return imported;
  const fresh = imported.value.templates.slice(records.length);
  return ok({
    writes: fresh.map((template) => ({ id: newId(), template, mode: { kind: 'new' } as const })),
    outcome: { added: imported.value.added, renamed: imported.value.renamed },
  });
}

/** The listed templates in the order the picker shows them: by name, ignoring case. */
export function sortTemplateRecords(records: readonly TemplateRecord[]): TemplateRecord[] {
  return [...records].sort((a, b) => a.template.name.localeCompare(b.template.name, 'en', { sensitivity: 'base' }) || a.id.localeCompare(b.id));
}

/**
 * After a refused save or rename, what the panel keeps and says. A template changed in another
 * tab since it was taken up (`stale-revision`) is now taken at its saved revision, so saving
 * again replaces it knowingly; one deleted meanwhile (`deleted-elsewhere`) is no longer taken,
 * so saving again saves it as a new template. Other refusals change nothing.
 */
export function afterTemplateRefusal(
  taken: TakenTemplate | undefined,
  issues: readonly Issue[],
  records: readonly TemplateRecord[],
): { readonly taken: TakenTemplate | undefined; readonly issues: readonly Issue[] } {
  if (!taken) return { taken, issues };
  if (issues.some((i) => i.code === 'deleted-elsewhere')) {
    return {
      taken: undefined,
      issues: issues.map((i) => (i.code === 'deleted-elsewhere' ? { ...i, message: TEMPLATE_REFUSALS.deleted(taken.name) } : i)),
    };
  }
  if (issues.some((i) => i.code === 'stale-revision')) {
    const saved = records.find((r) => r.id === taken.id);
    return {
      taken: saved ? { id: saved.id, revision: saved.revision, name: saved.template.name } : undefined,
      issues: issues.map((i) => (i.code === 'stale-revision' ? { ...i, message: TEMPLATE_REFUSALS.changed(taken.name) } : i)),
    };
  }
  return { taken, issues };
}

/** The template panel's words for a save refused because of another tab. */
export const TEMPLATE_REFUSALS = {
  changed: (name: string) =>
    `Not saved: the template \u201c${name}\u201d was changed in another tab or window after you took it up, and saving would overwrite that change. Choose \u201cUse template\u201d to see the saved version, or save again to replace it with yours.`,
  deleted: (name: string) =>
    `Not saved: the template \u201c${name}\u201d was deleted in another tab or window after you took it up, so it stays deleted. Save again to keep your text as a new template.`,
} as const;
