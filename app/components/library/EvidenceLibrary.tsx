'use client';
/**
 * The saved evidence entries: find by words, use one, edit, delete (after a second click),
 * export all or those found as a JSON file, and import such a file — validated whole first;
 * any problem (naming the entry and field) or an id already saved refuses the whole file
 * unless "replace" is chosen, and nothing changes.
 *
 * Edits carry the revision they started from: when another tab saved the entry since, the
 * save is refused with a message and the saved version shown; when another tab deleted it,
 * the form stays open (marked) and a save is refused, so the entry never comes back.
 *
 * Props:
 * - onUse(entry): when given, each entry gets a "Use this evidence" button;
 * - selectedId: the entry in use, marked as such.
 *
 * Needs a {@link LibraryProvider} above it.
 */
import { useId, useMemo, useState, type ChangeEvent } from 'react';
import type { Issue } from '@/lib/result';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { StoredEvidence } from '@/lib/storage/records';
import { fileKindCode, fileKindSentence, sniffBytes, SNIFF_BYTES } from '@/lib/files/kind';
import { ADJUSTED_CHOICES_FOR_FORM, DESIGN_CHOICES } from '@/lib/consultation/choices';
import { searchEvidence } from '@/lib/evidence/search';
import { MAX_EVIDENCE_FILE_CHARS } from '@/lib/evidence/file';
import type { Library } from '@/app/storage/library';
import { useLibrary } from './LibraryContext';
import { useLibraryListing } from './useLibraryListing';
import { ConfirmDelete } from './ConfirmDelete';
import { countProblems, ProblemList } from './ProblemList';
import { EvidenceForm } from './EvidenceForm';
import { downloadText } from './download';
import './library.css';
import { intervalLabel } from '@/lib/wording/format';

export interface EvidenceLibraryProps {
  readonly onUse?: ((entry: EvidenceEntry) => void) | undefined;
  readonly selectedId?: string | undefined;
}

const readEvidence = (library: Library) => library.listEvidence();

