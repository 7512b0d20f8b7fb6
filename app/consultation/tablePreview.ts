/**
 * The line under the table picker: what the chosen table gives for the person typed so far
 * (their group, its risk or rate, the horizon), shown while the rest of the form is still
 * being filled in. Loaded with the lookup summary, once a table is chosen.
 */
import type { Person } from '@/lib/scenario/schema';
import { lookupStratum, tableNeeds } from '@/lib/tables/lookup';
import type { PopulationTable } from '@/lib/tables/schema';
import { formatCount, formatPercent, formatYears } from '@/lib/wording/format';
import { scenarioContext } from '@/lib/context';
import { checkedPerson, defined, numberFromText } from '@/lib/consultation/formValues';

export type TablePreview =
  | { readonly ok: true; readonly group: string; readonly figure: string }
  | { readonly ok: false; readonly message: string };

/**
 * What a table gives for the person typed so far, for the line under the table picker; shown
 * while the rest of the form is still being filled in.
 */
export function tablePreview(table: PopulationTable, person: { age: string; sex: string }): TablePreview {
  const needs = tableNeeds(table);
  const age = needs.age ? numberFromText(person.age) : undefined;
  const sex = needs.sex && (person.sex === 'female' || person.sex === 'male') ? person.sex : undefined;
  const candidate: Person = defined({ age, sex });
  const checked = checkedPerson(candidate);
  if (!checked.ok) return { ok: false, message: checked.issues[0]?.message ?? 'Check the age' };
  const found = lookupStratum(table, candidate);
  if (!found.ok) {
    const missing = found.issues.every((issue) => issue.code === 'required');
    const wanted = [needs.age ? 'age' : undefined, needs.sex ? 'sex' : undefined].filter((w) => w !== undefined).join(' and ');
    return { ok: false, message: missing ? `Enter the person’s ${wanted} to look up the risk.` : (found.issues[0]?.message ?? 'No group of the table fits') };
  }
  const { baseline } = found.value;
  const group = scenarioContext({ person: candidate, tableId: table.id }, { table, lookup: found.value }).people;
  const exposed = 'exposurePrevalence' in baseline && baseline.exposurePrevalence !== undefined ? ` (a population average with ${formatPercent(baseline.exposurePrevalence)} exposed)` : '';
  const figure =
    'risk' in baseline
      ? `a risk of ${formatPercent(baseline.risk)} over ${formatYears(baseline.years)} years`
      : 'populationRisk' in baseline
        ? `a risk of ${formatPercent(baseline.populationRisk)} over ${formatYears(baseline.years)} years${exposed}`
        : `${formatRate(baseline.rate)} events per ${formatCount(baseline.perPersonYears)} person-years${exposed}${table.horizonYears !== undefined ? `; the suggested horizon is ${formatYears(table.horizonYears)} years` : ''}`;
  return { ok: true, group: group.ok ? capitalise(group.value) : 'Everyone in the table', figure };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function formatRate(rate: number): string {
  return rate.toLocaleString('en', { maximumFractionDigits: 3 });
}
