/**
 * Batch handouts for the checkups screen (issue 10, item 9): the workers the physician chose →
 * one handout sheet per worker, each exactly the sheet `/handout` makes for that worker's
 * scenario and glucose history. Nothing here builds a sentence or a number of its own:
 * - the scenario is lib/workforce `workerScenario` (the one the worker's figures came from);
 * - the history is the worker's checkups read again from the file (./workerHistory.ts), handed to
 *   the sheet as the consultation screen hands it to /handout: one hand-over record
 *   (lib/handout `handOverRecord`, with the run's criteria set), read back by /handout's own
 *   checks (lib/handout `readHandOver`), so "Your own results" is worded as /handout words it;
 * - the sheet is lib/handout `handoutPageView` given that scenario's link fragment (lib/link
 *   `scenarioFragment`) and that record, i.e. the very call /handout makes when it opens that
 *   link, with the same default template, paper and date (less the editor's reading grades,
 *   which are not printed: `grades: false`).
 * Without checkups (neither a file nor a saved session's rows to read them from) the sheet has no
 * own results, as /handout's has when nothing was handed over.
 *
 * A worker gets no sheet, and is counted and listed with the reason, when the evidence does not
 * apply to them (status neither, insufficient or diabetes range: no figures), or when
 * `/handout` would refuse the sheet (`capped`: the figures reach certainty; `words` or `broken`).
 * The pseudonymous worker id rides beside the sheet, never inside it, and only when asked for.
 */
import type { Checkup } from '../glycaemia/schema';
import { DEFAULT_BLOCKS } from '../handout/blocks';
import { handOverRecord } from '../handout/ownResults';
import { handoutPageView, type HandoutProblemKind } from '../handout/page';
import type { HandoutSheet, HandoutSheetTemplate } from '../handout/sheet';
import type { PaperSize } from '../handout/paper';
import { scenarioFragment } from '../link/scenarioLink';
import { workerScenario, type CheckupsContext } from '../workforce/evaluate';
import type { WorkerResult } from '../workforce/types';
import { STATUS_LABELS } from './worklist';

/** Which workers: every exposed worker, every worker, or the ones ticked in the worklist. */
export const BATCH_CHOICES = ['exposed', 'all', 'selected'] as const;
export type BatchChoice = (typeof BATCH_CHOICES)[number];

export const BATCH_CHOICE_LABELS: Readonly<Record<BatchChoice, string>> = {
  exposed: 'All workers who fit the exposure',
  all: 'All workers',
  selected: 'The workers ticked in the worklist',
};

/**
 * The chosen workers' positions (indices into the run's results, file order).
 * @example
 * batchSelection([exposed, insufficient, exposed], 'exposed', new Set()) //=> [0, 2]
 * batchSelection([exposed, insufficient, exposed], 'selected', new Set([2, 1, 7])) //=> [1, 2]
 */
export function batchSelection(results: readonly Pick<WorkerResult, 'status'>[], choice: BatchChoice, selected: ReadonlySet<number>): number[] {
  const indices: number[] = [];
  results.forEach((r, i) => {
    if (choice === 'all' || (choice === 'exposed' && r.status === 'exposed') || (choice === 'selected' && selected.has(i))) indices.push(i);
  });
  return indices;
}

/**
 * How many workers each choice takes, in one pass over the results (the screen writes the count
 * beside each choice): every exposed worker, every worker, and the ticked positions that are
 * workers of this run. Equal, for every choice, to `batchSelection(results, choice, selected).length`.
 * @example
 * batchChoiceCounts([exposed, insufficient, exposed], new Set([2, 1, 7])) //=> { exposed: 2, all: 3, selected: 2 }
 */
export function batchChoiceCounts(results: readonly Pick<WorkerResult, 'status'>[], selected: ReadonlySet<number>): Readonly<Record<BatchChoice, number>> {
  let exposed = 0;
  for (const r of results) if (r.status === 'exposed') exposed++;
  let ticked = 0;
  for (const i of selected) if (Number.isInteger(i) && i >= 0 && i < results.length) ticked++;
  return { exposed, all: results.length, selected: ticked };
}

/**
 * A choice as the screen lists it, with how many workers it takes.
 * @example
 * batchChoiceLabel('all', 12000) //=> "All workers (12,000)"
 */
export function batchChoiceLabel(choice: BatchChoice, workers: number): string {
  return `${BATCH_CHOICE_LABELS[choice]} (${workers.toLocaleString('en')})`;
}

