'use client';
/**
 * Registers the service worker (service-worker/sw.ts, built to /sw.js) and, when a new version
 * of the app has been fetched in the background, offers "Reload to update". The new version
 * waits until the clinician chooses: nothing switches under them in the middle of a
 * consultation. Choosing it tells the waiting worker to take over (SKIP_WAITING) and reloads the
 * page once it has; "Not now" hides the offer until the next page load.
 *
 * Only in a production build: `next dev` serves changing code that must never be cached.
 */
import { useEffect, useRef, useState } from 'react';
import './update-banner.css';

export const SERVICE_WORKER_URL = '/sw.js';

/** True when a new worker is installed and waiting while an older one controls the page. */
function waitingUpdate(registration: ServiceWorkerRegistration): ServiceWorker | null {
  return registration.waiting && navigator.serviceWorker.controller ? registration.waiting : null;
}

export function UpdateBanner() {
  const [waiting, setWaiting] = useState<ServiceWorker | null>(null);
  const [dismissed, setDismissed] = useState(false);
  const reloading = useRef(false);

  useEffect(() => {
    if (process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
    let registration: ServiceWorkerRegistration | undefined;
    let cancelled = false;
    const check = (reg: ServiceWorkerRegistration) => {
      if (!cancelled) setWaiting(waitingUpdate(reg));
    };
    const onUpdateFound = () => {
      const installing = registration?.installing;
      installing?.addEventListener('statechange', () => {
        if (installing.state === 'installed' && registration) check(registration);
      });
    };
    const onVisible = () => {
      if (document.visibilityState === 'visible') registration?.update().catch(() => undefined);
    };
    const onControllerChange = () => {
      // Only after the clinician chose to update: the new version took over, so load it.
      if (reloading.current) window.location.reload();
    };
    navigator.serviceWorker.addEventListener('controllerchange', onControllerChange);
    document.addEventListener('visibilitychange', onVisible);
    navigator.serviceWorker
      .register(SERVICE_WORKER_URL, { scope: '/' })
      .then((reg) => {
        registration = reg;
        check(reg);
        reg.addEventListener('updatefound', onUpdateFound);
      })
      .catch(() => undefined); // No service worker (private mode, an old browser): the app still works online.
    return () => {
      cancelled = true;
      registration?.removeEventListener('updatefound', onUpdateFound);
      navigator.serviceWorker.removeEventListener('controllerchange', onControllerChange);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, []);

  if (!waiting || dismissed) return null;
  const update = () => {
    reloading.current = true;
    waiting.postMessage({ type: 'SKIP_WAITING' });
  };
  return (
    <div className="update-banner" role="region" aria-label="App update" data-testid="update-banner">
      <p role="status" className="update-banner__text">
        A new version of Hundredfold is ready. Reload when it suits you; until then this page keeps working as it is.
      </p>
      <div className="update-banner__actions">
        <button type="button" className="button" onClick={update} data-testid="update-reload">
          Reload to update
        </button>
        <button type="button" className="button button--secondary" onClick={() => setDismissed(true)}>
          Not now
        </button>
      </div>
    </div>
  );
}

export default UpdateBanner;
