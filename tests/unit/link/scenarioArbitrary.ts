/**
 * Every valid scenario, as fast-check sees it: each field over the schema's whole range
 * (lib/scenario/schema.ts), every optional field sometimes absent, −0 where a bound of 0 lets
 * it through, and text that is hard for a URL (&, =, #, +, %, Unicode; lone surrogates only in
 * {@link brokenTextArb}, since a link leaves such text out).
 * Narrower than the schema only where the schema itself is (the text length limits).
 */
import fc from 'fast-check';
import {
  DENOMINATORS,
  EFFECT_MEASURES,
  INTERVAL_LEVELS,
  MAX_RATIO,
  MIN_RATIO,
  MIN_INTERVAL_LEVEL,
  MAX_INTERVAL_LEVEL,
  MAX_TEXT,
  MAX_YEARS,
  STUDY_DESIGNS,
  type Baseline,
  type Effect,
  type Scenario,
} from '@/lib/scenario/schema';
import {
  CRITERIA_SETS,
  DECIDING_TESTS,
  GLYCAEMIC_CATEGORIES,
  MAX_RUN_GAP_MONTHS,
  MIN_RUN_GAP_MONTHS,
  type ExposureDefinition,
} from '@/lib/glycaemia/exposure';

/** Objects as JSON.parse and zod make them (fast-check would otherwise try null prototypes too). */
const plain = { noNullPrototype: true } as const;

/** Open interval (min, max) of doubles, plus round decimals as people type them. */
function openDouble(min: number, max: number, inclusiveMax = false, inclusiveMin = false): fc.Arbitrary<number> {
  return fc.oneof(
    fc.double({ min, max, minExcluded: !inclusiveMin, maxExcluded: !inclusiveMax, noNaN: true }),
    fc.integer({ min: 1, max: 999 }).map((n) => min + ((max - min) * n) / 1000),
  );
}

const fractionArb = openDouble(0, 1);
const yearsArb = openDouble(0, MAX_YEARS, true);
// [0.001, 1000]: the schema's ratio range (issue 14 item 14 added the lower bound).
const ratioArb = openDouble(MIN_RATIO, MAX_RATIO, true, true);

const baselineArb: fc.Arbitrary<Baseline> = fc.oneof(
  fc.record({ risk: fractionArb, years: yearsArb }, plain),
  fc.record({ rate: openDouble(0, 1e6, true), perPersonYears: openDouble(0, 1e9, true) }, plain),
  fc.record(
    {
      populationRisk: fractionArb,
      exposurePrevalence: fc.oneof(fc.constant(0), fc.constant(-0), fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true })),
      years: yearsArb,
    },
    plain,
  ),
);

const effectArb: fc.Arbitrary<Effect> = fc
  .tuple(
    fc.tuple(ratioArb, ratioArb, ratioArb).map((xs) => [...xs].sort((a, b) => a - b) as [number, number, number]),
    fc.record(
      {
        measure: fc.constantFrom(...EFFECT_MEASURES),
        level: fc.oneof(fc.constantFrom(...INTERVAL_LEVELS), fc.double({ min: MIN_INTERVAL_LEVEL, max: MAX_INTERVAL_LEVEL, noNaN: true })),
        design: fc.constantFrom(...STUDY_DESIGNS),
        followUpYears: yearsArb,
        adjusted: fc.boolean(),
      },
      { requiredKeys: ['measure'], ...plain },
    ),
  )
  .filter(([[lower, , upper]]) => lower < upper)
  .map(([[lower, estimate, upper], rest]) => ({ ...rest, estimate, lower, upper }));

/** Characters that a URL query treats specially, and text a clinician might type. */
const awkwardUnit = fc.constantFrom(
  '&', '=', '#', '+', '%', '?', '/', ';', ' ', '\n', '\t', '"', "'", '\\', '.json', 'wo=', '%20', '%zz',
  'é', 'ß', '€', 'µ', 'Δ', '≥', '≤', '–', '…', '中', '😀', '👩‍⚕️', '\u0301', '\u0000', '\uFEFF', '\uD800', '\uDFFF',
);
/** Any UTF-16 code unit, lone surrogates included (a valid JS string need not be valid Unicode). */
const codeUnit = fc.integer({ min: 0, max: 0xffff }).map((c) => String.fromCharCode(c));

