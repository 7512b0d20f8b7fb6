/**
 * "Your own results": the person's glucose history in plain words for the handout, when the
 * clinician gave one, and the hand-over that brings that history from the consultation screen
 * to /handout without it ever leaving the browser.
 *
 * The sentences (one per test, then the latest range):
 * - "Your HbA1c was between 5.8% and 6.2% at 5 yearly checkups, from March 2019 to March 2023."
 * - "Your HbA1c was 6.1% at your checkup in March 2023."
 * - "Your latest result, in March 2023, is in the prediabetes range by the ADA's limits. One
 *   result on its own is not a diagnosis."
 * Values are shown in the unit of the person's latest result for that test, as entered when every
 * result used that unit; a result entered in the other unit is converted (lib/glycaemia/hba1c.ts,
 * glucose.ts) and rounded as labs report (lib/glycaemia/format.ts THRESHOLD_DECIMALS). "Yearly"
 * is said only when every checkup starts its own yearly round and no gap is longer than 18 months
 * (the rules of lib/glycaemia/persistence.ts). "Diabetes" appears only as "diabetes range".
 *
 * The hand-over: the consultation screen writes one record into the tab's sessionStorage under
 * {@link HANDOUT_HISTORY_KEY} (app/handout/historyHandOver.ts does the storage), holding the
 * scenario's link query beside the history, so a history is only ever printed with the scenario
 * it was entered for. sessionStorage is per tab and cleared when the tab closes; nothing is sent.
 */
import { z } from '../zod';
import { classifyCheckup } from '../glycaemia/classify';
import type { CriteriaSet } from '../glycaemia/exposure';
import { bodyName, rangeName, roundTo, THRESHOLD_DECIMALS, withUnit, type ValueUnit } from '../glycaemia/format';
import { glucoseIn, type GlucoseUnit } from '../glycaemia/glucose';
import { hba1cIn, type Hba1cUnit } from '../glycaemia/hba1c';
import { parseGlucoseHistory, type GlucoseHistory } from '../glycaemia/parse';
import { countYearlyRounds, isLongGap } from '../glycaemia/persistence';
import type { Checkup } from '../glycaemia/schema';
import { scenarioQuery } from '../link/scenarioLink';
import { fail, type Result } from '../result';
import type { Scenario } from '../scenario/schema';
import { monthAndYear } from './dates';

/** Where the consultation screen leaves the history for /handout (sessionStorage key). */
export const HANDOUT_HISTORY_KEY = 'hundredfold.handout-history';
export const HANDOUT_HISTORY_FORMAT = 'hundredfold-handout-history';
export const HANDOUT_HISTORY_VERSION = 1;

/** The heading of the section on the sheet. */
export const OWN_RESULTS_HEADING = 'Your own results';

type TestKey = 'hba1c' | 'fpg';
const PATIENT_TEST_NAMES: Readonly<Record<TestKey, string>> = { hba1c: 'HbA1c', fpg: 'fasting blood sugar (glucose)' };

function valueIn(test: TestKey, unit: ValueUnit, reading: { readonly value: number; readonly unit: ValueUnit }): number {
  return test === 'hba1c'
    ? hba1cIn(unit as Hba1cUnit, reading as { value: number; unit: Hba1cUnit })
    : glucoseIn(unit as GlucoseUnit, reading as { value: number; unit: GlucoseUnit });
}

function testSentence(test: TestKey, checkups: readonly Checkup[]): string | undefined {
  const withTest = checkups.filter((c) => c[test] !== undefined);
  const latest = withTest[withTest.length - 1]?.[test];
  const first = withTest[0];
  const last = withTest[withTest.length - 1];
  if (!latest || !first || !last) return undefined;
  const unit = latest.unit;
  const allSameUnit = withTest.every((c) => c[test]?.unit === unit);
  const values = withTest.map((c) => {
    const reading = c[test] as { value: number; unit: ValueUnit };
    return allSameUnit ? reading.value : roundTo(valueIn(test, unit, reading), THRESHOLD_DECIMALS[unit]);
  });
  const low = Math.min(...values);
  const high = Math.max(...values);
  const name = PATIENT_TEST_NAMES[test];
  const n = withTest.length;
  if (n === 1) return `Your ${name} was ${withUnit(low, unit)} at your checkup in ${monthAndYear(last.date)}.`;
  const dates = withTest.map((c) => c.date);
  const yearly = countYearlyRounds(dates) === n && dates.every((d, i) => i === 0 || !isLongGap(dates[i - 1] ?? d, d));
  const span = monthAndYear(first.date) === monthAndYear(last.date) ? `in ${monthAndYear(last.date)}` : `from ${monthAndYear(first.date)} to ${monthAndYear(last.date)}`;
  const checkupWords = `${n} ${yearly ? 'yearly ' : ''}checkups`;
  if (withUnit(low, unit) === withUnit(high, unit)) return `Your ${name} was ${withUnit(low, unit)} at each of ${checkupWords}, ${span}.`;
  return `Your ${name} was between ${withUnit(low, unit)} and ${withUnit(high, unit)} at ${checkupWords}, ${span}.`;
}

