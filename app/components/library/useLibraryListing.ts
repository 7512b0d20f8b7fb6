'use client';
/**
 * Reads one of the library's listings (tables or evidence) and reads it again whenever the
 * library changes; unreadable records come back as problems, never as a thrown error.
 */
import { useEffect, useState } from 'react';
import type { Issue, Result } from '@/lib/result';
import type { Library, Listing } from '@/app/storage/library';
import { useLibrary } from './LibraryContext';

export interface LibraryListing<T> {
  /** Undefined until the first read has finished. */
  readonly items: readonly T[] | undefined;
  readonly problems: readonly Issue[];
}

export function useLibraryListing<T>(read: (library: Library) => Promise<Result<Listing<T>>>): LibraryListing<T> {
  const { library, revision } = useLibrary();
  const [items, setItems] = useState<readonly T[] | undefined>(undefined);
  const [problems, setProblems] = useState<readonly Issue[]>([]);

  useEffect(() => {
    if (!library) return;
    let live = true;
    void read(library).then((r) => {
      if (!live) return;
      if (r.ok) {
        setItems(r.value.items);
        setProblems(r.value.problems);
      } else setProblems(r.issues);
    });
    return () => {
      live = false;
    };
    // `read` is a module-level function at every call site; the listing follows the library.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [library, revision]);

  return { items, problems };
}
