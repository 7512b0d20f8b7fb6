import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EMPTY_FORM_VALUES, formExposure, formToOutcome, makeConsultationSchema, numberFromText, type ConsultationFormValues } from '@/lib/consultation/formValues';
import { evidenceToFormValues, scenarioToFormValues } from '@/lib/consultation/fromScenario';
import { computeScenario } from '@/lib/engine/compute';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import { DEMO_CORONARY_RATE, DEMO_HEART_FAILURE_10Y, DEMO_STROKE_5Y, DEMO_TABLES } from '@/lib/tables/demo';
import { patientText } from '@/lib/wording/patient';
import { scenarioArb } from '../support/arbitraries';

const typed: ConsultationFormValues = {
  ...EMPTY_FORM_VALUES,
  baselineSource: 'risk',
  riskBaseline: { risk: '0.08', years: '10' },
  effect: { ...EMPTY_FORM_VALUES.effect, measure: 'RR', estimate: '1.5', lower: '1.2', upper: '1.9' },
  wording: { ...EMPTY_FORM_VALUES.wording, outcome: 'heart failure needing hospital care', population: 'adults at a workplace health check' },
};
const typedWording = { outcome: 'heart failure needing hospital care', population: 'adults at a workplace health check' };

describe('numberFromText', () => {
  it('reads plain decimals, a decimal comma and exponents', () => {
    expect(numberFromText('0.08')).toBe(0.08);
    expect(numberFromText(' .08 ')).toBe(0.08);
    expect(numberFromText('0,08')).toBe(0.08);
    expect(numberFromText('1e-3')).toBe(0.001);
    expect(numberFromText('-2')).toBe(-2);
  });

  it('gives undefined for blank and NaN for anything else', () => {
    expect(numberFromText('')).toBeUndefined();
    expect(numberFromText('   ')).toBeUndefined();
    for (const bad of ['abc', '12abc', '0x10', 'Infinity', 'NaN', '1.2.3', '1,2,3', '--1']) expect(numberFromText(bad)).toBeNaN();
  });
});