export interface BatchOptions {
  readonly paper: PaperSize;
  /** The date printed on every sheet ("Prepared on …"). */
  readonly date: Date;
  /** Print the worker's pseudonymous id in small print (the physician's tick). */
  readonly showIds: boolean;
  /** Default: /handout's own default template (DEFAULT_BLOCKS, no clinic). */
  readonly template?: HandoutSheetTemplate;
}

/** Why a worker gets no sheet: no figures (the evidence does not apply), or /handout's own refusal. */
export type BatchSkipReason = 'not-applicable' | HandoutProblemKind;

export type BatchHandout =
  | {
      readonly kind: 'sheet';
      readonly index: number;
      readonly worker: string;
      readonly workerId: string | undefined;
      readonly sheet: HandoutSheet;
      /**
       * {@link batchSheetKey}: equal keys, equal sheets but for the own results' sentences, so the
       * screen draws a sheet once per key and copies it, writing in each worker's own results.
       */
      readonly sheetKey: string;
      /**
       * Set when the worker's checkups were given but /handout's checks refused them (the sheet
       * then has no own results, as on /handout): the reason, in /handout's words.
       */
      readonly historyLeftOff: string | undefined;
    }
  | { readonly kind: 'skipped'; readonly index: number; readonly worker: string; readonly reason: BatchSkipReason; readonly message: string };

/**
 * A sheet's content as a string, all but the own results' sentences: two sheets have equal keys
 * exactly when they are equal in everything else. Left out besides: the reading grades, which
 * the printed sheet does not show (they are the editor's) and which count the own results' words.
 * The pictures' cells are written one letter each (kind, and "+" for a "could be" icon) instead
 * of as objects, so a key of a 1,000-icon sheet stays a few kilobytes. Workers of the same age
 * band and sex share a key (the exact age is not printed), so a batch of 500 workers holds a
 * handful of distinct keys: the screen draws each once and writes in each worker's own results.
 */
export function batchSheetKey(sheet: HandoutSheet): string {
  const { readability: _grades, ownResults, ...printed } = sheet;
  return JSON.stringify({ ...printed, ownResults: ownResults ? ownResults.heading : null }, (key, value: unknown) =>
    key === 'cells' && Array.isArray(value) ? (value as { kind: string; uncertain: boolean }[]).map((c) => `${c.kind[0]}${c.uncertain ? '+' : ''}`).join('') : value,
  );
}

const DEFAULT_TEMPLATE: HandoutSheetTemplate = { blocks: DEFAULT_BLOCKS, clinic: {} };

/**
 * One worker's handout, or why there is none. `checkups`: the worker's glucose history as read
 * again from the file (./workerHistory.ts `workerCheckups`); undefined when it cannot be read.
 * @example
 * batchHandout(W001, 0, context, { paper: 'a4', date, showIds: true }, w001Checkups)
 * //=> { kind: 'sheet', worker: 'W001', workerId: 'W001', sheet: { caution: …, arrays: […], ownResults: { heading: 'Your own results', items: ['Your HbA1c was between 5.9% and 6.2% at five yearly checkups, from 2021 to 2025.', …] }, … }, … }
 * batchHandout(W002, 1, context, { paper: 'a4', date, showIds: false })
 * //=> { kind: 'skipped', worker: 'W002', reason: 'not-applicable', message: 'Not enough results: the study's figures do not apply (Not enough yearly results yet).' }
 */
export function batchHandout(result: WorkerResult, index: number, context: CheckupsContext, options: BatchOptions, checkups?: readonly Checkup[]): BatchHandout {
  const scenario = workerScenario(result, context);
  if (scenario === null) {
    const why = result.reasons[0];
    return {
      kind: 'skipped',
      index,
      worker: result.worker,
      reason: 'not-applicable',
      message: `${STATUS_LABELS[result.status]}: the study\u2019s figures do not apply${why ? ` (${why.replace(/\.$/, '')})` : ''}.`,
    };
  }
  const storedHistory = checkups === undefined ? null : handOverRecord(scenario, { criteria: context.criteria, checkups });
  // No reading grades: no one edits these sheets, and nothing printed depends on them.
  const view = handoutPageView(scenarioFragment(scenario), options.template ?? DEFAULT_TEMPLATE, { date: options.date, paper: options.paper, table: context.table, storedHistory, grades: false });
  if (view.kind === 'problem') {
    return { kind: 'skipped', index, worker: result.worker, reason: view.problem.kind, message: view.problem.heading };
  }
  return {
    kind: 'sheet',
    index,
    worker: result.worker,
    workerId: options.showIds ? result.worker : undefined,
    sheet: view.sheet,
    sheetKey: batchSheetKey(view.sheet),
    historyLeftOff: view.history.state === 'damaged' ? view.history.message : undefined,
  };
}

