/**
 * The consultation screen's view model: everything the result panel shows — the line saying
 * who the figures are for, the pictures with their keys and count tables, the patient
 * sentences, the groups table, the clinician's figures and warnings, the notes and bands —
 * computed once per change from a valid scenario and its result. The components under
 * app/consultation render this and compute nothing.
 *
 * Rules it applies:
 * - a result capped at certainty (engine warning `risk-ratio-exceeds-certainty`) gets the
 *   clinician's figures and the warning only: no pictures, no patient sentences, no handout;
 * - the pictures appear as soon as the numbers are valid, with neutral words ("the outcome",
 *   "people") until the clinician words the outcome and the group; the patient sentences and
 *   the handout wait for those words ({@link ConsultationView.wordsNeeded});
 * - each picture's key and count table add up to its denominator; the study's range has its
 *   own row (lib/wording/patient.ts, lib/wording/screen.ts);
 * - a result built on demo data carries the illustrative band;
 * - when the table's outcome and the study's outcome are both known and differ, the
 *   clinician panel warns (`outcome-mismatch`) and shows both.
 * The charts and "How this was worked out" are in {@link consultationDetails}, computed once
 * typing pauses.
 */
import { absoluteRiskBars } from '../chart/absoluteRisk';
import { describeRiskByHorizon, formatPercentValue, riskByHorizon, type RiskAtHorizon } from '../chart/riskByHorizon';
import type { ScenarioContext } from '../context';
import type { ComputeResult } from '../engine/types';
import { explainSteps, type ExplainStep } from '../explain/steps';
import type { Issue, Warning } from '../result';
import type { Scenario } from '../scenario/schema';
import { formatCount, phraseText } from '../text';
import { clinicianText, type ClinicianText } from '../wording/clinician';
import { formatYears, intervalLabel } from '../wording/format';
import { patientText, type ArrayText, type LegendItem, type LegendKind, type PatientText } from '../wording/patient';
import {
  CAPPED_TEXT,
  CAPPED_TITLE,
  ILLUSTRATIVE_BAND,
  NEUTRAL_OUTCOME,
  NEUTRAL_PEOPLE,
  NO_WARNINGS_TEXT,
  outcomeMismatchMessage,
  patientHeading,
  pictureTableCaption,
  pictureTotal,
  rangeRow,
  resultAnnouncement,
  resultContextLine,
  WORDS_NEEDED_LEAD,
} from '../wording/screen';

export interface ConsultationViewInput {
  readonly scenario: Scenario;
  readonly result: ComputeResult;
  /** Who the figures are about and where they come from (lib/context/scenarioContext.ts). */
  readonly context: ScenarioContext;
  /**
   * What the patient sentences still need (the outcome in words, who the people are), each on
   * its form field; empty when the sentences can be written.
   */
  readonly wordsNeeded?: readonly Issue[] | undefined;
  /** Cautions from outside the engine (the glucose history's match), shown with the engine's. */
  readonly extraWarnings?: readonly Warning[] | undefined;
  /** True when the evidence entry in use is a demo entry (illustrative). */
  readonly illustrativeEvidence?: boolean | undefined;
  /** A message when the figures no longer match the saved entry they started from. */
  readonly entryNotice?: string | undefined;
}

/** One row of the small table under a picture. */
export interface PictureRow {
  readonly kind: LegendKind | 'total';
  readonly label: string;
  /** The count as written ("8"), or the range in words for the range row. */
  readonly count: string;
}

/** A key entry: the icon to draw and its label. */
export interface KeyEntry {
  readonly kind: 'event' | 'added' | 'avoided' | 'none';
  readonly uncertain: boolean;
  readonly label: string;
}

export interface PictureView {
  readonly key: ArrayText['key'];
  readonly title: string;
  /** Visible under the picture and its text alternative. */
  readonly description: string;
  readonly layout: ArrayText['layout'];
  readonly keyEntries: readonly KeyEntry[];
  readonly tableCaption: string;
  /** The kinds drawn (adding up to the denominator), then the total row. */
  readonly rows: readonly PictureRow[];
  /** The study's range in its own row, when the picture marks one; never counted as people. */
  readonly rangeRow?: PictureRow;
}

