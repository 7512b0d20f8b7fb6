'use client';
/**
 * Reads the scenario's query from the address in the browser and hands it to the handout, so
 * /handout is a static page: the same HTML for every scenario, prerendered at build time. That
 * lets the service worker keep it for offline use and lets the Content Security Policy allow its
 * inline scripts by hash; and the scenario is never rendered on the server.
 */
import { useSyncExternalStore } from 'react';
import { HandoutScreen } from '@/app/components/handout/HandoutScreen';

function subscribe(onChange: () => void): () => void {
  window.addEventListener('popstate', onChange);
  return () => window.removeEventListener('popstate', onChange);
}

const readQuery = () => window.location.search;
/** On the server (prerendering) there is no address yet. */
const noQuery = () => null;

export function HandoutFromAddress() {
  const query = useSyncExternalStore(subscribe, readQuery, noQuery);
  if (query === null) return <p className="handout-loading">Opening the handout…</p>;
  return <HandoutScreen query={query} />;
}