export function EvidenceLibrary({ onUse, selectedId }: EvidenceLibraryProps) {
  const id = useId();
  const { library, status, changed } = useLibrary();
  const { items: stored, problems } = useLibraryListing(readEvidence);
  const [query, setQuery] = useState('');
  const [importIssues, setImportIssues] = useState<readonly Issue[]>([]);
  const [importNote, setImportNote] = useState('');
  const [pendingFile, setPendingFile] = useState<{ name: string; text: string } | undefined>(undefined);
  const [exportIssues, setExportIssues] = useState<readonly Issue[]>([]);
  /** Entries open for editing, as they were when editing began (kept even if another tab deletes them). */
  const [editing, setEditing] = useState<ReadonlyMap<string, StoredEvidence>>(new Map());

  const entries = useMemo(() => (stored ?? []).map((s) => s.entry), [stored]);
  const found = useMemo(() => searchEvidence(entries, query), [entries, query]);
  const storedById = useMemo(() => new Map((stored ?? []).map((s) => [s.entry.id, s] as const)), [stored]);
  /** Open edits whose entry is no longer saved: deleted in another tab. */
  const orphans = useMemo(() => (stored === undefined ? [] : [...editing.values()].filter((e) => !storedById.has(e.entry.id))), [editing, storedById, stored]);

  function setEditBase(id: string, base: StoredEvidence | undefined) {
    setEditing((current) => {
      const next = new Map(current);
      if (base) next.set(id, base);
      else next.delete(id);
      return next;
    });
  }

  async function runImport(file: { name: string; text: string }, replace: boolean) {
    if (!library) return;
    const r = await library.importEvidenceJson(file.text, { replace });
    if (!r.ok) {
      setImportIssues(r.issues);
      setImportNote('');
      setPendingFile(r.issues.some((i) => i.code === 'id-taken') ? file : undefined);
      return;
    }
    setImportIssues([]);
    setPendingFile(undefined);
    const { added, replaced, skipped } = r.value;
    setImportNote(
      `Imported ${file.name}: ${added.length} added, ${replaced.length} replaced${skipped.length > 0 ? `, ${skipped.length} bundled demo entries skipped` : ''}.`,
    );
    changed();
  }

  async function onFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    event.target.value = '';
    if (!file) return;
    if (file.size > MAX_EVIDENCE_FILE_CHARS * 4) {
      setImportIssues([{ code: 'file-too-large', path: [], message: `The file is larger than the ${MAX_EVIDENCE_FILE_CHARS / 1024 / 1024} MB accepted for an evidence file` }]);
      return;
    }
    const kind = sniffBytes(new Uint8Array(await file.slice(0, SNIFF_BYTES).arrayBuffer()));
    const kindCode = fileKindCode(kind);
    if (kindCode) {
      setImportIssues([{ code: kindCode, path: [], message: fileKindSentence(kind, 'an evidence file (.json)') ?? '' }]);
      setImportNote('');
      return;
    }
    await runImport({ name: file.name, text: await file.text() }, false);
  }

  async function exportEntries(which: 'all' | 'found') {
    if (!library) return;
    const r = await library.exportEvidence(which === 'all' ? undefined : found.map((e) => e.id));
    if (!r.ok) return setExportIssues(r.issues);
    setExportIssues([]);
    downloadText(which === 'all' ? 'evidence-library.json' : 'evidence-selection.json', r.value, 'application/json');
  }

  if (status !== 'ready') return null;
  return (
    <div className="library__list">
      <div className="library__toolbar">
        <div className="field">
          <label className="field__label" htmlFor={`${id}-search`}>
            Find by words
          </label>
          <input
            id={`${id}-search`}
            className="field__input"
            type="search"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
            aria-describedby={`${id}-count`}
          />
          <p className="field__hint" id={`${id}-count`} aria-live="polite">
            {stored === undefined ? 'Reading the saved entries…' : `${found.length} of ${entries.length} entries shown`}
          </p>
        </div>
        <div className="library__buttons">
          <button type="button" className="button button--secondary" onClick={() => void exportEntries('all')} disabled={entries.length === 0}>
            Export all (JSON)
          </button>
          <button type="button" className="button button--secondary" onClick={() => void exportEntries('found')} disabled={query.trim() === '' || found.length === 0}>
            Export those shown
          </button>
        </div>
        <div className="field">
          <label className="field__label" htmlFor={`${id}-import`}>
            Import entries (.json)
          </label>
          <input id={`${id}-import`} className="library__file" type="file" accept=".json,application/json" onChange={(e) => void onFile(e)} />
        </div>
      </div>
      <ProblemList problems={exportIssues} heading="Not exported" />
      <div aria-live="polite">{importNote && <p className="library__ok">{importNote}</p>}</div>
      <ProblemList problems={importIssues} heading={`${countProblems(importIssues)} — nothing was imported`} />
      {pendingFile && (
        <button type="button" className="button" onClick={() => void runImport(pendingFile, true)}>
          Import {pendingFile.name} again, replacing the saved entries with the same ids
        </button>
      )}
      <ProblemList problems={problems} heading="Some saved entries could not be read; they are left as they are" />

      {stored !== undefined && entries.length === 0 && <p>No evidence saved yet. Save the evidence from a consultation, or import a file.</p>}
      <ul className="library__items">
        {/* One list keyed by id, so an entry open for editing keeps its form (and what was typed) when another tab deletes it. */}
        {[...orphans.map((o) => ({ s: o, gone: true })), ...found.flatMap((e) => {
          const s = storedById.get(e.id);
          return s ? [{ s, gone: false }] : [];
        })].map(({ s, gone }) => (
          <li key={s.entry.id}>
            <EvidenceItem
              stored={s}
              gone={gone}
              editBase={gone ? s : editing.get(s.entry.id)}
              onEditBase={(b) => setEditBase(s.entry.id, b)}
              onUse={gone ? undefined : onUse}
              selected={!gone && s.entry.id === selectedId}
            />
          </li>
        ))}
      </ul>
    </div>
  );
}

/** "HR 1.6 (95% CI 1.2 to 2.1)": the numbers as entered, no arithmetic. */
export function describeEffect(e: EvidenceEntry): string {
  const level = e.effect.level === undefined ? 'CI' : intervalLabel(e.effect.level);
  return `${e.effect.measure} ${e.effect.estimate} (${level} ${e.effect.lower} to ${e.effect.upper})`;
}

