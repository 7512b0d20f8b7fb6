/**
 * "Open one worker" (issue 10, item 7): the record the checkups screen hands to the consultation
 * screen inside the browser, and its check on arrival. The record holds the worker's scenario
 * (lib/workforce `workerScenario`: the one their worklist figures came from), the evidence
 * entry's id (so the consultation screen matches the history against that entry's exposure) and
 * their glucose history under the run's criteria set. It holds no worker id: the consultation
 * screen does not need one.
 *
 * app/checkups/workerHandOver.ts keeps it in sessionStorage under {@link WORKER_HANDOVER_KEY},
 * one-shot: the consultation screen removes it as it reads it. It never goes into an address, a
 * title or a log.
 */
import { z } from '../zod';
import type { CriteriaSet } from '../glycaemia/exposure';
import { parseGlucoseHistory, type GlucoseHistory } from '../glycaemia/parse';
import type { Checkup } from '../glycaemia/schema';
import { fail, ok, type Result } from '../result';
import { parseScenario } from '../scenario/parse';
import type { Scenario } from '../scenario/schema';

export { WORKER_HANDOVER_KEY } from './workerHandOverKey';
export const WORKER_HANDOVER_FORMAT = 'hundredfold-checkups-worker';
export const WORKER_HANDOVER_VERSION = 1;

const recordSchema = z.strictObject({
  format: z.literal(WORKER_HANDOVER_FORMAT),
  version: z.literal(WORKER_HANDOVER_VERSION),
  scenario: z.unknown(),
  evidenceId: z.string().max(200),
  history: z.unknown(),
});

export interface WorkerHandOverInput {
  readonly scenario: Scenario;
  readonly evidenceId: string;
  /**
   * The evidence entry's exposure definition: it goes with the scenario, so the consultation
   * screen checks the worker's history against the same definition the worklist used.
   */
  readonly exposureDefinition?: Scenario['exposureDefinition'];
  readonly criteria: CriteriaSet;
  readonly checkups: readonly Checkup[];
}

export interface WorkerHandOver {
  readonly scenario: Scenario;
  readonly evidenceId: string;
  readonly history: GlucoseHistory;
}

/**
 * The record, as stored.
 * @example
 * workerHandOverRecord({ scenario, evidenceId: 'demo-workforce-hba1c-heart-failure', criteria: 'ADA', checkups: [...] })
 * //=> '{"format":"hundredfold-checkups-worker","version":1,"scenario":{…},"evidenceId":"demo-workforce-hba1c-heart-failure","history":{"criteria":"ADA","checkups":[…]}}'
 */
export function workerHandOverRecord(input: WorkerHandOverInput): string {
  return JSON.stringify({
    format: WORKER_HANDOVER_FORMAT,
    version: WORKER_HANDOVER_VERSION,
    scenario: input.exposureDefinition === undefined ? input.scenario : { ...input.scenario, exposureDefinition: input.exposureDefinition },
    evidenceId: input.evidenceId,
    history: { criteria: input.criteria, checkups: input.checkups },
  });
}

/**
 * Reads a stored record on arrival. Undefined when nothing is stored; issues (nothing filled in)
 * when it is damaged, from another version, or its scenario or history is no longer valid
 * (lib/scenario `parseScenario`, lib/glycaemia `parseGlucoseHistory` with today's date).
 */
export function readWorkerHandOver(stored: string | null | undefined, today: string): Result<WorkerHandOver> | undefined {
  if (stored === null || stored === undefined || stored === '') return undefined;
  let raw: unknown;
  try {
    raw = JSON.parse(stored);
  } catch {
    return fail([{ code: 'invalid-json', path: [], message: 'The record passed from the checkups screen is damaged and could not be read.' }]);
  }
  const record = recordSchema.safeParse(raw);
  if (!record.success) {
    return fail([{ code: 'wrong-format', path: [], message: 'The record passed from the checkups screen is not in a form this version of Hundredfold reads.' }]);
  }
  const scenario = parseScenario(record.data.scenario);
  if (!scenario.ok) return fail(scenario.issues.map((i) => ({ ...i, path: ['scenario', ...i.path] })));
  const history = parseGlucoseHistory(record.data.history, { today });
  if (!history.ok) return fail(history.issues.map((i) => ({ ...i, path: ['history', ...i.path] })));
  return ok({ scenario: scenario.value, evidenceId: record.data.evidenceId, history: history.value });
}

/**
 * What the consultation screen says above the list of issues when a worker handed over from the
 * checkups screen cannot be used (a damaged record, another version, a scenario or history that
 * is no longer valid): nothing is filled in, and the way to try again.
 */
export const HANDOVER_REFUSED_LEAD =
  'The worker opened from the checkups screen could not be filled in, so the form starts empty. Choose Open on the worklist again; if this keeps happening, process the file again:';

/** What the worklist says while and after it opens one worker in the consultation screen. */
export const OPEN_WORKER_MESSAGES = {
  notApplicable: (worker: string) => `${worker} cannot be opened: the study\u2019s figures do not apply to this worker.`,
  tabBlocked: 'The browser did not open a new tab. Allow this site to open new tabs (pop-ups), then choose Open again.',
  reading: (worker: string) => `Reading ${worker}\u2019s checkups from the file…`,
  unreadable: (worker: string, reason: string | null) => `${worker} could not be opened: the file could not be read again (${reason ?? 'unknown reason'}).`,
  opened: (worker: string) => `${worker} is open in the consultation screen, in a new tab.`,
  refused: (worker: string) => `${worker} could not be opened: the new tab was closed or refused the hand-over. Choose Open again.`,
} as const;