describe('formToOutcome', () => {
  it('builds the scenario from typed values and computes the engine’s result', () => {
    const outcome = formToOutcome(typed, DEMO_TABLES);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.value.scenario).toEqual({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 }, wording: typedWording });
    expect(outcome.value.people).toBe('adults at a workplace health check');
    // What the sentences need is there: lib/wording accepts this outcome and group.
    const text = patientText({ result: outcome.value.result, wording: outcome.value.scenario.wording, people: outcome.value.people, horizonYears: outcome.value.result.horizonYears });
    expect(text.ok).toBe(true);
    const direct = computeScenario(outcome.value.scenario);
    expect(direct.ok && direct.value).toEqual(outcome.value.result);
  });

  it('leaves an empty form with a “required” issue on each field the engine needs, and no result', () => {
    const outcome = formToOutcome({ ...EMPTY_FORM_VALUES, baselineSource: 'risk' }, DEMO_TABLES);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    const paths = outcome.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['riskBaseline.risk', 'riskBaseline.years', 'effect.measure', 'effect.estimate', 'effect.lower', 'effect.upper']));
    expect(outcome.issues.every((i) => i.message.length > 0)).toBe(true);
  });

  it('puts an estimate below its lower limit on the estimate field with the engine’s code', () => {
    const outcome = formToOutcome({ ...typed, effect: { ...typed.effect, lower: '1.6' } }, DEMO_TABLES);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.issues).toEqual([expect.objectContaining({ code: 'estimate-outside-interval', path: ['effect', 'estimate'] })]);
  });

  it('puts limits in the wrong order on the lower limit', () => {
    const outcome = formToOutcome({ ...typed, effect: { ...typed.effect, lower: '2', upper: '1.9' } }, DEMO_TABLES);
    expect(!outcome.ok && outcome.issues[0]).toEqual(expect.objectContaining({ code: 'interval-order', path: ['effect', 'lower'] }));
  });

  it('says “must be a number” for text, and refuses 8 for a fraction', () => {
    const outcome = formToOutcome({ ...typed, riskBaseline: { risk: '8', years: 'ten' } }, DEMO_TABLES);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.issues).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ code: 'out-of-range', path: ['riskBaseline', 'risk'] }),
        expect.objectContaining({ code: 'not-a-number', path: ['riskBaseline', 'years'] }),
      ]),
    );
  });

  it('looks the baseline up in a table, asking only for what the table needs', () => {
    const noPerson = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_HEART_FAILURE_10Y.id }, DEMO_TABLES);
    expect(!noPerson.ok && noPerson.issues.map((i) => i.path.join('.'))).toEqual(['person.sex', 'person.age']);

    const found = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_HEART_FAILURE_10Y.id, person: { age: '45', sex: 'female' } }, DEMO_TABLES);
    expect(found.ok).toBe(true);
    if (!found.ok) return;
    // The demo table's female 40–49 stratum is 0.006 over 10 years (lib/tables/demo.ts, invented).
    expect(found.value.scenario.baseline).toEqual({ risk: 0.006, years: 10 });
    expect(found.value.scenario.person).toEqual({ age: 45, sex: 'female' });
    expect(found.value.scenario.tableId).toBe(DEMO_HEART_FAILURE_10Y.id);
    expect(found.value.table?.id).toBe(DEMO_HEART_FAILURE_10Y.id);

    // The stroke table is for both sexes together: the sex is not asked for, nor kept.
    const stroke = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_STROKE_5Y.id, person: { age: '62', sex: 'male' } }, DEMO_TABLES);
    expect(stroke.ok && stroke.value.scenario.person).toEqual({ age: 62 });
  });

  it('uses a rate table’s suggested horizon when none is typed', () => {
    const outcome = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_CORONARY_RATE.id, person: { age: '55', sex: 'male' } }, DEMO_TABLES);
    expect(outcome.ok && outcome.value.scenario.horizonYears).toBe(10);
  });

  it('reports an age outside every band, a fractional age and a missing table on their fields', () => {
    const young = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_HEART_FAILURE_10Y.id, person: { age: '17', sex: 'female' } }, DEMO_TABLES);
    expect(!young.ok && young.issues[0]).toEqual(expect.objectContaining({ code: 'no-stratum', path: ['person', 'age'] }));
    const fractional = formToOutcome({ ...typed, baselineSource: 'table', tableId: DEMO_HEART_FAILURE_10Y.id, person: { age: '45.5', sex: 'female' } }, DEMO_TABLES);
    expect(!fractional.ok && fractional.issues[0]?.path).toEqual(['person', 'age']);
    const none = formToOutcome({ ...typed, baselineSource: 'table', tableId: '' }, DEMO_TABLES);
    expect(!none.ok && none.issues[0]).toEqual(expect.objectContaining({ code: 'required', path: ['tableId'] }));
  });

  it('needs the outcome in words and who the figures are about before it shows sentences', () => {
    const noWords = formToOutcome({ ...typed, wording: EMPTY_FORM_VALUES.wording }, DEMO_TABLES);
    expect(!noWords.ok && noWords.issues.map((i) => [i.code, i.path.join('.')])).toEqual([
      ['population-required', 'wording.population'],
      ['outcome-required', 'wording.outcome'],
    ]);
    // An outcome of only dots or spaces is no outcome, as the sentences see it.
    const dots = formToOutcome({ ...typed, wording: { ...typed.wording, outcome: ' ... ' } }, DEMO_TABLES);
    expect(!dots.ok && dots.issues.map((i) => i.code)).toEqual(['outcome-required']);
    // An age or a sex names the group instead of the population text.
    const withAge = formToOutcome({ ...typed, person: { age: '53', sex: '' }, wording: { ...EMPTY_FORM_VALUES.wording, outcome: 'a stroke' } }, DEMO_TABLES);
    expect(withAge.ok && withAge.value.people).toBe('people aged 53');
  });

  it('never offers a result the sentences would refuse (1000 runs)', () => {
    const words = fc.oneof(fc.constant(''), fc.constant(' . '), fc.constant('...'), fc.string({ maxLength: 30 }), fc.constant('a first stroke'));
    fc.assert(
      fc.property(words, words, fc.constantFrom('', '53'), fc.constantFrom('', 'female'), (outcome, population, age, sex) => {
        const values = { ...typed, person: { age, sex }, wording: { ...EMPTY_FORM_VALUES.wording, outcome, population } } as ConsultationFormValues;
        const outcomeResult = formToOutcome(values, DEMO_TABLES);
        if (!outcomeResult.ok) return;
        const { result, scenario, people } = outcomeResult.value;
        expect(patientText({ result, wording: scenario.wording, people, horizonYears: result.horizonYears }).ok).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });

  it('requires a horizon with a typed rate, on the horizon field', () => {
    const outcome = formToOutcome({ ...typed, baselineSource: 'rate', rateBaseline: { rate: '12', perPersonYears: '1000' } }, DEMO_TABLES);
    expect(!outcome.ok && outcome.issues).toEqual([expect.objectContaining({ code: 'horizon-required', path: ['horizonYears'] })]);
  });

  it('keeps optional fields absent when left blank and sets them when chosen', () => {
    const outcome = formToOutcome(
      {
        ...typed,
        effect: { ...typed.effect, level: '0.9', design: 'risk-set-case-control', measure: 'OR', followUpYears: '8', adjusted: 'no' },
        wording: { ...EMPTY_FORM_VALUES.wording, outcome: '  heart failure needing hospital care ' },
        person: { age: '53', sex: 'female' },
        horizonYears: '5',
        denominator: '1000',
      },
      DEMO_TABLES,
    );
    expect(outcome.ok && outcome.value.scenario).toEqual({
      baseline: { risk: 0.08, years: 10 },
      effect: { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9, level: 0.9, design: 'risk-set-case-control', followUpYears: 8, adjusted: false },
      wording: { outcome: 'heart failure needing hospital care' },
      horizonYears: 5,
      denominator: 1000,
      person: { age: 53, sex: 'female' },
    });
  });
});

describe('makeConsultationSchema (the resolver’s schema)', () => {
  const schema = makeConsultationSchema(DEMO_TABLES);

  it('outputs the same outcome as formToOutcome for valid values', () => {
    const parsed = schema.safeParse(typed);
    const outcome = formToOutcome(typed, DEMO_TABLES);
    // Both must succeed: before, two failures compared false with false and passed (issue 11).
    expect(parsed.success).toBe(true);
    expect(outcome.ok).toBe(true);
    expect(parsed.success && outcome.ok && parsed.data.scenario).toEqual(outcome.ok && outcome.value.scenario);
  });

  it('fails with the engine’s messages on the form’s paths', () => {
    const parsed = schema.safeParse({ ...typed, effect: { ...typed.effect, lower: '1.6' } });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    expect(parsed.error.issues).toEqual([expect.objectContaining({ path: ['effect', 'estimate'], message: expect.stringContaining('must lie within its interval') })]);
  });

  it('refuses values that are not the form’s shape', () => {
    expect(schema.safeParse({}).success).toBe(false);
    expect(schema.safeParse(null).success).toBe(false);
    expect(schema.safeParse({ ...typed, denominator: '10' }).success).toBe(false);
  });
});

describe('scenarioToFormValues', () => {
  it('round-trips every valid scenario through the form unchanged (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (bare) => {
        // The sentences need the outcome and who the figures are about.
        const scenario = { ...bare, wording: { outcome: 'a first stroke' }, person: { age: 60 } };
        const outcome = formToOutcome(scenarioToFormValues(scenario, DEMO_TABLES), DEMO_TABLES);
        const direct = computeScenario(scenario);
        expect(outcome.ok).toBe(direct.ok);
        if (outcome.ok) expect(outcome.value.scenario).toEqual(scenario);
      }),
      { numRuns: 1000 },
    );
  });

  it('reopens a table baseline as the table with the person', () => {
    const values = scenarioToFormValues(
      { baseline: { risk: 0.006, years: 10 }, effect: { measure: 'HR', estimate: 1.6, lower: 1.2, upper: 2.1 }, person: { age: 45, sex: 'female' }, tableId: DEMO_HEART_FAILURE_10Y.id },
      DEMO_TABLES,
    );
    expect(values.baselineSource).toBe('table');
    expect(values.tableId).toBe(DEMO_HEART_FAILURE_10Y.id);
    expect(values.person).toEqual({ age: '45', sex: 'female' });
  });

  it('reopens a baseline that does not match its table’s stratum as a typed risk', () => {
    const values = scenarioToFormValues(
      { baseline: { risk: 0.5, years: 10 }, effect: { measure: 'HR', estimate: 1.6, lower: 1.2, upper: 2.1 }, person: { age: 45, sex: 'female' }, tableId: DEMO_HEART_FAILURE_10Y.id },
      DEMO_TABLES,
    );
    expect(values.baselineSource).toBe('risk');
    expect(values.riskBaseline).toEqual({ risk: '0.5', years: '10' });
  });

  it('fills the effect and wording from each demo evidence entry', () => {
    for (const entry of DEMO_EVIDENCE) {
      const filled = evidenceToFormValues(entry);
      // The demo populations describe the study, too long for "people like you": an age names the group.
      const outcome = formToOutcome({ ...typed, ...filled, person: { age: '50', sex: '' } }, DEMO_TABLES);
      expect(outcome.ok).toBe(true);
      if (outcome.ok) {
        expect(outcome.value.scenario.effect).toEqual(entry.effect);
        expect(outcome.value.scenario.wording).toEqual(entry.wording);
        // The exposure definition comes along too (issue 9 item 1), or stays absent.
        expect(outcome.value.scenario.exposureDefinition).toEqual(entry.exposureDefinition);
      }
    }
  });

  it('carries an exposure definition typed on the screen into the scenario, and back from a link', () => {
    const exposure = { defined: 'yes', test: 'hba1c', category: 'prediabetes', criteria: 'ADA', minYears: '3', maxGapMonths: '15', comparison: 'normal', comparisonYears: '' } as const;
    const outcome = formToOutcome({ ...typed, exposure }, DEMO_TABLES);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const definition = { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', maxGapMonths: 15, comparison: { category: 'normal' } };
    expect(outcome.value.scenario.exposureDefinition).toEqual(definition);
    expect(formExposure({ ...typed, exposure })).toEqual(definition);
    expect(scenarioToFormValues(outcome.value.scenario, DEMO_TABLES).exposure).toEqual(exposure);
  });

  it('puts a bad exposure definition on its field, and gives the glucose check none', () => {
    const exposure = { ...EMPTY_FORM_VALUES.exposure, defined: 'yes', comparison: 'prediabetes' } as const;
    const outcome = formToOutcome({ ...typed, exposure }, DEMO_TABLES);
    expect(outcome.ok === false && outcome.issues.map((i) => i.path.join('.'))).toEqual(['exposure.comparison']);
    expect(formExposure({ ...typed, exposure })).toBeUndefined();
    expect(formExposure(null)).toBeUndefined();
  });
});