/** The study design in the form's words ("Case-control with risk-set sampling …"), never its code. */
export function designWords(design: string): string {
  const label = DESIGN_CHOICES.find((c) => c.value === design)?.label ?? design;
  return label.charAt(0).toLowerCase() + label.slice(1);
}

/** "adjusted" / "unadjusted", in the form's words. */
function adjustedWords(adjusted: boolean): string {
  return (ADJUSTED_CHOICES_FOR_FORM.find((c) => c.value === (adjusted ? 'yes' : 'no'))?.label ?? '').toLowerCase();
}

interface EvidenceItemProps {
  readonly stored: StoredEvidence;
  /** Deleted in another tab while open for editing. */
  readonly gone: boolean;
  /** The entry as it was when editing began; undefined when not editing. */
  readonly editBase: StoredEvidence | undefined;
  readonly onEditBase: (base: StoredEvidence | undefined) => void;
  readonly onUse: ((e: EvidenceEntry) => void) | undefined;
  readonly selected: boolean;
}

function EvidenceItem({ stored, gone, editBase, onEditBase, onUse, selected }: EvidenceItemProps) {
  const id = useId();
  const entry = stored.entry;
  const { library, changed } = useLibrary();
  const [confirming, setConfirming] = useState(false);
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const w = entry.wording;

  async function remove() {
    if (!library) return;
    const r = await library.deleteEvidence(entry.id);
    if (!r.ok) return setIssues(r.issues);
    changed();
  }

  return (
    <article className="library__item" aria-labelledby={`${id}-title`}>
      <h4 id={`${id}-title`}>
        {entry.title}
        {selected && <span className="library__badge"> (in use)</span>}
      </h4>
      {gone && (
        <p className="library__problem" role="alert">
          This entry was deleted in another tab or window. Your changes below cannot be saved to it; save them as a new entry from the consultation screen if you need them.
        </p>
      )}
      <p className="library__meta">
        {describeEffect(entry)}
        {entry.effect.design ? `, ${designWords(entry.effect.design)}` : ''}
        {entry.effect.followUpYears !== undefined ? `, ${entry.effect.followUpYears} years of follow-up` : ''}
        {entry.effect.adjusted === undefined ? '' : `, ${adjustedWords(entry.effect.adjusted)}`}.
      </p>
      {(w.outcome || w.exposure) && (
        <p className="library__meta">
          {w.exposure ?? 'Exposure not stated'}
          {w.comparison ? ` vs ${w.comparison}` : ''}
          {w.outcome ? `; outcome: ${w.outcome}` : ''}.
        </p>
      )}
      {w.citation && <p className="library__meta">{w.citation}</p>}
      {entry.illustrative && (
        <p className="library__meta">
          <strong>Illustrative entry, not a real study.</strong>
        </p>
      )}

      {editBase ? (
        <EvidenceForm
          entry={editBase.entry}
          onCancel={() => onEditBase(undefined)}
          onSave={async (edited) => {
            if (!library) return [];
            const r = await library.saveEvidence(edited, { revision: editBase.revision });
            if (!r.ok) {
              // Changed elsewhere: the list now shows the saved version; a second save replaces it, knowingly.
              if (r.issues.some((i) => i.code === 'stale-revision')) {
                const fresh = await library.getEvidence(entry.id);
                if (fresh.ok) onEditBase(fresh.value);
              }
              changed();
              return r.issues;
            }
            onEditBase(undefined);
            changed();
            return [];
          }}
        />
      ) : confirming ? (
        <ConfirmDelete title={entry.title} onDelete={() => void remove()} onKeep={() => setConfirming(false)} />
      ) : (
        <div className="library__buttons">
          {onUse && (
            <button type="button" className="button" onClick={() => onUse(entry)} aria-pressed={selected}>
              Use this evidence
            </button>
          )}
          <button type="button" className="button button--secondary" onClick={() => onEditBase(stored)}>
            Edit
          </button>
          <button type="button" className="button button--secondary" onClick={() => setConfirming(true)}>
            Delete…
          </button>
        </div>
      )}
      <ProblemList problems={issues} heading="Not done" />
    </article>
  );
}
