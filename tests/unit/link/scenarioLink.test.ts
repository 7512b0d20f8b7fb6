import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeScenarioQuery, encodeScenarioLink, LINK_PARAMS, scenarioQuery } from '@/lib/link';
import { parseScenario } from '@/lib/scenario/parse';
import type { Scenario } from '@/lib/scenario/schema';
import type { Issue } from '@/lib/result';
import { anyValidScenarioArb } from './scenarioArbitrary';

// Expected queries below are written out by hand from the parameter table in
// lib/link/scenarioLink.ts, and the form encoding of the WHATWG URL Standard
// (application/x-www-form-urlencoded serializer: space as "+", else percent-encoded UTF-8) (from memory).

const minimal: Scenario = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
};

function decoded(query: string | URLSearchParams): Scenario {
  const result = decodeScenarioQuery(query);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.value;
}

function issuesOf(query: string): readonly Issue[] {
  const result = decodeScenarioQuery(query);
  if (result.ok) throw new Error(`expected issues for ${query}, got ${JSON.stringify(result.value)}`);
  return result.issues;
}

/** Deep equality that tells −0 from 0 (Object.is on every leaf), so the round trip is exact. */
function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a !== 'object' || a === null || typeof b !== 'object' || b === null) return Object.is(a, b);
  const keysA = Object.keys(a).filter((k) => (a as Record<string, unknown>)[k] !== undefined);
  const keysB = Object.keys(b).filter((k) => (b as Record<string, unknown>)[k] !== undefined);
  if (keysA.length !== keysB.length) return false;
  return keysA.every((k) => sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}

