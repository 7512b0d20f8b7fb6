'use client';
/**
 * "Save this evidence to the library": takes the consultation's current effect, wording and
 * exposure definition, asks for a title, and saves a new entry with a free id.
 *
 * Props:
 * - effect, wording, exposureDefinition: the current evidence (the screen's valid values);
 * - illustrative: true when it came from a demo entry (default false);
 * - onSaved(stored): called after saving.
 *
 * Needs a {@link LibraryProvider} above it.
 */
import { useId, useState, type FormEvent } from 'react';
import type { Issue } from '@/lib/result';
import type { Effect, Wording } from '@/lib/scenario/schema';
import type { ExposureDefinition } from '@/lib/glycaemia/exposure';
import type { StoredEvidence } from '@/lib/storage/records';
import { useLibrary } from './LibraryContext';
import { ProblemList } from './ProblemList';
import './library.css';

export interface SaveEvidenceProps {
  readonly effect: Effect;
  readonly wording?: Wording | undefined;
  readonly exposureDefinition?: ExposureDefinition | undefined;
  readonly illustrative?: boolean;
  readonly onSaved?: ((stored: StoredEvidence) => void) | undefined;
}

/** A first title from the wording: "HbA1c in the prediabetes range and heart failure needing hospital care". */
export function suggestTitle(wording: Wording | undefined, effect: Effect): string {
  const parts = [wording?.exposure, wording?.outcome].filter((p): p is string => typeof p === 'string' && p.trim() !== '');
  return (parts.length > 0 ? parts.join(' and ') : `${effect.measure} ${effect.estimate}`).slice(0, 200);
}

export function SaveEvidence({ effect, wording, exposureDefinition, illustrative = false, onSaved }: SaveEvidenceProps) {
  const id = useId();
  const { library, status, changed } = useLibrary();
  const [title, setTitle] = useState(() => suggestTitle(wording, effect));
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const [saved, setSaved] = useState<StoredEvidence | undefined>(undefined);

  async function submit(event: FormEvent) {
    event.preventDefault();
    if (!library) return;
    const free = await library.freeEvidenceId(title);
    if (!free.ok) return setIssues(free.issues);
    const r = await library.saveEvidence({
      id: free.value,
      title,
      effect,
      wording: wording ?? {},
      ...(exposureDefinition ? { exposureDefinition } : {}),
      illustrative,
    });
    if (!r.ok) {
      setSaved(undefined);
      return setIssues(r.issues);
    }
    setIssues([]);
    setSaved(r.value);
    changed();
    onSaved?.(r.value);
  }

  if (status !== 'ready') return null;
  const titleIssues = issues.filter((i) => i.path[i.path.length - 1] === 'title');
  const others = issues.filter((i) => !titleIssues.includes(i));
  return (
    <form className="library__inline" onSubmit={(e) => void submit(e)} noValidate aria-label="Save this evidence to the library">
      <div className={`field${titleIssues.length > 0 ? ' field--invalid' : ''}`}>
        <label className="field__label" htmlFor={`${id}-title`}>
          Title in the library
        </label>
        <input
          id={`${id}-title`}
          className="field__input"
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          aria-invalid={titleIssues.length > 0}
          aria-describedby={titleIssues.length > 0 ? `${id}-title-error` : undefined}
        />
        {titleIssues.length > 0 && (
          <p className="field__error" id={`${id}-title-error`}>
            {titleIssues.map((i) => i.message).join(' ')}
          </p>
        )}
      </div>
      <button type="submit" className="button">
        Save this evidence
      </button>
      <div aria-live="polite">{saved && <p className="library__ok">Saved as “{saved.entry.title}”.</p>}</div>
      <ProblemList problems={others} heading="Not saved" />
    </form>
  );
}
