import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { hba1cIn, ifccMmolMolToNgspPercent, ngspPercentToIfccMmolMol } from '@/lib/glycaemia/hba1c';
import { glucoseIn, glucoseMgDlToMmolL, glucoseMmolLToMgDl } from '@/lib/glycaemia/glucose';

/*
 * Published pairs are rounded by their sources: whole mmol/mol and 0.1 % for HbA1c, whole mg/dL
 * and 0.1 mmol/L for glucose. So a pair is checked in the direction in which the source rounded,
 * with half that step as the tolerance (0.5 mmol/mol, 0.05 %, 0.5 mg/dL, 0.05 mmol/L): a value
 * that rounds to the published one is within half a step of it.
 */

describe('HbA1c: NGSP % → IFCC mmol/mol (master equation, Hoelzel et al. 2004, Clin Chem 50:166)', () => {
  // IFCC–NGSP conversion table in the 2010 consensus statement on worldwide standardisation of
  // HbA1c (Hanas & John 2010, Diabetes Care 33:1903) and on the NGSP website (from memory).
  const table: ReadonlyArray<readonly [number, number]> = [
    [4.0, 20],
    [5.0, 31],
    [6.0, 42],
    [7.0, 53],
    [8.0, 64],
    [9.0, 75],
    [10.0, 86],
    [11.0, 97],
    [12.0, 108],
  ];
  it.each(table)('%d %% ≈ %d mmol/mol, within 0.5 mmol/mol (table rounds to whole mmol/mol)', (percent, mmolMol) => {
    expect(Math.abs(ngspPercentToIfccMmolMol(percent) - mmolMol)).toBeLessThanOrEqual(0.5);
  });

  // Pairs quoted by the guideline bodies themselves (methods guide table): ADA section 2
  // 5.7 % (39 mmol/mol) and 6.5 % (48); NICE PH38 6.0 % (42) (from memory for ADA/NICE wording).
  it.each([
    [5.7, 39],
    [6.5, 48],
    [6.0, 42],
  ] as const)('guideline pair %d %% ≈ %d mmol/mol, within 0.5', (percent, mmolMol) => {
    expect(Math.abs(ngspPercentToIfccMmolMol(percent) - mmolMol)).toBeLessThanOrEqual(0.5);
  });

  it('gives the exact master-equation values (hand-computed)', () => {
    expect(ngspPercentToIfccMmolMol(6.5)).toBeCloseTo(47.545, 10); // 10.93 × 6.5 − 23.5 = 71.045 − 23.5
    expect(ngspPercentToIfccMmolMol(7)).toBeCloseTo(53.01, 10); // 76.51 − 23.5
    expect(ngspPercentToIfccMmolMol(5.7)).toBeCloseTo(38.801, 10); // 62.301 − 23.5
  });
});

describe('HbA1c: IFCC mmol/mol → NGSP % (exact inverse of the master equation)', () => {
  // Same table read the other way (Hanas & John 2010; from memory); % rounded to 0.1.
  it.each([
    [31, 5.0],
    [42, 6.0],
    [53, 7.0],
    [64, 8.0],
    [75, 9.0],
    [86, 10.0],
  ] as const)('%d mmol/mol ≈ %d %%, within 0.05 %%', (mmolMol, percent) => {
    expect(Math.abs(ifccMmolMolToNgspPercent(mmolMol) - percent)).toBeLessThanOrEqual(0.05);
  });

  it('gives the exact inverse (hand-computed)', () => {
    expect(ifccMmolMolToNgspPercent(48)).toBeCloseTo(71.5 / 10.93, 12); // (48 + 23.5) / 10.93 = 6.5416…
    expect(ifccMmolMolToNgspPercent(47)).toBeCloseTo(70.5 / 10.93, 12); // 6.4501…: below 6.5 %, so ADA's "47 mmol/mol" stays prediabetes
  });

  it('agrees with NGSP\'s rounded inverse, NGSP = 0.09148·IFCC + 2.152, within 0.0025 % over 9–195 mmol/mol', () => {
    // NGSP's published form of the inverse (methods guide). The difference is
    // Hand-computed: (0.09148 − 1/10.93)·IFCC + (2.152 − 23.5/10.93) = −0.0000113·IFCC + 0.00195, at most
    // 0.00185 % here (at 9 mmol/mol; 0.00025 % at 195).
    fc.assert(
      fc.property(fc.double({ min: 9, max: 195, noNaN: true }), (mmolMol) => {
        expect(Math.abs(ifccMmolMolToNgspPercent(mmolMol) - (0.09148 * mmolMol + 2.152))).toBeLessThan(0.0025);
      }),
      { numRuns: 1000 },
    );
  });

  it('round-trips % → mmol/mol → % (property, 1000 runs)', () => {
    fc.assert(
      fc.property(fc.double({ min: 3, max: 20, noNaN: true }), (percent) => {
        expect(ifccMmolMolToNgspPercent(ngspPercentToIfccMmolMol(percent))).toBeCloseTo(percent, 10);
      }),
      { numRuns: 1000 },
    );
  });

  it('is strictly increasing for differences above float resolution (property, 1000 runs)', () => {
    fc.assert(
      fc.property(fc.double({ min: 3, max: 20, noNaN: true }), fc.double({ min: 1e-6, max: 17, noNaN: true }), (a, step) => {
        expect(ngspPercentToIfccMmolMol(a)).toBeLessThan(ngspPercentToIfccMmolMol(a + step));
        expect(ifccMmolMolToNgspPercent(a * 10)).toBeLessThan(ifccMmolMolToNgspPercent(a * 10 + step));
      }),
      { numRuns: 1000 },
    );
  });

  it('hba1cIn leaves a value in its own unit untouched and converts the other', () => {
    expect(hba1cIn('%', { value: 6.1, unit: '%' })).toBe(6.1);
    expect(hba1cIn('mmol/mol', { value: 43, unit: 'mmol/mol' })).toBe(43);
    expect(hba1cIn('mmol/mol', { value: 6.5, unit: '%' })).toBeCloseTo(47.545, 10); // hand-computed above
    expect(hba1cIn('%', { value: 48, unit: 'mmol/mol' })).toBeCloseTo(71.5 / 10.93, 12);
  });
});

