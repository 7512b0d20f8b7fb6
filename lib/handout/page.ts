/**
 * The /handout screen's view model: from the link's query to either one sheet (./sheet.ts) or a
 * page that says in plain words why there is no handout and what to do. Never schema text: a
 * field is named as the consultation screen names it, and a message that reads like a
 * programmer's (braces, "expected …", "Invalid input") is replaced by a plain one.
 *
 * Kinds of "no handout":
 * - `empty`: the link holds no scenario at all (someone opened /handout directly);
 * - `broken`: the link is cut short or damaged, or a figure in it is not allowed;
 * - `capped`: the figures reach certainty (./sheet.ts, `certainty-reached`);
 * - `words`: the figures are fine but the patient sentences need words first (the outcome, or who
 *   the people are).
 */
import { decodeScenarioQuery, LINK_PARAMS } from '../link';
import type { Issue, Result } from '../result';
import type { Scenario } from '../scenario/schema';
import { localIsoDate } from '../glycaemia/dates';
import { readHandOver } from './ownResults';
import { handoutSheet, type HandoutSheet, type HandoutSheetOptions, type HandoutSheetTemplate } from './sheet';

export type HandoutProblemKind = 'empty' | 'broken' | 'capped' | 'words';

export interface HandoutProblem {
  readonly kind: HandoutProblemKind;
  /** First line of the alert; always begins "The handout cannot be made". */
  readonly heading: string;
  /** What is wrong, field by field, in plain words. */
  readonly details: readonly string[];
  /** What to do next. */
  readonly whatToDo: string;
}

/** The glucose history handed over from the consultation screen, as the editor reports it. */
export interface HandOverState {
  /** `none`: nothing for this scenario; `available`: a valid history; `damaged`: refused, with why. */
  readonly state: 'none' | 'available' | 'damaged';
  /** For the editor: what was found, in a sentence. */
  readonly message: string;
}

export type HandoutPageView =
  | { readonly kind: 'sheet'; readonly sheet: HandoutSheet; readonly scenario: Scenario; readonly backHref: string; readonly history: HandOverState }
  | { readonly kind: 'problem'; readonly problem: HandoutProblem; readonly backHref: string };

/** How the consultation screen names the parts of a scenario. */
const GROUP_LABELS: Readonly<Record<string, string>> = {
  baseline: 'the baseline risk (the risk without the risk factor)',
  effect: 'the study\u2019s figures (the ratio and its interval)',
  wording: 'the words for the patient',
  person: 'the person\u2019s age and sex',
  horizonYears: 'the time frame in years',
  denominator: 'the number of people in the pictures',
  tableId: 'the population table',
  people: 'who the figures are about',
};

