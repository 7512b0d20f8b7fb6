'use client';
/** The second click a delete needs, for a saved table or evidence entry. */
export function ConfirmDelete({ title, onDelete, onKeep }: { title: string; onDelete: () => void; onKeep: () => void }) {
  return (
    <div className="library__inline" role="group" aria-label={`Delete ${title}?`}>
      <p>Delete “{title}” from this browser? This cannot be undone; export it first to keep a copy.</p>
      <button type="button" className="button button--danger" onClick={onDelete}>
        Delete
      </button>
      <button type="button" className="button button--secondary" onClick={onKeep}>
        Keep it
      </button>
    </div>
  );
}
