'use client';
/**
 * The worklist with what can be done to its workers: tick workers for batch handouts
 * (./BatchHandouts.tsx, their own results read again from the file in the screen's Web Worker,
 * ./workerHistories.ts), and open one worker in the consultation screen (issue 10, item 7).
 *
 * Open one worker: the consultation screen opens in a new tab, so this tab keeps its worklist
 * (the file lives only in this tab's memory). The worker's checkups are read again from the same
 * file with the same columns in the screen's Web Worker (lib/checkups/workerHistory.ts); their scenario is
 * the one their figures came from (lib/workforce `workerScenario`); both go to the new tab inside
 * the browser (app/checkups/workerHandOver.ts), never in its address.
 */
import { useCallback, useMemo, useRef, useState } from 'react';
import { handOverToTab, openWorkerTab } from '@/app/checkups/workerHandOver';
import { OPEN_WORKER_MESSAGES, workerHandOverRecord } from '@/lib/checkups/workerHandOver';
import type { WorklistRow } from '@/lib/checkups/worklist';
import { prepareCheckups, workerScenario, type WorkerResult } from '@/lib/workforce';
import { BatchHandouts } from './BatchHandouts';
import type { FilterChoices, FromWorker, ToWorker } from './protocol';
import { historiesReader } from './workerHistories';
import { Worklist } from './Worklist';
import type { WorklistRanks } from '@/lib/checkups/worklistOrder';

/** What a run was made from: the files, their columns and the settings (the screen's 'run' message). */
export type CheckupsRunInput = Omit<Extract<ToWorker, { type: 'run' }>, 'type'>;

export interface BatchWorklistProps {
  readonly rows: readonly WorklistRow[];
  /** The run's results, in the order of `rows[i].index`. */
  readonly results: readonly WorkerResult[];
  /** What the results were made from; null when unknown (then no worker can be opened). */
  readonly run: CheckupsRunInput | null;
  /**
   * The screen's own Web Worker (./checkups.worker.ts), which answers 'history' requests too. One
   * worker for the page: Chromium loses the bootstrap fragment of a second worker from the same
   * script ("Missing worker bootstrap config"), so no second one is started.
   */
  readonly worker: () => Worker;
  /** The filters' choices and each column's sort ranks, from the worker (passed on to the worklist). */
  readonly choices?: FilterChoices | null;
  readonly ranks?: WorklistRanks | null;
}

export function BatchWorklist({ rows, results, run, worker, choices = null, ranks = null }: BatchWorklistProps) {
  const [ticked, setTicked] = useState<ReadonlySet<number>>(() => new Set());
  const [openMessage, setOpenMessage] = useState('');
  const pending = useRef<((event: MessageEvent<FromWorker>) => void) | null>(null);

  // New results: the ticks belonged to the old ones.
  const [tickedFor, setTickedFor] = useState(results);
  if (tickedFor !== results) {
    setTickedFor(results);
    setTicked(new Set());
  }

  const context = useMemo(() => {
    if (!run) return null;
    const prepared = prepareCheckups({ evidence: run.evidence, table: run.table, criteria: run.criteria, ...(run.horizon !== null ? { horizonYears: run.horizon } : {}) });
    return prepared.ok ? prepared.value : null;
  }, [run]);

  // Batch handouts read the chosen workers' checkups again: from the file, or from a saved
  // session's rows (the worker keeps the open session's; a run from a session gives no file).
  const readHistories = useMemo(() => (run ? historiesReader(worker, { files: run.files, kind: run.kind, today: run.today, mapping: run.mapping }) : null), [run, worker]);

  const onSelect = useCallback((indices: readonly number[], on: boolean) => {
    setTicked((old) => {
      const next = new Set(old);
      for (const i of indices) {
        if (on) next.add(i);
        else next.delete(i);
      }
      return next;
    });
  }, []);

  // The worker's history comes from the file, or from a saved session's rows, as for batch handouts.
  const canOpen = useCallback((row: WorklistRow) => run !== null && results[row.index]?.referenceRisk != null, [run, results]);

  const onOpen = (row: WorklistRow) => {
    const result = results[row.index];
    const scenario = result && context ? workerScenario(result, context) : null;
    if (!run || !context || !scenario) {
      setOpenMessage(OPEN_WORKER_MESSAGES.notApplicable(row.worker));
      return;
    }
    const tab = openWorkerTab(); // straight from the click, or the browser blocks it
    if (!tab) {
      setOpenMessage(OPEN_WORKER_MESSAGES.tabBlocked);
      return;
    }
    setOpenMessage(OPEN_WORKER_MESSAGES.reading(row.worker));
    const w = worker();
    if (pending.current) w.removeEventListener('message', pending.current);
    const listener = (event: MessageEvent<FromWorker>) => {
      const m = event.data;
      if (m.type !== 'history' || m.worker !== row.worker) return;
      w.removeEventListener('message', listener);
      if (pending.current === listener) pending.current = null;
      if (m.checkups === null) {
        tab.close();
        setOpenMessage(OPEN_WORKER_MESSAGES.unreadable(row.worker, m.message));
        return;
      }
      const record = workerHandOverRecord({
        scenario,
        evidenceId: run.evidence.id,
        ...(run.evidence.exposureDefinition ? { exposureDefinition: run.evidence.exposureDefinition } : {}),
        criteria: context.criteria,
        checkups: m.checkups,
      });
      setOpenMessage(
        handOverToTab(tab, record) ? OPEN_WORKER_MESSAGES.opened(row.worker) : OPEN_WORKER_MESSAGES.refused(row.worker),
      );
    };
    pending.current = listener;
    w.addEventListener('message', listener);
    const message: ToWorker = { type: 'history', files: run.files, kind: run.kind, today: run.today, mapping: run.mapping, worker: row.worker };
    w.postMessage(message);
  };

  return (
    <>
      <BatchHandouts results={results} context={context} ticked={ticked} readHistories={readHistories} />
      <Worklist rows={rows} selected={ticked} onSelect={onSelect} onOpen={onOpen} canOpen={canOpen} choices={choices} ranks={ranks} />
      <p role="status" data-testid="open-status" className="checkups__inline-status">
        {openMessage}
      </p>
    </>
  );
}
