import { describe, expect, it } from 'vitest';
import { EMPTY_FORM_VALUES, formToFigures, type ConsultationFormValues } from '@/lib/consultation/formValues';
import { consultationDetails, consultationView, outcomeMismatch, type ConsultationView } from '@/lib/consultation';
import { scenarioContext } from '@/lib/context';
import { computeScenario } from '@/lib/engine/compute';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_CORONARY_RATE, DEMO_TABLES } from '@/lib/tables/demo';

// Hand-computed: RR 1.5 (1.2 to 1.9) at P0 = 0.08 over 10 years gives P1 = 0.12 (0.096 to 0.152);
// at D = 100: 8 reference events, 12 exposed (8 as the comparison group + 4 extra), range 10 to 15.
const HARM: Scenario = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
  wording: { outcome: 'a first stroke', exposure: 'raised blood pressure', comparison: 'normal blood pressure' },
  person: { age: 62, sex: 'female' },
};

function view(scenario: Scenario, extra: Partial<Parameters<typeof consultationView>[0]> = {}): ConsultationView {
  const computed = computeScenario(scenario);
  if (!computed.ok) throw new Error(JSON.stringify(computed.issues));
  return consultationView({ scenario, result: computed.value, context: scenarioContext(scenario), ...extra });
}

function sum(rows: readonly { kind: string; count: string }[]): number {
  return rows.filter((r) => r.kind !== 'total').reduce((s, r) => s + Number(r.count.replace(/,/g, '')), 0);
}