export interface PatientPanelView {
  readonly heading: string;
  readonly pictures: readonly [PictureView, PictureView];
  /** The groups side by side in words (the shape lib/wording/patient.ts gives, shared with the handout). */
  readonly groupsTable: Pick<PatientText, 'outcome' | 'dataTable'>;
  /** True once the outcome and the group are worded: the sentences may be shown to the person. */
  readonly sentencesReady: boolean;
  readonly means: readonly string[];
  readonly doesNotMean: readonly string[];
}

/** The clinician's figures (lib/wording/clinician.ts), with every warning and the teach-back questions. */
export interface ClinicianPanelView extends Omit<ClinicianText, 'warnings'> {
  /** The engine's warnings, then those from outside it (glucose history, outcome mismatch). */
  readonly warnings: readonly Warning[];
  readonly noWarningsText: string;
  /** Teach-back questions: only with worded sentences and an uncapped result. */
  readonly teachBack?: { readonly intro: string; readonly questions: readonly string[] };
}

export interface ConsultationView {
  /** What a screen reader hears once the result has settled. */
  readonly announcement: string;
  /** "Figures for …, over the next 10 years. Each picture shows 100 people (…)." */
  readonly contextLine: string;
  /** The illustrative band, when demo data went in. */
  readonly illustrativeBand?: string;
  /** The glucose history's "diabetes range" note for the clinician, when there is one. */
  readonly rangeNote?: Warning;
  /** Set when the result is capped at certainty: nothing reaches the person. */
  readonly capped?: { readonly title: string; readonly text: string };
  /** The pictures and patient sentences; absent for a capped result. */
  readonly patient?: PatientPanelView;
  /** What the patient sentences and handout still need, with a lead line; no issues when none. */
  readonly wordsNeeded: { readonly lead: string; readonly issues: readonly Issue[] };
  /** A notice that the saved entry no longer applies. */
  readonly entryNotice?: string;
  readonly clinician: ClinicianPanelView;
  /** "Prepare handout" is offered only when the sentences can be written and nothing is capped. */
  readonly handoutAllowed: boolean;
}

/** The engine's code for a result capped at certainty (lib/engine/warnings.ts). */
export const CAPPED_WARNING = 'risk-ratio-exceeds-certainty';

function keyEntry(item: LegendItem): KeyEntry {
  return item.kind === 'uncertain' ? { kind: 'none', uncertain: true, label: item.text } : { kind: item.kind, uncertain: false, label: item.text };
}

function picture(text: ArrayText, range: { lower: number; upper: number } | undefined): PictureView {
  const d = text.layout.denominator;
  const kinds = text.legend.filter((item) => item.kind !== 'uncertain');
  const marked = range && text.layout.tally.uncertain > 0 ? rangeRow(range.lower, range.upper, d) : undefined;
  return {
    key: text.key,
    title: text.title,
    description: text.alt,
    layout: text.layout,
    keyEntries: text.legend.map(keyEntry),
    tableCaption: pictureTableCaption(d),
    rows: [...kinds.map((item) => ({ kind: item.kind, label: item.label, count: formatCount(item.count) })), { kind: 'total' as const, ...pictureTotal(d) }],
    ...(marked ? { rangeRow: { kind: 'uncertain' as const, ...marked } } : {}),
  };
}

/** Case, spaces, a leading article and trailing full stops do not make two outcomes differ. */
function outcomeKey(text: string): string {
  return text.toLowerCase().replace(/\s+/g, ' ').replace(/^(a|an|the) /, '');
}

/**
 * The outcome-mismatch warning (code `outcome-mismatch`) when the table's outcome and the
 * study's outcome are both known and differ; both are named in it.
 * @example
 * outcomeMismatch('first coronary events', 'any cardiovascular event')?.code //=> "outcome-mismatch"
 * outcomeMismatch('A stroke.', 'a stroke') //=> undefined
 */
