'use client';
/**
 * The fields of a study's exposure definition (lib/glycaemia/exposure.ts): whether the study
 * defined one, which test decides, the range and criteria set, the run length, the longest gap,
 * and the comparison group's own definition. Plain labels, a one-line explanation under each
 * (aria-describedby), every choice a select so nothing typed needs parsing. Controlled: the
 * parent holds the value (undefined when the study defined none) and validates it on save with
 * the entry schema; problems for these fields arrive in `issues` and show under their field.
 *
 * Props:
 * - value: the definition, or undefined;
 * - onChange(value): the new definition, or undefined when "no exposure definition" is chosen;
 * - issues: problems whose path ends in a field of the definition (e.g. ["exposureDefinition", "minYears"]).
 */
import { useId } from 'react';
import { DECIDING_TEST_LABELS as TEST_LABELS, EXPOSURE_FIELD_TEXT as TEXT, GAP_MONTHS as GAPS, RANGE_LABELS, RUN_YEARS as YEARS } from '@/lib/evidence/exposureForm';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import {
  CRITERIA_SETS,
  DECIDING_TESTS,
  GLYCAEMIC_CATEGORIES,
  MAX_RUN_GAP_MONTHS,
  type DecidingTest,
  type ExposureDefinition,
  type GlycaemicCategory,
} from '@/lib/glycaemia/exposure';
import type { Issue } from '@/lib/result';

export interface ExposureFieldsProps {
  readonly value: ExposureDefinition | undefined;
  readonly onChange: (value: ExposureDefinition | undefined) => void;
  readonly issues?: readonly Issue[];
}

/** A new definition's starting values: the common shape of a workforce study. */
export const DEFAULT_EXPOSURE: ExposureDefinition = { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'either', comparison: { category: 'normal' } };

/** The entry with this exposure definition, or with none. */
export function withExposure(entry: EvidenceEntry, exposure: ExposureDefinition | undefined): EvidenceEntry {
  const { exposureDefinition: _previous, ...rest } = entry;
  return exposure ? { ...rest, exposureDefinition: exposure } : rest;
}

function withYears(list: readonly number[], current: number | undefined): number[] {
  return current !== undefined && !list.includes(current) ? [...list, current].sort((a, b) => a - b) : [...list];
}

