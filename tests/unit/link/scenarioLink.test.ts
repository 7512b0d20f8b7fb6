import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeScenarioQuery, encodeScenarioLink, LINK_PARAMS, MAX_LINK_CHARS, readScenarioLink, scenarioFragment, scenarioLinkIssues, scenarioQuery } from '@/lib/link';
import { parseScenario } from '@/lib/scenario/parse';
import type { Scenario } from '@/lib/scenario/schema';
import type { Issue } from '@/lib/result';
import { anyValidScenarioArb, brokenTextArb } from './scenarioArbitrary';

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
    expect(encodeScenarioLink(minimal)).toBe('/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
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
      '/#bp=0.1&bx=0.3&by=10&em=OR&ee=2&el=1.5&eu=2.7&ec=0.9&ed=case-control&ef=8&ea=1&h=5&n=1000' +
        '&wo=a+stroke&wx=smoking&wc=not+smoking&wp=adults+40%E2%80%9370&wr=Illustrative+2024&pa=55&ps=female&t=demo-stroke',
    );
    expect(decoded(encodeScenarioLink(full))).toStrictEqual(full);
  });

  it('carries the study\'s exposure definition as one JSON parameter, and reads it back unchanged (issue 9 item 1)', () => {
    const s: Scenario = {
      ...minimal,
      exposureDefinition: { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', maxGapMonths: 15, comparison: { category: 'normal' } },
    };
    // Hand-written: JSON.stringify of the definition, then form-encoded ({ → %7B, " → %22, : → %3A, , → %2C, } → %7D).
    expect(encodeScenarioLink(s)).toBe(
      '/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9' +
        '&x=%7B%22category%22%3A%22prediabetes%22%2C%22criteria%22%3A%22ADA%22%2C%22minYears%22%3A3%2C%22test%22%3A%22hba1c%22%2C%22maxGapMonths%22%3A15%2C%22comparison%22%3A%7B%22category%22%3A%22normal%22%7D%7D',
    );
    expect(decoded(encodeScenarioLink(s))).toStrictEqual(s);
  });

  it('leaves out an exposure definition that is not a JSON object, or that the schema refuses, and keeps the rest', () => {
    const notJson = readScenarioLink('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&x=prediabetes');
    expect(notJson.result).toEqual({ ok: true, value: minimal });
    expect(notJson.dropped[0]?.message).toBe('The link\'s "x" (the exposure definition) must be a JSON object, not "prediabetes"');
    const refused = readScenarioLink(`#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&x=${encodeURIComponent(JSON.stringify({ category: 'prediabetes', criteria: 'ADA', minYears: 0 }))}`);
    expect(refused.result).toEqual({ ok: true, value: minimal });
    expect(refused.dropped[0]?.path).toEqual(['exposureDefinition', 'minYears']);
  });

  it('writes a rate baseline with its horizon, and adjusted false as 0', () => {
    const rate: Scenario = {
      baseline: { rate: 12, perPersonYears: 1000 },
      horizonYears: 5,
      effect: { measure: 'HR', estimate: 0.8, lower: 0.7, upper: 0.92, design: 'trial', adjusted: false },
    };
    expect(encodeScenarioLink(rate)).toBe('/#bn=12&bt=1000&em=HR&ee=0.8&el=0.7&eu=0.92&ed=trial&ea=0&h=5');
  });

  it('encodes text that a query treats specially, and reads it back unchanged', () => {
    const outcome = 'heart attack & stroke #1 = 50% + more? yes/no; "quoted" é 😀';
    const s: Scenario = { ...minimal, wording: { outcome } };
    const link = encodeScenarioLink(s);
    expect(link).toBe(
      '/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wo=heart+attack+%26+stroke+%231+%3D+50%25+%2B+more%3F+yes%2Fno%3B+%22quoted%22+%C3%A9+%F0%9F%98%80',
    );
    expect(decoded(link).wording?.outcome).toBe(outcome);
  });

  it('leaves out text with a lone surrogate (a broken character) and names it; an old .json link holding one is refused', () => {
    // Behaviour changed (issue 14 item 16): such text used to travel as a JSON literal under
    // <key>.json and printed as a broken character on /handout; now it is named for retyping.
    const s: Scenario = { ...minimal, wording: { citation: 'a\uD800b', outcome: 'a stroke' } };
    expect(scenarioFragment(s)).toBe('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wo=a+stroke');
    expect(scenarioLinkIssues(s)).toEqual([
      { code: 'invalid-link', path: ['wording', 'citation'], message: expect.stringContaining('The citation holds a broken character') as unknown as string },
    ]);
    const old = readScenarioLink('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wr.json=%22a%5Cud800b%22');
    expect(old.result).toEqual({ ok: true, value: minimal });
    expect(old.dropped).toEqual([{ code: 'invalid-link', path: ['wording', 'citation'], message: expect.stringContaining('broken character') as unknown as string }]);
    // A well-formed .json literal from an old link still reads.
    expect(decoded('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&wr.json=%22a%5Cu00e9b%22').wording?.citation).toBe('a\u00e9b');
  });

  it('writes −0 as "-0" so that it comes back as −0, not 0', () => {
    const s: Scenario = { baseline: { populationRisk: 0.1, exposurePrevalence: -0, years: 5 }, effect: minimal.effect };
    expect(scenarioFragment(s)).toBe('#bp=0.1&bx=-0&by=5&em=RR&ee=1.5&el=1.2&eu=1.9');
    const back = decoded(scenarioFragment(s)).baseline;
    expect('exposurePrevalence' in back && Object.is(back.exposurePrevalence, -0)).toBe(true);
  });

  it('keeps an empty wording or person object apart from an absent one with a bare marker', () => {
    const s: Scenario = { ...minimal, wording: {}, person: {} };
    expect(scenarioFragment(s)).toBe('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9&w=&p=');
    expect(decoded(scenarioFragment(s))).toStrictEqual(s);
    expect(decoded(scenarioFragment(minimal))).toStrictEqual(minimal);
  });

  it('writes numbers as the shortest decimal that reads back as the same double', () => {
    // String(n) for these doubles, ECMA-262 Number::toString (from memory); each reads back exactly.
    const s: Scenario = {
      // Ratios below 0.001 are refused since issue 14 item 14, so the smallest double moved to the period.
      baseline: { risk: 0.1 + 0.2, years: 5e-324 },
      effect: { measure: 'OR', estimate: 0.001, lower: 0.001, upper: 1000 },
    };
    expect(scenarioFragment(s)).toBe('#br=0.30000000000000004&by=5e-324&em=OR&ee=0.001&el=0.001&eu=1000');
    expect(decoded(scenarioFragment(s))).toStrictEqual(s);
  });

  it('gives the handout the same fragment as the main screen', () => {
    expect(`/handout${scenarioFragment(minimal)}`).toBe('/handout#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
    expect(encodeScenarioLink(minimal, '/handout')).toBe('/handout#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
    expect(encodeScenarioLink(minimal)).toBe(`/${scenarioFragment(minimal)}`);
    // The old query form, kept only to make old links in tests, holds the same parameters.
    expect(scenarioQuery(minimal)).toBe('?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9');
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
    expect(decoded(`#${q}`)).toStrictEqual(minimal);
    expect(decoded(`/#${q}`)).toStrictEqual(minimal);
    expect(decoded(`/handout#${q}`)).toStrictEqual(minimal);
    expect(decoded(`https://clinic.example/handout#${q}`)).toStrictEqual(minimal);
    expect(decoded(`https://clinic.example/?${q}`)).toStrictEqual(minimal);
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
        // The fragment opens the same scenario on any path, and fits the length cap.
        const again = decodeScenarioQuery(`/handout${scenarioFragment(s)}`);
        expect(again.ok && sameValue(again.value, s)).toBe(true);
        expect(encodeScenarioLink(s, '/handout').length).toBeLessThanOrEqual(MAX_LINK_CHARS);
        expect(scenarioLinkIssues(s)).toEqual([]);
        // An old query link with the same parameters opens it too.
        const old = decodeScenarioQuery(`/${scenarioQuery(s)}`);
        expect(old.ok && sameValue(old.value, s)).toBe(true);
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

describe('readScenarioLink: what mail programs and chat tools do to a link', () => {
  const good = 'br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9';

  it('reads a link whose "&" became "&amp;" (HTML-escaped by a mail program)', () => {
    const reading = readScenarioLink(`https://clinic.example/#${good.replace(/&/g, '&amp;')}&amp;wo=a+stroke`);
    expect(reading.result).toEqual({ ok: true, value: { ...minimal, wording: { outcome: 'a stroke' } } });
    expect(reading.dropped).toEqual([]);
    expect(readScenarioLink(`/#${good.replace(/&/g, '&#38;')}`).result).toEqual({ ok: true, value: minimal });
    // An "&" typed in the wording is written %26 and stays text.
    expect(decoded(`#${good}&wo=a+%26amp%3B+b`).wording?.outcome).toBe('a &amp; b');
  });

  it('keeps every valid parameter when others are not, and names each one left out', () => {
    const reading = readScenarioLink(`#${good}&utm_source=mail&ea=maybe&ed=survey&wo=a+stroke`);
    expect(reading.result).toEqual({ ok: true, value: { ...minimal, wording: { outcome: 'a stroke' } } });
    expect(reading.dropped.map((i) => i.path)).toEqual([['utm_source'], ['effect', 'adjusted'], ['effect', 'design']]);
    expect(reading.dropped[0]?.message).toContain('"utm_source"');
    expect(reading.dropped[1]?.message).toContain('"ea" (adjusted)');
    expect(reading.dropped[2]).toMatchObject({ code: 'invalid-choice' });
    expect(reading.dropped[2]?.message).toMatch(/^The link's "ed" \(the study design\) was left out: /);
    // The strict reader refuses the same link, naming the same parameters.
    expect(issuesOf(`#${good}&utm_source=mail&ea=maybe&ed=survey`).map((i) => i.path)).toEqual([['utm_source'], ['effect', 'adjusted'], ['effect', 'design']]);
  });

  it('drops every copy of a repeated parameter rather than guess which was meant', () => {
    const reading = readScenarioLink(`#${good}&wo=first&wo=second`);
    expect(reading.result).toEqual({ ok: true, value: minimal });
    expect(reading.dropped).toHaveLength(1);
    expect(reading.dropped[0]?.message).toContain('more than once');
  });

  it('refuses a broken % escape instead of turning it into "�"', () => {
    for (const broken of ['a%zzb', 'a%2', 'a%', '%E2%80', '%C3%28', '%FF']) {
      const reading = readScenarioLink(`#${good}&wo=${broken}`);
      expect(reading.result).toEqual({ ok: true, value: minimal });
      expect(reading.dropped).toEqual([{ code: 'invalid-link', path: ['wording', 'outcome'], message: expect.stringContaining('broken % escape') as unknown as string }]);
      expect(JSON.stringify(reading)).not.toContain('\uFFFD');
    }
    // In a number that is required, the link cannot open, and says why.
    const bad = readScenarioLink(`#${good.replace('ee=1.5', 'ee=1%2G5')}`);
    expect(bad.result.ok).toBe(false);
    expect(bad.dropped[0]).toMatchObject({ path: ['effect', 'estimate'] });
    // A key with a broken escape is named by its raw text.
    expect(readScenarioLink(`#${good}&w%ZZ=1`).dropped[0]?.message).toContain('"w%ZZ=1"');
    // A real "�" sent as %EF%BF%BD is text like any other.
    expect(decoded(`#${good}&wo=%EF%BF%BD`).wording?.outcome).toBe('\uFFFD');
  });

  it('names a link that was cut short as the cause, with what is missing', () => {
    const full = encodeScenarioLink({ ...minimal, wording: { outcome: 'heart attack' } });
    const cut = full.slice(0, full.indexOf('&el='));
    const reading = readScenarioLink(cut);
    expect(reading.result.ok).toBe(false);
    expect(reading.cutShort?.message).toMatch(/^This link looks cut short: it stops after "ee=1\.5" \(\d+ characters arrived\) and lacks "el" \(the lower limit\), "eu" \(the upper limit\)/);
    // Ending inside a % escape is cut short too.
    const inEscape = readScenarioLink(`#${good}&wo=heart%E2%8`);
    expect(inEscape.cutShort?.message).toContain('cut short');
    // A whole link, or one with a field missing from the middle, is not called cut short.
    expect(readScenarioLink(full).cutShort).toBeUndefined();
    expect(readScenarioLink(`#${good.replace('&el=1.2', '')}`).cutShort).toBeUndefined();
  });

  it('treats __proto__, constructor and toString as unknown parameters', () => {
    for (const key of ['__proto__', 'constructor', 'toString', 'hasOwnProperty', '__proto__.json']) {
      const reading = readScenarioLink(`#${good}&${key}=`);
      expect(reading.result).toEqual({ ok: true, value: minimal });
      expect(reading.dropped).toEqual([{ code: 'invalid-link', path: [key], message: expect.stringContaining(`unknown parameter "${key}"`) as unknown as string }]);
      expect(reading.dropped[0]?.message).not.toContain('[object Object]');
    }
  });

  it('says a plain visit holds no scenario (empty), without issues to show', () => {
    for (const link of ['', '/', '/handout', '#', '/?', 'https://clinic.example/']) {
      expect(readScenarioLink(link)).toMatchObject({ empty: true, dropped: [] });
    }
  });

  it('caps the link length with a clear message, and every valid scenario fits under the cap', () => {
    const long = `#${good}&wo=${'a'.repeat(MAX_LINK_CHARS)}`;
    const reading = readScenarioLink(long);
    expect(reading.result.ok).toBe(false);
    if (!reading.result.ok) expect(reading.result.issues[0]?.message).toMatch(/^This link is [\d,]+ characters long; a scenario link is at most 32,768/);
    // The longest valid scenario: five wording fields of 500 three-byte characters (中 is
    // E4 B8 AD in UTF-8, 9 characters once percent-encoded), a 100-character table id of the
    // same, and long numbers. Hand-computed: 5 × 500 × 9 + 100 × 9 = 23,400 plus parameters.
    const wide = '中'.repeat(500);
    const longest: Scenario = {
      baseline: { populationRisk: 0.30000000000000004, exposurePrevalence: 0.30000000000000004, years: 0.30000000000000004 },
      effect: { measure: 'OR', estimate: 1.0000000000000002, lower: 0.0010000000000000002, upper: 999.9999999999999, level: 0.95, design: 'risk-set-case-control', followUpYears: 99.99999999999999, adjusted: true },
      horizonYears: 99.99999999999999,
      denominator: 1000,
      wording: { outcome: wide, exposure: wide, comparison: wide, population: wide, citation: wide },
      person: { age: 100, sex: 'female' },
      tableId: '中'.repeat(100),
    };
    expect(parseScenario(longest).ok).toBe(true);
    const link = encodeScenarioLink(longest, '/handout');
    expect(link.length).toBeGreaterThan(22_500);
    expect(link.length).toBeLessThan(MAX_LINK_CHARS);
    expect(scenarioLinkIssues(longest)).toEqual([]);
    expect(decoded(link)).toStrictEqual(longest);
  });

  it('leaves out and names any text with a lone surrogate, and keeps the rest (fast-check)', () => {
    fc.assert(
      fc.property(anyValidScenarioArb, brokenTextArb, fc.constantFrom('outcome', 'exposure', 'comparison', 'population', 'citation'), (s, text, field) => {
        const broken: Scenario = { ...s, wording: { ...s.wording, [field]: text } };
        fc.pre(parseScenario(broken).ok);
        const issues = scenarioLinkIssues(broken);
        expect(issues.map((i) => i.path)).toContainEqual(['wording', field]);
        const back = decodeScenarioQuery(encodeScenarioLink(broken));
        expect(back.ok).toBe(true);
        if (back.ok) {
          expect(back.value.wording?.[field as keyof NonNullable<Scenario['wording']>]).toBeUndefined();
          expect(back.value.effect).toStrictEqual(s.effect);
          expect(back.value.baseline).toStrictEqual(s.baseline);
        }
      }),
      { numRuns: 300 },
    );
  });
});
