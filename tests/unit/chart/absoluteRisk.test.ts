import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { absoluteRiskBars } from '@/lib/chart/absoluteRisk';
import { computeScenario } from '@/lib/engine/compute';
import { scenarioArb } from '../support/arbitraries';

function computed(scenario: Parameters<typeof computeScenario>[0]) {
  const result = computeScenario(scenario);
  if (!result.ok) throw new Error(`test scenario must compute: ${JSON.stringify(result.issues)}`);
  return result.value;
}

describe('absoluteRiskBars: the engine’s risks in per cent, with whiskers', () => {
  it('gives 8% and 12% (9.6% to 15.2%) for a 10-year risk of 0.08 and RR 1.5 (1.2 to 1.9)', () => {
    // Hand-computed: P1 = 1.5·0.08 = 0.12, limits 1.2·0.08 = 0.096 and 1.9·0.08 = 0.152;
    // whiskers 12 − 9.6 = 2.4 and 15.2 − 12 = 3.2 percentage points.
    const [reference, exposed] = absoluteRiskBars(computed({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } }));
    expect(reference).toEqual({ group: 'reference', riskPercent: 8, lowerPercent: 8, upperPercent: 8, whiskerPercent: [0, 0] });
    expect(exposed.group).toBe('exposed');
    expect(exposed.riskPercent).toBeCloseTo(12, 12);
    expect(exposed.lowerPercent).toBeCloseTo(9.6, 12);
    expect(exposed.upperPercent).toBeCloseTo(15.2, 12);
    expect(exposed.whiskerPercent[0]).toBeCloseTo(2.4, 12);
    expect(exposed.whiskerPercent[1]).toBeCloseTo(3.2, 12);
  });

  it('keeps a protective effect’s whiskers on both sides of the bar', () => {
    // Hand-computed: P0 = 0.2, RR 0.5 (0.4 to 0.7) → 10% (8% to 14%); whiskers 2 and 4.
    const [, exposed] = absoluteRiskBars(computed({ baseline: { risk: 0.2, years: 5 }, effect: { measure: 'RR', estimate: 0.5, lower: 0.4, upper: 0.7 } }));
    expect(exposed.riskPercent).toBeCloseTo(10, 12);
    expect(exposed.whiskerPercent[0]).toBeCloseTo(2, 12);
    expect(exposed.whiskerPercent[1]).toBeCloseTo(4, 12);
  });

  it('stops the upper whisker at 100% when the engine caps a risk ratio at certainty', () => {
    // Hand-computed: P0 = 0.5, RR 1.5 (1.2 to 2.5): P1 = 0.75, upper 2.5·0.5 = 1.25 capped at 1 → 100%, whisker 25.
    const [, exposed] = absoluteRiskBars(computed({ baseline: { risk: 0.5, years: 5 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 2.5 } }));
    expect(exposed.upperPercent).toBe(100);
    expect(exposed.whiskerPercent[1]).toBeCloseTo(25, 12);
  });

  it('always has lower ≤ risk ≤ upper, whiskers ≥ 0 that reach the limits, and per cents in [0, 100] (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        fc.pre(result.ok);
        if (!result.ok) return;
        for (const bar of absoluteRiskBars(result.value)) {
          expect(bar.lowerPercent).toBeLessThanOrEqual(bar.riskPercent);
          expect(bar.riskPercent).toBeLessThanOrEqual(bar.upperPercent);
          expect(bar.lowerPercent).toBeGreaterThanOrEqual(0);
          expect(bar.upperPercent).toBeLessThanOrEqual(100);
          expect(bar.whiskerPercent[0]).toBeGreaterThanOrEqual(0);
          expect(bar.whiskerPercent[1]).toBeGreaterThanOrEqual(0);
          expect(bar.riskPercent - bar.whiskerPercent[0]).toBeCloseTo(bar.lowerPercent, 9);
          expect(bar.riskPercent + bar.whiskerPercent[1]).toBeCloseTo(bar.upperPercent, 9);
        }
      }),
      { numRuns: 1000 },
    );
  });
});
