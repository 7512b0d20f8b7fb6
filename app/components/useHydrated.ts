'use client';
/**
 * True once the page runs in the browser (after hydration), false in the server's HTML and
 * during hydration. Controls that would lose what is done to them before the page runs (a file
 * chosen, a choice made) wait for it, and browser tests wait for the `data-hydrated` mark it sets.
 */
import { useSyncExternalStore } from 'react';

const subscribeNothing = () => () => {};

export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribeNothing,
    () => true,
    () => false,
  );
}
