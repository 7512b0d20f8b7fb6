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

// A Web Worker's script (the checkups worker): the bundler's worker bootstrap reads its settings
// from the script's own address (`…#params=…`). A worker answered with the cached response takes
// the cached file's address, without them, and stops ("Missing worker bootstrap config"). So the
// cached file is answered as a new response, which has no address of its own: the worker keeps
// the address it was asked for (Fetch Standard, "main fetch": a response with an empty URL list
// takes the request's URL), and the checkups screen processes files offline too. A worker script
// not in the cache is fetched. Registered before Serwist's listener, so it answers these first.
type WorkerFetch = Event & { readonly request: Request; respondWith(response: Promise<Response>): void };
addEventListener('fetch', (event: Event) => {
  const fetchEvent = event as WorkerFetch;
  if (fetchEvent.request?.destination !== 'worker') return;
  event.stopImmediatePropagation();
  fetchEvent.respondWith(
    (async () => {
      const url = new URL(fetchEvent.request.url);
      url.hash = '';
      const cached = await serwist.matchPrecache(url.href);
      if (!cached) return fetch(fetchEvent.request);
      return new Response(cached.body, { status: cached.status, statusText: cached.statusText, headers: cached.headers });
    })(),
  );
});

serwist.addEventListeners();