/**
 * What the screen keeps of a handout once its page is made: enough to count the batch and list
 * who got none or got theirs without own results, but not the sheet. Holding 500 whole sheets
 * (each up to 2,000 icon cells) alive while the pages were made kept about a million small
 * objects surviving the garbage collector's young generation, whose pauses then reached 50 ms.
 */
export type BatchTally =
  | { readonly kind: 'sheet'; readonly index: number; readonly worker: string; readonly historyLeftOff: string | undefined }
  | Extract<BatchHandout, { kind: 'skipped' }>;

/**
 * A handout's {@link BatchTally}.
 * @example
 * batchTally({ kind: 'sheet', index: 0, worker: 'W001', workerId: undefined, sheet, sheetKey, historyLeftOff: undefined })
 * //=> { kind: 'sheet', index: 0, worker: 'W001', historyLeftOff: undefined }
 */
export function batchTally(handout: BatchHandout): BatchTally {
  if (handout.kind === 'skipped') return handout;
  return { kind: 'sheet', index: handout.index, worker: handout.worker, historyLeftOff: handout.historyLeftOff };
}

export interface BatchCounts {
  readonly chosen: number;
  readonly sheets: number;
  readonly skipped: number;
  /** Skipped workers by reason (only reasons that occur). */
  readonly byReason: Readonly<Partial<Record<BatchSkipReason, number>>>;
}

