import { describe, expect, it } from 'vitest';
import { exposureDefinitionSchema, MAX_RUN_GAP_MONTHS, resolveExposureDefinition, type ExposureDefinition } from '@/lib/glycaemia/exposure';
import { exposureStatus, matchHistory } from '@/lib/glycaemia/match';
import { MAX_GAP_MONTHS } from '@/lib/glycaemia/persistence';
import type { Checkup } from '@/lib/glycaemia/schema';

// Invented histories (illustrative). ADA: HbA1c prediabetes 5.7–6.4 %, FPG prediabetes 100–125 mg/dL
// (ADA Standards of Care, section 2, as lib/glycaemia/criteria.ts).
const a1c = (date: string, value: number, fpg?: number): Checkup => ({ date, hba1c: { value, unit: '%' }, ...(fpg !== undefined ? { fpg: { value: fpg, unit: 'mg/dL' as const } } : {}) });
const fpgOnly = (date: string, value: number): Checkup => ({ date, fpg: { value, unit: 'mg/dL' } });
const OLD: ExposureDefinition = { category: 'prediabetes', criteria: 'ADA', minYears: 3 };
const FULL: ExposureDefinition = { ...OLD, test: 'hba1c', comparison: { category: 'normal' } };

describe('exposure definition schema', () => {
  it('the first shape {category, criteria, minYears} is still valid and resolves to the old meaning', () => {
    expect(exposureDefinitionSchema.safeParse(OLD).success).toBe(true);
    expect(resolveExposureDefinition(OLD)).toEqual({ category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'either', maxGapMonths: 18, comparison: null });
  });
  it('the comparison run defaults to the exposure\'s ("over the same span")', () => {
    expect(resolveExposureDefinition(FULL).comparison).toEqual({ category: 'normal', minYears: 3 });
  });
  it('refuses a comparison in the exposure\'s own range, a gap over 18 months, an unknown test', () => {
    const issues = (d: unknown) => {
      const r = exposureDefinitionSchema.safeParse(d);
      return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
    };
    expect(issues({ ...OLD, comparison: { category: 'prediabetes' } })).toEqual(['comparison.category']);
    expect(issues({ ...OLD, maxGapMonths: 24 })).toEqual(['maxGapMonths']);
    expect(issues({ ...OLD, test: 'ogtt' })).toEqual(['test']);
  });
  it('the longest gap allowed equals the run rule of persistence.ts', () => {
    expect(MAX_RUN_GAP_MONTHS).toBe(MAX_GAP_MONTHS);
  });
});

describe('which test decides', () => {
  // HbA1c 6.0 % is prediabetes; FPG 92 mg/dL is normal: "either" takes the higher range, prediabetes.
  const discordant = [a1c('2022-03-01', 6.0, 92), a1c('2023-03-01', 6.0, 92), a1c('2024-03-01', 6.0, 92)];
  it('either (default): the higher range of the two tests', () => {
    expect(matchHistory(discordant, OLD).matches).toBe(true);
  });
  it('hba1c: only the HbA1c counts', () => {
    expect(matchHistory(discordant, { ...OLD, test: 'hba1c' }).matches).toBe(true);
  });
  it('fpg: only the fasting glucose counts (normal here)', () => {
    const m = matchHistory(discordant, { ...OLD, test: 'fpg' });
    expect(m.matches).toBe(false);
    expect(m.persistence.category).toBe('normal');
    expect(m.reasons[0]).toBe('The study needed 3 yearly results in the prediabetes range (ADA, by fasting glucose); this history has 0.');
  });
  it('both: the tests must agree; discordant checkups do not count', () => {
    expect(matchHistory(discordant, { ...OLD, test: 'both' }).matches).toBe(false);
    const agreeing = [a1c('2022-03-01', 6.0, 110), a1c('2023-03-01', 6.1, 105), a1c('2024-03-01', 6.2, 112)];
    expect(matchHistory(agreeing, { ...OLD, test: 'both' }).matches).toBe(true);
  });
  it('hba1c: checkups with only a fasting glucose are not results of the definition', () => {
    const m = matchHistory([fpgOnly('2022-03-01', 110), fpgOnly('2023-03-01', 110), fpgOnly('2024-03-01', 110)], { ...OLD, test: 'hba1c' });
    expect(m.matches).toBe(false);
    expect(m.reasons).toContain('There are no checkups with HbA1c.');
  });
});

describe('longest gap allowed', () => {
  // 2022-03-01 → 2023-06-01 is 15 months: within 18, beyond 12.
  const history = [a1c('2021-03-01', 6.0), a1c('2022-03-01', 6.0), a1c('2023-06-01', 6.1)];
  it('18 months (default): the run holds 3 yearly results', () => {
    expect(matchHistory(history, OLD).matches).toBe(true);
  });
  it('12 months: the 15-month gap cuts the run to 1 result and says so', () => {
    const m = matchHistory(history, { ...OLD, maxGapMonths: 12 });
    expect(m.matches).toBe(false);
    expect(m.matchingYearlyResults).toBe(1);
    expect(m.reasons[1]).toBe('The run starts after a gap of 15 months (2022-03-01 to 2023-06-01); results before a gap of more than 12 months do not count.');
  });
});

describe('exposed, comparison or neither', () => {
  it('exposed: 3 yearly prediabetes-range HbA1c', () => {
    const s = exposureStatus([a1c('2022-03-01', 6.0), a1c('2023-03-01', 6.1), a1c('2024-03-01', 6.2)], FULL);
    expect(s.status).toBe('exposed');
    expect(s.reasons[0]).toBe("Fits the study's exposure.");
  });
  it('comparison: 3 yearly normal HbA1c (below 5.7 %)', () => {
    const s = exposureStatus([a1c('2022-03-01', 5.2), a1c('2023-03-01', 5.3), a1c('2024-03-01', 5.1)], FULL);
    expect(s.status).toBe('comparison');
    expect(s.reasons[1]).toBe("The study's comparison group needed 3 yearly results in the normal range (ADA, by HbA1c); this history has 3, from 2022-03-01 to 2024-03-01.");
  });
  it('neither, too short: 2 normal results with nothing earlier', () => {
    const s = exposureStatus([a1c('2023-03-01', 5.2), a1c('2024-03-01', 5.3)], FULL);
    expect([s.status, s.neitherReason]).toEqual(['neither', 'short']);
  });
  it('neither, changed: normal results after prediabetes-range ones', () => {
    const s = exposureStatus([a1c('2021-03-01', 6.0), a1c('2022-03-01', 6.0), a1c('2023-03-01', 5.2), a1c('2024-03-01', 5.3)], FULL);
    expect([s.status, s.neitherReason]).toEqual(['neither', 'changed']);
  });
  it('neither: no comparison group defined, a normal history is not matched to one', () => {
    const s = exposureStatus([a1c('2022-03-01', 5.2), a1c('2023-03-01', 5.3), a1c('2024-03-01', 5.1)], OLD);
    expect([s.status, s.neitherReason]).toEqual(['neither', 'no-comparison']);
    expect(s.comparison).toBeNull();
  });
  it('neither: latest in the diabetes range, which the study compared neither way', () => {
    const s = exposureStatus([a1c('2023-03-01', 6.0), a1c('2024-03-01', 6.9)], FULL);
    expect([s.status, s.neitherReason]).toEqual(['neither', 'other-range']);
  });
});
