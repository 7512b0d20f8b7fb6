'use client';
/**
 * Saved sessions: save the processed checkups under a name of the physician's own, and the list
 * of saved sessions with Open and Delete (Delete asks first). One line says exactly what is kept
 * and where. The name is shown here only: never in an address, a page title or a file name.
 *
 * Saving and opening happen in the checkups Web Worker (the rows never cross to the page); this
 * panel lists and deletes through app/storage/sessions.ts and re-reads the list whenever any tab
 * changes it.
 */
import { useEffect, useRef, useState } from 'react';
import { checkSessionName, SESSION_STORAGE_LINE, type SessionSummary } from '@/lib/checkups/session';
import { openSessionStore } from '@/app/storage/sessions';
import { onLibraryChange } from '@/app/storage/changes';

export type SaveState = { readonly status: 'idle' | 'saving' | 'saved' } | { readonly status: 'failed'; readonly messages: readonly string[] };

export interface SessionPanelProps {
  /** True when a finished run can be saved. */
  readonly canSave: boolean;
  readonly saveState: SaveState;
  readonly onSave: (name: string) => void;
  readonly onOpen: (id: string) => void;
  /** True while a file or session is being processed (Open waits). */
  readonly busy: boolean;
  /** Why the session last opened could not be (a newer format, damage), when it could not. */
  readonly openMessages: readonly string[];
}

interface ListedSession {
  readonly summary: SessionSummary;
  readonly savedAt: string;
}

function savedOn(iso: string): string {
  return iso.slice(0, 10);
}

export function SessionPanel({ canSave, saveState, onSave, onOpen, busy, openMessages }: SessionPanelProps) {
  const [name, setName] = useState('');
  const [nameProblem, setNameProblem] = useState<string | null>(null);
  const [sessions, setSessions] = useState<readonly ListedSession[] | undefined>(undefined);
  const [problems, setProblems] = useState<readonly string[]>([]);
  const [revision, setRevision] = useState(0);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const keepRef = useRef<HTMLButtonElement>(null);

  useEffect(() => onLibraryChange((change) => change.kind === 'sessions' && setRevision((n) => n + 1)), []);

  useEffect(() => {
    let live = true;
    void openSessionStore().then(async (opened) => {
      if (!opened.ok) {
        if (live) setProblems(opened.issues.map((i) => i.message));
        return;
      }
      const listed = await opened.value.list();
      opened.value.close();
      if (!live) return;
      if (listed.ok) {
        setSessions(listed.value.items.map((s) => ({ summary: s.summary, savedAt: s.savedAt })));
        setProblems(listed.value.problems.map((p) => p.message));
      } else setProblems(listed.issues.map((i) => i.message));
    });
    return () => {
      live = false;
    };
  }, [revision, saveState.status]);

  useEffect(() => {
    if (confirming) keepRef.current?.focus();
  }, [confirming]);

  const save = () => {
    const checked = checkSessionName(name);
    if (!checked.ok) {
      setNameProblem(checked.issues[0]?.message ?? 'Give the session a name');
      return;
    }
    setNameProblem(null);
    setMessage(null);
    onSave(checked.value);
  };

  const remove = async (id: string) => {
    setConfirming(null);
    const opened = await openSessionStore();
    if (!opened.ok) {
      setMessage(opened.issues[0]?.message ?? 'The saved sessions cannot be reached');
      return;
    }
    const deleted = await opened.value.delete(id);
    opened.value.close();
    setMessage(deleted.ok ? 'The session was deleted from this browser.' : (deleted.issues[0]?.message ?? 'The session could not be deleted'));
    setRevision((n) => n + 1);
  };

  return (
    <section aria-labelledby="sessions-heading" className="checkups__section" data-testid="sessions">
      <h2 id="sessions-heading">Saved sessions</h2>
      <p className="checkups__note" data-testid="sessions-what">
        {SESSION_STORAGE_LINE}
      </p>
      {canSave ? (
        <div className="checkups__save">
          <label>
            Name for this session (your own label; shown only in this list)
            <input
              value={name}
              maxLength={120}
              autoComplete="off"
              aria-invalid={nameProblem ? true : undefined}
              aria-describedby={nameProblem ? 'session-name-problem' : undefined}
              onChange={(e) => setName(e.target.value)}
            />
          </label>
          <button type="button" onClick={save} disabled={saveState.status === 'saving'}>
            Save the session
          </button>
          {nameProblem ? (
            <p id="session-name-problem" role="alert" className="checkups__message">
              {nameProblem}
            </p>
          ) : null}
        </div>
      ) : null}
      <p aria-live="polite" data-testid="sessions-status">
        {saveState.status === 'saving'
          ? 'Saving…'
          : saveState.status === 'saved'
            ? 'Saved in this browser.'
            : saveState.status === 'failed'
              ? `Not saved: ${saveState.messages.join(' ')}`
              : (message ?? '')}
      </p>
      {[...openMessages, ...problems].map((p) => (
        <p key={p} className="checkups__message">
          {p}
        </p>
      ))}
      {sessions === undefined ? null : sessions.length === 0 ? (
        <p>No session is saved in this browser.</p>
      ) : (
        <ul className="checkups__sessions" data-testid="session-list">
          {sessions.map(({ summary, savedAt }) => (
            <li key={summary.id}>
              <p>
                <strong>{summary.name}</strong>
                <br />
                {summary.workers} workers, {summary.rows} checkup rows · {summary.evidenceTitle} · {summary.tableTitle} · {summary.criteria} · saved {savedOn(savedAt)}
              </p>
              {confirming === summary.id ? (
                <div role="group" aria-label={`Delete the session ${summary.name}?`}>
                  <p>Delete “{summary.name}” and its checkup rows from this browser? This cannot be undone.</p>
                  <div className="checkups__actions">
                    <button type="button" onClick={() => void remove(summary.id)}>
                      Delete
                    </button>
                    <button ref={keepRef} type="button" onClick={() => setConfirming(null)}>
                      Keep it
                    </button>
                  </div>
                </div>
              ) : (
                <div className="checkups__actions">
                  <button type="button" onClick={() => onOpen(summary.id)} disabled={busy} aria-label={`Open ${summary.name}`}>
                    Open
                  </button>
                  <button type="button" onClick={() => setConfirming(summary.id)} aria-label={`Delete ${summary.name}`}>
                    Delete
                  </button>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
