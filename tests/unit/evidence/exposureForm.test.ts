/**
 * The exposure definition as form fields (lib/evidence/exposureForm.ts): the mapping both ways,
 * the choices offered, and problems on the form field that holds them. Expected values are
 * written out by hand from lib/glycaemia/exposure.ts.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EMPTY_EXPOSURE_FORM, exposureChoices, exposureFromFormValues, exposureToFormValues } from '@/lib/evidence/exposureForm';
import { exposureDefinitionArb } from '../link/scenarioArbitrary';

describe('exposureToFormValues / exposureFromFormValues', () => {
  it('maps a full definition to choices and back', () => {
    const definition = { category: 'prediabetes', criteria: 'NICE', minYears: 4, test: 'both', maxGapMonths: 15, comparison: { category: 'normal', minYears: 2 } } as const;
    const form = exposureToFormValues(definition);
    expect(form).toEqual({ defined: 'yes', test: 'both', category: 'prediabetes', criteria: 'NICE', minYears: '4', maxGapMonths: '15', comparison: 'normal', comparisonYears: '2' });
    expect(exposureFromFormValues(form)).toEqual({ ok: true, value: definition });
  });

  it('keeps unstated parts absent, so the first shape of a definition comes back as it was', () => {
    const form = exposureToFormValues({ category: 'diabetes-range', criteria: 'WHO', minYears: 1 });
    expect(form).toEqual({ defined: 'yes', test: '', category: 'diabetes-range', criteria: 'WHO', minYears: '1', maxGapMonths: '', comparison: '', comparisonYears: '' });
    expect(exposureFromFormValues(form)).toEqual({ ok: true, value: { category: 'diabetes-range', criteria: 'WHO', minYears: 1 } });
  });

  it('no definition: "No, or not stated" gives undefined, whatever the other fields hold', () => {
    expect(exposureToFormValues(undefined)).toEqual(EMPTY_EXPOSURE_FORM);
    expect(exposureFromFormValues(EMPTY_EXPOSURE_FORM)).toEqual({ ok: true, value: undefined });
  });

  it('round-trips every valid definition (fast-check, 500 runs)', () => {
    fc.assert(
      fc.property(exposureDefinitionArb, (definition) => {
        expect(exposureFromFormValues(exposureToFormValues(definition))).toEqual({ ok: true, value: definition });
      }),
      { numRuns: 500 },
    );
  });

  it('puts the schema’s problem on the form field: a comparison in the same range as the exposure', () => {
    const read = exposureFromFormValues({ ...EMPTY_EXPOSURE_FORM, defined: 'yes', comparison: 'prediabetes' });
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.issues).toEqual([
      { code: 'invalid-choice', path: ['exposure', 'comparison'], message: 'The comparison category must differ from the exposure category (prediabetes)' },
    ]);
    const years = exposureFromFormValues({ ...EMPTY_EXPOSURE_FORM, defined: 'yes', comparisonYears: '0' }, ['form', 'exposure']);
    expect(years.ok === false && years.issues[0]?.path).toEqual(['form', 'exposure', 'comparisonYears']);
  });
});

describe('exposureChoices', () => {
  it('offers short criteria names, "not stated" for the optional parts, and a run length read from a file', () => {
    const choices = exposureChoices({ minYears: '20', comparisonYears: '' });
    expect(choices.criteria.map((c) => c.label)).toEqual(['ADA', 'WHO', 'NICE']);
    expect(choices.test[0]).toEqual({ value: '', label: 'Not stated (either test; the higher range counts)' });
    expect(choices.maxGapMonths[0]).toEqual({ value: '', label: 'Not stated (18 months)' });
    expect(choices.maxGapMonths.slice(1).map((c) => c.value)).toEqual(['6', '7', '8', '9', '10', '11', '12', '13', '14', '15', '16', '17', '18']);
    expect(choices.minYears.map((c) => c.value).slice(-2)).toEqual(['15', '20']);
    expect(choices.comparisonYears[0]).toEqual({ value: '', label: 'Same as the exposed group' });
  });
});
