'use client';
/**
 * Edit an evidence entry: its title, the effect (measure, estimate, interval, level, design,
 * follow-up, adjusted), the wording and notes. Validated by the entry schema on save; each
 * problem appears beside its field (aria-describedby) and nothing is saved until all are fixed.
 *
 * Props:
 * - entry: the entry to edit (its id and exposure definition are kept);
 * - onSave(entry): called with the valid entry; it resolves to issues when the library refused it;
 * - onCancel().
 */
import { useId, useState, type FormEvent } from 'react';
import type { Issue } from '@/lib/result';
import { parseEvidenceEntry } from '@/lib/evidence/parse';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { EFFECT_MEASURES, INTERVAL_LEVELS, STUDY_DESIGNS } from '@/lib/scenario/schema';
import { ADJUSTED_CHOICES_FOR_FORM, DESIGN_CHOICES, LEVEL_CHOICES_FOR_FORM, MEASURE_CHOICES } from '@/lib/consultation/choices';
import { ProblemList } from './ProblemList';
import { ExposureFields, withExposure } from '../exposure/ExposureFields';

export interface EvidenceFormProps {
  readonly entry: EvidenceEntry;
  readonly onSave: (entry: EvidenceEntry) => Promise<readonly Issue[]>;
  readonly onCancel: () => void;
}

const WORDING = ['outcome', 'exposure', 'comparison', 'population', 'citation'] as const;
type Draft = Record<string, string>;

function toDraft(e: EvidenceEntry): Draft {
  const d: Draft = {
    title: e.title,
    measure: e.effect.measure,
    estimate: String(e.effect.estimate),
    lower: String(e.effect.lower),
    upper: String(e.effect.upper),
    level: e.effect.level === undefined ? '' : String(e.effect.level),
    design: e.effect.design ?? '',
    followUpYears: e.effect.followUpYears === undefined ? '' : String(e.effect.followUpYears),
    adjusted: e.effect.adjusted === undefined ? '' : String(e.effect.adjusted),
    notes: e.notes ?? '',
  };
  for (const k of WORDING) d[k] = e.wording[k] ?? '';
  return d;
}

/** Text to a number for the schema to judge; "" stays absent; a non-number stays text so the schema names it. */
function numberOrText(text: string): number | string {
  const t = text.trim();
  return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t) ? Number(t) : t;
}

function fromDraft(d: Draft, base: EvidenceEntry): unknown {
  const opt = <T,>(key: string, value: T) => ((d[key] ?? '').trim() === '' ? {} : { [key]: value });
  const wording: Record<string, string> = {};
  for (const k of WORDING) if ((d[k] ?? '').trim() !== '') wording[k] = (d[k] ?? '').trim();
  return {
    id: base.id,
    title: d.title ?? '',
    effect: {
      measure: d.measure,
      estimate: numberOrText(d.estimate ?? ''),
      lower: numberOrText(d.lower ?? ''),
      upper: numberOrText(d.upper ?? ''),
      ...opt('level', numberOrText(d.level ?? '')),
      ...opt('design', d.design),
      ...opt('followUpYears', numberOrText(d.followUpYears ?? '')),
      ...opt('adjusted', d.adjusted === 'true'),
    },
    wording,
    ...(base.exposureDefinition ? { exposureDefinition: base.exposureDefinition } : {}),
    illustrative: base.illustrative,
    ...opt('notes', d.notes ?? ''),
  };
}

const LABELS: Record<string, string> = {
  title: 'Title in the library',
  measure: 'Measure',
  estimate: 'Estimate',
  lower: 'Lower limit',
  upper: 'Upper limit',
  level: 'Interval level',
  design: 'Study design',
  followUpYears: 'Follow-up (years)',
  adjusted: 'Adjusted',
  outcome: 'Outcome',
  exposure: 'Exposure',
  comparison: 'Comparison',
  population: 'Population',
  citation: 'Citation',
  notes: 'Notes',
};

/** An option in the form's words (the consultation form's choice lists), never its stored code. */
function optionWords(key: string, value: string): string {
  const list = key === 'measure' ? MEASURE_CHOICES : key === 'level' ? LEVEL_CHOICES_FOR_FORM : key === 'design' ? DESIGN_CHOICES : undefined;
  if (key === 'adjusted') return ADJUSTED_CHOICES_FOR_FORM.find((c) => c.value === (value === 'true' ? 'yes' : 'no'))?.label ?? value;
  return list?.find((c) => c.value === value)?.label ?? value;
}

