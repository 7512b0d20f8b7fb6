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
    ['unknown level', withEffect({ level: 0.8 }), 'invalid-choice', ['effect', 'level']],
    ['adjusted as text', withEffect({ adjusted: 'yes' }), 'wrong-type', ['effect', 'adjusted']],
    ['misspelt field', withEffect({ uper: 1.9 }), 'unknown-field', ['effect', 'uper']],
    ['missing effect', { baseline: valid.baseline }, 'required', ['effect']],
    ['rate without a horizon', { baseline: { rate: 12, perPersonYears: 1000 }, effect: valid.effect }, 'horizon-required', ['horizonYears']],
    ['horizon over 100 years', { ...valid, horizonYears: 101 }, 'out-of-range', ['horizonYears']],
    ['denominator 50', { ...valid, denominator: 50 }, 'invalid-choice', ['denominator']],
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
