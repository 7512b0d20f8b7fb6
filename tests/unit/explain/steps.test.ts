import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { explainSteps, sig, type ExplainStep } from '@/lib/explain/steps';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { scenarioArb } from '../support/arbitraries';

function steps(scenario: Scenario, extra: Partial<Parameters<typeof explainSteps>[0]> = {}): ExplainStep[] {
  const result = computeScenario(scenario);
  if (!result.ok) throw new Error(`test scenario must compute: ${JSON.stringify(result.issues)}`);
  return explainSteps({ scenario, result: result.value, ...extra });
}

function step(list: ExplainStep[], id: ExplainStep['id']): ExplainStep {
  const found = list.find((s) => s.id === id);
  if (!found) throw new Error(`no step ${id}`);
  return found;
}

describe('sig: four significant digits', () => {
  it('rounds and drops trailing zeros', () => {
    expect(sig(0.11538461538)).toBe('0.1154');
    expect(sig(0.08)).toBe('0.08');
    expect(sig(25.000000000000004)).toBe('25');
    expect(sig(1234567)).toBe('1235000');
  });

  it('writes non-finite values as they are', () => {
    expect(sig(Number.NaN)).toBe('NaN');
    expect(sig(Number.POSITIVE_INFINITY)).toBe('Infinity');
  });
});

