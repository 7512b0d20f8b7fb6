/**
 * The service worker: after one visit every page, every code chunk (the charts, the link codec,
 * the glucose history, the library and the workbook reader included), the demo tables and
 * entries (bundled in those chunks), the icons and the manifest are in the browser's cache, so
 * the app opens and computes with no network at all.
 *
 * Built with Serwist (the Workbox family) by scripts/postbuild.mjs after `next build`: it lists
 * the built files with @serwist/build's getManifest and bundles this file with esbuild, putting
 * the list where `self.__SW_MANIFEST` stands. Each entry carries a revision (a hash of the file),
 * so a new build re-fetches only what changed.
 *
 * Updates are never forced: a new version installs in the background and waits; the page shows
 * "Reload to update" (app/components/UpdateBanner.tsx), which sends SKIP_WAITING (handled by
 * Serwist because skipWaiting is false) and reloads once the new version is in control.
 *
 * Nothing here talks to any other origin: only this origin's own files are cached or fetched.
 */
import { Serwist, type PrecacheEntry } from 'serwist';

declare const self: { readonly __SW_MANIFEST: (PrecacheEntry | string)[] };

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: {
    // A scenario link (`/?bp=…`, `/handout?bp=…`) opens the cached page: the query is read by the
    // page in the browser. `_rsc` (the router's own data requests) is kept, so those never match
    // a cached HTML page; offline they fail and the router falls back to loading the page itself.
    ignoreURLParametersMatching: [/^(?!_rsc$)/],
    cleanupOutdatedCaches: true,
  },
  skipWaiting: false,
  clientsClaim: false,
  navigationPreload: false,
  disableDevLogs: true,
});

// A Web Worker's script (the checkups worker) is left to the network: the bundler's worker
// bootstrap reads its settings from the script's own address (`…#params=…`), and a worker
// answered from the cache takes the cached file's address, without them, and stops ("Missing
// worker bootstrap config") — on every visit after the first. Registered before Serwist's
// listener, so Serwist never answers these requests.
addEventListener('fetch', (event: Event) => {
  const request = (event as Event & { readonly request?: Request }).request;
  if (request?.destination === 'worker') event.stopImmediatePropagation();
});

serwist.addEventListeners();
