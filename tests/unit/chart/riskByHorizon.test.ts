import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { chartHorizons, describeRiskByHorizon, formatPercentValue, riskByHorizon } from '@/lib/chart/riskByHorizon';
import { computeScenario } from '@/lib/engine/compute';
import { scenarioArb } from '../support/arbitraries';

describe('chartHorizons: whole years from 1 to H, then H', () => {
  it('lists whole years and ends at the horizon', () => {
    expect(chartHorizons(3)).toEqual([1, 2, 3]);
    expect(chartHorizons(3.5)).toEqual([1, 2, 3, 3.5]);
    expect(chartHorizons(1)).toEqual([1]);
  });

  it('gives just the horizon below one year', () => {
    expect(chartHorizons(0.5)).toEqual([0.5]);
  });

  it('gives nothing for a horizon the schema refuses', () => {
    for (const bad of [0, -1, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 100.5]) {
      expect(chartHorizons(bad)).toEqual([]);
    }
    expect(chartHorizons(100)).toHaveLength(100);
  });
});

describe('riskByHorizon: the engine run at each year', () => {
  it('rescales a 2-year risk of 0.19 to 10% at 1 year under a constant hazard, RR 2 (1.5 to 2.5)', () => {
    // Hand-computed (Miller & Homan 1994): 1 − 0.81^(1/2) = 0.1 → 10%; P1 = 2·0.1 = 20%, limits 15% and 25%.
    // At 2 years: 19%, P1 = 38%, limits 28.5% and 47.5%.
    const points = riskByHorizon({ baseline: { risk: 0.19, years: 2 }, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.5 } }, 2);
    expect(points.ok).toBe(true);
    if (!points.ok) return;
    const [one, two] = points.value;
    expect(points.value).toHaveLength(2);
    expect(one?.horizonYears).toBe(1);
    expect(one?.referencePercent).toBeCloseTo(10, 12);
    expect(one?.exposedPercent).toBeCloseTo(20, 12);
    expect(one?.exposedLowerPercent).toBeCloseTo(15, 12);
    expect(one?.exposedUpperPercent).toBeCloseTo(25, 12);
    expect(two?.referencePercent).toBeCloseTo(19, 12);
    expect(two?.exposedPercent).toBeCloseTo(38, 12);
    expect(two?.exposedBandPercent[0]).toBeCloseTo(28.5, 12);
    expect(two?.exposedBandPercent[1]).toBeCloseTo(47.5, 12);
  });

  it('turns a rate of 10 per 1000 person-years into risks year by year, HR 2 (1.5 to 2.7)', () => {
    // Hand-computed: λ = 0.01; 1 year: 1 − e^−0.01 = 0.00995017 → 0.995017%; exposed
    // 1 − (e^−0.01)² = 1 − e^−0.02 = 0.0198013 → 1.98013%. 3 years: 1 − e^−0.03 = 2.955447%.
    const points = riskByHorizon({ baseline: { rate: 10, perPersonYears: 1000 }, effect: { measure: 'HR', estimate: 2, lower: 1.5, upper: 2.7 }, horizonYears: 3 }, 3);
    expect(points.ok).toBe(true);
    if (!points.ok) return;
    expect(points.value.map((p) => p.horizonYears)).toEqual([1, 2, 3]);
    expect(points.value[0]?.referencePercent).toBeCloseTo(0.995017, 6);
    expect(points.value[0]?.exposedPercent).toBeCloseTo(1.98013, 5);
    expect(points.value[2]?.referencePercent).toBeCloseTo(2.955447, 6);
  });

  it('refuses a horizon outside the schema’s range', () => {
    const scenario = { baseline: { risk: 0.1, years: 10 }, effect: { measure: 'RR' as const, estimate: 1.5, lower: 1.2, upper: 1.9 } };
    for (const bad of [0, -3, Number.NaN, Number.POSITIVE_INFINITY, 250]) {
      const points = riskByHorizon(scenario, bad);
      expect(points.ok).toBe(false);
      if (!points.ok) expect(points.issues[0]?.code).toBe('out-of-range');
    }
  });

  it('ends exactly at the engine’s result for the chosen horizon, and rises with time in both groups (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        fc.pre(result.ok);
        if (!result.ok) return;
        const points = riskByHorizon(scenario, result.value.horizonYears);
        expect(points.ok).toBe(true);
        if (!points.ok) return;
        const last = points.value[points.value.length - 1];
        expect(last?.horizonYears).toBe(result.value.horizonYears);
        expect(last?.referencePercent).toBe(result.value.referenceRisk * 100);
        expect(last?.exposedPercent).toBe(result.value.exposedRisk.estimate * 100);
        for (let i = 1; i < points.value.length; i += 1) {
          const before = points.value[i - 1]!;
          const now = points.value[i]!;
          expect(now.referencePercent).toBeGreaterThanOrEqual(before.referencePercent);
          expect(now.exposedPercent).toBeGreaterThanOrEqual(before.exposedPercent);
        }
        for (const p of points.value) {
          expect(p.exposedLowerPercent).toBeLessThanOrEqual(p.exposedPercent);
          expect(p.exposedPercent).toBeLessThanOrEqual(p.exposedUpperPercent);
        }
      }),
      { numRuns: 1000 },
    );
  });
});

describe('describeRiskByHorizon and formatPercentValue', () => {
  const groups = { exposed: 'with the exposure', comparison: 'without it' };

  it('writes per cents with one decimal', () => {
    expect(formatPercentValue(8)).toBe('8.0%');
    expect(formatPercentValue(12.345)).toBe('12.3%');
    expect(formatPercentValue(0.04)).toBe('0.0%');
  });

  it('names both groups at the first year and gives the interval at the horizon', () => {
    // Hand-computed values as above: 1 year 10% and 20%; 2 years 19% and 38% (28.5% to 47.5%).
    const points = riskByHorizon({ baseline: { risk: 0.19, years: 2 }, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.5 } }, 2);
    expect(points.ok).toBe(true);
    if (!points.ok) return;
    expect(describeRiskByHorizon(points.value, groups)).toBe(
      'Risk by year, from 1 year to 2 years: at 1 year 20.0% with the exposure and 10.0% without it; at 2 years 38.0% (95% CI 28.5% to 47.5%) and 19.0%.',
    );
  });

  it('has a one-point form and an empty form', () => {
    const points = riskByHorizon({ baseline: { risk: 0.19, years: 2 }, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 2.5 } }, 0.5);
    expect(points.ok && describeRiskByHorizon(points.value, groups)).toMatch(/^Risk at 0\.5 years: /);
    expect(describeRiskByHorizon([], groups)).toBe('No horizon to show.');
  });
});
