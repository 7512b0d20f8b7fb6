import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeScenario } from '@/lib/engine/compute';
import type { ComputeResult } from '@/lib/engine/types';
import type { Scenario, Wording } from '@/lib/scenario/schema';
import { allPatientStrings, CAUTION_TEXT, patientText, type PatientText } from '@/lib/wording';

const WORDING: Wording = {
  outcome: 'heart failure needing hospital care',
  exposure: 'HbA1c in the prediabetes range',
  comparison: 'normal HbA1c',
};

function compute(scenario: Scenario): ComputeResult {
  const r = computeScenario(scenario);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value;
}

function text(result: ComputeResult, wording: Wording = WORDING, people = 'women aged 50 to 59'): PatientText {
  const t = patientText({ result, wording, people, horizonYears: result.horizonYears });
  if (!t.ok) throw new Error(JSON.stringify(t.issues));
  return t.value;
}

// Hand-computed: RR 1.5 (1.2 to 1.9) at P0 = 0.08 over 10 years gives P1 = 0.12 (0.096 to 0.152);
// at D = 100: 8 reference events, 12 exposed (12 − 8 = 4 more), limits round(9.6) = 10 and round(15.2) = 15.
const HARM = compute({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } });
// Hand-computed: RR 0.7 (0.5 to 0.9) at P0 = 0.1 gives P1 = 0.07 (0.05 to 0.09): 10 vs 7, 3 fewer.
const BENEFIT = compute({ baseline: { risk: 0.1, years: 5 }, effect: { measure: 'RR', estimate: 0.7, lower: 0.5, upper: 0.9 } });
// Hand-computed: RR 1 (0.8 to 1.25) at P0 = 0.2: 20 vs 20; limits 0.16 → 16 and 0.25 → 25.
const NONE = compute({ baseline: { risk: 0.2, years: 10 }, effect: { measure: 'RR', estimate: 1, lower: 0.8, upper: 1.25 } });

