/**
 * Handout templates: an educator's editable blocks and clinic details under a name, kept in
 * the browser and moved between browsers as a JSON file:
 *
 *   { "format": "hundredfold-handout-templates", "version": 1, "templates": [ { name, blocks, clinic }, … ] }
 *
 * A file is read all or nothing: any problem refuses the whole file, with issues that name the
 * template (number and name) and the field, and the saved templates are left as they were.
 * Every function here is pure: it returns a new list and never changes its input. The browser
 * storage wrapper is app/handout/templateStore.ts.
 */
import { z } from '../zod';
import { fail, ok, type Issue, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { handoutBlocksSchema, type HandoutBlocks } from './blocks';

export const TEMPLATE_FILE_FORMAT = 'hundredfold-handout-templates';
export const TEMPLATE_FILE_VERSION = 1;
/** Longest template name, in characters. */
export const MAX_TEMPLATE_NAME = 80;
/** Most templates one browser or file holds: a clinic's set, not an archive. */
export const MAX_TEMPLATES = 100;
/** Longest clinic name and contact line, in characters. */
export const MAX_CLINIC_NAME = 120;
export const MAX_CLINIC_CONTACT = 200;

export const clinicSchema = z.strictObject({
  name: z.string({ error: 'The clinic name must be text' }).max(MAX_CLINIC_NAME, { error: `The clinic name must be at most ${MAX_CLINIC_NAME} characters` }).optional(),
  contact: z
    .string({ error: 'The clinic contact must be text' })
    .max(MAX_CLINIC_CONTACT, { error: `The clinic contact must be at most ${MAX_CLINIC_CONTACT} characters` })
    .optional(),
});

export const templateNameSchema = z
  .string({ error: (iss) => (iss.input === undefined ? 'The template name is required' : 'The template name must be text') })
  .trim()
  .min(1, { error: 'The template name must not be empty' })
  .max(MAX_TEMPLATE_NAME, { error: `The template name must be at most ${MAX_TEMPLATE_NAME} characters` });

export const handoutTemplateSchema = z.strictObject({
  name: templateNameSchema,
  blocks: handoutBlocksSchema,
  clinic: clinicSchema,
});

export const templateFileSchema = z.strictObject({
  format: z.literal(TEMPLATE_FILE_FORMAT, { error: `The file's "format" must be "${TEMPLATE_FILE_FORMAT}": this is not a Hundredfold handout template file` }),
  version: z.literal(TEMPLATE_FILE_VERSION, { error: `The file's "version" must be ${TEMPLATE_FILE_VERSION}; this version of Hundredfold reads version ${TEMPLATE_FILE_VERSION} only` }),
  templates: z
    .array(handoutTemplateSchema, { error: 'The file\u2019s "templates" must be a list' })
    .max(MAX_TEMPLATES, { error: `A file may hold at most ${MAX_TEMPLATES} templates` }),
});

export type Clinic = z.infer<typeof clinicSchema>;
export type HandoutTemplate = z.infer<typeof handoutTemplateSchema>;
export type TemplateFile = z.infer<typeof templateFileSchema>;

function sameName(a: string, b: string): boolean {
  return a.trim().toLocaleLowerCase('en') === b.trim().toLocaleLowerCase('en');
}

/** Prefixes an issue under templates[i] with the template's number and name. */
function locate(issue: Issue, raw: unknown): Issue {
  const [head, index] = issue.path;
  if (head !== 'templates' || typeof index !== 'number') return issue;
  const entry = Array.isArray(raw) ? (raw[index] as unknown) : undefined;
  const name = typeof entry === 'object' && entry !== null && typeof (entry as { name?: unknown }).name === 'string' ? (entry as { name: string }).name.trim() : '';
  // An unknown key's message says only "is not a field here": name the group it sits in ("clinic").
  const group = issue.code === 'unknown-field' ? issue.path.slice(2, -1).filter((p): p is string => typeof p === 'string').join('.') : '';
  const which = `Template ${index + 1}${name ? ` ("${name}")` : ''}${group ? `, ${group}` : ''}`;
  return { ...issue, message: `${which}: ${issue.message}` };
}

/**
 * Reads a template file's text. All or nothing: the first problem's template and field are
 * named; duplicate names within the file are refused too.
 *
 * @example
 * parseTemplateFile('{"format":"hundredfold-handout-templates","version":1,"templates":[]}') //=> { ok: true, value: [] }
 * parseTemplateFile('{') //=> { ok: false, issues: [{ code: 'invalid-json', path: [], message: 'The file is not valid JSON: …' }] }
 */
export function parseTemplateFile(text: string): Result<HandoutTemplate[]> {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    const detail = error instanceof Error ? error.message : 'unreadable';
    return fail([{ code: 'invalid-json', path: [], message: `The file is not valid JSON: ${detail}` }]);
  }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return fail([{ code: 'wrong-type', path: [], message: `The file must hold one object with "format", "version" and "templates"` }]);
  }
  const parsed = templateFileSchema.safeParse(raw, { reportInput: true });
  const rawTemplates = (raw as { templates?: unknown }).templates;
  if (!parsed.success) return fail(toIssues(parsed.error.issues).map((issue) => locate(issue, rawTemplates)));
  const issues: Issue[] = [];
  parsed.data.templates.forEach((template, i) => {
    const first = parsed.data.templates.findIndex((t) => sameName(t.name, template.name));
    if (first < i) {
      issues.push({
        code: 'duplicate-name',
        path: ['templates', i, 'name'],
        message: `Template ${i + 1} ("${template.name}"): the name is already used by template ${first + 1}; each template needs its own name`,
      });
    }
  });
  return issues.length > 0 ? fail(issues) : ok(parsed.data.templates);
}

