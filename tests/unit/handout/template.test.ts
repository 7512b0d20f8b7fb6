import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DEFAULT_BLOCKS,
  deleteTemplate,
  exportTemplateFile,
  importTemplates,
  MAX_TEMPLATES,
  parseTemplateFile,
  renameTemplate,
  saveTemplate,
  TEMPLATE_MESSAGES,
  type HandoutTemplate,
} from '@/lib/handout';

const A: HandoutTemplate = { name: 'Diabetes clinic', blocks: DEFAULT_BLOCKS, clinic: { name: 'North Street Practice', contact: '01234 567890' } };
const B: HandoutTemplate = { name: 'Workplace checks', blocks: { ...DEFAULT_BLOCKS, title: 'Your checkup numbers' }, clinic: {} };

function file(templates: unknown, extra: Record<string, unknown> = {}): string {
  return JSON.stringify({ format: 'hundredfold-handout-templates', version: 1, templates, ...extra });
}

describe('template file: export and import', () => {
  it('round-trips exactly', () => {
    expect(parseTemplateFile(exportTemplateFile([A, B]))).toEqual({ ok: true, value: [A, B] });
  });

  it('writes the versioned format', () => {
    expect(JSON.parse(exportTemplateFile([A]))).toEqual({ format: 'hundredfold-handout-templates', version: 1, templates: [A] });
  });

  it('round-trips any valid templates (fast-check, 1000 runs)', () => {
    const text = (max: number) => fc.string({ maxLength: max });
    const template = fc.record({
      name: fc.string({ minLength: 1, maxLength: 80 }).filter((s) => s.trim() === s && s.length > 0),
      blocks: fc.record({ title: fc.string({ minLength: 1, maxLength: 120 }).filter((s) => s.trim().length > 0), opening: text(400), nextSteps: text(400) }),
      clinic: fc.record({ name: text(120), contact: text(200) }, { requiredKeys: [] }),
    });
    fc.assert(
      fc.property(fc.uniqueArray(template, { maxLength: 5, selector: (t) => t.name.toLowerCase() }), (templates) => {
        expect(parseTemplateFile(exportTemplateFile(templates))).toEqual({ ok: true, value: templates });
      }),
      { numRuns: 1000 },
    );
  });

  it('refuses text that is not JSON', () => {
    const r = parseTemplateFile('{"format":');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'invalid-json', path: [] });
  });

  it.each([['null'], ['[]'], ['42'], ['"text"']])('refuses a file that is not one object: %s', (text) => {
    const r = parseTemplateFile(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('wrong-type');
  });

  it('refuses another format or version, saying what is expected', () => {
    const wrongFormat = parseTemplateFile(JSON.stringify({ format: 'something-else', version: 1, templates: [] }));
    expect(wrongFormat.ok).toBe(false);
    if (!wrongFormat.ok) expect(wrongFormat.issues[0]).toMatchObject({ path: ['format'], message: expect.stringContaining('hundredfold-handout-templates') });
    const wrongVersion = parseTemplateFile(file([], { version: 2 }));
    expect(wrongVersion.ok).toBe(false);
    if (!wrongVersion.ok) expect(wrongVersion.issues[0]).toMatchObject({ path: ['version'], message: expect.stringContaining('version 1') });
  });

  it('names the template and the field of a bad entry', () => {
    const r = parseTemplateFile(file([A, { ...B, blocks: { ...B.blocks, title: 42 } }]));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues).toHaveLength(1);
      expect(r.issues[0]).toMatchObject({ code: 'wrong-type', path: ['templates', 1, 'blocks', 'title'] });
      expect(r.issues[0]?.message).toBe('Template 2 ("Workplace checks"): The title must be text');
    }
  });

  it('names a missing field, an unknown field and a too-long text', () => {
    const r = parseTemplateFile(file([{ name: 'X', blocks: { title: 'T', opening: 'o' }, clinic: { phone: '1' } }, { ...A, blocks: { ...A.blocks, opening: 'x'.repeat(401) } }]));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues.map((i) => [i.code, i.path.join('.')])).toEqual([
        ['required', 'templates.0.blocks.nextSteps'],
        ['unknown-field', 'templates.0.clinic.phone'],
        ['too-long', 'templates.1.blocks.opening'],
      ]);
      expect(r.issues[2]?.message).toBe('Template 2 ("Diabetes clinic"): The opening words must be at most 400 characters');
    }
  });

  it('refuses an empty name and an empty title', () => {
    const r = parseTemplateFile(file([{ ...A, name: '  ' }, { ...B, blocks: { ...B.blocks, title: ' ' } }]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.path.join('.'))).toEqual(['templates.0.name', 'templates.1.blocks.title']);
  });

  it('refuses duplicate names within a file (ignoring case)', () => {
    const r = parseTemplateFile(file([A, { ...B, name: 'DIABETES CLINIC' }]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'duplicate-name', path: ['templates', 1, 'name'] });
  });

  it('refuses more than the maximum number of templates', () => {
    const many = Array.from({ length: MAX_TEMPLATES + 1 }, (_, i) => ({ ...B, name: `T${i}` }));
    expect(parseTemplateFile(file(many)).ok).toBe(false);
  });
});

