'use client';
/**
 * Opens the browser library once for everything under it and tells the lists when it changed.
 *
 * Props of {@link LibraryProvider}:
 * - name: the IndexedDB database name (tests give their own; default the app's);
 * - children.
 *
 * `useLibrary()` gives `{ status, library, issues, revision, changed }`: `status` is "opening",
 * "ready" or "unavailable" (with `issues` saying why); `revision` grows after every change made
 * through `changed()`, and after every change another tab announces (app/storage/changes.ts),
 * so every open tab's lists re-read.
 */
import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { Issue } from '@/lib/result';
import { openLibrary, type Library } from '@/app/storage/library';
import { onLibraryChange } from '@/app/storage/changes';

export interface LibraryState {
  readonly status: 'opening' | 'ready' | 'unavailable';
  readonly library: Library | undefined;
  readonly issues: readonly Issue[];
  readonly revision: number;
  /** Call after a change so every list re-reads. */
  readonly changed: () => void;
}

const LibraryContext = createContext<LibraryState | undefined>(undefined);

export interface LibraryProviderProps {
  readonly name?: string;
  readonly children: ReactNode;
}

export function LibraryProvider({ name, children }: LibraryProviderProps) {
  const [opened, setOpened] = useState<{ library?: Library; issues: readonly Issue[]; done: boolean }>({ issues: [], done: false });
  const [revision, setRevision] = useState(0);

  useEffect(() => {
    let live = true;
    let library: Library | undefined;
    void openLibrary(name === undefined ? {} : { name }).then((r) => {
      if (!live) {
        if (r.ok) r.value.close();
        return;
      }
      if (r.ok) library = r.value;
      setOpened(r.ok ? { library: r.value, issues: [], done: true } : { issues: r.issues, done: true });
    });
    return () => {
      live = false;
      library?.close();
    };
  }, [name]);

  const changed = useCallback(() => setRevision((n) => n + 1), []);
  // Another tab (or another panel of this one) changed the library: read the lists again.
  useEffect(() => onLibraryChange(() => setRevision((n) => n + 1)), []);
  const value = useMemo<LibraryState>(
    () => ({
      status: !opened.done ? 'opening' : opened.library ? 'ready' : 'unavailable',
      library: opened.library,
      issues: opened.issues,
      revision,
      changed,
    }),
    [opened, revision, changed],
  );
  return <LibraryContext.Provider value={value}>{children}</LibraryContext.Provider>;
}

/** The library state; outside a {@link LibraryProvider} the library is "unavailable". */
export function useLibrary(): LibraryState {
  const state = useContext(LibraryContext);
  return (
    state ?? {
      status: 'unavailable',
      library: undefined,
      issues: [{ code: 'no-provider', path: [], message: 'The library is not available here (no LibraryProvider)' }],
      revision: 0,
      changed: () => {},
    }
  );
}

/** One line saying why the library cannot be used, or nothing while it opens or once it is ready. */
export function LibraryStatus() {
  const { status, issues } = useLibrary();
  if (status === 'opening') return <p className="library__status" role="status">Opening the library…</p>;
  if (status === 'unavailable') {
    return (
      <p className="library__problem" role="alert">
        {issues[0]?.message ?? 'The library is not available in this browser.'}
      </p>
    );
  }
  return null;
}