export function outcomeMismatch(tableOutcome: string | undefined, evidenceOutcome: string | undefined): Warning | undefined {
  const a = phraseText(tableOutcome);
  const b = phraseText(evidenceOutcome);
  if (a === '' || b === '' || outcomeKey(a) === outcomeKey(b)) return undefined;
  return { code: 'outcome-mismatch', message: outcomeMismatchMessage(a, b) };
}

/** The patient text, with neutral words standing in until the clinician has worded them. */
function textFor(scenario: Scenario, result: ComputeResult, context: ScenarioContext, worded: boolean) {
  const people = context.people.ok ? context.people.value : NEUTRAL_PEOPLE;
  const wording = worded ? scenario.wording : { ...scenario.wording, outcome: phraseText(scenario.wording?.outcome) || NEUTRAL_OUTCOME };
  return patientText({ result, wording, people, horizonYears: result.horizonYears });
}

/**
 * @example
 * consultationView({ scenario, result, context: scenarioContext(scenario, { table }) })
 * //=> { contextLine: "Figures for women aged 50 to 59, over the next 10 years. …", patient: { pictures: [...] }, clinician: { … }, handoutAllowed: true, … }
 */
export function consultationView(input: ConsultationViewInput): ConsultationView {
  const { scenario, result, context } = input;
  const wordsNeeded = input.wordsNeeded ?? [];
  const extra = input.extraWarnings ?? [];
  const capped = result.warnings.some((w) => w.code === CAPPED_WARNING);
  const people = context.people.ok ? context.people.value : NEUTRAL_PEOPLE;
  const sentencesReady = wordsNeeded.length === 0 && context.people.ok && phraseText(scenario.wording?.outcome) !== '';
  const counts = result.iconArray;

  const mismatch = outcomeMismatch(context.table?.outcome, scenario.wording?.outcome);
  const clinician = clinicianText(result, scenario.wording);
  const rangeNote = extra.find((w) => w.code === 'diabetes-range-latest');
  // The range note is shown beside the result and also stays in the clinician's list of warnings.
  const warnings = [...clinician.warnings, ...extra, ...(mismatch ? [mismatch] : [])];

  const text = textFor(scenario, result, context, sentencesReady);
  let patient: PatientPanelView | undefined;
  if (!capped && text.ok) {
    const t = text.value;
    patient = {
      heading: patientHeading(t.denominator),
      pictures: [picture(t.reference, undefined), picture(t.exposed, { lower: counts.exposedLower, upper: counts.exposedUpper })],
      groupsTable: { outcome: t.outcome, dataTable: t.dataTable },
      sentencesReady,
      means: t.means,
      doesNotMean: t.doesNotMean,
    };
  }
  const teachBack = !capped && sentencesReady && text.ok ? { intro: text.value.teachBackIntro, questions: text.value.teachBack } : undefined;

  return {
    announcement: resultAnnouncement({ people, horizonYears: result.horizonYears, denominator: counts.denominator }),
    contextLine: resultContextLine({ people, horizonYears: result.horizonYears, denominator: counts.denominator, automatic: counts.automatic, tableTitle: context.table?.title }),
    ...(context.illustrativeTable || input.illustrativeEvidence === true ? { illustrativeBand: ILLUSTRATIVE_BAND } : {}),
    ...(rangeNote ? { rangeNote } : {}),
    ...(capped ? { capped: { title: CAPPED_TITLE, text: CAPPED_TEXT } } : {}),
    ...(patient ? { patient } : {}),
    wordsNeeded: { lead: WORDS_NEEDED_LEAD, issues: capped ? [] : wordsNeeded },
    ...(input.entryNotice ? { entryNotice: input.entryNotice } : {}),
    clinician: {
      ...clinician,
      warnings,
      noWarningsText: NO_WARNINGS_TEXT,
      ...(teachBack ? { teachBack } : {}),
    },
    handoutAllowed: !capped && sentencesReady,
  };
}

