'use client';
/**
 * The one place the app reads and writes the scenario in the address.
 *
 * The scenario travels in the URL fragment (`/#br=…`, `/handout#br=…`; codec: lib/link), which
 * a browser never sends to a server, so the page itself is static and no server, proxy or cache
 * sees what was typed. Links made before the move carried it in the query (`/?br=…`); on
 * arrival such a link is moved into the fragment with `history.replaceState`, so the query
 * leaves the address bar (it has reached the server once, on that first load, and never again).
 *
 * - {@link useScenarioLink}: the scenario part of the address ("#…", or "" for none), read once
 *   the page runs in the browser (undefined before: on the server and in the first render), and
 *   again when the fragment changes by navigation (a pasted link, Back). Writes through
 *   {@link writeScenarioLink} do not count as changes (so a screen that writes what it shows is
 *   not reset by its own write); pasting the very link the page opened with, after edits, is
 *   therefore not read again (reload the page to do that).
 * - {@link writeScenarioLink}: puts a path and fragment in the address without a request or a
 *   history entry.
 */
import { useSyncExternalStore } from 'react';

/** The scenario part of an address: its fragment, else (an old link) its query; "" for none. */
function scenarioPart(location: Location): string {
  if (location.hash.length > 1) return location.hash;
  if (location.search.length > 1) return `#${location.search.slice(1)}`;
  return '';
}

/** An old `?…` link: move its query into the fragment, keeping the path. */
function moveQueryToFragment(): void {
  const { pathname, search, hash } = window.location;
  if (search.length <= 1 || hash.length > 1) return;
  window.history.replaceState(window.history.state, '', `${pathname}#${search.slice(1)}`);
}

let current: string | undefined;
const listeners = new Set<() => void>();

function refresh(): void {
  const next = scenarioPart(window.location);
  if (next === current) return;
  current = next;
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void): () => void {
  if (listeners.size === 0) {
    moveQueryToFragment();
    window.addEventListener('hashchange', refresh);
    window.addEventListener('popstate', refresh);
  }
  listeners.add(listener);
  refresh();
  return () => {
    listeners.delete(listener);
    if (listeners.size === 0) {
      window.removeEventListener('hashchange', refresh);
      window.removeEventListener('popstate', refresh);
    }
  };
}

const onServer = (): undefined => undefined;
const snapshot = (): string | undefined => current;

/**
 * The scenario part of the address, "#br=…" (an old `?br=…` link is moved and returned as
 * "#br=…"), or "" when there is none; undefined until the page runs in the browser. Decode it
 * with `readScenarioLink` from lib/link.
 *
 * @example
 * const link = useScenarioLink();
 * const reading = useMemo(() => (link === undefined ? undefined : readScenarioLink(link)), [link]);
 */
export function useScenarioLink(): string | undefined {
  return useSyncExternalStore(subscribe, snapshot, onServer);
}

/**
 * Puts `pathAndFragment` ("/#br=…", "/handout#br=…", or a bare "/" to clear) in the address
 * bar, replacing the current entry: no request, no new history entry, no re-read by
 * {@link useScenarioLink}. Does nothing when the address already says so.
 */
export function writeScenarioLink(pathAndFragment: string): void {
  const { pathname, search, hash } = window.location;
  if (`${pathname}${search}${hash}` === pathAndFragment) return;
  // The snapshot is left as it was: what the screen wrote is not a link to read again.
  window.history.replaceState(window.history.state, '', pathAndFragment);
}

/**
 * Leaves the scenario for an empty address as a new history entry ("Clear the form"), so Back
 * brings the scenario back: the hook then reads the old fragment again, even the very link the
 * page opened with.
 */
export function pushEmptyScenarioLink(path = '/'): void {
  window.history.pushState(null, '', path);
  refresh();
}