describe('glucose: mg/dL = mmol/L × 18.016 (methods guide; molar mass 180.16 g/mol)', () => {
  // mg/dL → mmol/L, where the source gives mmol/L to 0.1 (tolerance 0.05 mmol/L):
  it.each([
    [100, 5.6, 'ADA section 2: 100 mg/dL (5.6 mmol/L) (from memory)'],
    [126, 7.0, 'ADA section 2: 126 mg/dL (7.0 mmol/L) (from memory)'],
    [110, 6.1, 'WHO 1999/2006: IFG from 6.1 mmol/L (110 mg/dL) (from memory)'],
    [140, 7.8, 'WHO 1999/2006: 2-h glucose 7.8 mmol/L (140 mg/dL) (from memory)'],
    [200, 11.1, 'WHO 1999/2006, ADA: 11.1 mmol/L (200 mg/dL) (from memory)'],
  ] as const)('%d mg/dL ≈ %d mmol/L (%s)', (mgDl, mmolL, _source) => {
    expect(Math.abs(glucoseMgDlToMmolL(mgDl) - mmolL)).toBeLessThanOrEqual(0.05);
  });

  // mmol/L → mg/dL, where the source gives whole mg/dL (tolerance 0.5 mg/dL):
  it.each([
    [7.0, 126, 'WHO 2006: 7.0 mmol/L (126 mg/dL) (from memory)'],
    [6.1, 110, 'WHO 2006: 6.1 mmol/L (110 mg/dL) (from memory)'],
    [11.1, 200, 'WHO 2006: 11.1 mmol/L (200 mg/dL) (from memory)'],
  ] as const)('%d mmol/L ≈ %d mg/dL (%s)', (mmolL, mgDl, _source) => {
    expect(Math.abs(glucoseMmolLToMgDl(mmolL) - mgDl)).toBeLessThanOrEqual(0.5);
  });

  it('gives the exact products (hand-computed)', () => {
    expect(glucoseMmolLToMgDl(7)).toBeCloseTo(126.112, 10); // 7 × 18.016
    expect(glucoseMmolLToMgDl(5.5)).toBeCloseTo(99.088, 10); // 5.5 × 18.016
    expect(glucoseMgDlToMmolL(126)).toBeCloseTo(126 / 18.016, 12); // 6.9938…: just under WHO's 7.0
  });

  it('round-trips and is linear (property, 1000 runs)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 50, noNaN: true }), fc.double({ min: 1, max: 50, noNaN: true }), (a, b) => {
        expect(glucoseMgDlToMmolL(glucoseMmolLToMgDl(a))).toBeCloseTo(a, 10);
        expect(glucoseMmolLToMgDl(a + b)).toBeCloseTo(glucoseMmolLToMgDl(a) + glucoseMmolLToMgDl(b), 8);
      }),
      { numRuns: 1000 },
    );
  });

  it('glucoseIn converts only across units', () => {
    expect(glucoseIn('mmol/L', { value: 5.6, unit: 'mmol/L' })).toBe(5.6);
    expect(glucoseIn('mg/dL', { value: 101, unit: 'mg/dL' })).toBe(101);
    expect(glucoseIn('mg/dL', { value: 5.5, unit: 'mmol/L' })).toBeCloseTo(99.088, 10); // hand-computed above
  });

  it('passes NaN and infinities through unchanged in kind (validation happens at the edge, ./schema.ts)', () => {
    expect(glucoseMmolLToMgDl(Number.NaN)).toBeNaN();
    expect(ngspPercentToIfccMmolMol(Number.POSITIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
    expect(ifccMmolMolToNgspPercent(Number.NEGATIVE_INFINITY)).toBe(Number.NEGATIVE_INFINITY);
  });
});
