/**
 * Telling every open tab of this app that the library changed, so its lists read again:
 * a BroadcastChannel message, or, in a browser without BroadcastChannel, a localStorage
 * write that other tabs see as a `storage` event. Only the kind, id and kind of change are
 * sent (lib/storage/policy.ts `LibraryChange`), never a record's content, and nothing leaves
 * the browser.
 */
import { LIBRARY_CHANGE_CHANNEL, readLibraryChange, type LibraryChange, type RecordKind } from '@/lib/storage/policy';

function nonce(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now()}-${Math.random()}`;
}

/** Announce a change to every tab (this one included). Never throws. */
export function announceLibraryChange(kind: RecordKind, id: string, change: LibraryChange['change']): void {
  const message: LibraryChange = { kind, id, change, nonce: nonce() };
  try {
    if (typeof BroadcastChannel !== 'undefined') {
      const channel = new BroadcastChannel(LIBRARY_CHANGE_CHANNEL);
      channel.postMessage(message);
      channel.close();
      return;
    }
    if (typeof localStorage !== 'undefined') localStorage.setItem(LIBRARY_CHANGE_CHANNEL, JSON.stringify(message));
  } catch {
    // Telling other tabs is a courtesy: they also re-read on their next own change.
  }
}

/** Calls `listener` on every change announced by any tab; returns the unsubscribe function. */
export function onLibraryChange(listener: (change: LibraryChange) => void): () => void {
  const stops: (() => void)[] = [];
  if (typeof BroadcastChannel !== 'undefined') {
    const channel = new BroadcastChannel(LIBRARY_CHANGE_CHANNEL);
    channel.onmessage = (event: MessageEvent) => {
      const change = readLibraryChange(event.data);
      if (change) listener(change);
    };
    stops.push(() => channel.close());
  }
  if (typeof window !== 'undefined') {
    const onStorage = (event: StorageEvent) => {
      if (event.key !== LIBRARY_CHANGE_CHANNEL || event.newValue === null) return;
      let data: unknown;
      try {
        data = JSON.parse(event.newValue);
      } catch {
        return;
      }
      const change = readLibraryChange(data);
      if (change) listener(change);
    };
    window.addEventListener('storage', onStorage);
    stops.push(() => window.removeEventListener('storage', onStorage));
  }
  return () => {
    for (const stop of stops) stop();
  };
}
