/**
 * fast-check arbitraries for valid scenarios, built from the schema's own ranges, shared by the
 * property tests.
 */
import fc from 'fast-check';
import { EFFECT_MEASURES, STUDY_DESIGNS, type Effect, type Scenario } from '@/lib/scenario/schema';

export const fractionArb = fc.double({ min: 1e-6, max: 1 - 1e-6, noNaN: true });
export const yearsArb = fc.double({ min: 0.25, max: 100, noNaN: true });
export const ratioArb = fc.double({ min: 0.05, max: 20, noNaN: true });

export const effectArb: fc.Arbitrary<Effect> = fc
  .record({
    measure: fc.constantFrom(...EFFECT_MEASURES),
    estimate: ratioArb,
    widthLower: fc.double({ min: 1, max: 3, noNaN: true }),
    widthUpper: fc.double({ min: 1.0001, max: 3, noNaN: true }),
    design: fc.constantFrom(...STUDY_DESIGNS),
  })
  .map(({ measure, estimate, widthLower, widthUpper, design }) => ({
    measure,
    estimate,
    lower: estimate / widthLower,
    upper: estimate * widthUpper,
    design,
  }));

export const scenarioArb: fc.Arbitrary<Scenario> = fc
  .record({
    form: fc.constantFrom('risk', 'rate', 'population'),
    risk: fc.double({ min: 0.001, max: 0.6, noNaN: true }),
    years: fc.integer({ min: 1, max: 30 }),
    prevalence: fc.double({ min: 0, max: 0.9, noNaN: true }),
    ratePerThousand: fc.double({ min: 0.1, max: 80, noNaN: true }),
    horizon: fc.option(fc.integer({ min: 1, max: 30 }), { nil: undefined }),
    effect: effectArb,
  })
  .map(({ form, risk, years, prevalence, ratePerThousand, horizon, effect }): Scenario => {
    const baseline =
      form === 'risk'
        ? { risk, years }
        : form === 'rate'
          ? { rate: ratePerThousand, perPersonYears: 1000 }
          : { populationRisk: risk, exposurePrevalence: prevalence, years };
    const horizonYears = form === 'rate' ? (horizon ?? years) : horizon;
    return horizonYears === undefined ? { baseline, effect } : { baseline, effect, horizonYears };
  });
