import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { classifyCheckup, classifyHistory } from '@/lib/glycaemia/classify';
import { CRITERIA_SETS } from '@/lib/glycaemia/exposure';
import { categoryLabel } from '@/lib/glycaemia/format';

describe('classifyCheckup: which test decides, discordance', () => {
  it('takes the higher range and names the test that gave it (ADA: either test suffices, §2, from memory)', () => {
    // ADA thresholds (methods guide table): 5.7 ≤ 6.1 % < 6.5 is prediabetes; 92 < 100 mg/dL is normal.
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 92, unit: 'mg/dL' } }, 'ADA');
    expect(c.category).toBe('prediabetes');
    expect(c.decidedBy).toBe('hba1c');
    expect(c.discordant).toBe(true);
    expect(c.notes.map((n) => n.code)).toEqual(['discordant-tests']);
  });

  it('says "both" when the two tests agree', () => {
    // NICE PH38 (methods guide table): 42 ≤ 44 < 48 mmol/mol and 5.5 ≤ 5.9 < 7.0 mmol/L, both prediabetes.
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 44, unit: 'mmol/mol' }, fpg: { value: 5.9, unit: 'mmol/L' } }, 'NICE');
    expect(c).toMatchObject({ category: 'prediabetes', decidedBy: 'both', discordant: false, notes: [] });
  });

  it('lets the fasting glucose decide when it is the higher', () => {
    // ADA: 5.4 % < 5.7 is normal; 130 ≥ 126 mg/dL is the diabetes range.
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 5.4, unit: '%' }, fpg: { value: 130, unit: 'mg/dL' } }, 'ADA');
    expect(c).toMatchObject({ category: 'diabetes-range', decidedBy: 'fpg', discordant: true });
  });

  it('uses a single test alone, without discordance', () => {
    // WHO 2006: 6.1 ≤ 6.3 < 7.0 mmol/L is impaired fasting glucose.
    const c = classifyCheckup({ date: '2023-03-01', fpg: { value: 6.3, unit: 'mmol/L' } }, 'WHO');
    expect(c).toMatchObject({ category: 'prediabetes', decidedBy: 'fpg', discordant: false, hba1c: null, hba1cPercent: null, hba1cMmolMol: null });
  });

  describe('WHO: an HbA1c below 6.5 % does not classify (WHO 2011, from memory)', () => {
    it('leaves a checkup with only such an HbA1c unclassified, with a note', () => {
      const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.2, unit: '%' } }, 'WHO');
      expect(c.category).toBeNull();
      expect(c.decidedBy).toBeNull();
      expect(c.notes.map((n) => n.code)).toEqual(['not-classified']);
      expect(categoryLabel(c.category, 'WHO')).toBe('not classified (WHO)');
    });
    it('lets the fasting glucose decide, without calling the pair discordant', () => {
      const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.2, unit: '%' }, fpg: { value: 6.3, unit: 'mmol/L' } }, 'WHO');
      expect(c).toMatchObject({ category: 'prediabetes', decidedBy: 'fpg', discordant: false });
    });
    it('flags discordance when the fasting glucose is in the diabetes range and the HbA1c is not', () => {
      // WHO 2006: 7.4 ≥ 7.0 mmol/L is the diabetes range; WHO 2011: 6.2 % < 6.5 is below it.
      const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.2, unit: '%' }, fpg: { value: 7.4, unit: 'mmol/L' } }, 'WHO');
      expect(c).toMatchObject({ category: 'diabetes-range', decidedBy: 'fpg', discordant: true });
    });
    it('flags discordance when the HbA1c is in the diabetes range and the glucose is not', () => {
      // WHO 2011: 6.7 ≥ 6.5 % is the diabetes range; WHO 2006: 5.0 < 6.1 mmol/L is normal.
      const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.7, unit: '%' }, fpg: { value: 5.0, unit: 'mmol/L' } }, 'WHO');
      expect(c).toMatchObject({ category: 'diabetes-range', decidedBy: 'hba1c', discordant: true });
    });
  });

  it('reports both units of each test (hand-computed)', () => {
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.5, unit: '%' }, fpg: { value: 7, unit: 'mmol/L' } }, 'ADA');
    expect(c.hba1cPercent).toBe(6.5);
    expect(c.hba1cMmolMol).toBeCloseTo(47.545, 10); // 10.93 × 6.5 − 23.5
    expect(c.fpgMmolL).toBe(7);
    expect(c.fpgMgDl).toBeCloseTo(126.112, 10); // 7 × 18.016
  });

  it('classifyHistory sorts by date', () => {
    const h = classifyHistory(
      [
        { date: '2022-01-01', fpg: { value: 5, unit: 'mmol/L' } },
        { date: '2020-01-01', fpg: { value: 5, unit: 'mmol/L' } },
        { date: '2021-01-01', fpg: { value: 5, unit: 'mmol/L' } },
      ],
      'NICE',
    );
    expect(h.map((c) => c.date)).toEqual(['2020-01-01', '2021-01-01', '2022-01-01']);
  });

  it('is monotone: a higher value never gives a lower range (property, 1000 runs)', () => {
    const rank = { normal: 0, prediabetes: 1, 'diabetes-range': 2 } as const;
    fc.assert(
      fc.property(
        fc.constantFrom(...CRITERIA_SETS),
        fc.constantFrom('%' as const, 'mmol/mol' as const),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (criteria, unit, u, v) => {
          const [lo, hi] = unit === '%' ? [3, 20] : [9, 195];
          const a = lo + Math.min(u, v) * (hi - lo);
          const b = lo + Math.max(u, v) * (hi - lo);
          const ca = classifyCheckup({ date: '2023-01-01', hba1c: { value: a, unit }, fpg: { value: 4, unit: 'mmol/L' } }, criteria).category;
          const cb = classifyCheckup({ date: '2023-01-01', hba1c: { value: b, unit }, fpg: { value: 4, unit: 'mmol/L' } }, criteria).category;
          expect(ca).not.toBeNull();
          expect(cb).not.toBeNull();
          if (ca !== null && cb !== null) expect(rank[ca]).toBeLessThanOrEqual(rank[cb]);
        },
      ),
      { numRuns: 1000 },
    );
  });

  it('never words a category as a diagnosis: "diabetes" only as "diabetes range"', () => {
    for (const criteria of CRITERIA_SETS) {
      for (const category of ['normal', 'prediabetes', 'diabetes-range', null] as const) {
        expect(categoryLabel(category, criteria)).not.toMatch(/\bdiabetes\b(?! range)/i);
      }
    }
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.2, unit: '%' }, fpg: { value: 7.4, unit: 'mmol/L' } }, 'WHO');
    for (const note of c.notes) expect(note.message).not.toMatch(/\bdiabetes\b(?! range)/i);
  });
});

