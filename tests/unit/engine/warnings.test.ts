import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import type { Scenario } from '@/lib/scenario/schema';

function codes(scenario: Scenario): string[] {
  const result = computeScenario(scenario);
  if (!result.ok) throw new Error('expected a result');
  return result.value.warnings.map((w) => w.code);
}

const clean: Scenario = {
  baseline: { risk: 0.05, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9, adjusted: true, followUpYears: 12 },
};

describe('scenarioWarnings', () => {
  it('raises nothing for a clean scenario', () => {
    // Hand-computed: √(1.2·1.9) = 1.51 ≈ 1.5; 1 < 1.2; RR·P0 = 1.9·0.05 = 0.095 < 1; horizon 10 ≤ 12; adjusted.
    expect(codes(clean)).toEqual([]);
  });

  it('flags an interval far from geometric symmetry (a likely typing slip)', () => {
    // Hand-computed: √(1.2·9.1) = 3.3, far from 1.5 (see logInterval tests).
    expect(codes({ ...clean, effect: { ...clean.effect, upper: 9.1 } })).toContain('interval-asymmetric');
  });

  it('flags an interval that includes no effect', () => {
    // Definition: 0.9 ≤ 1 ≤ 1.35.
    expect(codes({ ...clean, effect: { ...clean.effect, estimate: 1.1, lower: 0.9, upper: 1.35 } })).toContain(
      'interval-includes-no-effect',
    );
  });

  it('flags an odds ratio converted at a baseline above 10% (Zhang & Yu 1998)', () => {
    // The 10% limit is Zhang & Yu's; 0.15 is above it, 0.1 is at it and not above.
    const s: Scenario = { baseline: { risk: 0.15, years: 10 }, effect: { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
    expect(codes(s)).toContain('odds-ratio-high-baseline');
    expect(codes({ ...s, baseline: { risk: 0.1, years: 10 } })).not.toContain('odds-ratio-high-baseline');
  });

  it('flags the conversion of an adjusted odds ratio (McNutt et al. 2003, Am J Epidemiol 157:940)', () => {
    const s: Scenario = {
      baseline: { risk: 0.05, years: 10 },
      effect: { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9, adjusted: true },
    };
    expect(codes(s)).toContain('odds-ratio-adjusted');
    // Not for a risk-set sampled odds ratio, which is treated as a rate ratio, not converted by Zhang–Yu.
    expect(codes({ ...s, effect: { ...s.effect, design: 'risk-set-case-control' } })).not.toContain('odds-ratio-adjusted');
  });

  it('flags a risk ratio that would pass certainty at this baseline', () => {
    // Hand-computed: upper limit 1.9·0.6 = 1.14 ≥ 1.
    expect(codes({ ...clean, baseline: { risk: 0.6, years: 10 } })).toContain('risk-ratio-exceeds-certainty');
  });

  it('flags a horizon beyond the study follow-up', () => {
    // Definition: 15 > 12 years is beyond; 12 is not.
    expect(codes({ ...clean, horizonYears: 15 })).toContain('horizon-beyond-follow-up');
    expect(codes({ ...clean, horizonYears: 12 })).not.toContain('horizon-beyond-follow-up');
  });

  it('flags an unadjusted estimate', () => {
    // Issue 2's warning list: adjusted = false.
    expect(codes({ ...clean, effect: { ...clean.effect, adjusted: false } })).toContain('unadjusted-estimate');
  });

  it('flags a risk ratio said to come from a case-control study', () => {
    // Rodrigues & Kirkwood 1990: case-control sampling estimates odds ratios, not risk ratios.
    expect(codes({ ...clean, effect: { ...clean.effect, design: 'case-control' } })).toContain('risk-ratio-from-case-control');
  });

  it('applies each trigger at its boundary (≥ and ≤ as documented in DEVELOPERS.md)', () => {
    // Definition L ≤ 1 ≤ U: a limit of exactly 1 includes no effect.
    expect(codes({ ...clean, effect: { ...clean.effect, estimate: 1.4, lower: 1, upper: 1.96 } })).toContain('interval-includes-no-effect');
    expect(codes({ ...clean, effect: { ...clean.effect, estimate: 0.7, lower: 0.5, upper: 1 } })).toContain('interval-includes-no-effect');
    // Hand-computed: RR × P0 ≥ 1 — upper 2·0.5 = 1 exactly is flagged; 1.9·0.5 = 0.95 is not.
    expect(codes({ ...clean, baseline: { risk: 0.5, years: 10 }, effect: { ...clean.effect, upper: 2 } })).toContain('risk-ratio-exceeds-certainty');
    expect(codes({ ...clean, baseline: { risk: 0.5, years: 10 } })).not.toContain('risk-ratio-exceeds-certainty');
  });

  it('warns about Zhang–Yu only where Zhang–Yu is used', () => {
    // conversion table (methods guide): a case-control OR with controls from non-cases is a risk odds
    // ratio (converted, so McNutt applies); a case-cohort OR is a risk ratio (not converted).
    const adjustedOr = { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9, adjusted: true } as const;
    expect(codes({ baseline: { risk: 0.15, years: 10 }, effect: { ...adjustedOr, design: 'case-control' } })).toEqual(
      expect.arrayContaining(['odds-ratio-high-baseline', 'odds-ratio-adjusted']),
    );
    const caseCohort = codes({ baseline: { risk: 0.15, years: 10 }, effect: { ...adjustedOr, design: 'case-cohort' } });
    expect(caseCohort).not.toContain('odds-ratio-high-baseline');
    expect(caseCohort).not.toContain('odds-ratio-adjusted');
  });

  it('gives every warning a code and a plain message', () => {
    const result = computeScenario({
      baseline: { risk: 0.6, years: 10 },
      horizonYears: 20,
      effect: { measure: 'RR', estimate: 1.1, lower: 0.9, upper: 9, adjusted: false, followUpYears: 5, design: 'case-control' },
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // Exactly these, hand-derived from each rule: √(0.9·9) = 2.85 is far from 1.1; 0.9 ≤ 1 ≤ 9; P0 over
    // 20 years = 1 − 0.4² = 0.84 and 9·0.84 ≥ 1; 20 > 5 years; unadjusted; an RR from a case-control
    // study. Not stretched: 20 years is exactly twice the 10-year period and not beyond 20 years.
    expect(result.value.warnings.map((w) => w.code)).toEqual([
      'interval-asymmetric',
      'interval-includes-no-effect',
      'risk-ratio-exceeds-certainty',
      'horizon-beyond-follow-up',
      'unadjusted-estimate',
      'risk-ratio-from-case-control',
    ]);
    for (const w of result.value.warnings) {
      expect(w.code).toMatch(/^[a-z-]+$/);
      expect(w.message.length).toBeGreaterThan(20);
    }
  });

  it('warns when a baseline is stretched beyond twice its period or 20 years, saying by how much (issue 11 item 4)', () => {
    // Methods guide, "Baselines": warn beyond twice the period or about 20 years.
    const oneYear: Scenario = { ...clean, baseline: { risk: 0.01, years: 1 }, horizonYears: 100, effect: { ...clean.effect, followUpYears: 100 } };
    const w = computeScenario(oneYear);
    if (!w.ok) throw new Error('expected a result');
    const stretched = w.value.warnings.find((x) => x.code === 'baseline-extrapolated');
    // Hand-computed: 100 / 1 = 100 times the period.
    expect(stretched?.message).toContain('100 times its own period');
    expect(stretched?.message).toContain('beyond 20 years');
    expect(codes({ ...clean, baseline: { risk: 0.05, years: 5 }, horizonYears: 10 })).not.toContain('baseline-extrapolated'); // 2×, 10 y
    expect(codes({ ...clean, baseline: { risk: 0.05, years: 4 }, horizonYears: 9 })).toContain('baseline-extrapolated'); // 2.25×
    expect(codes({ ...clean, baseline: { risk: 0.05, years: 15 }, horizonYears: 21, effect: { ...clean.effect, followUpYears: 30 } })).toContain('baseline-extrapolated'); // > 20 y
    expect(codes({ ...clean, baseline: { risk: 0.05, years: 30 }, horizonYears: 25, effect: { ...clean.effect, followUpYears: 30 } })).not.toContain('baseline-extrapolated'); // shortened
    // A rate has no period of its own: only the 20-year rule.
    expect(codes({ ...clean, baseline: { rate: 5, perPersonYears: 1000 }, horizonYears: 20 })).not.toContain('baseline-extrapolated');
    expect(codes({ ...clean, baseline: { rate: 5, perPersonYears: 1000 }, horizonYears: 30 })).toContain('baseline-extrapolated');
  });

  it('warns that a cross-sectional ratio compares prevalence (issue 11 item 5)', () => {
    const s: Scenario = { ...clean, effect: { ...clean.effect, measure: 'OR', design: 'cross-sectional' } };
    expect(codes(s)).toContain('cross-sectional-prevalence');
    expect(codes({ ...s, effect: { ...s.effect, design: 'cohort' } })).not.toContain('cross-sectional-prevalence');
  });

  it('words the high-baseline odds-ratio warning for a protective odds ratio too (issue 11 item 6)', () => {
    const s: Scenario = { baseline: { risk: 0.3, years: 10 }, effect: { measure: 'OR', estimate: 0.5, lower: 0.4, upper: 0.63 } };
    const r = computeScenario(s);
    if (!r.ok) throw new Error('expected a result');
    const message = r.value.warnings.find((x) => x.code === 'odds-ratio-high-baseline')?.message ?? '';
    expect(message).toContain('further from 1');
    expect(message).toContain('smaller, for an odds ratio below 1');
    expect(message).not.toContain('clearly larger');
  });

  it('reads a matched case-control odds ratio by its sampling and as adjusted (issue 11 item 7)', () => {
    const or = { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9 } as const;
    const matched = computeScenario({ baseline: { risk: 0.05, years: 10 }, effect: { ...or, design: 'matched-case-control' } });
    const riskSet = computeScenario({ baseline: { risk: 0.05, years: 10 }, effect: { ...or, design: 'matched-risk-set-case-control' } });
    if (!matched.ok || !riskSet.ok) throw new Error('expected results');
    expect(matched.value.conversion).toBe('risk-odds-ratio');
    expect(riskSet.value.conversion).toBe('rate-ratio');
    // Conditional odds ratio: adjusted for the matching factors (Pearce 2016, from memory), so the McNutt warning applies.
    expect(matched.value.warnings.map((w) => w.code)).toContain('odds-ratio-adjusted');
    expect(codes({ baseline: { risk: 0.05, years: 10 }, effect: { ...or, design: 'matched-case-control', adjusted: false } })).not.toContain(
      'unadjusted-estimate',
    );
  });

  it('warns when a hazard or risk ratio comes with a case-control or cross-sectional design (issue 11 item 7)', () => {
    expect(codes({ ...clean, effect: { ...clean.effect, measure: 'HR', design: 'case-control' } })).toContain('measure-unusual-for-design');
    expect(codes({ ...clean, effect: { ...clean.effect, measure: 'HR', design: 'matched-risk-set-case-control' } })).toContain('measure-unusual-for-design');
    expect(codes({ ...clean, effect: { ...clean.effect, measure: 'RR', design: 'cross-sectional' } })).toContain('measure-unusual-for-design');
    expect(codes({ ...clean, effect: { ...clean.effect, measure: 'HR', design: 'cohort' } })).not.toContain('measure-unusual-for-design');
    expect(codes({ ...clean, effect: { ...clean.effect, measure: 'OR', design: 'case-control' } })).not.toContain('measure-unusual-for-design');
  });

  it('warns with the size of the effect when a table baseline has no exposure prevalence (issue 11 item 3)', () => {
    const fromTable: Scenario = { ...clean, baseline: { risk: 0.1, years: 10 }, effect: { ...clean.effect, estimate: 2, lower: 1.5, upper: 2.67 }, tableId: 'demo' };
    const r = computeScenario(fromTable);
    if (!r.ok) throw new Error('expected a result');
    const w = r.value.warnings.find((x) => x.code === 'table-prevalence-unknown');
    // Hand-computed: at pe = 0.2 and RR 2, P0 = 0.1 / (0.8 + 0.4) = 0.0833, so 0.1 overstates it by 0.1/0.0833 − 1 = 20%.
    expect(w?.message).toContain('overstate');
    expect(w?.message).toContain('about 20%');
    expect(codes({ ...fromTable, tableId: undefined })).not.toContain('table-prevalence-unknown');
    expect(codes({ ...fromTable, baseline: { populationRisk: 0.1, exposurePrevalence: 0.3, years: 10 } })).not.toContain('table-prevalence-unknown');
  });

  it('carries the two standing assumptions in every result (issue 11 item 9)', () => {
    const r = computeScenario(clean);
    if (!r.ok) throw new Error('expected a result');
    expect(r.value.assumptions.map((a) => a.code)).toEqual(['baseline-uncertainty-not-included', 'constant-relative-effect']);
  });
});