describe('encodeScenarioLink', () => {
  it('writes the documented short parameters, in the table order', () => {
    expect(encodeScenarioLink(minimal)).toBe('/?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
  });

  it('writes every optional field when present', () => {
    const full: Scenario = {
      baseline: { populationRisk: 0.1, exposurePrevalence: 0.3, years: 10 },
      effect: { measure: 'OR', estimate: 2, lower: 1.5, upper: 2.7, level: 0.9, design: 'case-control', followUpYears: 8, adjusted: true },
      horizonYears: 5,
      denominator: 1000,
      wording: { outcome: 'a stroke', exposure: 'smoking', comparison: 'not smoking', population: 'adults 40–70', citation: 'Illustrative 2024' },
      person: { age: 55, sex: 'female' },
      tableId: 'demo-stroke',
    };
    expect(encodeScenarioLink(full)).toBe(
      '/?bp=0.1&bx=0.3&by=10&em=OR&ee=2&el=1.5&eu=2.7&ec=0.9&ed=case-control&ef=8&ea=1&h=5&n=1000' +
        '&wo=a+stroke&wx=smoking&wc=not+smoking&wp=adults+40%E2%80%9370&wr=Illustrative+2024&pa=55&ps=female&t=demo-stroke',
    );
    expect(decoded(encodeScenarioLink(full))).toStrictEqual(full);
  });

  it('writes a rate baseline with its horizon, and adjusted false as 0', () => {
    const rate: Scenario = {
      baseline: { rate: 12, perPersonYears: 1000 },
      horizonYears: 5,
      effect: { measure: 'HR', estimate: 0.8, lower: 0.7, upper: 0.92, design: 'trial', adjusted: false },
    };
    expect(encodeScenarioLink(rate)).toBe('/?bn=12&bt=1000&em=HR&ee=0.8&el=0.7&eu=0.92&ed=trial&ea=0&h=5');
  });

  it('encodes text that a query treats specially, and reads it back unchanged', () => {
    const outcome = 'heart attack & stroke #1 = 50% + more? yes/no; "quoted" é 😀';
    const s: Scenario = { ...minimal, wording: { outcome } };
    const link = encodeScenarioLink(s);
    expect(link).toBe(
      '/?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wo=heart+attack+%26+stroke+%231+%3D+50%25+%2B+more%3F+yes%2Fno%3B+%22quoted%22+%C3%A9+%F0%9F%98%80',
    );
    expect(decoded(link).wording?.outcome).toBe(outcome);
  });

  it('writes text with a lone surrogate, which UTF-8 cannot carry, as a JSON literal under <key>.json', () => {
    const s: Scenario = { ...minimal, wording: { citation: 'a\uD800b' } };
    expect(scenarioQuery(s)).toBe('?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wr.json=%22a%5Cud800b%22');
    expect(decoded(scenarioQuery(s)).wording?.citation).toBe('a\uD800b');
  });

  it('writes −0 as "-0" so that it comes back as −0, not 0', () => {
    const s: Scenario = { baseline: { populationRisk: 0.1, exposurePrevalence: -0, years: 5 }, effect: minimal.effect };
    expect(scenarioQuery(s)).toBe('?bp=0.1&bx=-0&by=5&em=RR&ee=1.5&el=1.2&eu=1.9');
    const back = decoded(scenarioQuery(s)).baseline;
    expect('exposurePrevalence' in back && Object.is(back.exposurePrevalence, -0)).toBe(true);
  });

  it('keeps an empty wording or person object apart from an absent one with a bare marker', () => {
    const s: Scenario = { ...minimal, wording: {}, person: {} };
    expect(scenarioQuery(s)).toBe('?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&w=&p=');
    expect(decoded(scenarioQuery(s))).toStrictEqual(s);
    expect(decoded(scenarioQuery(minimal))).toStrictEqual(minimal);
  });

  it('writes numbers as the shortest decimal that reads back as the same double', () => {
    // String(n) for these doubles, ECMA-262 Number::toString (from memory); each reads back exactly.
    const s: Scenario = {
      // Ratios below 0.001 are refused since issue 14 item 14, so the smallest double moved to the period.
      baseline: { risk: 0.1 + 0.2, years: 5e-324 },
      effect: { measure: 'OR', estimate: 0.001, lower: 0.001, upper: 1000 },
    };
    expect(scenarioQuery(s)).toBe('?br=0.30000000000000004&by=5e-324&em=OR&ee=0.001&el=0.001&eu=1000');
    expect(decoded(scenarioQuery(s))).toStrictEqual(s);
  });

  it('gives the handout the same query as the main screen', () => {
    expect(`/handout${scenarioQuery(minimal)}`).toBe('/handout?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
    expect(encodeScenarioLink(minimal)).toBe(`/${scenarioQuery(minimal)}`);
  });

  it('names every parameter once, and every one maps to a distinct field', () => {
    const keys = LINK_PARAMS.map((p) => p.key);
    const paths = LINK_PARAMS.map((p) => p.path.join('.'));
    expect(new Set(keys).size).toBe(keys.length);
    expect(new Set(paths).size).toBe(paths.length);
  });
});

describe('decodeScenarioQuery', () => {
  it('reads a query with or without "?", a path with a query, and URLSearchParams', () => {
    const q = 'br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9';
    expect(decoded(q)).toStrictEqual(minimal);
    expect(decoded(`?${q}`)).toStrictEqual(minimal);
    expect(decoded(`/?${q}`)).toStrictEqual(minimal);
    expect(decoded(`/handout?${q}`)).toStrictEqual(minimal);
    expect(decoded(new URLSearchParams(q))).toStrictEqual(minimal);
  });

  it('accepts parameters in any order and percent-encoded keys', () => {
    expect(decoded('eu=1.9&el=1.2&ee=1.5&em=RR&by=10&b%72=0.08')).toStrictEqual(minimal);
  });

  it('round-trips every valid scenario exactly (fast-check, 2000 runs)', () => {
    fc.assert(
      fc.property(anyValidScenarioArb, (s) => {
        // The arbitrary must only make valid scenarios, or the property proves nothing.
        expect(parseScenario(s).ok).toBe(true);
        const back = decodeScenarioQuery(encodeScenarioLink(s));
        expect(back.ok).toBe(true);
        if (back.ok) {
          expect(back.value).toStrictEqual(s);
          expect(sameValue(back.value, s)).toBe(true);
        }
        // The query without the leading "/" opens the same scenario on any path.
        const again = decodeScenarioQuery(`/handout${scenarioQuery(s)}`);
        expect(again.ok && sameValue(again.value, s)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('decodeScenarioQuery: bad links', () => {
  const good = 'br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9';

  it.each([
    ['1.5abc'],
    [''],
    ['NaN'],
    ['Infinity'],
    ['-Infinity'],
    ['0x10'],
    [' 1.5'],
    ['1.5 '],
    ['+1.5'],
    ['.5'],
    ['1.'],
    ['1,5'],
    ['1e999'],
    ['1.5e'],
    ['15%'],
  ])('refuses the number %j, naming the parameter and the field', (raw) => {
    const issues = issuesOf(good.replace('ee=1.5', `ee=${encodeURIComponent(raw)}`));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ code: 'invalid-link', path: ['effect', 'estimate'] });
    expect(issues[0]?.message).toContain('"ee"');
    expect(issues[0]?.message).toContain('the estimate');
  });

  it('refuses a parameter given twice', () => {
    const issues = issuesOf(`${good}&br=0.09`);
    expect(issues).toEqual([
      { code: 'invalid-link', path: ['baseline', 'risk'], message: expect.stringContaining('"br"') as unknown as string },
    ]);
    expect(issues[0]?.message).toContain('more than once');
  });

  it('refuses a parameter given twice even when one copy is the .json form', () => {
    const issues = issuesOf(`${good}&wo=x&wo.json=%22y%22`);
    expect(issues[0]).toMatchObject({ code: 'invalid-link', path: ['wording', 'outcome'] });
  });

  it('refuses an unknown parameter, naming it', () => {
    const issues = issuesOf(`${good}&zz=1`);
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ code: 'invalid-link', path: ['zz'] });
    expect(issues[0]?.message).toContain('"zz"');
  });

  it('refuses .json on a parameter that is not text, and a .json value that is not a JSON string', () => {
    expect(issuesOf(`${good}&ee.json=1.5`.replace('ee=1.5&', ''))[0]).toMatchObject({ code: 'invalid-link', path: ['ee.json'] });
    expect(issuesOf(`${good}&wo.json=notjson`)[0]).toMatchObject({ code: 'invalid-link', path: ['wording', 'outcome'] });
    expect(issuesOf(`${good}&wo.json=42`)[0]).toMatchObject({ code: 'invalid-link', path: ['wording', 'outcome'] });
  });

  it('refuses an adjusted flag other than 1 or 0', () => {
    for (const raw of ['yes', 'true', '', '2']) {
      expect(issuesOf(`${good}&ea=${raw}`)[0]).toMatchObject({ code: 'invalid-link', path: ['effect', 'adjusted'] });
    }
  });

  it('refuses a value on an empty-group marker, and a repeated marker', () => {
    expect(issuesOf(`${good}&w=x`)[0]).toMatchObject({ code: 'invalid-link', path: ['wording'] });
    expect(issuesOf(`${good}&p=&p=`)[0]).toMatchObject({ code: 'invalid-link', path: ['person'] });
  });

  it('reports every unreadable parameter at once', () => {
    expect(issuesOf('br=x&by=y&zz=1').map((i) => i.path)).toEqual([['baseline', 'risk'], ['baseline', 'years'], ['zz']]);
  });

  it('passes readable values to the scenario schema, whose issues keep their field paths', () => {
    // 8 is a percentage typed as a fraction: the schema refuses risks ≥ 1 (lib/scenario/schema.ts).
    expect(issuesOf(good.replace('br=0.08', 'br=8'))[0]).toMatchObject({ code: 'out-of-range', path: ['baseline', 'risk'] });
    expect(issuesOf(good.replace('br=0.08', 'br=0'))[0]).toMatchObject({ code: 'out-of-range', path: ['baseline', 'risk'] });
    expect(issuesOf(good.replace('br=0.08', 'br=-0.1'))[0]).toMatchObject({ code: 'out-of-range', path: ['baseline', 'risk'] });
    expect(issuesOf(good.replace('el=1.2', 'el=2'))[0]).toMatchObject({ code: 'interval-order', path: ['effect', 'lower'] });
    expect(issuesOf(good.replace('ee=1.5', 'ee=3'))[0]).toMatchObject({
      code: 'estimate-outside-interval',
      path: ['effect', 'estimate'],
    });
    expect(issuesOf(good.replace('em=RR', 'em=rr'))[0]).toMatchObject({ code: 'invalid-choice', path: ['effect', 'measure'] });
    expect(issuesOf(`${good}&ed=survey`)[0]).toMatchObject({ code: 'invalid-choice', path: ['effect', 'design'] });
    // Any level from 0.8 to 0.999 is valid since issue 11 item 10; 0.79 is outside it.
    expect(issuesOf(`${good}&ec=0.79`)[0]).toMatchObject({ code: 'out-of-range', path: ['effect', 'level'] });
    expect(issuesOf(`${good}&n=10`)[0]).toMatchObject({ code: 'invalid-choice', path: ['denominator'] });
    expect(issuesOf(`${good}&pa=40.5`)[0]).toMatchObject({ path: ['person', 'age'] });
    expect(issuesOf(`${good}&t=`)[0]).toMatchObject({ path: ['tableId'] });
    expect(issuesOf(good.replace('eu=1.9', 'eu=1001'))[0]).toMatchObject({ code: 'out-of-range', path: ['effect', 'upper'] });
  });

  it('reports missing fields as the schema does', () => {
    expect(issuesOf('')[0]).toMatchObject({ code: 'required', path: ['baseline'] });
    expect(issuesOf('/handout')[0]).toMatchObject({ code: 'required', path: ['baseline'] });
    expect(issuesOf('br=0.08&by=10')[0]).toMatchObject({ code: 'required', path: ['effect'] });
    expect(issuesOf(good.replace('&eu=1.9', ''))[0]).toMatchObject({ code: 'required', path: ['effect', 'upper'] });
    expect(issuesOf(good.replace('br=0.08&by=10', 'bn=12&bt=1000'))[0]).toMatchObject({
      code: 'horizon-required',
      path: ['horizonYears'],
    });
  });

  it('refuses a link that mixes two baseline forms', () => {
    const issues = issuesOf(`${good}&bn=12`);
    expect(issues[0]?.path[0]).toBe('baseline');
  });
});