/** One bar of the absolute-risk chart, with its row in the chart's data table. */
export interface ChartBar {
  readonly group: 'reference' | 'exposed';
  /** The group's short name under its bar. */
  readonly name: string;
  readonly riskPercent: number;
  /** [below, above] whisker lengths; absent for the reference group, whose risk is held fixed. */
  readonly whisker?: readonly [number, number];
  readonly riskText: string;
  readonly intervalText: string;
}

/** One row of the "risk by year" data table. */
export interface HorizonRow {
  readonly years: string;
  readonly reference: string;
  readonly exposed: string;
  readonly interval: string;
}

export interface ChartsView {
  readonly bars: readonly ChartBar[];
  /** The absolute-risk chart's caption and text alternative (the clinician's sentence). */
  readonly absoluteSentence: string;
  readonly absoluteTableCaption: string;
  /** Points for the risk-by-horizon chart (per cent). */
  readonly points: readonly RiskAtHorizon[];
  /** The risk-by-horizon chart's caption and text alternative. */
  readonly horizonSentence: string;
  readonly horizonRows: readonly HorizonRow[];
  /** "95% CI". */
  readonly intervalLabel: string;
  /** Capitalised short names of the groups, for axis labels, keys and table headers. */
  readonly names: { readonly exposed: string; readonly comparison: string };
  readonly keyReference: string;
  readonly keyExposed: string;
}

/** The charts' data and words, and the worked-out steps: drawn once typing pauses. */
export interface ConsultationDetails {
  readonly charts?: ChartsView;
  readonly steps: readonly ExplainStep[];
}

/**
 * @example
 * consultationDetails({ scenario, result, context }).steps.map((s) => s.id)
 * //=> ['baseline', 'horizon', 'conversion', 'risk-ratio', 'risk-difference', 'number-needed', 'icon-counts']
 */
export function consultationDetails(input: Pick<ConsultationViewInput, 'scenario' | 'result' | 'context'>): ConsultationDetails {
  const { scenario, result, context } = input;
  const steps = explainSteps({ scenario, result, table: context.table, stratum: context.stratum });
  const points = riskByHorizon(scenario, result.horizonYears);
  const text = textFor(scenario, result, context, false);
  if (!points.ok || !text.ok) return { steps };
  const t = text.value;
  const names = { exposed: t.exposed.heading, comparison: t.reference.heading };
  const ci = intervalLabel(result.level);
  const bars: ChartBar[] = absoluteRiskBars(result).map((bar) =>
    bar.group === 'exposed'
      ? {
          group: bar.group,
          name: names.exposed,
          riskPercent: bar.riskPercent,
          whisker: bar.whiskerPercent,
          riskText: formatPercentValue(bar.riskPercent),
          intervalText: `${formatPercentValue(bar.lowerPercent)} to ${formatPercentValue(bar.upperPercent)}`,
        }
      : { group: bar.group, name: names.comparison, riskPercent: bar.riskPercent, riskText: formatPercentValue(bar.riskPercent), intervalText: 'held fixed' },
  );
  const last = points.value[points.value.length - 1];
  return {
    steps,
    charts: {
      bars,
      absoluteSentence: clinicianText(result, scenario.wording).absoluteRisks,
      absoluteTableCaption: `Chart data: risk over ${formatYears(last?.horizonYears ?? result.horizonYears)} years`,
      points: points.value,
      horizonSentence: describeRiskByHorizon(points.value, { exposed: t.exposedGroup, comparison: t.comparisonGroup }, result.level),
      horizonRows: points.value.map((p) => ({
        years: formatYears(p.horizonYears),
        reference: formatPercentValue(p.referencePercent),
        exposed: formatPercentValue(p.exposedPercent),
        interval: `${formatPercentValue(p.exposedLowerPercent)} to ${formatPercentValue(p.exposedUpperPercent)}`,
      })),
      intervalLabel: ci,
      names,
      keyReference: `Solid line: ${names.comparison}`,
      keyExposed: `Dashed line: ${names.exposed} (shaded: ${ci})`,
    },
  };
}
