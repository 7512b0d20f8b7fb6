/**
 * The way back: a scenario (from a link) or an evidence entry into the form's text values.
 * Kept apart from ./formValues.ts because the page needs it only after it has started (a link
 * is read after hydration, an entry is picked by a click), so it loads on demand.
 */
import type { EvidenceEntry } from '../evidence/schema';
import type { Scenario } from '../scenario/schema';
import { lookupStratum } from '../tables/lookup';
import type { PopulationTable } from '../tables/schema';
import { exposureToFormValues } from '../evidence/exposureForm';
import { EMPTY_FORM_VALUES, type ConsultationFormValues } from './formValues';

function text(value: number | undefined): string {
  return value === undefined ? '' : String(value);
}

/**
 * A scenario (from a link) back into form values. A baseline that came from a known table, and
 * that the same lookup gives again, reopens as that table; any other baseline reopens in its own
 * typed-in form, keeping the person (who "people like you" are) but not the table.
 */
export function scenarioToFormValues(scenario: Scenario, tables: readonly PopulationTable[]): ConsultationFormValues {
  const { baseline, effect, wording = {}, person = {} } = scenario;
  const values: ConsultationFormValues = {
    ...EMPTY_FORM_VALUES,
    effect: {
      measure: effect.measure,
      estimate: text(effect.estimate),
      lower: text(effect.lower),
      upper: text(effect.upper),
      level: effect.level === undefined ? '' : (String(effect.level) as ConsultationFormValues['effect']['level']),
      design: effect.design ?? '',
      followUpYears: text(effect.followUpYears),
      adjusted: effect.adjusted === undefined ? '' : effect.adjusted ? 'yes' : 'no',
    },
    wording: {
      outcome: wording.outcome ?? '',
      exposure: wording.exposure ?? '',
      comparison: wording.comparison ?? '',
      population: wording.population ?? '',
      citation: wording.citation ?? '',
    },
    exposure: exposureToFormValues(scenario.exposureDefinition),
    horizonYears: text(scenario.horizonYears),
    denominator: scenario.denominator === undefined ? 'auto' : scenario.denominator === 100 ? '100' : '1000',
    person: { age: text(person.age), sex: person.sex ?? '' },
  };
  const table = scenario.tableId === undefined ? undefined : tables.find((t) => t.id === scenario.tableId);
  if (table) {
    const found = lookupStratum(table, person);
    if (found.ok && JSON.stringify(found.value.baseline) === JSON.stringify(baseline)) {
      return { ...values, baselineSource: 'table', tableId: table.id };
    }
  }
  if ('rate' in baseline) {
    return { ...values, baselineSource: 'rate', rateBaseline: { rate: text(baseline.rate), perPersonYears: text(baseline.perPersonYears) } };
  }
  if ('populationRisk' in baseline) {
    return {
      ...values,
      baselineSource: 'population',
      populationBaseline: {
        populationRisk: text(baseline.populationRisk),
        exposurePrevalence: text(baseline.exposurePrevalence),
        years: text(baseline.years),
      },
    };
  }
  return { ...values, baselineSource: 'risk', riskBaseline: { risk: text(baseline.risk), years: text(baseline.years) } };
}

/** The effect, wording and exposure fields an evidence entry fills in when the clinician picks it. */
export function evidenceToFormValues(entry: EvidenceEntry): Pick<ConsultationFormValues, 'effect' | 'wording' | 'exposure'> {
  const filled = scenarioToFormValues(
    { baseline: { risk: 0.5, years: 1 }, effect: entry.effect, wording: entry.wording, ...(entry.exposureDefinition ? { exposureDefinition: entry.exposureDefinition } : {}) },
    [],
  );
  return { effect: filled.effect, wording: filled.wording, exposure: filled.exposure };
}
