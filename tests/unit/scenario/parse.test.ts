import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseScenario, parseScenarioJson } from '@/lib/scenario/parse';
import { scenarioArb } from '../support/arbitraries';

const valid = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'OR', estimate: 1.5, lower: 1.2, upper: 1.9, level: 0.95, design: 'cohort', followUpYears: 8, adjusted: true },
  horizonYears: 10,
};

type Json = Record<string, unknown>;
function withBaseline(baseline: unknown): Json {
  return { ...valid, baseline };
}
function withEffect(patch: Json): Json {
  return { ...valid, effect: { ...valid.effect, ...patch } };
}
function firstIssue(input: unknown) {
  const result = parseScenario(input);
  expect(result.ok).toBe(false);
  if (result.ok) throw new Error('expected issues');
  return result.issues[0];
}

describe('parseScenario accepts', () => {
  it('the documented contract', () => {
    expect(parseScenario(valid)).toEqual({ ok: true, value: valid });
  });

  it('each baseline form', () => {
    expect(parseScenario(withBaseline({ rate: 12, perPersonYears: 1000 })).ok).toBe(true);
    expect(parseScenario(withBaseline({ populationRisk: 0.1, exposurePrevalence: 0.3, years: 10 })).ok).toBe(true);
    expect(parseScenario(withBaseline({ populationRisk: 0.1, exposurePrevalence: 0, years: 10 })).ok).toBe(true);
  });

  it('every scenario the property arbitrary makes (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        expect(parseScenario(s)).toMatchObject({ ok: true });
      }),
      { numRuns: 1000 },
    );
  });
});

