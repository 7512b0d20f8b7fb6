'use client';
/**
 * Saved handout templates: pick, save, rename, delete, export and import. The list and every
 * change go through app/handout/useTemplates.ts (the browser library, with revisions); a
 * refused change or a bad file shows its reasons and leaves the saved templates as they were.
 */
import { useId, useState, type ChangeEvent } from 'react';
import type { TemplateRecord } from '@/lib/handout';
import type { Issue } from '@/lib/result';

type Outcome = { message?: string; issues?: readonly Issue[] };

export interface TemplatePanelProps {
  readonly templates: readonly TemplateRecord[];
  /** False until the library is open; the buttons that change it wait. */
  readonly ready: boolean;
  readonly onUse: (template: TemplateRecord) => string;
  readonly onSave: (name: string) => Promise<Outcome>;
  readonly onRename: (id: string, to: string) => Promise<Outcome>;
  readonly onDelete: (template: TemplateRecord) => Promise<Outcome>;
  readonly onExport: () => Promise<Outcome>;
  readonly onImport: (text: string) => Promise<Outcome>;
  /** A problem reading the saved templates, shown until it is fixed. */
  readonly loadIssues: readonly Issue[];
}

export function TemplatePanel({ templates, ready, onUse, onSave, onRename, onDelete, onExport, onImport, loadIssues }: TemplatePanelProps) {
  const id = useId();
  const [selected, setSelected] = useState('');
  const [name, setName] = useState('');
  const [message, setMessage] = useState('');
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const [busy, setBusy] = useState(false);
  const chosen = templates.find((t) => t.id === selected);

  async function run(action: () => Promise<Outcome>): Promise<Outcome> {
    setBusy(true);
    try {
      const outcome = await action();
      report(outcome);
      return outcome;
    } finally {
      setBusy(false);
    }
  }

  function report(outcome: { message?: string; issues?: readonly Issue[] }) {
    setIssues(outcome.issues ?? []);
    setMessage(outcome.message ?? '');
  }

  async function importFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    event.target.value = '';
    if (!file) return;
    const text = await file.text();
    await run(() => onImport(text));
  }

  const shownIssues = [...loadIssues, ...issues];
  return (
    <fieldset className="template-panel">
      <legend>Templates</legend>
      <p className="controls__hint">A template keeps the title, opening words, next steps and clinic details in this browser.</p>
      <div className="controls__row">
        <label htmlFor={`${id}-select`}>Saved templates</label>
        <select id={`${id}-select`} value={chosen ? selected : ''} onChange={(e) => setSelected(e.target.value)}>
          <option value="">{templates.length === 0 ? 'No saved templates yet' : 'Choose a template'}</option>
          {templates.map((t) => (
            <option key={t.id} value={t.id}>
              {t.template.name}
            </option>
          ))}
        </select>
        <button type="button" disabled={!chosen} onClick={() => chosen && report({ message: onUse(chosen) })}>
          Use template
        </button>
        <button
          type="button"
          disabled={!chosen || !ready || busy}
          onClick={() => {
            if (!chosen) return;
            setSelected('');
            void run(() => onDelete(chosen));
          }}
        >
          Delete template
        </button>
      </div>
      <div className="controls__row">
        <label htmlFor={`${id}-name`}>Template name</label>
        <input id={`${id}-name`} type="text" value={name} maxLength={80} onChange={(e) => setName(e.target.value)} />
        <button type="button" disabled={!ready || busy} onClick={() => void run(() => onSave(name))}>
          Save as template
        </button>
        <button
          type="button"
          disabled={!chosen || !ready || busy}
          onClick={() => {
            if (!chosen) return;
            void run(() => onRename(chosen.id, name));
          }}
        >
          Rename chosen template
        </button>
      </div>
      <div className="controls__row">
        <button type="button" disabled={!ready || busy} onClick={() => void run(onExport)}>
          Export templates
        </button>
        <label htmlFor={`${id}-import`} className="file-label">
          Import templates (JSON file)
        </label>
        <input id={`${id}-import`} type="file" accept=".json,application/json" disabled={!ready || busy} onChange={importFile} />
      </div>
      <p className="controls__status" role="status" aria-live="polite">
        {message}
      </p>
      {shownIssues.length > 0 ? (
        <ul className="controls__issues" role="alert">
          {shownIssues.map((issue, i) => (
            <li key={`${issue.code}-${i}`}>{issue.message}</li>
          ))}
        </ul>
      ) : null}
    </fieldset>
  );
}
