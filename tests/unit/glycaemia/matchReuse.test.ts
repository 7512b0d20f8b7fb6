import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CRITERIA_SETS, DECIDING_TESTS, GLYCAEMIC_CATEGORIES, type ExposureDefinition } from '@/lib/glycaemia/exposure';
import { exposureStatus, matchHistory } from '@/lib/glycaemia/match';
import type { Checkup } from '@/lib/glycaemia/schema';

// exposureStatus and matchHistory reuse what depends only on the definition (its resolved form and
// the words of its reasons) while the definition's fields stay the same. Whatever was matched
// before, the answer must be the one worked out afresh. Invented histories and definitions.

const checkupArb: fc.Arbitrary<Checkup> = fc
  .record({
    year: fc.integer({ min: 2015, max: 2024 }),
    month: fc.integer({ min: 1, max: 12 }),
    hba1c: fc.option(fc.integer({ min: 50, max: 70 }).map((v) => ({ value: v / 10, unit: '%' as const })), { nil: undefined }),
    fpg: fc.option(fc.integer({ min: 85, max: 135 }).map((v) => ({ value: v, unit: 'mg/dL' as const })), { nil: undefined }),
  })
  .filter((c) => c.hba1c !== undefined || c.fpg !== undefined)
  .map((c) => ({ date: `${c.year}-${String(c.month).padStart(2, '0')}-01`, ...(c.hba1c ? { hba1c: c.hba1c } : {}), ...(c.fpg ? { fpg: c.fpg } : {}) }));
const historyArb = fc.uniqueArray(checkupArb, { selector: (c) => c.date, maxLength: 6 });

const definitionArb: fc.Arbitrary<ExposureDefinition> = fc
  .record({
    category: fc.constantFrom(...GLYCAEMIC_CATEGORIES),
    criteria: fc.constantFrom(...CRITERIA_SETS),
    minYears: fc.integer({ min: 1, max: 4 }),
    test: fc.option(fc.constantFrom(...DECIDING_TESTS), { nil: undefined }),
    maxGapMonths: fc.option(fc.integer({ min: 6, max: 18 }), { nil: undefined }),
    comparison: fc.option(fc.record({ category: fc.constantFrom(...GLYCAEMIC_CATEGORIES), minYears: fc.option(fc.integer({ min: 1, max: 4 }), { nil: undefined }) }), { nil: undefined }),
  })
  .map((d) => {
    const definition: Record<string, unknown> = { category: d.category, criteria: d.criteria, minYears: d.minYears };
    if (d.test !== undefined) definition.test = d.test;
    if (d.maxGapMonths !== undefined) definition.maxGapMonths = d.maxGapMonths;
    if (d.comparison && d.comparison.category !== d.category) {
      definition.comparison = d.comparison.minYears !== undefined ? { category: d.comparison.category, minYears: d.comparison.minYears } : { category: d.comparison.category };
    }
    return definition as ExposureDefinition;
  });

/** A definition and others that each differ from it in one field (so reuse keyed on the wrong fields shows). */
const definitionsArb: fc.Arbitrary<ExposureDefinition[]> = fc
  .tuple(definitionArb, fc.array(definitionArb, { minLength: 1, maxLength: 3 }), fc.array(fc.constantFrom('category', 'criteria', 'minYears', 'test', 'maxGapMonths', 'comparison'), { minLength: 1, maxLength: 3 }))
  .map(([base, others, fields]) => [
    base,
    ...others.map((other, i) => {
      const field = fields[i % fields.length] as keyof ExposureDefinition;
      const variant: Record<string, unknown> = { ...base };
      if (other[field] === undefined) delete variant[field];
      else variant[field] = other[field];
      if (variant.comparison && (variant.comparison as { category: string }).category === variant.category) delete variant.comparison;
      return variant as ExposureDefinition;
    }),
  ]);

/** A definition unlike any the arbitrary makes (minYears 50): matching against it first clears what was reused. */
const OTHER: ExposureDefinition = { category: 'normal', criteria: 'WHO', minYears: 50, test: 'both', maxGapMonths: 7 };
function fresh<T>(work: () => T): T {
  exposureStatus([], OTHER);
  matchHistory([], OTHER);
  return work();
}

