import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lookupStratum, tableNeeds } from '@/lib/tables/lookup';
import { DEMO_CORONARY_RATE, DEMO_HEART_FAILURE_10Y, DEMO_STROKE_5Y, DEMO_TABLES } from '@/lib/tables/demo';
import { parseTable } from '@/lib/tables/parse';
import type { PopulationTable } from '@/lib/tables/schema';
import { baselineSchema } from '@/lib/scenario/schema';

describe('demo tables', () => {
  it.each(DEMO_TABLES.map((t) => [t.id, t] as const))('%s is a valid table, flagged illustrative', (_id, t) => {
    expect(parseTable(t)).toEqual({ ok: true, value: t });
    expect(t.illustrative).toBe(true);
    expect(t.source).toMatch(/Illustrative numbers, not from a real population/);
  });

  it('keeps stable ids', () => {
    expect(DEMO_TABLES.map((t) => t.id)).toEqual(['demo-heart-failure-10y', 'demo-coronary-rate', 'demo-stroke-5y']);
  });
});

describe('lookupStratum', () => {
  it('gives the risk and the table horizon for a risk table', () => {
    // The demo table's female 40–49 value is 0.006 (invented, lib/tables/demo.ts).
    const r = lookupStratum(DEMO_HEART_FAILURE_10Y, { age: 45, sex: 'female' });
    expect(r).toEqual({ ok: true, value: { stratum: { sex: 'female', ageFrom: 40, ageTo: 49, risk: 0.006 }, baseline: { risk: 0.006, years: 10 }, prevalenceSource: 'none' } });
  });

  it('gives the rate and its person-years for a rate table', () => {
    // The demo table's male 60–69 value is 9.5 per 1000 person-years (invented, lib/tables/demo.ts).
    const r = lookupStratum(DEMO_CORONARY_RATE, { age: 60, sex: 'male' });
    expect(r.ok && r.value.baseline).toEqual({ rate: 9.5, perPersonYears: 1000 });
  });

  it('includes both ends of a band', () => {
    for (const age of [30, 39]) {
      const r = lookupStratum(DEMO_HEART_FAILURE_10Y, { age, sex: 'male' });
      expect(r.ok && r.value.stratum.ageFrom).toBe(30);
    }
    const top = lookupStratum(DEMO_STROKE_5Y, { age: 120 });
    expect(top.ok && top.value.baseline).toEqual({ risk: 0.12, years: 5 });
  });

  it('does not need the sex when every stratum is "any"', () => {
    expect(tableNeeds(DEMO_STROKE_5Y)).toEqual({ age: true, sex: false, extra: [] });
    expect(lookupStratum(DEMO_STROKE_5Y, { age: 55 }).ok).toBe(true);
  });

  it('names every missing field the table needs', () => {
    const r = lookupStratum(DEMO_HEART_FAILURE_10Y, {});
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => [i.code, i.path])).toEqual([
      ['required', ['person', 'sex']],
      ['required', ['person', 'age']],
    ]);
  });

  it('says no band covers an age outside the table, and which ages it covers', () => {
    const r = lookupStratum(DEMO_HEART_FAILURE_10Y, { age: 17, sex: 'female' });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues[0]).toMatchObject({ code: 'no-stratum', path: ['person', 'age'] });
      expect(r.issues[0]?.message).toMatch(/covers age 17 for female; the table covers ages 30 to 79/);
    }
  });

  it('matches extra strata, and names one that is missing or unknown', () => {
    const t: PopulationTable = {
      ...DEMO_STROKE_5Y,
      id: 'regional',
      strata: [
        { sex: 'any', ageFrom: 0, ageTo: 120, extra: { region: 'north' }, risk: 0.01 },
        { sex: 'any', ageFrom: 0, ageTo: 120, extra: { region: 'south' }, risk: 0.02 },
      ],
    };
    expect(tableNeeds(t)).toEqual({ age: false, sex: false, extra: ['region'] });
    const south = lookupStratum(t, {}, { region: 'south' });
    expect(south.ok && south.value.baseline).toEqual({ risk: 0.02, years: 5 });
    const missing = lookupStratum(t, {});
    expect(!missing.ok && missing.issues[0]).toMatchObject({ code: 'required', path: ['extra', 'region'] });
    const unknown = lookupStratum(t, {}, { region: 'east' });
    expect(!unknown.ok && unknown.issues[0]).toMatchObject({ code: 'no-stratum', path: ['extra', 'region'] });
  });

  it('property: every age 30–79 of either sex finds exactly its band in the demo tables, and the baseline is a valid scenario baseline', () => {
    fc.assert(
      fc.property(fc.integer({ min: 30, max: 79 }), fc.constantFrom('female' as const, 'male' as const), fc.constantFrom(DEMO_HEART_FAILURE_10Y, DEMO_CORONARY_RATE), (age, sex, t) => {
        const r = lookupStratum(t, { age, sex });
        if (!r.ok) return false;
        const { stratum, baseline } = r.value;
        return stratum.sex === sex && stratum.ageFrom <= age && age <= stratum.ageTo && baselineSchema.safeParse(baseline).success;
      }),
      { numRuns: 1000 },
    );
  });
});