/** Counts of a finished batch (its handouts, or their tallies). */
export function batchCounts(handouts: readonly BatchTally[]): BatchCounts {
  const byReason: Partial<Record<BatchSkipReason, number>> = {};
  let sheets = 0;
  for (const h of handouts) {
    if (h.kind === 'sheet') sheets++;
    else byReason[h.reason] = (byReason[h.reason] ?? 0) + 1;
  }
  return { chosen: handouts.length, sheets, skipped: handouts.length - sheets, byReason };
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

/**
 * What the batch will print, in one sentence for the screen.
 * @example
 * batchCountsText({ chosen: 5, sheets: 3, skipped: 2, byReason: { 'not-applicable': 2 } })
 * //=> "5 workers chosen: 3 handouts (one page each); 2 workers get none (listed below)."
 */
export function batchCountsText(counts: BatchCounts): string {
  if (counts.chosen === 0) return 'No worker chosen yet.';
  const head = `${plural(counts.chosen, 'worker', 'workers')} chosen: ${plural(counts.sheets, 'handout', 'handouts')} (one page each)`;
  return counts.skipped === 0 ? `${head}.` : `${head}; ${plural(counts.skipped, 'worker gets', 'workers get')} none (listed below).`;
}

/** The batch controls' words with their counts (numbers with thousands separators, as the screen writes them). */
export const BATCH_BUTTON_TEXT = {
  prepare: (workers: number): string => (workers === 1 ? 'Prepare the handout' : `Prepare ${workers.toLocaleString('en')} handouts`),
  print: (pages: number): string => `Print or save as PDF (${pages === 1 ? '1 page' : `${pages.toLocaleString('en')} pages`})`,
} as const;

/**
 * Every chosen worker's handout, in file order; `histories` holds each worker's checkups (by
 * worker id) when they could be read again from the file.
 * @example
 * batchHandouts(results, batchSelection(results, 'exposed', new Set()), context, { paper: 'letter', date, showIds: false }, histories)
 * //=> [{ kind: 'sheet', worker: 'W001', workerId: undefined, … }, …]
 */
export function batchHandouts(
  results: readonly WorkerResult[],
  indices: readonly number[],
  context: CheckupsContext,
  options: BatchOptions,
  histories?: ReadonlyMap<string, readonly Checkup[]>,
): BatchHandout[] {
  const out: BatchHandout[] = [];
  for (const i of indices) {
    const r = results[i];
    if (r) out.push(batchHandout(r, i, context, options, histories?.get(r.worker)));
  }
  return out;
}

/** What the screen says while it prepares the handouts, and about the workers' own results. */
export const BATCH_MESSAGES = {
  /** Said before printing when neither a file nor a saved session's rows can give the workers' own results. */
  noFile: 'Without the checkup file or a saved session\u2019s rows, these handouts print without each worker\u2019s own results (their glucose history).',
  /** While the chosen workers' checkups are read again: from the file, or from a saved session's rows. */
  reading: 'Reading the chosen workers\u2019 results again\u2026',
  /** The file could not be read again: the handouts are made without own results. */
  unreadable: (why: string) => `The workers\u2019 own results could not be read again from the file, so these handouts print without them. ${why.replace(/\.?$/, '.')}`,
  preparing: (done: number, total: number) => `Preparing handout ${done.toLocaleString('en')} of ${total.toLocaleString('en')}\u2026`,
  /** The small print under a sheet when the physician ticks "print each worker's id". */
  idLine: (worker: string) => `Worker ${worker}`,
  /** A worker whose history /handout's checks refused: their handout prints without it. */
  leftOff: (worker: string, why: string) => `${worker}: the handout prints without their own results. ${why}`,
  /** The heading over the list of {@link BATCH_MESSAGES.leftOff} lines. */
  leftOffHeading: (workers: number) => `Handouts without the worker\u2019s own results (${workers.toLocaleString('en')})`,
  /** The heading over the list of workers who get no sheet, each with the reason. */
  skippedHeading: (workers: number) => `Workers without a handout (${workers.toLocaleString('en')})`,
} as const;

/** A titled list of workers on the screen, one line each (`key`: the worker's position). */
export interface BatchWorkerList {
  readonly heading: string;
  readonly lines: readonly { readonly key: number; readonly text: string }[];
}

/**
 * What the screen shows once the sheets are made: the counts, the workers whose handout prints
 * without their own results (and why), and the workers who get none (and why).
 * @example
 * batchDoneView([{ kind: 'sheet', index: 0, worker: 'W001', historyLeftOff: undefined }, { kind: 'skipped', index: 1, worker: 'W002', reason: 'not-applicable', message: 'Not enough results: …' }])
 * //=> { counts: { chosen: 2, sheets: 1, skipped: 1, … }, leftOff: { heading: 'Handouts without the worker’s own results (0)', lines: [] }, skipped: { heading: 'Workers without a handout (1)', lines: [{ key: 1, text: 'W002: Not enough results: …' }] } }
 */
export function batchDoneView(tallies: readonly BatchTally[]): { readonly counts: BatchCounts; readonly leftOff: BatchWorkerList; readonly skipped: BatchWorkerList } {
  const leftOff: { key: number; text: string }[] = [];
  const skipped: { key: number; text: string }[] = [];
  for (const t of tallies) {
    if (t.kind === 'skipped') skipped.push({ key: t.index, text: `${t.worker}: ${t.message}` });
    else if (t.historyLeftOff !== undefined) leftOff.push({ key: t.index, text: BATCH_MESSAGES.leftOff(t.worker, t.historyLeftOff) });
  }
  return {
    counts: batchCounts(tallies),
    leftOff: { heading: BATCH_MESSAGES.leftOffHeading(leftOff.length), lines: leftOff },
    skipped: { heading: BATCH_MESSAGES.skippedHeading(skipped.length), lines: skipped },
  };
}

/**
 * The batch's one-line status (read out to a screen reader when it changes): what is ready once
 * the sheets are made; before any is asked for, that none is chosen when none is; nothing while
 * they are being made (the progress bar speaks then).
 * @example
 * batchStatusText({ chosen: 3, counts: null, working: false }) //=> ""
 * batchStatusText({ chosen: 0, counts: null, working: false }) //=> "No worker chosen yet."
 * batchStatusText({ chosen: 2, counts: { chosen: 2, sheets: 2, skipped: 0, byReason: {} }, working: false }) //=> "Ready. 2 workers chosen: 2 handouts (one page each)."
 */
export function batchStatusText(state: { readonly chosen: number; readonly counts: BatchCounts | null; readonly working: boolean }): string {
  if (state.counts) return `Ready. ${batchCountsText(state.counts)}`;
  if (state.working || state.chosen > 0) return '';
  return batchCountsText({ chosen: 0, sheets: 0, skipped: 0, byReason: {} });
}
