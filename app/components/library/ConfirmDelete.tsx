'use client';
/**
 * The second click a delete needs, for a saved table or evidence entry. Focus moves to
 * "Keep it" when it opens, so a stray Enter keeps the record.
 */
import { useEffect, useRef } from 'react';

export function ConfirmDelete({ title, onDelete, onKeep }: { title: string; onDelete: () => void; onKeep: () => void }) {
  const keep = useRef<HTMLButtonElement>(null);
  useEffect(() => keep.current?.focus(), []);
  return (
    <div className="library__inline" role="group" aria-label={`Delete ${title}?`}>
      <p>Delete “{title}” from this browser? This cannot be undone; export it first to keep a copy.</p>
      <button type="button" className="button button--danger" onClick={onDelete}>
        Delete
      </button>
      <button ref={keep} type="button" className="button button--secondary" onClick={onKeep}>
        Keep it
      </button>
    </div>
  );
}
