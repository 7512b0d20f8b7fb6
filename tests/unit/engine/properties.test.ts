import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeScenario } from '@/lib/engine/compute';
import { exposedRisk, exposedRiskSlope, ratioFromRisks } from '@/lib/engine/exposedRisk';
import { populationRisk, referenceRiskFromPopulation, rescaleRisk } from '@/lib/engine/baseline';
import { exposedLayout, referenceLayout } from '@/lib/engine/iconArray';
import type { Conversion } from '@/lib/engine/types';
import { fractionArb, ratioArb, scenarioArb, yearsArb } from '../support/arbitraries';

const RUNS = { numRuns: 1000 };
const conversionArb = fc.constantFrom<Conversion>('risk-ratio', 'risk-odds-ratio', 'rate-ratio');

describe('engine properties (fast-check, 1000 runs each)', () => {
  it('keeps every risk in [0, 1] and the limits ordered', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        // A degenerate baseline is refused, which is allowed; fc.pre (not return) so an engine that
        // refused everything would fail the property (too many skipped runs).
        fc.pre(result.ok);
        const r = result.value;
        for (const p of [r.referenceRisk, r.exposedRisk.estimate, r.exposedRisk.lower, r.exposedRisk.upper]) {
          expect(p).toBeGreaterThanOrEqual(0);
          expect(p).toBeLessThanOrEqual(1);
        }
        expect(r.exposedRisk.lower).toBeLessThanOrEqual(r.exposedRisk.estimate);
        expect(r.exposedRisk.estimate).toBeLessThanOrEqual(r.exposedRisk.upper);
      }),
      RUNS,
    );
  });

  it('raises the exposed risk with the ratio at a fixed baseline', () => {
    fc.assert(
      fc.property(conversionArb, fractionArb, ratioArb, ratioArb, (conversion, p0, a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        // 1e-15 absolute: for ratios one ulp apart, rounding can reorder results in the last bit.
        expect(exposedRisk(conversion, p0, lo)).toBeLessThanOrEqual(exposedRisk(conversion, p0, hi) + 1e-15);
      }),
      RUNS,
    );
  });

  it('gives no difference for a ratio of 1', () => {
    fc.assert(
      fc.property(conversionArb, fractionArb, (conversion, p0) => {
        // Relative 1e-12: 1 − P0 + P0 may differ from 1 in the last bit.
        expect(Math.abs(exposedRisk(conversion, p0, 1) - p0)).toBeLessThanOrEqual(1e-12 * p0);
      }),
      RUNS,
    );
  });

  it('round-trips ratio → risk → ratio', () => {
    fc.assert(
      fc.property(conversionArb, fc.double({ min: 0.001, max: 0.9, noNaN: true }), ratioArb, (conversion, p0, ratio) => {
        const p1 = exposedRisk(conversion, p0, ratio);
        fc.pre(p1 < 0.999999); // beyond this the inverse is ill-conditioned in double precision
        expect(ratioFromRisks(conversion, p0, p1)).toBeCloseTo(ratio, 6);
      }),
      RUNS,
    );
  });

  it('round-trips a horizon t1 → t2 → t1', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 0.9, noNaN: true }), yearsArb, yearsArb, (p, t1, t2) => {
        const there = rescaleRisk(p, t1, t2);
        fc.pre(there < 1 - 1e-9);
        expect(rescaleRisk(there, t2, t1)).toBeCloseTo(p, 8);
      }),
      RUNS,
    );
  });

  it('reproduces the population risk from the solved reference risk', () => {
    fc.assert(
      fc.property(conversionArb, fc.double({ min: 0.001, max: 0.95, noNaN: true }), ratioArb, fc.double({ min: 0, max: 0.95, noNaN: true }), (conversion, ppop, ratio, pe) => {
        const p0 = referenceRiskFromPopulation(conversion, ppop, ratio, pe);
        expect(p0).toBeGreaterThanOrEqual(0);
        expect(p0).toBeLessThanOrEqual(1);
        if (1 - p0 < 1e-12) {
          // The root lies within rounding of certainty (the engine refuses such a baseline as
          // degenerate): then P0 = 1 must reach at least the population risk.
          // Or there is no solution below certainty: then P0 = 1 is returned as the cap.
          expect(p0 === 1 || populationRisk(conversion, 1, ratio, pe) >= ppop).toBe(true);
        } else {
          // Near P0 = 1 a protective rate ratio makes Ppop(P0) very steep, so the best double-precision
          // P0 reproduces Ppop only to slope × 1 ulp; allow that on top of 1e-10.
          const slope = 1 - pe + pe * exposedRiskSlope(conversion, p0, ratio);
          expect(Math.abs(populationRisk(conversion, p0, ratio, pe) - ppop)).toBeLessThan(1e-10 + slope * 1e-15);
        }
      }),
      RUNS,
    );
  });

  it('makes icon counts whole and sum to the denominator in both arrays', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        fc.pre(result.ok);
        const c = result.value.iconArray;
        const reference = referenceLayout(c);
        const exposed = exposedLayout(c);
        for (const layout of [reference, exposed]) {
          const { event, added, avoided, none } = layout.tally;
          expect(event + added + avoided + none).toBe(layout.denominator);
          expect(layout.cells).toHaveLength(layout.denominator);
        }
        expect(reference.tally.uncertain).toBe(0);
        expect(exposed.tally.uncertain).toBe(c.exposedUpper - c.exposedLower);
        for (const n of [c.referenceEvents, c.exposedEvents, c.exposedLower, c.exposedUpper]) {
          expect(Number.isInteger(n)).toBe(true);
          expect(n).toBeGreaterThanOrEqual(0);
          expect(n).toBeLessThanOrEqual(c.denominator);
        }
      }),
      RUNS,
    );
  });

  it('makes the number needed 1/|difference|', () => {
    fc.assert(
      fc.property(scenarioArb, (scenario) => {
        const result = computeScenario(scenario);
        fc.pre(result.ok);
        const { riskDifference, numberNeeded } = result.value;
        if (riskDifference.estimate === 0) {
          expect(numberNeeded.estimate).toBeNull();
        } else {
          expect(numberNeeded.estimate).toBeCloseTo(1 / Math.abs(riskDifference.estimate), 9);
          expect(numberNeeded.direction).toBe(riskDifference.estimate > 0 ? 'harm' : 'benefit');
          expect(numberNeeded.display).toBeGreaterThanOrEqual((numberNeeded.estimate ?? Infinity) - 1e-9);
        }
      }),
      RUNS,
    );
  });
});
