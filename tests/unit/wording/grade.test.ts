/**
 * Plain language, measured: every default patient text scores at or below Flesch–Kincaid
 * grade 8 (risk-communication guide, after NIH advice), with the counter in lib/readability.
 * The whole prose of a page is scored (sentences, meaning, caution, teach-back); the caution
 * alone too, since it is the one text on every page.
 */
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { readability, MAX_GRADE } from '@/lib/readability';
import type { Scenario, Wording } from '@/lib/scenario/schema';
import { DEMO_EVIDENCE } from '@/lib/evidence';
import { baselineOf, DEMO_TABLES } from '@/lib/tables';
import { CAUTION_TEXT, describePeople, patientProse, patientText } from '@/lib/wording';

function grade(text: string): number {
  const r = readability(text);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.value.grade;
}

function proseFor(scenario: Scenario, people: string): string {
  const r = computeScenario(scenario);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  const t = patientText({ result: r.value, wording: scenario.wording, people, horizonYears: r.value.horizonYears });
  if (!t.ok) throw new Error(JSON.stringify(t.issues));
  return patientProse(t.value);
}

// Fixture scenarios of our own (invented numbers), covering harm, benefit, no effect, D = 1,000.
const FIXTURE_WORDING: Wording = { outcome: 'a heart attack', exposure: 'high blood pressure', comparison: 'normal blood pressure' };
const FIXTURES: readonly (readonly [string, Scenario, string])[] = [
  ['harm', { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 }, wording: FIXTURE_WORDING }, 'women aged 50 to 59'],
  ['benefit', { baseline: { risk: 0.1, years: 5 }, effect: { measure: 'HR', estimate: 0.7, lower: 0.5, upper: 0.9, design: 'trial' }, wording: FIXTURE_WORDING }, 'men aged 60 to 69'],
  ['no effect', { baseline: { risk: 0.2, years: 10 }, effect: { measure: 'OR', estimate: 1, lower: 0.8, upper: 1.25 }, wording: FIXTURE_WORDING }, 'people aged 70 to 79'],
  ['1,000', { baseline: { risk: 0.004, years: 5 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.1, upper: 2 }, wording: { outcome: 'a stroke' } }, 'people aged 40 to 49'],
];

describe('default patient text is at or below grade 8', () => {
  it('the caution alone', () => {
    expect(grade(CAUTION_TEXT)).toBeLessThanOrEqual(MAX_GRADE);
  });

  it.each(FIXTURES)('fixture scenario: %s', (_name, scenario, people) => {
    expect(grade(proseFor(scenario, people))).toBeLessThanOrEqual(MAX_GRADE);
  });

  // Every demo evidence entry against every demo table and every stratum in it: the scenarios
  // the consultation screen offers out of the box.
  const demo = DEMO_EVIDENCE.flatMap((entry) =>
    DEMO_TABLES.flatMap((table) =>
      table.strata.map((stratum) => {
        const person = { age: stratum.ageFrom, ...(stratum.sex === 'any' ? {} : { sex: stratum.sex }) };
        const scenario: Scenario = {
          baseline: baselineOf(table, stratum),
          effect: entry.effect,
          horizonYears: table.horizonYears ?? 10,
          wording: entry.wording,
          person,
          tableId: table.id,
        };
        const people = describePeople({ person, ageBand: { fromYears: stratum.ageFrom, toYears: stratum.ageTo } });
        if (!people.ok) throw new Error(JSON.stringify(people.issues));
        return [`${entry.id} × ${table.id} × ${stratum.sex} ${stratum.ageFrom}-${stratum.ageTo}`, scenario, people.value] as const;
      }),
    ),
  );

  it('covers every demo entry and table', () => {
    // Literal counts, so a scenario the loop dropped would fail (issue 11): lib/evidence/demo.ts holds 3
    // entries; lib/tables/demo.ts holds 10 + 10 + 5 strata. Hand-computed 3 × 25 = 75.
    expect(DEMO_EVIDENCE).toHaveLength(3);
    expect(DEMO_TABLES.map((t) => t.strata.length)).toEqual([10, 10, 5]);
    expect(demo).toHaveLength(75);
    expect(new Set(demo.map(([name]) => name)).size).toBe(75);
  });

  it.each(demo)('demo scenario: %s', (_name, scenario, people) => {
    expect(grade(proseFor(scenario, people))).toBeLessThanOrEqual(MAX_GRADE);
  });
});
