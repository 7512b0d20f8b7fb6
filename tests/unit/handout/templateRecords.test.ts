import { describe, expect, it } from 'vitest';
import {
  afterTemplateRefusal,
  DEFAULT_BLOCKS,
  planTemplateImport,
  planTemplateRename,
  planTemplateSave,
  sortTemplateRecords,
  TEMPLATE_REFUSALS,
  exportTemplateFile,
  type HandoutTemplate,
  type TemplateRecord,
} from '@/lib/handout';

// Invented templates (illustrative); the expected writes follow the rules written in
// lib/handout/templateRecords.ts and lib/storage/policy.ts.
const A: HandoutTemplate = { name: 'Diabetes clinic', blocks: DEFAULT_BLOCKS, clinic: {} };
const B: HandoutTemplate = { name: 'Heart clinic', blocks: DEFAULT_BLOCKS, clinic: {} };
const LISTED: TemplateRecord[] = [
  { id: 'ta', revision: 3, template: A },
  { id: 'tb', revision: 1, template: B },
];

describe('planTemplateSave', () => {
  it('a new name is a new record', () => {
    expect(planTemplateSave(LISTED, undefined, { name: 'Lipids', blocks: DEFAULT_BLOCKS, clinic: {} }, 'new')).toEqual({
      ok: true,
      value: { id: 'new', template: { name: 'Lipids', blocks: DEFAULT_BLOCKS, clinic: {} }, mode: { kind: 'new' } },
    });
  });

  it('a listed name is an edit of the listed revision', () => {
    const r = planTemplateSave(LISTED, undefined, { ...A, name: 'heart CLINIC' }, 'new');
    expect(r.ok && r.value.id).toBe('tb');
    expect(r.ok && r.value.mode).toEqual({ kind: 'edit', revision: 1 });
  });

  it('the taken-up template is an edit of the revision taken up, even when the list has moved on or lost it', () => {
    const taken = { id: 'ta', revision: 2, name: 'Diabetes clinic' };
    expect(planTemplateSave(LISTED, taken, A, 'new')).toMatchObject({ ok: true, value: { id: 'ta', mode: { kind: 'edit', revision: 2 } } });
    // Deleted in another tab: no longer listed, still written as an edit so the policy refuses it.
    expect(planTemplateSave(LISTED.slice(1), taken, A, 'new')).toMatchObject({ ok: true, value: { id: 'ta', mode: { kind: 'edit', revision: 2 } } });
  });

  it('a bad name is refused with the name rules of template.ts', () => {
    const r = planTemplateSave(LISTED, undefined, { name: '   ', blocks: DEFAULT_BLOCKS, clinic: {} }, 'new');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.message).toBe('The template name must not be empty');
  });
});

describe('planTemplateRename', () => {
  it('is an edit of the listed revision, or of the one taken up', () => {
    expect(planTemplateRename(LISTED, undefined, 'tb', 'Heart')).toMatchObject({ ok: true, value: { id: 'tb', template: { name: 'Heart' }, mode: { kind: 'edit', revision: 1 } } });
    expect(planTemplateRename(LISTED, { id: 'tb', revision: 0, name: 'Heart clinic' }, 'tb', 'Heart')).toMatchObject({ ok: true, value: { mode: { kind: 'edit', revision: 0 } } });
  });

  it('refuses a name another template has, and a template no longer listed', () => {
    const clash = planTemplateRename(LISTED, undefined, 'tb', 'diabetes clinic');
    expect(clash.ok).toBe(false);
    if (!clash.ok) expect(clash.issues[0]?.code).toBe('duplicate-name');
    const gone = planTemplateRename(LISTED, undefined, 'tz', 'X');
    expect(gone.ok).toBe(false);
    if (!gone.ok) expect(gone.issues[0]?.code).toBe('not-found');
  });
});

describe('planTemplateImport', () => {
  it('every imported template is a new record; taken names get " (2)"', () => {
    let n = 0;
    const r = planTemplateImport(LISTED, exportTemplateFile([A]), () => `i${++n}`);
    expect(r).toEqual({
      ok: true,
      value: {
        writes: [{ id: 'i1', template: { ...A, name: 'Diabetes clinic (2)' }, mode: { kind: 'new' } }],
        outcome: { added: ['Diabetes clinic (2)'], renamed: [{ from: 'Diabetes clinic', to: 'Diabetes clinic (2)' }] },
      },
    });
  });

  it('a bad file writes nothing', () => {
    expect(planTemplateImport(LISTED, '{', () => 'x').ok).toBe(false);
  });
});

describe('afterTemplateRefusal', () => {
  const taken = { id: 'ta', revision: 2, name: 'Diabetes clinic' };
  it('a stale save takes the saved revision up, so saving again replaces it knowingly', () => {
    const after = afterTemplateRefusal(taken, [{ code: 'stale-revision', path: ['id'], message: 'x' }], LISTED);
    expect(after.taken).toEqual({ id: 'ta', revision: 3, name: 'Diabetes clinic' });
    expect(after.issues[0]?.message).toBe(TEMPLATE_REFUSALS.changed('Diabetes clinic'));
  });

  it('a save of a template deleted elsewhere lets go of it, so saving again makes a new one', () => {
    const after = afterTemplateRefusal(taken, [{ code: 'deleted-elsewhere', path: ['id'], message: 'x' }], LISTED.slice(1));
    expect(after.taken).toBeUndefined();
    expect(after.issues[0]?.message).toBe(TEMPLATE_REFUSALS.deleted('Diabetes clinic'));
  });

  it('other refusals change nothing', () => {
    const issues = [{ code: 'too-long', path: ['name'], message: 'x' }];
    expect(afterTemplateRefusal(taken, issues, LISTED)).toEqual({ taken, issues });
  });
});

it('lists templates by name, ignoring case', () => {
  const lower: TemplateRecord = { id: 'tc', revision: 1, template: { ...A, name: 'asthma' } };
  expect(sortTemplateRecords([...LISTED, lower]).map((r) => r.id)).toEqual(['tc', 'ta', 'tb']);
});