describe('lookupStratum with an exposure prevalence (issue 11 item 3)', () => {
  const withTablePrevalence: PopulationTable = { ...DEMO_HEART_FAILURE_10Y, exposurePrevalence: 0.25 };

  it('gives a population-average baseline when the table states the prevalence', () => {
    const r = lookupStratum(withTablePrevalence, { age: 45, sex: 'female' });
    expect(r.ok && r.value.baseline).toEqual({ populationRisk: 0.006, exposurePrevalence: 0.25, years: 10 });
    expect(r.ok && r.value.prevalenceSource).toBe('table');
  });

  it('prefers the stratum’s prevalence to the table’s, and the clinician’s to both', () => {
    const table: PopulationTable = {
      ...withTablePrevalence,
      strata: withTablePrevalence.strata.map((s) => (s.sex === 'female' && s.ageFrom === 40 ? { ...s, exposurePrevalence: 0.1 } : s)),
    };
    const byStratum = lookupStratum(table, { age: 45, sex: 'female' });
    expect(byStratum.ok && byStratum.value.baseline).toEqual({ populationRisk: 0.006, exposurePrevalence: 0.1, years: 10 });
    expect(byStratum.ok && byStratum.value.prevalenceSource).toBe('stratum');
    const typed = lookupStratum(table, { age: 45, sex: 'female' }, {}, { exposurePrevalence: 0.4 });
    expect(typed.ok && typed.value.baseline).toEqual({ populationRisk: 0.006, exposurePrevalence: 0.4, years: 10 });
    expect(typed.ok && typed.value.prevalenceSource).toBe('clinician');
  });

  it('gives a rate with its prevalence for a rate table', () => {
    const r = lookupStratum({ ...DEMO_CORONARY_RATE, exposurePrevalence: 0.3 }, { age: 60, sex: 'male' });
    expect(r.ok && r.value.baseline).toEqual({ rate: 9.5, perPersonYears: 1000, exposurePrevalence: 0.3 });
  });

  it('accepts the prevalence in the table schema and refuses 1 or more', () => {
    expect(parseTable(withTablePrevalence).ok).toBe(true);
    expect(parseTable({ ...DEMO_HEART_FAILURE_10Y, exposurePrevalence: 1 }).ok).toBe(false);
    const badStratum = { ...DEMO_HEART_FAILURE_10Y, strata: DEMO_HEART_FAILURE_10Y.strata.map((s, i) => (i === 0 ? { ...s, exposurePrevalence: -0.1 } : s)) };
    expect(parseTable(badStratum).ok).toBe(false);
  });
});
