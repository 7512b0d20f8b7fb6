/**
 * The glucose-history hand-over from the consultation screen to /handout, in this tab's
 * sessionStorage (never sent anywhere; gone when the tab closes). The record's format and the
 * rule that a history only goes with the scenario it was entered for are in
 * lib/handout/ownResults.ts.
 *
 * The consultation screen calls {@link saveHistoryForHandout} when the clinician chooses
 * "Prepare handout" (or whenever its valid history changes) and {@link clearHistoryForHandout}
 * when there is no valid history; /handout calls {@link loadHistoryForHandout}.
 */
import type { GlucoseHistory } from '@/lib/glycaemia/parse';
import { HANDOUT_HISTORY_KEY, handOverRecord } from '@/lib/handout';
import type { Scenario } from '@/lib/scenario/schema';

/** The part of the Web Storage API the hand-over uses. */
export interface SessionStorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

function sessionStore(): SessionStorageLike | undefined {
  try {
    return typeof window === 'undefined' ? undefined : window.sessionStorage;
  } catch {
    return undefined;
  }
}

/** Stores the history for this scenario's handout; false when the browser refuses storage. */
export function saveHistoryForHandout(
  scenario: Scenario,
  history: Pick<GlucoseHistory, 'criteria' | 'checkups'>,
  storage: SessionStorageLike | undefined = sessionStore(),
): boolean {
  if (!storage) return false;
  try {
    storage.setItem(HANDOUT_HISTORY_KEY, handOverRecord(scenario, history));
    return true;
  } catch {
    return false;
  }
}

/** Forgets any handed-over history (the consultation has none, or it was cleared). */
export function clearHistoryForHandout(storage: SessionStorageLike | undefined = sessionStore()): void {
  try {
    storage?.removeItem(HANDOUT_HISTORY_KEY);
  } catch {
    // Storage refused: there is nothing to forget.
  }
}

/** The stored record, or null when there is none or storage is unavailable. */
export function loadHistoryForHandout(storage: SessionStorageLike | undefined = sessionStore()): string | null {
  try {
    return storage?.getItem(HANDOUT_HISTORY_KEY) ?? null;
  } catch {
    return null;
  }
}