export function ExposureFields({ value, onChange, issues = [] }: ExposureFieldsProps) {
  const id = useId();
  const errorsFor = (...path: string[]) =>
    issues.filter((i) => {
      const tail = i.path.slice(i.path.indexOf('exposureDefinition') + 1).map(String);
      return tail.join('.') === path.join('.');
    });

  function field(key: string, label: string, hint: string, control: (props: { id: string; 'aria-describedby': string; 'aria-invalid'?: true }) => React.ReactNode, path: string[]) {
    const errs = errorsFor(...path);
    const controlId = `${id}-${key}`;
    const hintId = `${controlId}-hint`;
    const errorId = `${controlId}-error`;
    return (
      <div className={`field field--long${errs.length > 0 ? ' field--invalid' : ''}`}>
        <label className="field__label" htmlFor={controlId}>
          {label}
        </label>
        <p className="field__hint" id={hintId}>
          {hint}
        </p>
        {control({ id: controlId, 'aria-describedby': errs.length > 0 ? `${hintId} ${errorId}` : hintId, ...(errs.length > 0 ? { 'aria-invalid': true as const } : {}) })}
        {errs.length > 0 && (
          <p className="field__error" id={errorId}>
            {errs.map((e) => e.message).join(' ')}
          </p>
        )}
      </div>
    );
  }

  const defined = value !== undefined;
  const current = value ?? DEFAULT_EXPOSURE;
  const set = (patch: Partial<ExposureDefinition>) => onChange({ ...current, ...patch });

  return (
    <fieldset className="subsection">
      <legend className="subsection__title">Exposure over time (optional)</legend>
      {field(
        'defined',
        TEXT.defined.label,
        TEXT.defined.hint,
        (props) => (
          <select {...props} className="field__input" value={defined ? 'yes' : 'no'} onChange={(e) => onChange(e.target.value === 'yes' ? current : undefined)}>
            <option value="no">No, or not stated</option>
            <option value="yes">Yes</option>
          </select>
        ),
        [],
      )}
      {defined && (
        <>
          {field(
            'test',
            TEXT.test.label,
            TEXT.test.hint,
            (props) => (
              <select {...props} className="field__input" value={current.test ?? 'either'} onChange={(e) => set({ test: e.target.value as DecidingTest })}>
                {DECIDING_TESTS.map((t) => (
                  <option key={t} value={t}>
                    {TEST_LABELS[t]}
                  </option>
                ))}
              </select>
            ),
            ['test'],
          )}
          {field(
            'category',
            TEXT.category.label,
            TEXT.category.hint,
            (props) => (
              <select {...props} className="field__input" value={current.category} onChange={(e) => set({ category: e.target.value as GlycaemicCategory })}>
                {GLYCAEMIC_CATEGORIES.map((c) => (
                  <option key={c} value={c}>
                    {RANGE_LABELS[c]}
                  </option>
                ))}
              </select>
            ),
            ['category'],
          )}
          {field(
            'criteria',
            TEXT.criteria.label,
            TEXT.criteria.hint,
            (props) => (
              <select {...props} className="field__input" value={current.criteria} onChange={(e) => set({ criteria: e.target.value as ExposureDefinition['criteria'] })}>
                {CRITERIA_SETS.map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </select>
            ),
            ['criteria'],
          )}
          {field(
            'minYears',
            TEXT.minYears.label,
            TEXT.minYears.hint,
            (props) => (
              <select {...props} className="field__input" value={String(current.minYears)} onChange={(e) => set({ minYears: Number(e.target.value) })}>
                {withYears(YEARS, current.minYears).map((n) => (
                  <option key={n} value={String(n)}>
                    {n}
                  </option>
                ))}
              </select>
            ),
            ['minYears'],
          )}
          {field(
            'maxGapMonths',
            TEXT.maxGapMonths.label,
            TEXT.maxGapMonths.hint,
            (props) => (
              <select {...props} className="field__input" value={String(current.maxGapMonths ?? MAX_RUN_GAP_MONTHS)} onChange={(e) => set({ maxGapMonths: Number(e.target.value) })}>
                {GAPS.map((n) => (
                  <option key={n} value={String(n)}>
                    {n} months
                  </option>
                ))}
              </select>
            ),
            ['maxGapMonths'],
          )}
          {field(
            'comparison',
            TEXT.comparison.label,
            TEXT.comparison.hint,
            (props) => (
              <select
                {...props}
                className="field__input"
                value={current.comparison?.category ?? ''}
                onChange={(e) => {
                  const category = e.target.value as GlycaemicCategory | '';
                  const { comparison: _previous, ...rest } = current;
                  onChange(category === '' ? rest : { ...rest, comparison: { ...(current.comparison ?? {}), category } });
                }}
              >
                <option value="">Not stated</option>
                {GLYCAEMIC_CATEGORIES.map((c) => (
                  <option key={c} value={c}>
                    {RANGE_LABELS[c]}
                  </option>
                ))}
              </select>
            ),
            ['comparison', 'category'],
          )}
          {current.comparison &&
            field(
              'comparisonYears',
              TEXT.comparisonYears.label,
              TEXT.comparisonYears.hint,
              (props) => (
                <select
                  {...props}
                  className="field__input"
                  value={current.comparison?.minYears === undefined ? '' : String(current.comparison.minYears)}
                  onChange={(e) => {
                    const category = current.comparison?.category ?? 'normal';
                    set({ comparison: e.target.value === '' ? { category } : { category, minYears: Number(e.target.value) } });
                  }}
                >
                  <option value="">Same as the exposed group</option>
                  {withYears(YEARS, current.comparison?.minYears).map((n) => (
                    <option key={n} value={String(n)}>
                      {n}
                    </option>
                  ))}
                </select>
              ),
              ['comparison', 'minYears'],
            )}
        </>
      )}
    </fieldset>
  );
}