describe('template list operations (pure)', () => {
  it('saves new templates at the end and replaces one of the same name', () => {
    const one = saveTemplate([], A);
    expect(one).toEqual({ ok: true, value: [A] });
    const replaced = saveTemplate([A, B], { ...A, name: 'diabetes clinic', blocks: { ...A.blocks, title: 'New' } });
    expect(replaced.ok && replaced.value.map((t) => [t.name, t.blocks.title])).toEqual([
      ['diabetes clinic', 'New'],
      ['Workplace checks', 'Your checkup numbers'],
    ]);
  });

  it('drops empty clinic fields and trims the name', () => {
    const r = saveTemplate([], { name: '  Mine ', blocks: DEFAULT_BLOCKS, clinic: { name: ' ', contact: ' 555 ' } });
    expect(r).toEqual({ ok: true, value: [{ name: 'Mine', blocks: DEFAULT_BLOCKS, clinic: { contact: '555' } }] });
  });

  it('refuses an invalid template without changing the list', () => {
    const list = [A];
    const r = saveTemplate(list, { ...B, name: '' });
    expect(r.ok).toBe(false);
    expect(list).toEqual([A]);
  });

  it('renames, refusing a missing template and a taken name', () => {
    expect(renameTemplate([A, B], 'Workplace checks', 'Work')).toEqual({ ok: true, value: [A, { ...B, name: 'Work' }] });
    const missing = renameTemplate([A], 'Nope', 'X');
    expect(missing.ok).toBe(false);
    if (!missing.ok) expect(missing.issues[0]?.code).toBe('not-found');
    const taken = renameTemplate([A, B], 'Workplace checks', 'diabetes CLINIC');
    expect(taken.ok).toBe(false);
    if (!taken.ok) expect(taken.issues[0]?.code).toBe('duplicate-name');
    const empty = renameTemplate([A], 'Diabetes clinic', '');
    expect(empty.ok).toBe(false);
    // Renaming to the same name in another case is allowed.
    expect(renameTemplate([A], 'Diabetes clinic', 'DIABETES CLINIC').ok).toBe(true);
  });

  it('deletes by name and ignores an unknown name', () => {
    expect(deleteTemplate([A, B], 'diabetes clinic')).toEqual([B]);
    expect(deleteTemplate([A, B], 'none')).toEqual([A, B]);
  });

  it('imports without overwriting: a taken name is saved as "Name (2)"', () => {
    const r = importTemplates([A], file([{ ...A, clinic: {} }, B]));
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.templates.map((t) => t.name)).toEqual(['Diabetes clinic', 'Diabetes clinic (2)', 'Workplace checks']);
      expect(r.value.templates[0]).toEqual(A);
      expect(r.value.renamed).toEqual([{ from: 'Diabetes clinic', to: 'Diabetes clinic (2)' }]);
      expect(r.value.added).toEqual(['Diabetes clinic (2)', 'Workplace checks']);
    }
  });

  it('a bad import returns issues and leaves the list unchanged', () => {
    const list = [A];
    const r = importTemplates(list, file([B, { name: 'Bad' }]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.message).toMatch(/^Template 2 \("Bad"\): /);
    expect(list).toEqual([A]);
  });
});

describe('TEMPLATE_MESSAGES', () => {
  it('say what happened in plain words, with the right plural', () => {
    expect(TEMPLATE_MESSAGES.imported({ added: ['A'], renamed: [] })).toBe('Imported 1 template.');
    expect(TEMPLATE_MESSAGES.imported({ added: ['A', 'B (2)'], renamed: [{ from: 'B', to: 'B (2)' }] })).toBe(
      'Imported 2 templates. "B" was saved as "B (2)" because the name was taken.',
    );
    expect(TEMPLATE_MESSAGES.saved(' Heart clinic ')).toBe('Saved the template "Heart clinic".');
  });
});