/** A lone UTF-16 surrogate (half of a pair). */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/**
 * Text of the given length. Lone surrogates (broken characters, which a link leaves out and
 * names: lib/link/scenarioLink.ts) are replaced by "x" unless `broken` is set.
 */
function textArb(minLength: number, maxLength: number, broken = false): fc.Arbitrary<string> {
  const text = fc
    .oneof(
      fc.string({ unit: awkwardUnit, minLength, maxLength: 40 }),
      fc.string({ unit: 'grapheme', minLength, maxLength: Math.min(maxLength, 100) }),
      fc.string({ unit: codeUnit, minLength, maxLength: Math.min(maxLength, 60) }),
      fc.string({ unit: 'binary', minLength, maxLength: Math.floor(maxLength / 2) }),
    )
    .filter((s) => s.length >= minLength && s.length <= maxLength);
  return broken ? text : text.map((s) => s.replace(LONE_SURROGATE, 'x'));
}

/** Text that holds at least one lone surrogate. */
export const brokenTextArb: fc.Arbitrary<string> = fc
  .tuple(textArb(0, 200, true), fc.constantFrom('\uD800', '\uDBFF', '\uDC00', '\uDFFF'), textArb(0, 200, true))
  .map(([a, lone, b]) => `${a}${lone}${b}`)
  .filter((s) => s.length <= MAX_TEXT && new RegExp(LONE_SURROGATE.source).test(s));

const wordingArb = fc.record(
  {
    outcome: textArb(0, MAX_TEXT),
    exposure: textArb(0, MAX_TEXT),
    comparison: textArb(0, MAX_TEXT),
    population: textArb(0, MAX_TEXT),
    citation: textArb(0, MAX_TEXT),
  },
  { requiredKeys: [], ...plain },
);

const personArb = fc.record(
  { age: fc.oneof(fc.integer({ min: 0, max: 120 }), fc.constant(-0)), sex: fc.constantFrom('female' as const, 'male' as const) },
  { requiredKeys: [], ...plain },
);

/** Every valid exposure definition (lib/glycaemia/exposure.ts): the comparison's range differs from the exposure's. */
export const exposureDefinitionArb: fc.Arbitrary<ExposureDefinition> = fc
  .record(
    {
      category: fc.constantFrom(...GLYCAEMIC_CATEGORIES),
      criteria: fc.constantFrom(...CRITERIA_SETS),
      minYears: fc.integer({ min: 1, max: 50 }),
      test: fc.constantFrom(...DECIDING_TESTS),
      maxGapMonths: fc.integer({ min: MIN_RUN_GAP_MONTHS, max: MAX_RUN_GAP_MONTHS }),
      comparison: fc.record({ category: fc.constantFrom(...GLYCAEMIC_CATEGORIES), minYears: fc.integer({ min: 1, max: 50 }) }, { requiredKeys: ['category'], ...plain }),
    },
    { requiredKeys: ['category', 'criteria', 'minYears'], ...plain },
  )
  .filter((d) => d.comparison === undefined || d.comparison.category !== d.category);

export const anyValidScenarioArb: fc.Arbitrary<Scenario> = fc
  .record(
    {
      baseline: baselineArb,
      effect: effectArb,
      horizonYears: yearsArb,
      denominator: fc.constantFrom(...DENOMINATORS),
      // An empty object is valid too, and must stay an empty object.
      wording: fc.oneof(fc.constant({}), wordingArb),
      person: fc.oneof(fc.constant({}), personArb),
      exposureDefinition: exposureDefinitionArb,
      tableId: textArb(1, 100),
    },
    { requiredKeys: ['baseline', 'effect'], ...plain },
  )
  // The schema requires a horizon with a rate baseline.
  .filter((s) => !('rate' in s.baseline) || s.horizonYears !== undefined);
