/**
 * Everything the glucose history section of the screen shows, computed in one pure function from
 * what the user typed: errors per row and field, each checkup's category in words, the run, the
 * chart's data, and — when the evidence defines an exposure — whether this history matches it.
 * The component renders this object and computes nothing.
 */
import type { Warning } from '../result';
import { OWN_RESULTS_HEADING, ownResultsText } from '../wording/ownResults';
import { classifyHistory } from './classify';
import { CRITERIA } from './criteria';
import { decidedByText, describeCheckup, describeExposure, describePersistence, GLYCAEMIA_CAUTION } from './describe';
import { draftsToCheckups, type CheckupDraft, type DraftField } from './draft';
import type { CriteriaSet, ExposureDefinition, GlycaemicCategory } from './exposure';
import { categoryLabel } from './format';
import { diabetesRangeNote, matchHistory, type HistoryMatch } from './match';
import { parseGlucoseHistory, type GlucoseHistory } from './parse';
import { persistence } from './persistence';
import { glucoseTimeline, type Timeline } from './timeline';

export interface GlucoseHistoryViewInput {
  readonly drafts: readonly CheckupDraft[];
  readonly criteria: CriteriaSet;
  /** Today as YYYY-MM-DD. */
  readonly today: string;
  readonly exposure?: ExposureDefinition | undefined;
}

export interface CheckupView {
  readonly date: string;
  readonly category: GlycaemicCategory | null;
  /** "prediabetes range (ADA)". */
  readonly label: string;
  /** Each test in the body's unit, as shown: "6.1%"; null when missing. */
  readonly hba1cText: string | null;
  readonly fpgText: string | null;
  readonly decidedBy: string | null;
  readonly discordant: boolean;
  readonly sentence: string;
  readonly notes: readonly string[];
}

export type RowErrors = Partial<Record<DraftField | 'row', string>>;

export interface GlucoseHistoryView {
  /** empty: no rows typed yet; invalid: some row has errors; ready: classified. */
  readonly status: 'empty' | 'invalid' | 'ready';
  readonly criteria: CriteriaSet;
  readonly criteriaName: string;
  /** Parallel to the drafts: "Row 1", "Row 2", … */
  readonly rowLabels: readonly string[];
  /** Parallel to the drafts: the errors of each row, by field ("row" for the whole row). */
  readonly rowErrors: readonly RowErrors[];
  /** One line per error, naming row and field, for a summary. */
  readonly errorLines: readonly string[];
  readonly checkups: readonly CheckupView[];
  readonly runText: string | null;
  /** Same-day merges and similar notes about the input. */
  readonly notes: readonly string[];
  readonly timeline: Timeline | null;
  /** Null without an exposure definition or before the rows are valid. */
  readonly match: HistoryMatch | null;
  readonly diabetesRangeNote: Warning | null;
  /** The study's exposure in words; null without one. */
  readonly exposureText: string | null;
  /** The valid history, for the handout's hand-over; null until every row is valid. */
  readonly history: GlucoseHistory | null;
  /** The person's own results as the handout prints them (lib/wording/ownResults.ts); null until the rows are valid. */
  readonly ownResults: { readonly heading: string; readonly text: string } | null;
  /** One line on what the screen shows: "3 checkups, classified under ADA." */
  readonly statusText: string;
  readonly caution: string;
}

const FIELD_WORDS: Readonly<Record<DraftField | 'row', string>> = {
  date: 'date',
  hba1cValue: 'HbA1c',
  hba1cUnit: 'HbA1c unit',
  fpgValue: 'fasting glucose',
  fpgUnit: 'glucose unit',
  row: 'row',
};

function fieldOf(rest: readonly (string | number)[]): DraftField | 'row' {
  const [test, part] = rest;
  if (test === 'date') return 'date';
  if (test === 'hba1c') return part === 'unit' ? 'hba1cUnit' : 'hba1cValue';
  if (test === 'fpg') return part === 'unit' ? 'fpgUnit' : 'fpgValue';
  return 'row';
}