describe('parseScenario refuses, naming the field', () => {
  it.each([
    ['risk 0', withBaseline({ risk: 0, years: 10 }), 'out-of-range', ['baseline', 'risk']],
    ['risk 1', withBaseline({ risk: 1, years: 10 }), 'out-of-range', ['baseline', 'risk']],
    ['a percentage typed as a risk', withBaseline({ risk: 8, years: 10 }), 'out-of-range', ['baseline', 'risk']],
    ['negative risk', withBaseline({ risk: -0.1, years: 10 }), 'out-of-range', ['baseline', 'risk']],
    ['risk as a string', withBaseline({ risk: '0.08', years: 10 }), 'not-a-number', ['baseline', 'risk']],
    ['NaN risk', withBaseline({ risk: Number.NaN, years: 10 }), 'not-a-number', ['baseline', 'risk']],
    ['infinite years', withBaseline({ risk: 0.1, years: Number.POSITIVE_INFINITY }), 'not-a-number', ['baseline', 'years']],
    ['zero years', withBaseline({ risk: 0.1, years: 0 }), 'out-of-range', ['baseline', 'years']],
    ['missing years', withBaseline({ risk: 0.1 }), 'required', ['baseline', 'years']],
    ['negative rate', withBaseline({ rate: -1, perPersonYears: 1000 }), 'out-of-range', ['baseline', 'rate']],
    ['prevalence 1', withBaseline({ populationRisk: 0.1, exposurePrevalence: 1, years: 10 }), 'out-of-range', ['baseline', 'exposurePrevalence']],
    ['unknown baseline form', withBaseline({ odds: 0.1 }), 'baseline-form', ['baseline']],
    ['baseline not an object', withBaseline('0.08'), 'baseline-form', ['baseline']],
    ['estimate 0', withEffect({ estimate: 0 }), 'out-of-range', ['effect', 'estimate']],
    ['negative lower', withEffect({ lower: -1.2 }), 'out-of-range', ['effect', 'lower']],
    ['-Infinity upper', withEffect({ upper: Number.NEGATIVE_INFINITY }), 'not-a-number', ['effect', 'upper']],
    ['estimate as a string', withEffect({ estimate: 'high' }), 'not-a-number', ['effect', 'estimate']],
    ['lower above upper', withEffect({ lower: 2, upper: 1.9 }), 'interval-order', ['effect', 'lower']],
    ['estimate outside its interval', withEffect({ estimate: 2.5 }), 'estimate-outside-interval', ['effect', 'estimate']],
    ['unknown measure', withEffect({ measure: 'IRR' }), 'invalid-choice', ['effect', 'measure']],
    ['unknown design', withEffect({ design: 'ecological' }), 'invalid-choice', ['effect', 'design']],
    // Issue 11 item 10: any level from 0.8 to 0.999 is accepted now, so the refused levels moved outside that range.
    ['level below 80%', withEffect({ level: 0.79 }), 'out-of-range', ['effect', 'level']],
    ['level above 99.9%', withEffect({ level: 0.9995 }), 'out-of-range', ['effect', 'level']],
    ['level as text', withEffect({ level: '95%' }), 'not-a-number', ['effect', 'level']],
    // Issue 14 item 14: ratios below 0.001 are refused, symmetric with the 1000 upper bound.
    ['estimate 1e-320', withEffect({ estimate: 1e-320, lower: 1e-321, upper: 1.9 }), 'out-of-range', ['effect', 'estimate']],
    ['lower just below 0.001', withEffect({ lower: 0.000999 }), 'out-of-range', ['effect', 'lower']],
    ['adjusted as text', withEffect({ adjusted: 'yes' }), 'wrong-type', ['effect', 'adjusted']],
    ['misspelt field', withEffect({ uper: 1.9 }), 'unknown-field', ['effect', 'uper']],
    ['missing effect', { baseline: valid.baseline }, 'required', ['effect']],
    ['rate without a horizon', { baseline: { rate: 12, perPersonYears: 1000 }, effect: valid.effect }, 'horizon-required', ['horizonYears']],
    ['horizon over 100 years', { ...valid, horizonYears: 101 }, 'out-of-range', ['horizonYears']],
    ['denominator 50', { ...valid, denominator: 50 }, 'invalid-choice', ['denominator']],
    // Further boundaries and bad input (issue 2 §4), field by field.
    ['missing baseline', { effect: valid.effect }, 'required', ['baseline']],
    ['baseline null', withBaseline(null), 'baseline-form', ['baseline']],
    ['risk −Infinity', withBaseline({ risk: Number.NEGATIVE_INFINITY, years: 10 }), 'not-a-number', ['baseline', 'risk']],
    ['years negative', withBaseline({ risk: 0.1, years: -5 }), 'out-of-range', ['baseline', 'years']],
    ['years as a string', withBaseline({ risk: 0.1, years: '10' }), 'not-a-number', ['baseline', 'years']],
    ['rate 0', withBaseline({ rate: 0, perPersonYears: 1000 }), 'out-of-range', ['baseline', 'rate']],
    ['rate NaN', withBaseline({ rate: Number.NaN, perPersonYears: 1000 }), 'not-a-number', ['baseline', 'rate']],
    ['rate as a string', withBaseline({ rate: '12', perPersonYears: 1000 }), 'not-a-number', ['baseline', 'rate']],
    ['person-years 0', withBaseline({ rate: 12, perPersonYears: 0 }), 'out-of-range', ['baseline', 'perPersonYears']],
    ['person-years +Infinity', withBaseline({ rate: 12, perPersonYears: Number.POSITIVE_INFINITY }), 'not-a-number', ['baseline', 'perPersonYears']],
    ['missing person-years', withBaseline({ rate: 12 }), 'required', ['baseline', 'perPersonYears']],
    ['population risk 0', withBaseline({ populationRisk: 0, exposurePrevalence: 0.3, years: 10 }), 'out-of-range', ['baseline', 'populationRisk']],
    ['population risk 1', withBaseline({ populationRisk: 1, exposurePrevalence: 0.3, years: 10 }), 'out-of-range', ['baseline', 'populationRisk']],
    ['negative prevalence', withBaseline({ populationRisk: 0.1, exposurePrevalence: -0.1, years: 10 }), 'out-of-range', ['baseline', 'exposurePrevalence']],
    ['prevalence as a string', withBaseline({ populationRisk: 0.1, exposurePrevalence: '30%', years: 10 }), 'not-a-number', ['baseline', 'exposurePrevalence']],
    ['missing prevalence', withBaseline({ populationRisk: 0.1, years: 10 }), 'required', ['baseline', 'exposurePrevalence']],
    ['missing measure', { ...valid, effect: { estimate: 1.5, lower: 1.2, upper: 1.9 } }, 'required', ['effect', 'measure']],
    ['missing estimate', { ...valid, effect: { measure: 'RR', lower: 1.2, upper: 1.9 } }, 'required', ['effect', 'estimate']],
    ['missing lower', { ...valid, effect: { measure: 'RR', estimate: 1.5, upper: 1.9 } }, 'required', ['effect', 'lower']],
    ['missing upper', { ...valid, effect: { measure: 'RR', estimate: 1.5, lower: 1.2 } }, 'required', ['effect', 'upper']],
    ['estimate NaN', withEffect({ estimate: Number.NaN }), 'not-a-number', ['effect', 'estimate']],
    ['estimate +Infinity', withEffect({ estimate: Number.POSITIVE_INFINITY }), 'not-a-number', ['effect', 'estimate']],
    ['negative estimate', withEffect({ estimate: -1.5 }), 'out-of-range', ['effect', 'estimate']],
    ['estimate as a numeric string', withEffect({ estimate: '1.5' }), 'not-a-number', ['effect', 'estimate']],
    ['lower 0', withEffect({ lower: 0 }), 'out-of-range', ['effect', 'lower']],
    ['upper above the largest ratio', withEffect({ upper: 1001 }), 'out-of-range', ['effect', 'upper']],
    ['lower equal to upper', withEffect({ estimate: 1.5, lower: 1.5, upper: 1.5 }), 'interval-order', ['effect', 'lower']],
    ['estimate below its interval', withEffect({ estimate: 1.1 }), 'estimate-outside-interval', ['effect', 'estimate']],
    ['level as a percentage', withEffect({ level: 95 }), 'out-of-range', ['effect', 'level']],
    ['design as a number', withEffect({ design: 3 }), 'invalid-choice', ['effect', 'design']],
    ['follow-up 0', withEffect({ followUpYears: 0 }), 'out-of-range', ['effect', 'followUpYears']],
    ['negative follow-up', withEffect({ followUpYears: -8 }), 'out-of-range', ['effect', 'followUpYears']],
    ['adjusted as 1', withEffect({ adjusted: 1 }), 'wrong-type', ['effect', 'adjusted']],
    ['effect not an object', { ...valid, effect: 'RR 1.5' }, 'wrong-type', ['effect']],
    ['horizon 0', { ...valid, horizonYears: 0 }, 'out-of-range', ['horizonYears']],
    ['negative horizon', { ...valid, horizonYears: -10 }, 'out-of-range', ['horizonYears']],
    ['horizon NaN', { ...valid, horizonYears: Number.NaN }, 'not-a-number', ['horizonYears']],
    ['horizon as a string', { ...valid, horizonYears: '10' }, 'not-a-number', ['horizonYears']],
    ['unknown top-level field', { ...valid, horizon: 10 }, 'unknown-field', ['horizon']],
    ['age with a fraction', { ...valid, person: { age: 45.5 } }, 'not-a-whole-number', ['person', 'age']],
    ['unknown sex', { ...valid, person: { sex: 'f' } }, 'invalid-choice', ['person', 'sex']],
  ] as const)('%s', (_label, input, code, path) => {
    const issue = firstIssue(input);
    expect(issue?.code).toBe(code);
    expect(issue?.path).toEqual(path);
    expect(issue?.message.length).toBeGreaterThan(10);
  });

  it('refuses a non-object input', () => {
    for (const input of [null, 42, 'scenario', [], undefined]) {
      expect(parseScenario(input).ok).toBe(false);
    }
  });

  it('reports every problem, not only the first', () => {
    const result = parseScenario({ baseline: { risk: 2, years: -1 }, effect: { measure: 'XX', estimate: 1, lower: 1, upper: 1 } });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues.map((i) => i.path.join('.'))).toEqual(
      expect.arrayContaining(['baseline.risk', 'baseline.years', 'effect.measure']),
    );
  });
});

describe('parseScenarioJson', () => {
  it('reports malformed JSON as an issue, never a throw', () => {
    const result = parseScenarioJson('{"baseline": ');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'invalid-json', path: [] });
  });

  it('parses and validates JSON text', () => {
    expect(parseScenarioJson(JSON.stringify(valid)).ok).toBe(true);
  });
});

describe('interval level and ratio bounds (issue 11 item 10, issue 14 item 14)', () => {
  const base = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
  it.each([0.8, 0.9, 0.975, 0.999])('accepts the level %s', (level) => {
    expect(parseScenario({ ...base, effect: { ...base.effect, level } }).ok).toBe(true);
  });
  it('accepts 0.001 and 1000 as the two ends of a ratio', () => {
    expect(parseScenario({ ...base, effect: { measure: 'RR', estimate: 0.01, lower: 0.001, upper: 1000 } }).ok).toBe(true);
  });
  it('names the lower bound in the message', () => {
    const result = parseScenario({ ...base, effect: { measure: 'RR', estimate: 1e-320, lower: 1e-321, upper: 1.9 } });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]?.message).toContain('at least 0.001');
  });
});
