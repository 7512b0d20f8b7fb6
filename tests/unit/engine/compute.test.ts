import { describe, expect, it } from 'vitest';
import { computeScenario, resolveHorizonYears } from '@/lib/engine/compute';
import type { Scenario } from '@/lib/scenario/schema';

function value(scenario: Scenario) {
  const result = computeScenario(scenario);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.value;
}

describe('computeScenario', () => {
  it('fills the whole output contract for a risk ratio', () => {
    // Hand-computed: P0 = 0.08; P1 = 1.5·0.08 = 0.12 (limits 0.096, 0.152); RD = 0.04 → NNTH 25.
    const r = value({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } });
    expect(r.horizonYears).toBe(10);
    expect(r.referenceRisk).toBe(0.08);
    expect(r.exposedRisk.estimate).toBeCloseTo(0.12, 15);
    expect(r.exposedRisk.lower).toBeCloseTo(0.096, 15);
    expect(r.exposedRisk.upper).toBeCloseTo(0.152, 15);
    expect(r.riskRatio.estimate).toBeCloseTo(1.5, 14);
    expect(r.riskDifference.estimate).toBeCloseTo(0.04, 15);
    expect(r.numberNeeded).toMatchObject({ direction: 'harm', display: 25, crossesNull: false });
    expect(r.iconArray).toMatchObject({ denominator: 100, referenceEvents: 8, exposedEvents: 12 });
    expect(r).toMatchObject({ measure: 'RR', design: 'cohort', level: 0.95, conversion: 'risk-ratio' });
    expect(r.warnings).toEqual([]);
  });

  it('turns a rate into a risk over the horizon, then applies a hazard ratio', () => {
    // Hand-computed: λ = 20/1000/yr, t = 5 → P0 = 1 − e^−0.1 = 0.0951626; HR 1.5 → P1 = 1 − e^−0.15 = 0.1392920.
    const r = value({
      baseline: { rate: 20, perPersonYears: 1000 },
      horizonYears: 5,
      effect: { measure: 'HR', estimate: 1.5, lower: 1.2, upper: 1.9 },
    });
    expect(r.referenceRisk).toBeCloseTo(0.09516258196404048, 14);
    expect(r.exposedRisk.estimate).toBeCloseTo(0.1392920235749422, 14);
    expect(r.conversion).toBe('rate-ratio');
  });

  it('solves the reference risk from a population average before applying the effect', () => {
    // Hand-computed (see baseline tests): Ppop 0.1375, pe 0.25, OR 3 → P0 = 0.1, P1 = 0.25.
    const r = value({
      baseline: { populationRisk: 0.1375, exposurePrevalence: 0.25, years: 10 },
      effect: { measure: 'OR', estimate: 3, lower: 2, upper: 4.5, design: 'cross-sectional' },
    });
    expect(r.referenceRisk).toBeCloseTo(0.1, 12);
    expect(r.exposedRisk.estimate).toBeCloseTo(0.25, 12);
    expect(r.riskRatio.estimate).toBeCloseTo(2.5, 11);
  });

  it('rescales the baseline to the horizon under a constant hazard', () => {
    // Hand-computed: 10-year risk 0.2 → 5-year risk 1 − 0.8^0.5 = 0.1055728.
    const r = value({ baseline: { risk: 0.2, years: 10 }, horizonYears: 5, effect: { measure: 'RR', estimate: 1, lower: 0.8, upper: 1.25 } });
    expect(r.referenceRisk).toBeCloseTo(0.10557280900008414, 14);
    expect(r.riskDifference.estimate).toBe(0);
    expect(r.numberNeeded.direction).toBe('none');
  });

  it('treats a risk-set sampled odds ratio as a rate ratio, a case-cohort one as a risk ratio', () => {
    // Rodrigues & Kirkwood 1990, Int J Epidemiol 19:205. Hand-computed at P0 = 0.1, ratio 2:
    // rate ratio 1 − 0.9² = 0.19; risk ratio 0.2; risk odds ratio 0.2/1.1 = 0.1818.
    const base = { baseline: { risk: 0.1, years: 10 } } as const;
    const effect = { measure: 'OR', estimate: 2, lower: 1.5, upper: 2.7 } as const;
    expect(value({ ...base, effect: { ...effect, design: 'risk-set-case-control' } }).exposedRisk.estimate).toBeCloseTo(0.19, 14);
    expect(value({ ...base, effect: { ...effect, design: 'case-cohort' } }).exposedRisk.estimate).toBeCloseTo(0.2, 14);
    expect(value({ ...base, effect: { ...effect, design: 'case-control' } }).exposedRisk.estimate).toBeCloseTo(0.2 / 1.1, 14);
  });

  it('gives a protective effect as benefit', () => {
    const r = value({ baseline: { risk: 0.1, years: 5 }, effect: { measure: 'RR', estimate: 0.5, lower: 0.3, upper: 0.8 } });
    // Hand-computed: RD = 0.05 − 0.1 = −0.05 → NNTB 20.
    expect(r.numberNeeded).toMatchObject({ direction: 'benefit', display: 20 });
  });

  it('refuses a baseline that works out to certainty over the horizon', () => {
    // Hand-computed: 1e6 events per person-year over 100 years: 1 − e^(−1e8) is 1 in double precision.
    const result = computeScenario({
      baseline: { rate: 1e6, perPersonYears: 1 },
      horizonYears: 100,
      effect: { measure: 'HR', estimate: 1.5, lower: 1.2, upper: 1.9 },
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'baseline-degenerate', path: ['baseline'] });
  });

  it('gives no difference, not a vast number needed, for a ratio of exactly 1', () => {
    // Definition: a ratio of 1 gives P1 = P0, so RD = 0 and the number needed is infinite.
    // Before the exact identity, HR 1 at P0 = 0.061 gave RD = −6.9e-18 and "NNTB 144115188075855870".
    const r = value({ baseline: { risk: 0.061, years: 10 }, effect: { measure: 'HR', estimate: 1, lower: 0.8, upper: 1.25 } });
    expect(r.riskDifference.estimate).toBe(0);
    expect(r.numberNeeded).toMatchObject({ direction: 'none', estimate: null, display: null, crossesNull: true });
  });

  it('passes the number-needed interval through infinity when a limit is exactly 1', () => {
    // Altman 1998, BMJ 317:1309: a limit of no effect is an infinite number needed. Before the fix,
    // HR 1.3 (1.0–1.7) at P0 = 0.118 gave RD lower = +1.4e-17, so the interval did not cross the null.
    const r = value({ baseline: { risk: 0.118, years: 10 }, effect: { measure: 'HR', estimate: 1.3, lower: 1, upper: 1.7 } });
    expect(r.riskDifference.lower).toBe(0);
    expect(r.numberNeeded.crossesNull).toBe(true);
    expect(r.numberNeeded.interval.from).toEqual({ direction: 'none', value: null, display: null });
    // Issue 11 item 12: written from the finite end (was "∞ to NNTH n").
    expect(r.numberNeeded.text).toMatch(/^NNTH \d+ \(95% CI: NNTH \d+ to ∞\)$/);
  });

  it('keeps the limits on either side of the estimate when they are ulps apart', () => {
    // Found by a long fast-check run: Zhang–Yu at P0 = 0.5999642784883066 put the lower limit
    // (OR 10.886858932020477) one ulp above the estimate (OR 10.886858932020479). Monotonicity
    // (methods guide, "Confidence intervals") means lower ≤ estimate ≤ upper must hold exactly.
    const r = value({
      baseline: { risk: 0.5999642784883066, years: 1 },
      effect: { measure: 'OR', estimate: 10.886858932020479, lower: 10.886858932020477, upper: 10.88794761791368 },
    });
    expect(r.exposedRisk.lower).toBeLessThanOrEqual(r.exposedRisk.estimate);
    expect(r.exposedRisk.estimate).toBeLessThanOrEqual(r.exposedRisk.upper);
    expect(r.riskDifference.lower).toBeLessThanOrEqual(r.riskDifference.estimate);
  });

  it('defaults the horizon to the baseline period', () => {
    // Issue contract: H defaults to the baseline's years.
    expect(resolveHorizonYears({ baseline: { risk: 0.1, years: 7 }, effect: { measure: 'RR', estimate: 1, lower: 0.9, upper: 1.1 } })).toBe(7);
  });
});

describe('computeScenario: inconsistent population baseline', () => {
  it('refuses a population risk that no reference risk can produce', () => {
    // Hand-computed: RR 0.05, pe 0.95 → even P0 = 1 gives 0.05·1 + 0.95·0.05 = 0.0975 < 0.2.
    const result = computeScenario({
      baseline: { populationRisk: 0.2, exposurePrevalence: 0.95, years: 10 },
      effect: { measure: 'RR', estimate: 0.05, lower: 0.03, upper: 0.08 },
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'population-risk-inconsistent', path: ['baseline', 'populationRisk'] });
  });
});
