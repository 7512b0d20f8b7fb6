import { describe, expect, it } from 'vitest';
import { EMPTY_FORM_VALUES, formToFigures } from '@/lib/consultation/formValues';
import { createFormPipeline, sameFormValues } from '@/lib/consultation/pipeline';
import { DEMO_TABLES } from '@/lib/tables/demo';

describe('createFormPipeline: the engine runs once per change', () => {
  it('answers the same values (a copy) with the same outcome, computing once', () => {
    let runs = 0;
    const run = createFormPipeline((values, tables) => {
      runs += 1;
      return formToFigures(values, tables);
    });
    const a = run(EMPTY_FORM_VALUES, DEMO_TABLES);
    const b = run(structuredClone(EMPTY_FORM_VALUES), DEMO_TABLES);
    expect(b).toBe(a);
    expect(runs).toBe(1);
    run({ ...EMPTY_FORM_VALUES, horizonYears: '5' }, DEMO_TABLES);
    expect(runs).toBe(2);
    run({ ...EMPTY_FORM_VALUES, horizonYears: '5' }, [...DEMO_TABLES]);
    expect(runs).toBe(3);
  });

  it('refuses values that are not the form’s shape', () => {
    const run = createFormPipeline();
    expect(run({ nonsense: true }, DEMO_TABLES).ok).toBe(false);
  });

  it('sameFormValues compares field by field', () => {
    expect(sameFormValues({ a: '1', b: { c: '' } }, { b: { c: '' }, a: '1' })).toBe(true);
    expect(sameFormValues({ a: '1' }, { a: '2' })).toBe(false);
    expect(sameFormValues({ a: '1' }, { a: '1', b: '' })).toBe(false);
    expect(sameFormValues({ a: '1', b: undefined }, { a: '1', c: undefined })).toBe(false);
  });
});