describe('explainSteps', () => {
  const rr: Scenario = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };

  it('lists the seven steps in order, each with a formula, numbers, a result and a source', () => {
    const list = steps(rr);
    expect(list.map((s) => s.id)).toEqual(['baseline', 'horizon', 'conversion', 'risk-ratio', 'risk-difference', 'number-needed', 'icon-counts']);
    for (const s of list) for (const field of [s.title, s.formula, s.numbers, s.result, s.source]) expect(field.length).toBeGreaterThan(0);
  });

  it('puts the numbers of a risk ratio example into each formula', () => {
    // Hand-computed: P1 = 1.5 × 0.08 = 0.12 (limits 0.096, 0.152); RD = 0.04; NNTH = 1/0.04 = 25;
    // icons round(0.08 × 100) = 8, round(0.12 × 100) = 12, range round(9.6) = 10 to round(15.2) = 15.
    const list = steps(rr);
    expect(step(list, 'conversion').numbers).toBe('P1 = 1.5 × 0.08; limits 1.2 × 0.08 and 1.9 × 0.08');
    expect(step(list, 'conversion').result).toContain('P1 = 0.12 (12%)');
    expect(step(list, 'risk-difference').numbers).toBe('RD = 0.12 − 0.08; limits 0.096 − 0.08 and 0.152 − 0.08');
    expect(step(list, 'risk-difference').result).toContain('RD = 0.04');
    expect(step(list, 'number-needed').numbers).toBe('1 / |0.04| = 25, rounded up');
    expect(step(list, 'number-needed').result).toMatch(/^NNTH 25 /);
    expect(step(list, 'icon-counts').numbers).toBe('round(0.08 × 100) = 8; round(0.12 × 100) = 12; range round(0.096 × 100) = 10 to round(0.152 × 100) = 15');
    expect(step(list, 'horizon').formula).toContain('No change');
  });

  it('names Zhang and Yu for a cohort odds ratio and shows the conversion', () => {
    // Hand-computed (Zhang & Yu 1998): 1.5 × 0.08 / (0.92 + 0.12) = 0.12 / 1.04 = 0.1154.
    const list = steps({ ...rr, effect: { ...rr.effect, measure: 'OR', design: 'cohort' } });
    expect(step(list, 'conversion').source).toContain('Zhang & Yu 1998');
    expect(step(list, 'conversion').result).toContain('P1 = 0.1154');
  });

  it('reads a risk-set sampled odds ratio as a rate ratio and cites Greenland & Thomas', () => {
    // Hand-computed: 1 − 0.92^1.5 = 1 − 0.88244 = 0.1176.
    const list = steps({ ...rr, effect: { ...rr.effect, measure: 'OR', design: 'risk-set-case-control' } });
    expect(step(list, 'conversion').title).toContain('risk-set');
    expect(step(list, 'conversion').source).toContain('Greenland & Thomas 1982');
    expect(step(list, 'conversion').result).toContain('P1 = 0.1176');
  });

  it('reads a case-cohort odds ratio as a risk ratio', () => {
    const list = steps({ ...rr, effect: { ...rr.effect, measure: 'OR', design: 'case-cohort' } });
    expect(step(list, 'conversion').source).toContain('Rodrigues & Kirkwood 1990');
    expect(step(list, 'conversion').result).toContain('P1 = 0.12 ');
  });

  it('shows the rate and the exponential for a rate baseline', () => {
    // Hand-computed: λ = 12 / 1000 = 0.012; P0 = 1 − e^−0.12 = 0.1131.
    const list = steps({ baseline: { rate: 12, perPersonYears: 1000 }, effect: { measure: 'HR', estimate: 1.5, lower: 1.2, upper: 1.9 }, horizonYears: 10 });
    expect(step(list, 'baseline').result).toBe('λ = 0.012 events per person-year');
    expect(step(list, 'horizon').numbers).toBe('P0 = 1 − exp(−0.012 × 10)');
    expect(step(list, 'horizon').result).toContain('P0 = 0.1131');
    expect(step(list, 'horizon').source).toContain('Miller & Homan 1994');
  });

  it('rescales a risk to another horizon', () => {
    // Hand-computed: 1 − 0.8^(5/10) = 0.1056.
    const list = steps({ baseline: { risk: 0.2, years: 10 }, effect: rr.effect, horizonYears: 5 });
    expect(step(list, 'horizon').numbers).toBe('P0(5) = 1 − (1 − 0.2)^(5 / 10)');
    expect(step(list, 'horizon').result).toContain('P0 = 0.1056');
  });

  it('solves a population-average baseline', () => {
    // Hand-computed: P0 = 0.12 / (0.8 + 0.2 × 2) = 0.1.
    const list = steps({ baseline: { populationRisk: 0.12, exposurePrevalence: 0.2, years: 10 }, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.5 } });
    expect(step(list, 'baseline').result).toBe('P0 = 0.1 (10%) over 10 years');
  });

  it('names the table, its source and the illustrative note for a looked-up baseline', () => {
    const stratum = DEMO_HEART_FAILURE_10Y.strata.find((s) => s.sex === 'female' && s.ageFrom === 40);
    const list = steps({ baseline: { risk: 0.006, years: 10 }, effect: rr.effect, tableId: DEMO_HEART_FAILURE_10Y.id }, { table: DEMO_HEART_FAILURE_10Y, stratum });
    expect(step(list, 'baseline').source).toContain(DEMO_HEART_FAILURE_10Y.title);
    expect(step(list, 'baseline').source).toContain('ages 40 to 49');
    expect(step(list, 'baseline').source).toMatch(/illustrative numbers, not from a real population/i);
    // The demo table's source already says so: the note is not repeated.
    expect(step(list, 'baseline').source.match(/illustrative numbers, not from a real population/gi)).toHaveLength(1);
  });

  it('adds the illustrative note when an illustrative table’s source does not say so, and none for a real one', () => {
    const stratum = DEMO_HEART_FAILURE_10Y.strata[0];
    const base = { baseline: { risk: 0.002, years: 10 }, effect: rr.effect };
    const flagged = steps(base, { table: { ...DEMO_HEART_FAILURE_10Y, source: 'Invented for a workshop' }, stratum });
    expect(step(flagged, 'baseline').source).toContain('Invented for a workshop (2024)');
    expect(step(flagged, 'baseline').source).toMatch(/— illustrative numbers, not from a real population$/);
    const real = steps(base, { table: { ...DEMO_HEART_FAILURE_10Y, source: 'A regional registry report', illustrative: false }, stratum });
    expect(step(real, 'baseline').source).not.toMatch(/illustrative/i);
  });

  it('says when a risk ratio was capped at certainty', () => {
    const list = steps({ baseline: { risk: 0.5, years: 5 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 2.5 } });
    expect(step(list, 'conversion').result).toContain('capped at 1');
  });

  it('always gives complete steps whose icon counts are the engine’s (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        fc.pre(result.ok);
        if (!result.ok) return;
        const list = explainSteps({ scenario, result: result.value });
        expect(list).toHaveLength(7);
        for (const s of list) for (const field of [s.formula, s.numbers, s.result, s.source]) expect(field).not.toMatch(/undefined|NaN/);
        const counts = result.value.iconArray;
        expect(step(list, 'icon-counts').result.startsWith(`${counts.referenceEvents} and ${counts.exposedEvents} out of`)).toBe(true);
        expect(step(list, 'number-needed').result).toBe(result.value.numberNeeded.text);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('explainSteps: a table baseline corrected with an exposure prevalence (issue 11 item 3)', () => {
  const table = { title: 'Test table', source: 'Illustrative numbers, not from a real population', year: 2024, illustrative: true, exposurePrevalence: 0.2 };
  const stratum = { sex: 'female', ageFrom: 40, ageTo: 49, risk: 0.12 } as const;

  function baselineSource(pe: number, withStratumPrevalence?: number): string {
    const scenario: Scenario = {
      baseline: { populationRisk: 0.12, exposurePrevalence: pe, years: 10 },
      effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.67 },
      tableId: 'test',
    };
    const r = computeScenario(scenario);
    if (!r.ok) throw new Error('expected a result');
    // Hand-computed: P0 = 0.12 / (1 − 0.2 + 0.2·2) = 0.12 / 1.2 = 0.1.
    if (pe === 0.2) expect(r.value.referenceRisk).toBeCloseTo(0.1, 15);
    const s = withStratumPrevalence === undefined ? stratum : { ...stratum, exposurePrevalence: withStratumPrevalence };
    return explainSteps({ scenario, result: r.value, table, stratum: s }).find((x) => x.id === 'baseline')?.source ?? '';
  }

  it('says the prevalence came from the table', () => {
    expect(baselineSource(0.2)).toContain('exposure prevalence 0.2 (20%) from the table, for its whole population');
  });
  it('says the prevalence came from the table’s group', () => {
    expect(baselineSource(0.3, 0.3)).toContain('exposure prevalence 0.3 (30%) from the table, for this group');
  });
  it('says the clinician typed it when it differs from the table’s', () => {
    expect(baselineSource(0.35)).toContain('exposure prevalence 0.35 (35%) entered by the clinician');
  });
});
