import { describe, expect, it } from 'vitest';
import { findPasteColumns, foldHeader as pasteFold } from '@/lib/glycaemia/paste';
import { foldHeader, unitInHeader } from '@/lib/text/headers';
import { guessColumn, normaliseHeader } from '@/lib/workforce/columns';

// One header rule for the paste box and the workforce files (invented headers).
describe('lib/text/headers: one way to fold headers and find their units', () => {
  it('folds accents, compatibility forms, case and spaces; separators only when asked', () => {
    expect(foldHeader('  Glycémie   À JEUN ')).toBe('glycemie a jeun');
    expect(foldHeader('HbA1c （％）')).toBe('hba1c (%)');
    expect(foldHeader('Worker_ID')).toBe('worker_id');
    expect(foldHeader('Worker_ID', { separators: true })).toBe('worker id');
  });

  it('finds each unit however it is written, and gives the header without it', () => {
    expect(unitInHeader('hba1c (mmol/mol)').unit).toBe('mmol/mol');
    expect(unitInHeader('hba1c ifcc').unit).toBe('mmol/mol');
    expect(unitInHeader('fpg mg per dl').unit).toBe('mg/dL');
    expect(unitInHeader('glucose mmol / l').unit).toBe('mmol/L');
    expect(unitInHeader('a1c ngsp').unit).toBe('%');
    expect(unitInHeader('hba1c (%)').rest.replace(/[^a-z0-9]+/g, ' ').trim()).toBe('hba1c');
    expect(unitInHeader('fasting glucose')).toEqual({ unit: null, rest: 'fasting glucose' });
  });

  it('both readers use it: the paste box and the workforce columns agree on the same headers', () => {
    expect(pasteFold('HbA1c (%)')).toBe(foldHeader('HbA1c (%)'));
    expect(normaliseHeader('Worker_ID')).toBe(foldHeader('Worker_ID', { separators: true }));
    // "HbA1c (IFCC)": mmol/mol for both (the workforce reader learnt IFCC from the paste box).
    expect(guessColumn('HbA1c (IFCC)')).toMatchObject({ field: 'hba1c', unit: 'mmol/mol' });
    expect(findPasteColumns(['Date', 'HbA1c (IFCC)']).columns.hba1cHeaderUnit).toBe('mmol/mol');
  });
});
