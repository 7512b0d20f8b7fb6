import { describe, expect, it } from 'vitest';
import { classifyCheckup, classifyHistory } from '@/lib/glycaemia/classify';
import { parseGlucoseHistory } from '@/lib/glycaemia/parse';
import { parsePastedRows } from '@/lib/glycaemia/paste';
import { glucoseHistoryView } from '@/lib/glycaemia/view';
import { importFhirGlucose } from '@/lib/fhir/importGlucose';
import type { CriteriaSet } from '@/lib/glycaemia/exposure';
import type { Checkup } from '@/lib/glycaemia/schema';

/*
 * Issue 11 items 1 and 2. Cut-points as each body prints them in both units (from memory for each
 * document's wording): ADA §2 "126 mg/dL (7.0 mmol/L)", "6.5% (48 mmol/mol)"; WHO 2006 "7.0 mmol/L
 * (126 mg/dL)"; NICE PH38 "48 mmol/mol (6.5%)". Values are illustrative, invented for the tests.
 */
const TODAY = '2024-06-30';

describe('a result exactly at a published cut-point, in the unit the lab printed (item 1)', () => {
  it.each([
    ['WHO', { fpg: { value: 126, unit: 'mg/dL' } }, 'diabetes-range', 'WHO prints 7.0 mmol/L (126 mg/dL)'],
    ['WHO', { fpg: { value: 110, unit: 'mg/dL' } }, 'prediabetes', 'WHO prints 6.1 mmol/L (110 mg/dL)'],
    ['NICE', { hba1c: { value: 6.5, unit: '%' } }, 'diabetes-range', 'NICE prints 48 mmol/mol (6.5%)'],
    ['NICE', { hba1c: { value: 6.0, unit: '%' } }, 'prediabetes', 'NICE prints 42 mmol/mol (6.0%)'],
    ['ADA', { fpg: { value: 7.0, unit: 'mmol/L' } }, 'diabetes-range', 'ADA prints 126 mg/dL (7.0 mmol/L)'],
    ['ADA', { fpg: { value: 5.6, unit: 'mmol/L' } }, 'prediabetes', 'ADA prints 100 mg/dL (5.6 mmol/L)'],
    ['ADA', { hba1c: { value: 48, unit: 'mmol/mol' } }, 'diabetes-range', 'ADA prints 6.5% (48 mmol/mol)'],
    ['ADA', { hba1c: { value: 39, unit: 'mmol/mol' } }, 'prediabetes', 'ADA prints 5.7% (39 mmol/mol)'],
  ] as const)('%s %j → %s (%s)', (criteria, tests, expected, _source) => {
    const c = classifyCheckup({ date: '2023-03-01', ...tests } as Checkup, criteria);
    expect(c.category).toBe(expected);
  });

  it('fires the diabetes-range note for a lab’s 126 mg/dL under WHO and does not ask for a mmol/L value', () => {
    const v = glucoseHistoryView({
      drafts: [{ date: '2023-03-01', hba1cValue: '', hba1cUnit: '%', fpgValue: '126', fpgUnit: 'mg/dL' }],
      criteria: 'WHO',
      today: TODAY,
    });
    expect(v.diabetesRangeNote?.code).toBe('diabetes-range-latest');
    expect(v.checkups[0]?.notes.join(' ')).not.toMatch(/lab's own/);
  });
});

describe('the same test reported twice on one day in two units gives the same category in either order (item 2)', () => {
  // One sample: 47 mmol/mol is 6.45% (hand-computed (47 + 23.5) / 10.93 = 6.450), printed by a lab as 6.5%.
  // The two agree within rounding (lib/glycaemia/merge.ts), so they are one result. Under NICE the
  // mmol/mol form (its own unit) says prediabetes range; the % form alone would say diabetes range.
  const mmol = { value: 47, unit: 'mmol/mol' } as const;
  const percent = { value: 6.5, unit: '%' } as const;
  const cases: ReadonlyArray<readonly [CriteriaSet, string]> = [
    ['NICE', 'prediabetes'], // NICE's own unit is mmol/mol: 47 < 48
    ['ADA', 'diabetes-range'], // ADA's own unit is %: 6.5 ≥ 6.5
  ];

  it.each(cases)('typed history under %s → %s, both orders', (criteria, expected) => {
    for (const order of [[mmol, percent], [percent, mmol]] as const) {
      const h = parseGlucoseHistory(
        { criteria, checkups: order.map((hba1c) => ({ date: '2023-03-01', hba1c })) },
        { today: TODAY },
      );
      if (!h.ok) throw new Error(JSON.stringify(h.issues));
      expect(classifyHistory(h.value.checkups, criteria)[0]?.category).toBe(expected);
      expect(h.value.notes[0]?.message).toMatch(/writes its thresholds in/);
    }
  });

  it.each(cases)('pasted rows under %s → %s, both orders', (criteria, expected) => {
    for (const lines of [['2023-03-01\t47\tmmol/mol', '2023-03-01\t6.5\t%'], ['2023-03-01\t6.5\t%', '2023-03-01\t47\tmmol/mol']]) {
      const pasted = parsePastedRows(lines.join('\n'), criteria);
      expect(pasted.issues).toEqual([]);
      const v = glucoseHistoryView({ drafts: pasted.rows, criteria, today: TODAY });
      expect(v.checkups).toHaveLength(1);
      expect(v.checkups[0]?.category).toBe(expected);
    }
  });

  it.each(cases)('FHIR import under %s → %s, both orders', (criteria, expected) => {
    const observation = (value: number, unit: string) => ({
      resourceType: 'Observation',
      status: 'final',
      code: { coding: [{ system: 'http://loinc.org', code: '4548-4' }] },
      effectiveDateTime: '2023-03-01',
      valueQuantity: { value, unit, system: 'http://unitsofmeasure.org', code: unit },
    });
    for (const pair of [[observation(47, 'mmol/mol'), observation(6.5, '%')], [observation(6.5, '%'), observation(47, 'mmol/mol')]]) {
      const imported = importFhirGlucose({ resourceType: 'Bundle', type: 'collection', entry: pair.map((resource) => ({ resource })) }, { today: TODAY, criteria });
      if (!imported.ok) throw new Error('expected an import');
      expect(imported.value.checkups).toHaveLength(1);
      expect(classifyCheckup(imported.value.checkups[0] as Checkup, criteria).category).toBe(expected);
      expect(imported.value.skipped[0]?.reason).toMatch(/kept in (mmol\/mol|%), the unit the criteria set writes its thresholds in/);
    }
  });
});

describe('unit slips where the plausible ranges of the two units overlap (issue 11 item 8)', () => {
  it('asks to confirm 12 mmol/mol, a very low HbA1c that as 12% is in the diabetes range', () => {
    // Plausible ranges (lib/glycaemia/schema.ts): HbA1c 3–20 % and 9–195 mmol/mol overlap on 9–20.
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 12, unit: 'mmol/mol' } }, 'ADA');
    expect(c.notes.find((n) => n.code === 'unit-check')?.message).toBe(
      '12 mmol/mol is a very low HbA1c: is it 12.0%? As 12.0% it would be in the diabetes range (ADA); confirm the unit the lab printed',
    );
  });
  it('asks to confirm 20 mg/dL, a very low fasting glucose that as 20 mmol/L is in the diabetes range', () => {
    const c = classifyCheckup({ date: '2023-03-01', fpg: { value: 20, unit: 'mg/dL' } }, 'WHO');
    expect(c.notes.map((n) => n.code)).toContain('unit-check');
  });
  it('says nothing when the category is the same in both units, or the value is possible in one unit only', () => {
    // 6.1% is not a plausible mmol/mol value (below 9); 100 mg/dL is not a plausible mmol/L value (above 50).
    expect(classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }, 'ADA').notes).toEqual([]);
    expect(classifyCheckup({ date: '2023-03-01', fpg: { value: 100, unit: 'mg/dL' } }, 'ADA').notes).toEqual([]);
  });
  it('carries the note into the command’s report', async () => {
    const { glycaemiaReport } = await import('@/lib/glycaemia/report');
    const h = parseGlucoseHistory({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 12, unit: 'mmol/mol' } }] }, { today: TODAY });
    if (!h.ok) throw new Error('expected a history');
    expect(JSON.stringify(glycaemiaReport(h.value))).toContain('is it 12.0%?');
  });
});