export function EvidenceForm({ entry, onSave, onCancel }: EvidenceFormProps) {
  const id = useId();
  const [draft, setDraft] = useState<Draft>(() => toDraft(entry));
  const [issues, setIssues] = useState<readonly Issue[]>([]);
  const [saving, setSaving] = useState(false);
  const [exposure, setExposure] = useState(entry.exposureDefinition);

  const fieldIssues = (key: string) => issues.filter((i) => i.path[i.path.length - 1] === key);
  const other = issues.filter((i) => !(String(i.path[i.path.length - 1]) in LABELS) && i.path[0] !== 'exposureDefinition');

  async function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = parseEvidenceEntry(fromDraft(draft, withExposure(entry, exposure)));
    if (!parsed.ok) return setIssues(parsed.issues);
    setSaving(true);
    const refused = await onSave(parsed.value);
    setSaving(false);
    setIssues(refused);
  }

  function field(key: string, kind: 'text' | 'number' | 'textarea' = 'text') {
    const errs = fieldIssues(key);
    const errId = `${id}-${key}-error`;
    const common = {
      id: `${id}-${key}`,
      className: 'field__input',
      value: draft[key] ?? '',
      'aria-invalid': errs.length > 0,
      'aria-describedby': errs.length > 0 ? errId : undefined,
    };
    return (
      <div className={`field${errs.length > 0 ? ' field--invalid' : ''}`} key={key}>
        <label className="field__label" htmlFor={`${id}-${key}`}>
          {LABELS[key]}
        </label>
        {kind === 'textarea' ? (
          <textarea {...common} rows={3} onChange={(e) => setDraft({ ...draft, [key]: e.target.value })} />
        ) : (
          <input {...common} inputMode={kind === 'number' ? 'decimal' : undefined} onChange={(e) => setDraft({ ...draft, [key]: e.target.value })} />
        )}
        {errs.length > 0 && (
          <p className="field__error" id={errId}>
            {errs.map((e) => e.message).join(' ')}
          </p>
        )}
      </div>
    );
  }

  function select(key: string, options: readonly (string | number)[], allowEmpty: boolean) {
    const errs = fieldIssues(key);
    const errId = `${id}-${key}-error`;
    return (
      <div className={`field${errs.length > 0 ? ' field--invalid' : ''}`} key={key}>
        <label className="field__label" htmlFor={`${id}-${key}`}>
          {LABELS[key]}
        </label>
        <select
          id={`${id}-${key}`}
          className="field__input"
          value={draft[key] ?? ''}
          aria-invalid={errs.length > 0}
          aria-describedby={errs.length > 0 ? errId : undefined}
          onChange={(e) => setDraft({ ...draft, [key]: e.target.value })}
        >
          {allowEmpty && <option value="">(not stated)</option>}
          {options.map((o) => (
            <option key={String(o)} value={String(o)}>
              {optionWords(key, String(o))}
            </option>
          ))}
        </select>
        {errs.length > 0 && (
          <p className="field__error" id={errId}>
            {errs.map((e) => e.message).join(' ')}
          </p>
        )}
      </div>
    );
  }

  return (
    <form className="library__form" onSubmit={(e) => void submit(e)} noValidate aria-label={`Edit ${entry.title}`}>
      {field('title')}
      <fieldset className="subsection">
        <legend className="subsection__title">Effect</legend>
        {select('measure', EFFECT_MEASURES, false)}
        {field('estimate', 'number')}
        {field('lower', 'number')}
        {field('upper', 'number')}
        {select('level', INTERVAL_LEVELS, true)}
        {select('design', STUDY_DESIGNS, true)}
        {field('followUpYears', 'number')}
        {select('adjusted', ['true', 'false'], true)}
      </fieldset>
      <fieldset className="subsection">
        <legend className="subsection__title">Wording</legend>
        {WORDING.map((k) => field(k))}
      </fieldset>
      <ExposureFields value={exposure} onChange={setExposure} issues={issues.filter((i) => i.path[0] === 'exposureDefinition')} />
      {field('notes', 'textarea')}
      <ProblemList problems={other} heading="Not saved" />
      <div className="library__buttons">
        <button type="submit" className="button" disabled={saving}>
          {saving ? 'Saving…' : 'Save changes'}
        </button>
        <button type="button" className="button button--secondary" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
