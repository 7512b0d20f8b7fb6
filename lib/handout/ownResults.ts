/**
 * The hand-over that brings the person's glucose history from the consultation screen to
 * /handout without it ever leaving the browser; the sheet words it with
 * lib/wording/ownResults.ts ("Your own results").
 *
 * The hand-over: the consultation screen writes one record into the tab's sessionStorage under
 * {@link HANDOUT_HISTORY_KEY} (app/handout/historyHandOver.ts does the storage), holding the
 * scenario's link query beside the history, so a history is only ever printed with the scenario
 * it was entered for. sessionStorage is per tab and cleared when the tab closes; nothing is sent.
 */
import { z } from '../zod';
import { parseGlucoseHistory, type GlucoseHistory } from '../glycaemia/parse';
import { scenarioQuery } from '../link/scenarioLink';
import { fail, type Result } from '../result';
import type { Scenario } from '../scenario/schema';

/** Where the consultation screen leaves the history for /handout (sessionStorage key). */
export const HANDOUT_HISTORY_KEY = 'hundredfold.handout-history';
export const HANDOUT_HISTORY_FORMAT = 'hundredfold-handout-history';
export const HANDOUT_HISTORY_VERSION = 1;

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