describe('patientText: the sentences (hand-computed counts)', () => {
  it('states both frames for the reference group, with the group and the time frame', () => {
    expect(text(HARM).referenceSentence).toBe(
      'Think of 100 women aged 50 to 59 like you. All of them have normal HbA1c. In the next 10 years, about 8 out of 100 will have heart failure needing hospital care. The other 92 out of 100 will not.',
    );
  });

  it('states both frames for the exposed group, the difference and the range matching the icons', () => {
    const t = text(HARM);
    expect(t.exposedSentence).toContain('about 12 out of 100 will have heart failure needing hospital care');
    expect(t.exposedSentence).toContain('The other 88 out of 100 will not.');
    expect(t.differenceSentence).toBe('That is about 4 more out of 100.');
    expect(t.rangeSentence).toBe('The study\u2019s range means the 12 out of 100 could be anywhere from 10 to 15 out of 100.');
    // The "could be" icons run from exposedLower (10) to exposedUpper (15): 5 icons, as the words say.
    expect(t.exposed.layout.tally.uncertain).toBe(15 - 10);
    expect(t.direction).toBe('more');
    expect(t.noDifferenceSentence).toBeUndefined();
  });

  it('says "fewer" for a protective effect and draws avoided icons', () => {
    const t = text(BENEFIT);
    expect(t.differenceSentence).toBe('That is about 3 fewer out of 100.');
    expect(t.exposedSentence).toContain('In the next 5 years, about 7 out of 100 will have');
    expect(t.exposed.legend.map((l) => l.kind)).toEqual(['event', 'avoided', 'none', 'uncertain']);
    expect(t.exposed.legend.find((l) => l.kind === 'avoided')?.count).toBe(3);
  });

  it('says there may be no real difference when the interval includes no effect', () => {
    const t = text(NONE);
    expect(t.direction).toBe('same');
    expect(t.differenceSentence).toBe('That is the same number as for people with normal HbA1c.');
    expect(t.noDifferenceSentence).toBe('This range includes the number for people with normal HbA1c, so there may be no real difference.');
    expect(t.rangeSentence).toContain('anywhere from 16 to 25 out of 100');
  });

  it('says the difference is below 1 out of D when counts tie but the risks differ', () => {
    // Hand-computed: P0 = 0.5, RR 1.008 → P1 = 0.504 → 50 vs 50 at D = 100 (scenario fixes D).
    const r = compute({ baseline: { risk: 0.5, years: 10 }, denominator: 100, effect: { measure: 'RR', estimate: 1.008, lower: 1.004, upper: 1.012 } });
    expect(text(r).differenceSentence).toBe('The difference between the two groups is less than 1 out of 100.');
  });

  it('writes "fewer than 1 out of 100" rather than "0" when a non-zero risk rounds to nobody', () => {
    // Hand-computed: P0 = 0.002 at a chosen D = 100 → round(0.2) = 0 people.
    const r = compute({ baseline: { risk: 0.002, years: 10 }, denominator: 100, effect: { measure: 'RR', estimate: 2, lower: 1.5, upper: 3 } });
    const t = text(r);
    expect(t.referenceSentence).toContain('fewer than 1 out of 100 will have');
    expect(t.referenceSentence).toContain('More than 99 out of 100 will not.');
    expect(t.referenceSentence).not.toMatch(/about 0 out of/);
  });

  it('uses 1,000 with thousands grouping when the engine picks it', () => {
    // Hand-computed: P0 = 0.004, RR 1.5 → P1 = 0.006: at 100 both round below 1, so D = 1,000 (engine rule).
    const r = compute({ baseline: { risk: 0.004, years: 5 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.1, upper: 2 } });
    const t = text(r);
    expect(t.denominator).toBe(1000);
    expect(t.referenceSentence).toBe(
      'Think of 1,000 women aged 50 to 59 like you. All of them have normal HbA1c. In the next 5 years, about 4 out of 1,000 will have heart failure needing hospital care. The other 996 out of 1,000 will not.',
    );
    expect(t.differenceSentence).toBe('That is about 2 more out of 1,000.');
  });

  it('says "in the next year" for a 1-year horizon', () => {
    const r = compute({ baseline: { risk: 0.3, years: 1 }, effect: { measure: 'RR', estimate: 1.2, lower: 1.1, upper: 1.3 } });
    expect(text(r).referenceSentence).toContain('In the next year, about 30 out of 100');
    expect(text(r).reference.title).toContain('over the next year');
  });
});

describe('patientText: arrays, legends, text alternatives', () => {
  it('titles name the group and the time frame', () => {
    const t = text(HARM);
    expect(t.reference.title).toBe('100 women aged 50 to 59 with normal HbA1c, over the next 10 years');
    expect(t.exposed.title).toBe('100 women aged 50 to 59 with HbA1c in the prediabetes range, over the next 10 years');
  });

  it("each array's text alternative equals its visible caption", () => {
    for (const result of [HARM, BENEFIT, NONE]) {
      const t = text(result);
      expect(t.reference.alt).toBe(t.reference.caption);
      expect(t.exposed.alt).toBe(t.exposed.caption);
      expect(t.exposed.caption).toContain(t.rangeSentence);
    }
  });

  it('legend counts add up to the denominator and pluralise', () => {
    const t = text(HARM);
    const drawn = t.exposed.legend.filter((l) => l.kind !== 'uncertain').reduce((s, l) => s + l.count, 0);
    expect(drawn).toBe(100);
    expect(t.exposed.legend.find((l) => l.kind === 'added')?.text).toBe('Extra people who will have it with HbA1c in the prediabetes range (4 people)');
    // Hand-computed: P0 = 0.01 at D = 100 → 1 event, "1 person".
    const one = compute({ baseline: { risk: 0.01, years: 10 }, effect: { measure: 'RR', estimate: 3, lower: 2, upper: 4 } });
    expect(text(one).reference.legend[0]?.text).toBe('Will have heart failure needing hospital care (1 person)');
  });

  it('falls back to plain generic words when exposure and comparison are not worded', () => {
    const t = text(HARM, { outcome: 'a stroke' });
    expect(t.reference.heading).toBe('Without the risk factor studied');
    expect(t.exposed.heading).toBe('With the risk factor studied');
  });
});

