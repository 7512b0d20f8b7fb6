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
    expect(codes(clean)).toEqual([]);
  });

  it('flags an interval far from geometric symmetry (a likely typing slip)', () => {
    // Hand-computed: √(1.2·9.1) = 3.3, far from 1.5 (see logInterval tests).
    expect(codes({ ...clean, effect: { ...clean.effect, upper: 9.1 } })).toContain('interval-asymmetric');
  });

  it('flags an interval that includes no effect', () => {
    expect(codes({ ...clean, effect: { ...clean.effect, estimate: 1.1, lower: 0.9, upper: 1.35 } })).toContain(
      'interval-includes-no-effect',
    );
  });

  it('flags an odds ratio converted at a baseline above 10% (Zhang & Yu 1998)', () => {
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
    expect(codes({ ...clean, baseline: { risk: 0.6, years: 10 } })).toContain('risk-ratio-exceeds-certainty');
  });

  it('flags a horizon beyond the study follow-up', () => {
    expect(codes({ ...clean, horizonYears: 15 })).toContain('horizon-beyond-follow-up');
    expect(codes({ ...clean, horizonYears: 12 })).not.toContain('horizon-beyond-follow-up');
  });

  it('flags an unadjusted estimate', () => {
    expect(codes({ ...clean, effect: { ...clean.effect, adjusted: false } })).toContain('unadjusted-estimate');
  });

  it('flags a risk ratio said to come from a case-control study', () => {
    expect(codes({ ...clean, effect: { ...clean.effect, design: 'case-control' } })).toContain('risk-ratio-from-case-control');
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