describe('enteredText: a value entered with more decimals than labs print is written without them, never across a cut-point', () => {
  // Cut-points: ADA HbA1c 5.7% and 6.5%, fasting glucose 5.6 mmol/L (100 mg/dL) (lib/glycaemia/criteria.ts, ADA Standards of Care).
  it('a spreadsheet-computed value reads with one decimal past the lab’s', () => {
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 5.55555555555556, unit: '%' }, fpg: { value: 5.55555555555556, unit: 'mmol/L' } }, 'ADA');
    expect(c.hba1c?.enteredText).toBe('5.56%');
    expect(c.hba1c?.text).toBe('5.56%');
    expect(c.fpg?.enteredText).toBe('5.56 mmol/L');
    expect(c.fpg?.category).toBe('normal');
  });

  it('keeps every decimal needed to stay on its side of the cut-point: 6.4999% is not written 6.50%, 5.59999 mmol/L not 5.60', () => {
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.4999, unit: '%' }, fpg: { value: 5.59999, unit: 'mmol/L' } }, 'ADA');
    expect(c.hba1c?.category).toBe('prediabetes');
    expect(c.hba1c?.enteredText).toBe('6.4999%');
    expect(c.fpg?.category).toBe('normal');
    expect(c.fpg?.enteredText).toBe('5.59999 mmol/L');
  });

  it('a value with the decimals labs print, or one more, is written as entered', () => {
    const c = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.25, unit: '%' }, fpg: { value: 104, unit: 'mg/dL' } }, 'ADA');
    expect(c.hba1c?.enteredText).toBe('6.25%');
    expect(c.fpg?.enteredText).toBe('104 mg/dL');
    expect(c.fpg?.text).toBe('104 mg/dL'); // ADA's own unit for fasting glucose: not converted
  });
});
