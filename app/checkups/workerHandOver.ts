'use client';
/**
 * "Open one worker" (issue 10, item 7), the browser's half: the checkups screen opens the
 * consultation screen in a new tab (so the worklist, which lives only in its tab's memory, stays
 * as it is) and leaves the worker's record (lib/checkups/workerHandOver.ts) in that new tab's
 * sessionStorage; the consultation screen takes it once, removes it, checks it and fills the form
 * and the glucose history. The record never goes into an address, a title or a log.
 *
 * Why the tab is opened first and filled afterwards: the worker's checkups are read again from
 * the file in a Web Worker, which takes a moment, and a browser only lets a page open a tab
 * straight from the click. An empty tab of this origin is opened on the click; once the record
 * is ready it goes into that tab's own sessionStorage and the tab is sent to "/".
 */
import { useEffect, useState } from 'react';
import type { UseFormReset } from 'react-hook-form';
import type { GlucoseHistoryHolder } from '@/app/components/glucose/useGlucoseHistory';
import type { ConsultationFormValues } from '@/lib/consultation/formValues';
import { WORKER_HANDOVER_KEY } from '@/lib/checkups/workerHandOverKey';
import type { Issue } from '@/lib/result';
import type { PopulationTable } from '@/lib/tables/schema';

/** What the consultation screen says when a handed-over worker could not be used. */
export interface HandOverRefusal {
  readonly lead: string;
  readonly issues: readonly Issue[];
}

/** Opens an empty tab of this origin; call it in the click handler. Null when the browser refuses. */
export function openWorkerTab(): Window | null {
  try {
    return window.open('about:blank', '_blank');
  } catch {
    return null;
  }
}

/** Puts the record into the tab's own sessionStorage and sends the tab to the consultation screen; false when the tab is gone or refuses storage. */
export function handOverToTab(tab: Window, record: string): boolean {
  try {
    if (tab.closed) return false;
    tab.sessionStorage.setItem(WORKER_HANDOVER_KEY, record);
    tab.location.replace('/');
    tab.opener = null;
    return true;
  } catch {
    return false;
  }
}

/** The stored record, removed as it is read (one-shot); null when there is none. */
function takeRecord(): string | null {
  try {
    const stored = window.sessionStorage.getItem(WORKER_HANDOVER_KEY);
    if (stored !== null) window.sessionStorage.removeItem(WORKER_HANDOVER_KEY);
    return stored;
  } catch {
    return null;
  }
}

/**
 * On the consultation screen: a worker handed over from the checkups screen fills the form (the
 * scenario and the evidence entry) and the glucose history (opened, under the run's criteria).
 * When a record was there but could not be used, nothing is filled in and this returns what the
 * screen says: lib/checkups `HANDOVER_REFUSED_LEAD` and the issues (loaded with the checks, so the
 * words cost the first load nothing); else null.
 */
export function useWorkerHandOver({ reset, tables, glucose }: { reset: UseFormReset<ConsultationFormValues>; tables: readonly PopulationTable[]; glucose: GlucoseHistoryHolder }): HandOverRefusal | null {
  const { setOpen, setCriteria, putDrafts } = glucose;
  const [refused, setRefused] = useState<HandOverRefusal | null>(null);
  useEffect(() => {
    const stored = takeRecord();
    if (stored === null) return;
    // The checks and the form's way back are loaded only when a worker was handed over.
    void Promise.all([
      import('@/lib/checkups/workerHandOver'),
      import('@/lib/glycaemia/dates'),
      import('@/lib/glycaemia/draft'),
      import('@/lib/consultation/fromScenario'),
    ]).then(([{ readWorkerHandOver, HANDOVER_REFUSED_LEAD }, { localIsoDate }, { checkupToDraft }, { scenarioToFormValues }]) => {
      const got = readWorkerHandOver(stored, localIsoDate());
      if (!got) return;
      if (!got.ok) {
        setRefused({ lead: HANDOVER_REFUSED_LEAD, issues: got.issues });
        return;
      }
      const { scenario, evidenceId, history } = got.value;
      reset({ ...scenarioToFormValues(scenario, tables), evidenceId });
      setCriteria(history.criteria);
      setOpen(true);
      putDrafts(
        history.checkups.map((c) => checkupToDraft(c, history.criteria)),
        'replace',
      );
    });
  }, [reset, tables, setOpen, setCriteria, putDrafts]);
  return refused;
}
