import { describe, expect, it } from 'vitest';
import { EMPTY_FORM_VALUES, formToOutcome, type ConsultationFormValues } from '@/lib/consultation/formValues';
import { tablePreview } from '@/app/consultation/tablePreview';
import { groupPhrase, scenarioContext, stratumAgeBand } from '@/lib/context';
import { DEFAULT_BLOCKS, handoutSheet } from '@/lib/handout';
import { parseTable } from '@/lib/tables/parse';
import { DEMO_HEART_FAILURE_10Y, DEMO_STROKE_5Y } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';

// A valid table whose men have a single band covering every age (0 to 120) while women have
// two bands. Invented numbers (illustrative), for the test only.
const SINGLE_BAND_INPUT = {
  id: 'test-single-band',
  title: 'Single-band test table (illustrative)',
  outcome: 'a test outcome',
  horizonYears: 10,
  population: 'Invented adults (illustrative)',
  source: 'Illustrative numbers, invented for this test',
  year: 2024,
  illustrative: true,
  strata: [
    { sex: 'female', ageFrom: 0, ageTo: 49, risk: 0.01 },
    { sex: 'female', ageFrom: 50, ageTo: 120, risk: 0.03 },
    { sex: 'male', ageFrom: 0, ageTo: 120, risk: 0.02 },
  ],
};

function singleBandTable(): PopulationTable {
  const parsed = parseTable(SINGLE_BAND_INPUT);
  if (!parsed.ok) throw new Error(`test table is invalid: ${parsed.issues.map((i) => i.message).join('; ')}`);
  return parsed.value;
}

const FORM: ConsultationFormValues = {
  ...EMPTY_FORM_VALUES,
  baselineSource: 'table',
  tableId: 'test-single-band',
  person: { age: '55', sex: 'male' },
  effect: { ...EMPTY_FORM_VALUES.effect, measure: 'RR', estimate: '1.5', lower: '1.2', upper: '1.9' },
  wording: { ...EMPTY_FORM_VALUES.wording, outcome: 'a test outcome' },
};

describe('scenarioContext: "people like you" once, for the screen and the handout', () => {
  it('a single 0–120 band: the screen, the table preview and the handout all say "men" (issue 13)', () => {
    const table = singleBandTable();
    const screen = formToOutcome(FORM, [table]);
    expect(screen.ok).toBe(true);
    if (!screen.ok) return;
    // The band spans every age, so the phrase names no age: not "men aged 0 and over", and not
    // "men aged 55" (the table has no figure for 55-year-olds in particular).
    expect(screen.value.people).toBe('men');
    const handout = handoutSheet(screen.value.scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { table, date: new Date('2025-05-12T12:00:00Z') });
    expect(handout.ok).toBe(true);
    if (!handout.ok) return;
    expect(handout.value.text.people).toBe(screen.value.people);
    const preview = tablePreview(table, { age: '55', sex: 'male' });
    expect(preview).toMatchObject({ ok: true, group: 'Men' });
  });

  it('the same table still names the band for a woman', () => {
    const table = singleBandTable();
    const screen = formToOutcome({ ...FORM, person: { age: '62', sex: 'female' } }, [table]);
    expect(screen.ok && screen.value.people).toBe('women aged 50 and over');
    if (!screen.ok) return;
    const handout = handoutSheet(screen.value.scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { table, date: new Date('2025-05-12T12:00:00Z') });
    expect(handout.ok && handout.value.text.people).toBe('women aged 50 and over');
  });

  it('describes the stratum of a demo table, with its band and group', () => {
    // lib/tables/demo.ts (invented): female 50–59.
    const context = scenarioContext({ person: { age: 53, sex: 'female' }, tableId: DEMO_HEART_FAILURE_10Y.id }, { table: DEMO_HEART_FAILURE_10Y });
    expect(context.people).toEqual({ ok: true, value: 'women aged 50 to 59' });
    expect(context.ageBand).toEqual({ fromYears: 50, toYears: 59 });
    expect(context.group).toBe('women, ages 50 to 59');
    expect(context.illustrativeTable).toBe(true);
    expect(context.sourceLines[0]).toBe(
      'Risk for people like you: Heart failure needing hospital care within 10 years (demo). Source: Illustrative numbers, not from a real population; invented for the Hundredfold demo (2024).',
    );
  });

  it('a stratum of both sexes says "people", whatever sex the person has', () => {
    // lib/tables/demo.ts (invented): the stroke table is for both sexes; 80 and over is its top band.
    const context = scenarioContext({ person: { age: 85, sex: 'male' }, tableId: DEMO_STROKE_5Y.id }, { table: DEMO_STROKE_5Y });
    expect(context.people).toEqual({ ok: true, value: 'people aged 80 and over' });
    expect(context.group).toBe('both sexes, ages 80 and over');
  });

  it('without the table, uses the person: typed-in baselines and tables not at hand', () => {
    const context = scenarioContext({ person: { age: 55, sex: 'male' }, tableId: 'not-here' });
    expect(context.people).toEqual({ ok: true, value: 'men aged 55' });
    expect(context.baselineSourceLine).toBe('Risk for people like you: entered by your clinician.');
    expect(context.table).toBeUndefined();
    // A table with another id than the scenario's is not the scenario's source.
    const other = scenarioContext({ person: { age: 55, sex: 'male' } }, { table: DEMO_HEART_FAILURE_10Y });
    expect(other.table).toBeUndefined();
    expect(other.people).toEqual({ ok: true, value: 'men aged 55' });
  });

  it('falls back to the population wording, then refuses', () => {
    expect(scenarioContext({ wording: { outcome: 'x', population: 'adults at a health check.' } }).people).toEqual({ ok: true, value: 'adults at a health check' });
    const none = scenarioContext({});
    expect(none.people.ok).toBe(false);
    if (!none.people.ok) expect(none.people.issues[0]?.code).toBe('population-required');
  });

  it('writes the study line from the citation, once with a full stop', () => {
    expect(scenarioContext({ wording: { outcome: 'x', citation: 'Invented et al. 2020.' } }).studySourceLine).toBe('Study: Invented et al. 2020.');
    expect(scenarioContext({ wording: { outcome: 'x', citation: 'Invented 2020' } }).studySourceLine).toBe('Study: Invented 2020.');
    expect(scenarioContext({}).studySourceLine).toBe('Study: not named.');
  });

  it('stratumAgeBand and groupPhrase', () => {
    expect(stratumAgeBand({ ageFrom: 0, ageTo: 120 })).toBeUndefined();
    expect(stratumAgeBand({ ageFrom: 0, ageTo: 17 })).toEqual({ fromYears: 0, toYears: 17 });
    expect(groupPhrase({ sex: 'male', ageFrom: 0, ageTo: 120 })).toBe('men, all ages');
    expect(groupPhrase({ sex: 'female', ageFrom: 40, ageTo: 49, extra: { region: 'north' } })).toBe('women, ages 40 to 49, region north');
  });
});
