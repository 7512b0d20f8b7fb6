import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { clinicianText } from '@/lib/wording';

describe('clinicianText (hand-computed)', () => {
  // RR 1.5 (1.2 to 1.9) at P0 = 0.08: P1 = 0.12 (0.096 to 0.152); RD = 0.04 (0.016 to 0.072).
  const r = computeScenario({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } });
  if (!r.ok) throw new Error('fixture');
  const c = clinicianText(r.value, { exposure: 'HbA1c in the prediabetes range', comparison: 'normal HbA1c' });

  it('gives the risk ratio at this baseline with both absolute risks beside it', () => {
    expect(c.riskRatio).toBe('Risk ratio at this baseline: 1.50 (95% CI 1.20 to 1.90), from the reported risk ratio; 12.0% with HbA1c in the prediabetes range vs 8.0% with normal HbA1c over the next 10 years.');
  });
  it('gives the risk difference in percentage points with its interval', () => {
    expect(c.riskDifference).toBe('Risk difference over the next 10 years: +4.0 percentage points (95% CI +1.6 to +7.2); 12.0% with HbA1c in the prediabetes range vs 8.0% with normal HbA1c.');
  });
  it('gives the number needed beside the natural frequencies, same time frame', () => {
    // 1/0.04 = 25; 1/0.072 = 13.9 → 14; 1/0.016 = 62.5 → 63 (rounded up).
    expect(c.numberNeeded).toBe('NNTH 25 (95% CI: NNTH 14 to 63) over the next 10 years; 12 vs 8 out of 100 (12.0% with HbA1c in the prediabetes range vs 8.0% with normal HbA1c).');
  });
  it('passes the engine warnings through unchanged', () => {
    const w = computeScenario({ baseline: { risk: 0.2, years: 10 }, effect: { measure: 'OR', estimate: 1.2, lower: 0.9, upper: 1.6, adjusted: true } });
    if (!w.ok) throw new Error('fixture');
    expect(clinicianText(w.value).warnings).toBe(w.value.warnings);
    expect(clinicianText(w.value).warnings.length).toBeGreaterThan(0);
  });
  it('never writes "1 in X"', () => {
    expect(Object.values(c).filter((v) => typeof v === 'string').join(' ')).not.toMatch(/\b1 in \d+/);
  });
});

describe('a difference too small to move an icon (issue 11 item 15)', () => {
  it('says the difference is less than one person in the picture', async () => {
    const { computeScenario } = await import('@/lib/engine/compute');
    const { clinicianText } = await import('@/lib/wording/clinician');
    // Hand-computed: P0 0.081, P1 = 1.04 × 0.081 = 0.08424; round(8.1) = round(8.424) = 8 of 100; NNTH 1/0.00324 = 309.
    const r = computeScenario({ baseline: { risk: 0.081, years: 10 }, effect: { measure: 'RR', estimate: 1.04, lower: 1.01, upper: 1.07 }, denominator: 100 });
    if (!r.ok) throw new Error('expected a result');
    expect(r.value.iconArray.exposedEvents).toBe(8);
    expect(r.value.iconArray.referenceEvents).toBe(8);
    expect(clinicianText(r.value).numberNeeded).toContain('The difference is less than one person in the picture of 100.');
  });
});