function labelFor(path: readonly (string | number)[]): string {
  const param = LINK_PARAMS.find((p) => p.path.length === path.length && p.path.every((part, i) => part === path[i]));
  if (param) return param.label;
  const head = path[0];
  return typeof head === 'string' ? (GROUP_LABELS[head] ?? 'a part of the link') : 'a part of the link';
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** True for messages written for programmers rather than for clinicians. */
function looksTechnical(message: string): boolean {
  return /[{}[\]]|\bexpected\b|Invalid input|\breceived\b|undefined|NaN/.test(message);
}

/**
 * One issue as a plain sentence naming the field.
 * @example
 * plainIssue({ code: 'required', path: ['effect'], message: 'Invalid input: expected object, received undefined' })
 * //=> "The study’s figures (the ratio and its interval) are missing."
 */
export function plainIssue(issue: Issue): string {
  const label = labelFor(issue.path);
  const plural = /figures|words/.test(label) && !label.startsWith('the baseline');
  if (issue.code === 'required') return `${capitalise(label)} ${plural ? 'are' : 'is'} missing.`;
  const message = issue.message.trim();
  if (message.length === 0 || looksTechnical(message)) return `${capitalise(label)} ${plural ? 'are' : 'is'} not valid.`;
  return /[.!?]$/.test(message) ? message : `${message}.`;
}

function isEmptyQuery(query: string): boolean {
  const at = Math.max(query.indexOf('?'), query.indexOf('#'));
  const q = at >= 0 ? query.slice(at + 1) : query.startsWith('/') ? '' : query;
  return [...new URLSearchParams(q).keys()].length === 0;
}

const WHAT_TO_DO_LINK =
  'Go back to the consultation screen, fill in or check the figures, then choose \u201CPrepare handout\u201D again. If the link came in a message, copy the whole link, or ask for it to be sent again.';

function problemFor(query: string, issues: readonly Issue[]): HandoutProblem {
  if (isEmptyQuery(query)) {
    return {
      kind: 'empty',
      heading: 'The handout cannot be made from this link: it holds no consultation yet.',
      details: ['This page prints a one-page handout for the figures of a consultation.'],
      whatToDo:
        'Open the consultation screen, fill in the person, the baseline risk and the study\u2019s figures, then choose \u201CPrepare handout\u201D.',
    };
  }
  if (issues.some((i) => i.code === 'certainty-reached')) {
    return {
      kind: 'capped',
      heading: 'The handout cannot be made for these figures: they reach certainty.',
      details: issues.map((i) => i.message),
      whatToDo: 'Go back to the consultation screen: the clinician\u2019s figures and the warning are there. Check the baseline and the study before going on.',
    };
  }
  const wordsOnly = issues.every((i) => i.code === 'outcome-required' || i.code === 'population-required' || (i.code === 'too-long' && i.path[0] === 'people'));
  if (wordsOnly) {
    return {
      kind: 'words',
      heading: 'The handout cannot be made yet: the sentences for the patient need a few words first.',
      details: issues.map((i) => plainIssue(i)),
      whatToDo: 'Go back to the consultation screen, add these words, then choose \u201CPrepare handout\u201D again.',
    };
  }
  return {
    kind: 'broken',
    heading: 'The handout cannot be made from this link: part of it is missing or not valid.',
    details: [...new Set(issues.map((i) => plainIssue(i)))],
    whatToDo: WHAT_TO_DO_LINK,
  };
}

/** The tableId a query names, if it decodes: the screen loads that table before building the sheet. */
export function requestedTableId(query: string): string | undefined {
  const decoded = decodeScenarioQuery(query);
  return decoded.ok ? decoded.value.tableId : undefined;
}

/** The consultation screen's address for the same query. */
export function backHrefFor(query: string): string {
  // The scenario travels in the fragment (lib/link); an old "?…" query is written as a fragment.
  const params = query.replace(/^[?#]/, '');
  return `/${params ? `#${params}` : ''}`;
}

/**
 * The whole /handout view: the sheet, or the plain-words problem.
 * @example
 * handoutPageView('', template, { date }) //=> { kind: 'problem', problem: { kind: 'empty', heading: 'The handout cannot be made from this link: it holds no consultation yet.', … }, backHref: '/' }
 */
export interface HandoutPageOptions extends Omit<HandoutSheetOptions, 'history'> {
  /** Finds the table a scenario names (demo or saved), when `table` is not given. */
  readonly tableFor?: ((id: string) => HandoutSheetOptions['table']) | undefined;
  /** The hand-over record the consultation screen stored (./ownResults.ts), or null. */
  readonly storedHistory?: string | null | undefined;
  /** Print the person's own results when a history was handed over (default true). */
  readonly includeHistory?: boolean | undefined;
}

export function handoutPageView(query: string, template: HandoutSheetTemplate, options: HandoutPageOptions): HandoutPageView {
  const backHref = backHrefFor(query);
  const decoded = decodeScenarioQuery(query);
  if (!decoded.ok) return { kind: 'problem', problem: problemFor(query, decoded.issues), backHref };
  const scenario = decoded.value;
  const table = options.table ?? (scenario.tableId !== undefined ? options.tableFor?.(scenario.tableId) : undefined);
  const today = Number.isNaN(options.date.getTime()) ? localIsoDate() : localIsoDate(options.date);
  const handOver = readHandOver(options.storedHistory, scenario, today);
  const history: HandOverState =
    handOver === undefined
      ? { state: 'none', message: '' }
      : handOver.ok
        ? { state: 'available', message: `A glucose history with ${handOver.value.checkups.length} checkup${handOver.value.checkups.length === 1 ? '' : 's'} came with this consultation.` }
        : { state: 'damaged', message: `The glucose history that came with this consultation is left off. ${handOver.issues[0]?.message ?? 'It could not be read'}.`.replace(/\.\.$/, '.') };
  const useHistory = handOver?.ok === true && options.includeHistory !== false ? handOver.value : undefined;
  const sheet: Result<HandoutSheet> = handoutSheet(scenario, template, { ...options, table, history: useHistory });
  if (!sheet.ok) return { kind: 'problem', problem: problemFor(query, sheet.issues), backHref };
  return { kind: 'sheet', sheet: sheet.value, scenario, backHref, history };
}
