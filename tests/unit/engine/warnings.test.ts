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
    expect(result.value.warnings.length).toBeGreaterThanOrEqual(5);
    for (const w of result.value.warnings) {
      expect(w.code).toMatch(/^[a-z-]+$/);
      expect(w.message.length).toBeGreaterThan(20);
    }
  });
});