describe('matching reuses what depends only on the definition, with the same answers', () => {
  it('property: each match in a run of matches (definitions repeating and changing) equals the match worked out afresh', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(historyArb, fc.nat()), { minLength: 1, maxLength: 12 }), definitionsArb, (steps, definitions) => {
        const options = { shownCriteria: 'ADA' as const };
        const definitionOf = (pick: number) => definitions[pick % definitions.length] as ExposureDefinition;
        // All the matches one after another first (each may reuse what the one before left), then each afresh.
        const warm = steps.map(([history, pick]) => [exposureStatus(history, definitionOf(pick), options), matchHistory(history, definitionOf(pick), options)] as const);
        steps.forEach(([history, pick], i) => {
          expect(warm[i]?.[0]).toEqual(fresh(() => exposureStatus(history, definitionOf(pick), options)));
          expect(warm[i]?.[1]).toEqual(fresh(() => matchHistory(history, definitionOf(pick), options)));
        });
      }),
      { numRuns: 400 },
    );
  });

  it('a definition changed in place between two matches is read afresh', () => {
    // ADA prediabetes 5.7–6.4%: three yearly results of 6.0%.
    const history: Checkup[] = ['2021-03-01', '2022-03-01', '2023-03-01'].map((date) => ({ date, hba1c: { value: 6.0, unit: '%' } }));
    const definition: { -readonly [K in keyof ExposureDefinition]: ExposureDefinition[K] } = { category: 'prediabetes', criteria: 'ADA', minYears: 3, comparison: { category: 'normal' } };
    expect(exposureStatus(history, definition).status).toBe('exposed');
    definition.minYears = 4;
    const after = exposureStatus(history, definition);
    expect(after.status).toBe('neither');
    expect(after.exposure.reasons[0]).toBe('The study needed 4 yearly results in the prediabetes range (ADA); this history has 3, from 2021-03-01 to 2023-03-01.');
    definition.comparison = { category: 'prediabetes', minYears: 2 };
    definition.category = 'normal';
    expect(exposureStatus(history, definition).status).toBe('comparison');
    // Only the comparison group's own fields changed, inside the same object.
    const normal: Checkup[] = ['2021-03-01', '2022-03-01', '2023-03-01'].map((date) => ({ date, hba1c: { value: 5.2, unit: '%' } }));
    const comparison: { category: ExposureDefinition['category']; minYears?: number } = { category: 'normal' };
    const withComparison: ExposureDefinition = { category: 'prediabetes', criteria: 'ADA', minYears: 3, comparison };
    expect(exposureStatus(normal, withComparison).status).toBe('comparison');
    comparison.minYears = 4;
    expect(exposureStatus(normal, withComparison).status).toBe('neither');
    delete comparison.minYears;
    expect(exposureStatus(normal, withComparison).status).toBe('comparison');
    comparison.category = 'diabetes-range';
    expect(exposureStatus(normal, withComparison).status).toBe('neither');
    // The deciding test and the longest gap. HbA1c 6.0% (ADA prediabetes) with a fasting glucose of
    // 90 mg/dL (ADA normal, below 100), 14 months apart.
    const mixed: Checkup[] = ['2020-01-01', '2021-03-01', '2022-05-01'].map((date) => ({ date, hba1c: { value: 6.0, unit: '%' }, fpg: { value: 90, unit: 'mg/dL' } }));
    const byTest: { -readonly [K in keyof ExposureDefinition]: ExposureDefinition[K] } = { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', comparison: { category: 'normal' } };
    expect(exposureStatus(mixed, byTest).status).toBe('exposed');
    byTest.test = 'fpg';
    expect(exposureStatus(mixed, byTest).status).toBe('comparison');
    byTest.test = 'hba1c';
    expect(exposureStatus(mixed, byTest).status).toBe('exposed');
    byTest.maxGapMonths = 12;
    expect(exposureStatus(mixed, byTest).neitherReason).toBe('gap');
  });
});