/**
 * Writes templates as a version-1 file, indented for a person to read.
 * @example
 * exportTemplateFile([]) //=> '{\n  "format": "hundredfold-handout-templates",\n  "version": 1,\n  "templates": []\n}\n'
 */
export function exportTemplateFile(templates: readonly HandoutTemplate[]): string {
  const file: TemplateFile = { format: TEMPLATE_FILE_FORMAT, version: TEMPLATE_FILE_VERSION, templates: [...templates] };
  return `${JSON.stringify(file, null, 2)}\n`;
}

/** A clinic object without empty fields, so saved templates stay tidy. */
export function cleanClinic(clinic: Clinic): Clinic {
  const out: { name?: string; contact?: string } = {};
  const name = clinic.name?.trim();
  const contact = clinic.contact?.trim();
  if (name) out.name = name;
  if (contact) out.contact = contact;
  return out;
}

/**
 * Saves a template under its name: replaces the one with the same name (ignoring case), else
 * adds it at the end. Refuses an invalid template or a full list.
 */
export function saveTemplate(list: readonly HandoutTemplate[], template: { name: string; blocks: HandoutBlocks; clinic: Clinic }): Result<HandoutTemplate[]> {
  const parsed = handoutTemplateSchema.safeParse({ ...template, clinic: cleanClinic(template.clinic) }, { reportInput: true });
  if (!parsed.success) return fail(toIssues(parsed.error.issues));
  const at = list.findIndex((t) => sameName(t.name, parsed.data.name));
  if (at >= 0) return ok(list.map((t, i) => (i === at ? parsed.data : t)));
  if (list.length >= MAX_TEMPLATES) {
    return fail([{ code: 'too-many', path: [], message: `At most ${MAX_TEMPLATES} templates can be saved; delete one first` }]);
  }
  return ok([...list, parsed.data]);
}

/** Renames a template. Refuses a missing template, an invalid name or one already used by another. */
export function renameTemplate(list: readonly HandoutTemplate[], from: string, to: string): Result<HandoutTemplate[]> {
  const at = list.findIndex((t) => sameName(t.name, from));
  if (at < 0) return fail([{ code: 'not-found', path: ['name'], message: `No saved template is called "${from}"` }]);
  const name = templateNameSchema.safeParse(to, { reportInput: true });
  if (!name.success) return fail(toIssues(name.error.issues).map((i) => ({ ...i, path: ['name'] })));
  const clash = list.findIndex((t, i) => i !== at && sameName(t.name, name.data));
  if (clash >= 0) return fail([{ code: 'duplicate-name', path: ['name'], message: `Another template is already called "${name.data}"; choose another name` }]);
  return ok(list.map((t, i) => (i === at ? { ...t, name: name.data } : t)));
}

/** Deletes a template by name; a name not in the list leaves the list as it was. */
export function deleteTemplate(list: readonly HandoutTemplate[], name: string): HandoutTemplate[] {
  return list.filter((t) => !sameName(t.name, name));
}

export interface ImportOutcome {
  readonly templates: HandoutTemplate[];
  readonly added: readonly string[];
  /** Imported templates whose name was taken, with the new name they were saved under. */
  readonly renamed: readonly { readonly from: string; readonly to: string }[];
}

/**
 * Imports a template file into the saved list. A bad file changes nothing (the issues say why).
 * Saved templates are never overwritten: an imported template whose name is taken is saved as
 * "Name (2)", "Name (3)", … and listed in `renamed`.
 */
export function importTemplates(list: readonly HandoutTemplate[], fileText: string): Result<ImportOutcome> {
  const parsed = parseTemplateFile(fileText);
  if (!parsed.ok) return parsed;
  if (list.length + parsed.value.length > MAX_TEMPLATES) {
    return fail([
      {
        code: 'too-many',
        path: ['templates'],
        message: `Importing ${parsed.value.length} templates would make ${list.length + parsed.value.length}; at most ${MAX_TEMPLATES} can be saved. Delete some first`,
      },
    ]);
  }
  const templates = [...list];
  const added: string[] = [];
  const renamed: { from: string; to: string }[] = [];
  for (const template of parsed.value) {
    let name = template.name;
    for (let n = 2; templates.some((t) => sameName(t.name, name)); n += 1) {
      const suffix = ` (${n})`;
      name = `${template.name.slice(0, MAX_TEMPLATE_NAME - suffix.length)}${suffix}`;
    }
    if (name !== template.name) renamed.push({ from: template.name, to: name });
    templates.push({ ...template, name });
    added.push(name);
  }
  return ok({ templates, added, renamed });
}

/** What the template panel says after each action, in one place. */
export const TEMPLATE_MESSAGES = {
  using: (name: string) => `Using the template "${name}".`,
  saved: (name: string) => `Saved the template "${name.trim()}".`,
  renamed: (from: string, to: string) => `Renamed "${from}" to "${to.trim()}".`,
  deleted: (name: string) => `Deleted the template "${name}".`,
  exported: 'Exported the saved templates as a JSON file.',
  importRefused: 'The file was not imported; nothing saved was changed.',
  storageUnavailable: 'This browser does not allow saved templates here',
  /**
   * @example
   * TEMPLATE_MESSAGES.imported({ added: ['A', 'B (2)'], renamed: [{ from: 'B', to: 'B (2)' }] })
   * //=> 'Imported 2 templates. "B" was saved as "B (2)" because the name was taken.'
   */
  imported: (outcome: Pick<ImportOutcome, 'added' | 'renamed'>) =>
    `Imported ${outcome.added.length} template${outcome.added.length === 1 ? '' : 's'}.${outcome.renamed
      .map((n) => ` "${n.from}" was saved as "${n.to}" because the name was taken.`)
      .join('')}`,
} as const;
