/**
 * Validates a glucose history — from the command line, the screen's rows, pasted rows or a FHIR
 * import — and returns it sorted by date with one checkup per date.
 *
 * Same-day entries: results for different tests are merged into one checkup; the same result
 * given twice (or in both units, agreeing within rounding: ./merge.ts) is kept once, and the
 * merge is reported as a note; two different results for one test on one date are refused, with
 * the path of the later entry. Nothing is dropped silently.
 */
import type { z } from 'zod';
import { fail, ok, type Issue, type Result, type Warning } from '../result';
import { toIssues } from '../validation/issues';
import { sortByDate } from './dates';
import type { CriteriaSet } from './exposure';
import type { ValueUnit } from './format';
import { fpgReadingsAgree, hba1cReadingsAgree, keptWords, preferLater, readingText } from './merge';
import { glucoseHistorySchema, type Checkup, type HistoryOptions } from './schema';

export interface GlucoseHistory {
  readonly criteria: CriteriaSet;
  /** Sorted by date, earliest first; one checkup per date. */
  readonly checkups: readonly Checkup[];
  /** Same-day entries that were merged, as data. */
  readonly notes: readonly Warning[];
}

interface MergeOutcome {
  readonly checkups: Checkup[];
  readonly notes: Warning[];
  readonly issues: Issue[];
}

const TEST_NAMES = { hba1c: 'HbA1c', fpg: 'fasting glucose' } as const;

function defaultName(index: number): string {
  return `checkup [${index}]`;
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * Merges checkups that share a date. Indices in messages and paths are the input's.
 *
 * @example
 * mergeSameDate([{ date: '2021-03-04', hba1c: { value: 6.1, unit: '%' } }, { date: '2021-03-04', fpg: { value: 5.9, unit: 'mmol/L' } }])
 * //=> { checkups: [{ date: '2021-03-04', hba1c: …, fpg: … }], notes: [{ code: 'same-day-merged', … }], issues: [] }
 */
export function mergeSameDate(
  checkups: readonly Checkup[],
  checkupName: (index: number) => string = defaultName,
  criteria?: CriteriaSet,
): MergeOutcome {
  // Nothing shares a date (the usual case): each checkup copied, in date order — exactly what the
  // general path below gives then, without its table of dates.
  if (!sharesADate(checkups)) return { checkups: sortByDate(checkups.map((c) => ({ ...c }))), notes: [], issues: [] };
  const byDate = new Map<string, { merged: Checkup; firstIndex: number }>();
  const notes: Warning[] = [];
  const issues: Issue[] = [];
  checkups.forEach((checkup, index) => {
    const seen = byDate.get(checkup.date);
    if (!seen) {
      byDate.set(checkup.date, { merged: { ...checkup }, firstIndex: index });
      return;
    }
    const kept: string[] = [];
    const conflicts: Issue[] = [];
    const compare = <R extends { readonly value: number; readonly unit: ValueUnit }>(
      test: 'hba1c' | 'fpg',
      earlier: R | undefined,
      later: R | undefined,
      agree: (a: R, b: R) => boolean,
    ): R | undefined => {
      if (later === undefined) return earlier;
      if (earlier === undefined) return later;
      if (agree(earlier, later)) {
        const chosen = preferLater(test, earlier, later, criteria) ? later : earlier;
        kept.push(
          earlier.unit === later.unit
            ? `the ${TEST_NAMES[test]} ${readingText(earlier)} was given twice`
            : `the ${TEST_NAMES[test]} ${readingText(earlier)} and ${readingText(later)} are the same result in two units (${keptWords(chosen, criteria)})`,
        );
        return chosen;
      } else {
        conflicts.push({
          code: 'duplicate-date',
          path: ['checkups', index, test, 'value'],
          message: `${capitalised(checkupName(index))} (${checkup.date}) has a different ${TEST_NAMES[test]} (${readingText(later)}) from ${checkupName(seen.firstIndex)} on the same date (${readingText(earlier)}): keep one result per test and date`,
        });
      }
      return earlier;
    };
    const hba1c = compare('hba1c', seen.merged.hba1c, checkup.hba1c, hba1cReadingsAgree);
    const fpg = compare('fpg', seen.merged.fpg, checkup.fpg, fpgReadingsAgree);
    if (conflicts.length > 0) {
      issues.push(...conflicts);
      return;
    }
    seen.merged = { date: checkup.date, ...(hba1c ? { hba1c } : {}), ...(fpg ? { fpg } : {}) };
    notes.push({
      code: 'same-day-merged',
      message: `${capitalised(checkupName(seen.firstIndex))} and ${checkupName(index)} (${checkup.date}) share a date and were merged${kept.length > 0 ? `: ${kept.join('; ')}` : ''}`,
    });
  });
  const merged = sortByDate([...byDate.values()].map((entry) => entry.merged));
  return { checkups: merged, notes, issues };
}

/** Whether two checkups have the same date (pairwise for a short history, with a set for a long one). */
function sharesADate(checkups: readonly Checkup[]): boolean {
  const n = checkups.length;
  if (n > 16) {
    const seen = new Set<string>();
    for (const c of checkups) {
      if (seen.has(c.date)) return true;
      seen.add(c.date);
    }
    return false;
  }
  for (let i = 1; i < n; i++) {
    const date = (checkups[i] as Checkup).date;
    for (let j = 0; j < i; j++) if ((checkups[j] as Checkup).date === date) return true;
  }
  return false;
}

/**
 * zod's failures as issues. A missing unit or criteria set (an enum given nothing) is reported as
 * "required" rather than as a wrong choice, as for every other missing field.
 */
function historyIssues(zodIssues: readonly z.core.$ZodIssue[]): Issue[] {
  const out: Issue[] = [];
  for (const issue of zodIssues) {
    if (issue.code === 'invalid_value' && 'input' in issue && issue.input === undefined) {
      out.push({ code: 'required', path: issue.path.filter((p): p is string | number => typeof p !== 'symbol'), message: issue.message });
    } else {
      out.push(...toIssues([issue]));
    }
  }
  return out;
}

/**
 * Validate a glucose history.
 *
 * @example
 * parseGlucoseHistory({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }] }, { today: '2024-01-01' })
 * //=> { ok: true, value: { criteria: 'ADA', checkups: [...], notes: [] } }
 * parseGlucoseHistory({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 61, unit: '%' } }] }, { today: '2024-01-01' })
 * //=> { ok: false, issues: [{ code: 'out-of-range', path: ['checkups', 0, 'hba1c', 'value'], message: 'The HbA1c value in % must be between 3 and 20 (got 61); 61 looks like a value in mmol/mol: check the unit' }] }
 */
export function parseGlucoseHistory(input: unknown, options: HistoryOptions): Result<GlucoseHistory> {
  const parsed = glucoseHistorySchema(options).safeParse(input, { reportInput: true });
  if (!parsed.success) return fail(historyIssues(parsed.error.issues));
  const { checkups, notes, issues } = mergeSameDate(parsed.data.checkups, options.checkupName, parsed.data.criteria);
  if (issues.length > 0) return fail(issues);
  return ok({ criteria: parsed.data.criteria, checkups, notes });
}

/** Parse JSON text, then validate it. Malformed JSON is an issue, never a throw. */
export function parseGlucoseHistoryJson(text: string, options: HistoryOptions): Result<GlucoseHistory> {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'unreadable';
    return fail([{ code: 'invalid-json', path: [], message: `The input is not valid JSON (${detail})` }]);
  }
  return parseGlucoseHistory(value, options);
}