function latestRangeSentence(checkups: readonly Checkup[], criteria: CriteriaSet): string | undefined {
  const latest = checkups[checkups.length - 1];
  if (!latest) return undefined;
  const classified = classifyCheckup(latest, criteria);
  if (classified.category === null) return undefined;
  const range = rangeName(classified.category);
  return `Your latest result, in ${monthAndYear(latest.date)}, is in the ${range} by the ${bodyName(criteria)}\u2019s limits. One result on its own is not a diagnosis.`;
}

/**
 * The person's own results in plain words; empty for a history without checkups.
 * @example
 * ownResultsSentences({ criteria: 'ADA', checkups: [5 yearly HbA1c results 5.8 … 6.2%, 2019 to 2023] })
 * //=> ['Your HbA1c was between 5.8% and 6.2% at 5 yearly checkups, from March 2019 to March 2023.',
 * //    'Your latest result, in March 2023, is in the prediabetes range by the ADA’s limits. One result on its own is not a diagnosis.']
 */
export function ownResultsSentences(history: Pick<GlucoseHistory, 'criteria' | 'checkups'>): string[] {
  const sorted = [...history.checkups].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
  return [testSentence('hba1c', sorted), testSentence('fpg', sorted), latestRangeSentence(sorted, history.criteria)].filter(
    (s): s is string => s !== undefined,
  );
}

const handOverSchema = z.strictObject({
  format: z.literal(HANDOUT_HISTORY_FORMAT),
  version: z.literal(HANDOUT_HISTORY_VERSION),
  /** The scenario's link query (lib/link `scenarioQuery`), so the history goes with its scenario only. */
  query: z.string(),
  history: z.unknown(),
});

/**
 * The record the consultation screen stores for /handout: the scenario's query and the history.
 * @example
 * handOverRecord(scenario, { criteria: 'ADA', checkups: [...] })
 * //=> '{"format":"hundredfold-handout-history","version":1,"query":"?br=0.08&…","history":{"criteria":"ADA","checkups":[…]}}'
 */
export function handOverRecord(scenario: Scenario, history: Pick<GlucoseHistory, 'criteria' | 'checkups'>): string {
  return JSON.stringify({
    format: HANDOUT_HISTORY_FORMAT,
    version: HANDOUT_HISTORY_VERSION,
    query: scenarioQuery(scenario),
    history: { criteria: history.criteria, checkups: history.checkups },
  });
}

/**
 * Reads a stored record for this scenario. Undefined when nothing is stored or the record
 * belongs to another scenario (then the handout has no own results); issues when the record is
 * damaged or its history no longer valid (the checks of lib/glycaemia/parse.ts, with today).
 */
export function readHandOver(stored: string | null | undefined, scenario: Scenario, today: string): Result<GlucoseHistory> | undefined {
  if (stored === null || stored === undefined || stored === '') return undefined;
  let raw: unknown;
  try {
    raw = JSON.parse(stored);
  } catch {
    return fail([{ code: 'invalid-json', path: [], message: 'The glucose history passed from the consultation screen could not be read; it is left off the handout' }]);
  }
  const record = handOverSchema.safeParse(raw);
  if (!record.success) {
    return fail([{ code: 'wrong-format', path: [], message: 'The glucose history passed from the consultation screen is not in a form this version reads; it is left off the handout' }]);
  }
  if (record.data.query !== scenarioQuery(scenario)) return undefined;
  return parseGlucoseHistory(record.data.history, { today });
}
