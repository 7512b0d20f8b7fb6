'use client';
/**
 * Saved handout templates: pick, save, rename, delete, export and import. The list and every
 * change go through app/handout/templateStore.ts; a refused change or a bad file shows its
 * reasons and leaves the saved templates as they were.
 */
import { useId, useState, type ChangeEvent } from 'react';
import type { HandoutTemplate } from '@/lib/handout';
import type { Issue } from '@/lib/result';

export interface TemplatePanelProps {
  readonly templates: readonly HandoutTemplate[];
  readonly onUse: (template: HandoutTemplate) => string;
  readonly onSave: (name: string) => { message?: string; issues?: readonly Issue[] };
  readonly onRename: (from: string, to: string) => { message?: string; issues?: readonly Issue[] };
  readonly onDelete: (name: string) => { message?: string; issues?: readonly Issue[] };
  readonly onExport: () => { message?: string; issues?: readonly Issue[] };
  readonly onImport: (text: string) => { message?: string; issues?: readonly Issue[] };
  /** A problem reading the saved templates, shown until it is fixed. */
  readonly loadIssues: readonly Issue[];
}

export function TemplatePanel({ templates, onUse, onSave, onRename, onDelete, onExport, onImport, loadIssues }: TemplatePanelProps) {
  const id = useId();
  const [selected, setSelected] = useState('');
  const [name, setName] = useState('');
  const [message, setMessage] = useState('');
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const chosen = templates.find((t) => t.name === selected);

  function report(outcome: { message?: string; issues?: readonly Issue[] }) {
    setIssues(outcome.issues ?? []);
    setMessage(outcome.message ?? '');
  }

  async function importFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    event.target.value = '';
    if (!file) return;
    report(onImport(await file.text()));
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
            <option key={t.name} value={t.name}>
              {t.name}
            </option>
          ))}
        </select>
        <button type="button" disabled={!chosen} onClick={() => chosen && report({ message: onUse(chosen) })}>
          Use template
        </button>
        <button
          type="button"
          disabled={!chosen}
          onClick={() => {
            if (!chosen) return;
            report(onDelete(chosen.name));
            setSelected('');
          }}
        >
          Delete template
        </button>
      </div>
      <div className="controls__row">
        <label htmlFor={`${id}-name`}>Template name</label>
        <input id={`${id}-name`} type="text" value={name} maxLength={80} onChange={(e) => setName(e.target.value)} />
        <button type="button" onClick={() => report(onSave(name))}>
          Save as template
        </button>
        <button
          type="button"
          disabled={!chosen}
          onClick={() => {
            if (!chosen) return;
            const outcome = onRename(chosen.name, name);
            report(outcome);
            if (!outcome.issues?.length) setSelected(name.trim());
          }}
        >
          Rename chosen template
        </button>
      </div>
      <div className="controls__row">
        <button type="button" onClick={() => report(onExport())}>
          Export templates
        </button>
        <label htmlFor={`${id}-import`} className="file-label">
          Import templates (JSON file)
        </label>
        <input id={`${id}-import`} type="file" accept=".json,application/json" onChange={importFile} />
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
