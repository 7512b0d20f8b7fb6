/**
 * Published worked examples (issue 11), each with its source beside it. The expected figures are
 * the published ones, typed here as the source prints them — never computed by the code under test.
 * "(from memory)" marks figures recalled rather than re-read at the source (no network here).
 */
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { numberNeeded } from '@/lib/engine/numberNeeded';
import { glucoseMgDlToMmolL, glucoseMmolLToMgDl } from '@/lib/glycaemia/glucose';
import { ifccMmolMolToNgspPercent, ngspPercentToIfccMmolMol } from '@/lib/glycaemia/hba1c';

describe('HbA1c: NGSP % ↔ IFCC mmol/mol pairs as printed in the NGSP/IFCC conversion tables (Hoelzel et al. 2004 master equation; from memory)', () => {
  // Each pair as printed: the IFCC value is whole mmol/mol, the NGSP value one decimal.
  it.each([
    [5.0, 31],
    [5.7, 39], // ADA Standards of Care §2: 5.7% (39 mmol/mol)
    [6.0, 42], // NICE PH38: 42 mmol/mol (6.0%)
    [6.5, 48], // ADA §2, WHO 2011: 6.5% (48 mmol/mol)
    [7.0, 53],
    [8.0, 64],
    [9.0, 75],
    [10.0, 86],
    [11.0, 97],
    [12.0, 108],
  ])('NGSP %s%% ↔ IFCC %s mmol/mol', (percent, mmolMol) => {
    expect(Math.round(ngspPercentToIfccMmolMol(percent))).toBe(mmolMol);
    expect(Number(ifccMmolMolToNgspPercent(mmolMol).toFixed(1))).toBe(percent);
  });
});

describe('Plasma glucose: mmol/L ↔ mg/dL pairs as the bodies print them (from memory)', () => {
  it.each([
    [7.0, 126, 'WHO 2006 and ADA §2: fasting 7.0 mmol/L (126 mg/dL)'],
    [6.1, 110, 'WHO 2006: impaired fasting glucose from 6.1 mmol/L (110 mg/dL)'],
    [5.6, 100, 'ADA §2: 100 mg/dL (5.6 mmol/L)'],
    [7.8, 140, 'WHO 2006: 2-hour glucose 7.8 mmol/L (140 mg/dL)'],
    [11.1, 200, 'WHO 2006 and ADA §2: 11.1 mmol/L (200 mg/dL)'],
  ])('%s mmol/L ↔ %s mg/dL (%s)', (mmolL, mgDl) => {
    expect(Number(glucoseMgDlToMmolL(mgDl).toFixed(1))).toBe(mmolL);
    expect(Math.abs(glucoseMmolLToMgDl(mmolL) - mgDl)).toBeLessThan(1);
  });
});

describe('Number needed from a risk ratio at an assumed comparator risk', () => {
  it('RR 0.92 at an assumed comparator risk of 0.3 gives NNTB 42 (Cochrane Handbook v6, §15.4.4, worked example; from memory)', () => {
    // Published: NNT = 1 / (ACR × (1 − RR)) = 1 / (0.3 × 0.08) = 41.67, rounded up to 42.
    const r = computeScenario({ baseline: { risk: 0.3, years: 1 }, effect: { measure: 'RR', estimate: 0.92, lower: 0.88, upper: 0.96 } });
    if (!r.ok) throw new Error('expected a result');
    expect(r.value.numberNeeded.direction).toBe('benefit');
    expect(r.value.numberNeeded.display).toBe(42);
    expect(r.value.numberNeeded.estimate).toBeCloseTo(41.67, 2);
  });

  it('writes an interval that includes no effect as NNTB … to ∞ to NNTH … (Altman 1998, BMJ 317:1309, the notation it proposes)', () => {
    // The notation, not a figure from the paper: the difference's interval −0.05 to 0.1 becomes
    // NNTB 20 to ∞ to NNTH 10 (hand-computed 1/0.05 = 20, 1/0.1 = 10).
    expect(numberNeeded({ estimate: 0.02, lower: -0.05, upper: 0.1 }, 0.95).text).toBe('NNTH 50 (95% CI: NNTB 20 to ∞ to NNTH 10)');
  });
});