describe('patientText: refusals', () => {
  it('refuses a missing horizon', () => {
    const r = patientText({ result: HARM, wording: WORDING, people: 'women aged 50 to 59', horizonYears: undefined });
    expect(r).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'horizon-required', path: ['horizonYears'] })] });
  });

  it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('refuses horizon %s', (h) => {
    const r = patientText({ result: HARM, wording: WORDING, people: 'women', horizonYears: h });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('horizon-required');
  });

  it('refuses a horizon other than the one computed', () => {
    const r = patientText({ result: HARM, wording: WORDING, people: 'women', horizonYears: 5 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('horizon-mismatch');
  });

  it.each([undefined, '', '   ', ' . '])('refuses a missing group description (%j)', (people) => {
    const r = patientText({ result: HARM, wording: WORDING, people, horizonYears: 10 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.code)).toEqual(['population-required']);
  });

  it('refuses a missing outcome and reports every missing input at once', () => {
    const r = patientText({ result: HARM, wording: {}, people: undefined, horizonYears: undefined });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues.map((i) => i.code)).toEqual(['horizon-required', 'population-required', 'outcome-required']);
  });
});

describe('patientText: phrasing rules over random results (fast-check, 1000 runs)', () => {
  const scenarioArb = fc.record({
    risk: fc.double({ min: 0.001, max: 0.9, noNaN: true }),
    years: fc.integer({ min: 1, max: 30 }),
    measure: fc.constantFrom('OR' as const, 'RR' as const, 'HR' as const),
    estimate: fc.double({ min: 0.2, max: 5, noNaN: true }),
    spread: fc.double({ min: 1.05, max: 3, noNaN: true }),
    denominator: fc.constantFrom(undefined, 100 as const, 1000 as const),
  });

  it('never writes "1 in X"; every "out of" uses the one denominator; both frames; the caution is the constant', () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        const r = computeScenario({
          baseline: { risk: s.risk, years: s.years },
          effect: { measure: s.measure, estimate: s.estimate, lower: s.estimate / s.spread, upper: Math.min(s.estimate * s.spread, 1000) },
          ...(s.denominator === undefined ? {} : { denominator: s.denominator }),
        });
        fc.pre(r.ok); // a refusing engine fails the property instead of passing it
        const t = text(r.value);
        const D = t.denominator.toLocaleString('en');
        const all = allPatientStrings(t).join('\n');
        expect(all).not.toMatch(/\b1 in \d+/);
        for (const m of all.matchAll(/out of ([\d,]+)/g)) expect(m[1]).toBe(D);
        expect(t.referenceSentence).toMatch(/will have/);
        expect(t.referenceSentence).toMatch(/will not\./);
        expect(t.exposedSentence).toMatch(/will not\./);
        expect(t.caution).toBe(CAUTION_TEXT);
        // No relative figure reaches patient text: no ratios, percentages or "times".
        expect(all).not.toMatch(/%|\btimes\b|\bratio\b|\brelative\b/i);
        // The range in words matches the "could be" icons.
        expect(t.exposed.layout.tally.uncertain).toBe(r.value.iconArray.exposedUpper - r.value.iconArray.exposedLower);
        return true;
      }),
      { numRuns: 1000 },
    );
  });
});

describe('patientText: the group sentences without a worded comparison', () => {
  it('says the reference group does not have the exposure', () => {
    expect(text(HARM, { outcome: 'a stroke', exposure: 'high blood pressure' }).referenceSentence).toContain('None of them have high blood pressure.');
  });
});

describe('patientText: the group line', () => {
  it('names who and when', () => {
    expect(text(HARM).groupLine).toBe('Women aged 50 to 59 like you, over the next 10 years');
  });
});