describe('consultationView', () => {
  it('gives the context line, pictures and clinician figures of a worded result', () => {
    const v = view(HARM);
    expect(v.contextLine).toBe('Figures for women aged 62, over the next 10 years. Each picture shows 100 people (number chosen automatically).');
    expect(v.patient?.sentencesReady).toBe(true);
    expect(v.handoutAllowed).toBe(true);
    expect(v.capped).toBeUndefined();
    expect(v.patient?.heading).toBe('For the person: out of 100 people like you');
    expect(v.clinician.teachBack?.questions).toHaveLength(3);
    expect(v.wordsNeeded.issues).toEqual([]);
  });

  it('each picture’s table adds up to the denominator; the range is its own row (issue 12 item 5)', () => {
    const v = view(HARM);
    const [reference, exposed] = v.patient?.pictures ?? [];
    expect(reference && sum(reference.rows)).toBe(100);
    expect(exposed && sum(exposed.rows)).toBe(100);
    expect(exposed?.rows.at(-1)).toEqual({ kind: 'total', label: 'All the people in the picture', count: '100' });
    // Hand-computed above: the range runs from 10 to 15; it is described, not counted.
    expect(exposed?.rangeRow?.count).toBe('10 to 15 could have it, out of 100 (already counted above)');
    expect(reference?.rangeRow).toBeUndefined();
    // The key's entries carry no count for the range that would add up to more than 100.
    const keyCounts = (exposed?.keyEntries ?? []).filter((e) => !e.uncertain).map((e) => Number(/\((\d+) (?:person|people)\)/.exec(e.label)?.[1]));
    expect(keyCounts.reduce((s, n) => s + n, 0)).toBe(100);
    expect(exposed?.keyEntries.find((e) => e.uncertain)?.label).toBe('Could be: inside the study\u2019s range (from 10 to 15 in all; already counted above)');
  });

  it('a capped result shows the clinician figures and the warning only (issue 12 item 4)', () => {
    // Hand-computed: RR 2.5 (2 to 3) at P0 = 0.5 gives RR·P0 = 1.25 ≥ 1: capped.
    const v = view({ ...HARM, baseline: { risk: 0.5, years: 10 }, effect: { measure: 'RR', estimate: 2.5, lower: 2, upper: 3 } });
    expect(v.capped?.title).toBe('This result is not shown to the person');
    expect(v.patient).toBeUndefined();
    expect(v.handoutAllowed).toBe(false);
    expect(v.clinician.teachBack).toBeUndefined();
    expect(v.clinician.warnings.map((w) => w.code)).toContain('risk-ratio-exceeds-certainty');
    expect(v.clinician.absoluteRisks).toMatch(/^Absolute risk over the next 10 years: /);
  });

  it('shows the pictures with neutral words before the wording, and asks for the words (issue 12 item 6)', () => {
    const scenario: Scenario = { baseline: HARM.baseline, effect: HARM.effect };
    const computed = computeScenario(scenario);
    if (!computed.ok) throw new Error('computes');
    const v = consultationView({
      scenario,
      result: computed.value,
      context: scenarioContext(scenario),
      wordsNeeded: [{ code: 'outcome-required', path: ['wording', 'outcome'], message: 'The outcome is required' }],
    });
    expect(v.patient?.pictures[0].layout.denominator).toBe(100);
    expect(v.patient?.sentencesReady).toBe(false);
    expect(v.patient?.pictures[0].rows[0]?.label).toBe('Will have the outcome');
    expect(v.handoutAllowed).toBe(false);
    expect(v.clinician.teachBack).toBeUndefined();
    expect(v.wordsNeeded.issues.map((i) => i.code)).toEqual(['outcome-required']);
    expect(v.contextLine).toMatch(/^Figures for people, over the next 10 years/);
  });

  it('warns when the table’s outcome and the study’s outcome differ, naming both (issue 12 item 3)', () => {
    expect(outcomeMismatch('first coronary events', 'any cardiovascular event')?.message).toBe(
      'The table\'s outcome and the study\'s outcome differ: the baseline is for \u201cfirst coronary events\u201d, the study measured \u201cany cardiovascular event\u201d. Check that they are close enough to combine.',
    );
    expect(outcomeMismatch('A stroke.', 'a stroke')).toBeUndefined();
    expect(outcomeMismatch(undefined, 'a stroke')).toBeUndefined();
    const values: ConsultationFormValues = {
      ...EMPTY_FORM_VALUES,
      tableId: DEMO_CORONARY_RATE.id,
      person: { age: '55', sex: 'male' },
      effect: { ...EMPTY_FORM_VALUES.effect, measure: 'HR', estimate: '1.3', lower: '1.1', upper: '1.5' },
      wording: { ...EMPTY_FORM_VALUES.wording, outcome: 'any cardiovascular event' },
    };
    const figures = formToFigures(values, DEMO_TABLES);
    if (!figures.ok) throw new Error(JSON.stringify(figures.issues));
    const v = consultationView(figures.value);
    const warning = v.clinician.warnings.find((w) => w.code === 'outcome-mismatch');
    expect(warning?.message).toContain(DEMO_CORONARY_RATE.outcome);
    expect(warning?.message).toContain('any cardiovascular event');
    // A demo table: the illustrative band is on the result.
    expect(v.illustrativeBand).toMatch(/^Illustrative figures, not for patients/);
  });

  it('passes the glucose history’s notes: the range note beside the result and with the warnings', () => {
    const v = view(HARM, {
      extraWarnings: [
        { code: 'diabetes-range-latest', message: 'range note' },
        { code: 'exposure-mismatch', message: 'mismatch' },
      ],
    });
    expect(v.rangeNote?.message).toBe('range note');
    expect(v.clinician.warnings.map((w) => w.code)).toContain('exposure-mismatch');
    // The established screen (tests/e2e/glucose.spec.ts) lists it among the result's warnings too.
    expect(v.clinician.warnings.map((w) => w.code)).toContain('diabetes-range-latest');
  });

  it('no demo data, no band; a demo evidence entry brings it', () => {
    expect(view(HARM).illustrativeBand).toBeUndefined();
    expect(view(HARM, { illustrativeEvidence: true }).illustrativeBand).toBeDefined();
  });
});

describe('consultationDetails', () => {
  it('gives the worked-out steps and the charts’ words', () => {
    const computed = computeScenario(HARM);
    if (!computed.ok) throw new Error('computes');
    const d = consultationDetails({ scenario: HARM, result: computed.value, context: scenarioContext(HARM) });
    expect(d.steps.map((s) => s.id)).toContain('icon-counts');
    expect(d.charts?.bars.map((b) => b.riskText)).toEqual(['8.0%', '12.0%']); // hand-computed above
    expect(d.charts?.bars[0]?.intervalText).toBe('held fixed');
    expect(d.charts?.bars[1]?.intervalText).toBe('9.6% to 15.2%');
    expect(d.charts?.intervalLabel).toBe('95% CI');
    expect(d.charts?.keyExposed).toBe('Dashed line: With raised blood pressure (shaded: 95% CI)');
  });
});