/**
 * @example
 * glucoseHistoryView({ drafts: [{ date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '', fpgUnit: 'mg/dL' }], criteria: 'ADA', today: '2024-01-01' })
 * //=> { status: 'ready', checkups: [{ label: 'prediabetes range (ADA)', … }], runText: 'The latest result (2023-03-01) is in the prediabetes range (ADA). …', … }
 */
export function glucoseHistoryView(input: GlucoseHistoryViewInput): GlucoseHistoryView {
  const { drafts, criteria, today, exposure } = input;
  const rowErrors: RowErrors[] = drafts.map(() => ({}));
  const base = {
    criteria,
    rowLabels: drafts.map((_, i) => `Row ${i + 1}`),
    criteriaName: CRITERIA[criteria].name,
    caution: GLYCAEMIA_CAUTION,
    exposureText: exposure ? describeExposure(exposure) : null,
  };
  const empty = { checkups: [], runText: null, notes: [], timeline: null, match: null, diabetesRangeNote: null, history: null, ownResults: null } as const;
  const { checkups, rowOf } = draftsToCheckups(drafts);
  if (checkups.length === 0) {
    return { ...base, ...empty, status: 'empty', rowErrors, errorLines: [], statusText: 'No checkups yet: add a row, paste rows or load a FHIR file.' };
  }

  const rowName = (index: number) => `row ${(rowOf[index] ?? index) + 1}`;
  const parsed = parseGlucoseHistory({ criteria, checkups }, { today, checkupName: rowName });
  if (!parsed.ok) {
    const errorLines: string[] = [];
    for (const issue of parsed.issues) {
      const [head, index, ...rest] = issue.path;
      if (head !== 'checkups' || typeof index !== 'number') {
        errorLines.push(issue.message);
        continue;
      }
      const row = rowOf[index] ?? index;
      const field = fieldOf(rest);
      const errors = rowErrors[row];
      if (errors && errors[field] === undefined) errors[field] = issue.message;
      errorLines.push(`Row ${row + 1}, ${FIELD_WORDS[field]}: ${issue.message}`);
    }
    const n = errorLines.length;
    return { ...base, ...empty, status: 'invalid', rowErrors, errorLines, statusText: `${n} problem${n === 1 ? '' : 's'} in the rows; nothing is classified until ${n === 1 ? 'it is' : 'they are'} fixed:` };
  }

  const history = parsed.value;
  const classified = classifyHistory(history.checkups, criteria);
  const run = persistence(classified, criteria);
  const match = exposure ? matchHistory(history.checkups, exposure, { shownCriteria: criteria }) : null;
  const own = ownResultsText(history);
  return {
    ...base,
    status: 'ready',
    statusText: `${classified.length} checkup${classified.length === 1 ? '' : 's'}, classified under ${CRITERIA[criteria].id}.`,
    rowErrors,
    errorLines: [],
    checkups: classified.map((c) => ({
      date: c.date,
      category: c.category,
      label: categoryLabel(c.category, criteria),
      hba1cText: c.hba1c?.text ?? null,
      fpgText: c.fpg?.text ?? null,
      decidedBy: decidedByText(c),
      discordant: c.discordant,
      sentence: describeCheckup(c),
      notes: c.notes.filter((n) => n.code !== 'discordant-tests' && n.code !== 'not-classified').map((n) => n.message),
    })),
    runText: describePersistence(run),
    notes: history.notes.map((n) => n.message),
    timeline: glucoseTimeline(classified, criteria),
    match,
    diabetesRangeNote: diabetesRangeNote(classified, exposure?.category) ?? match?.diabetesRangeNote ?? null,
    history,
    ownResults: own ? { heading: `${OWN_RESULTS_HEADING}, as the handout words them`, text: own.text } : null,
  };
}
