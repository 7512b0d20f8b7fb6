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
import type { EvidenceEntry } from '@/lib/evidence/schema';
import {
  CRITERIA_SETS,
  DECIDING_TESTS,
  GLYCAEMIC_CATEGORIES,
  MAX_RUN_GAP_MONTHS,
  MIN_RUN_GAP_MONTHS,
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

const TEST_LABELS: Readonly<Record<DecidingTest, string>> = {
  either: 'HbA1c or fasting glucose (the higher range counts)',
  hba1c: 'HbA1c only',
  fpg: 'Fasting glucose only',
  both: 'Both tests, in the same range',
};

const RANGE_LABELS: Readonly<Record<GlycaemicCategory, string>> = {
  normal: 'Normal range',
  prediabetes: 'Prediabetes range',
  'diabetes-range': 'Diabetes range',
};

/** A new definition's starting values: the common shape of a workforce study. */
export const DEFAULT_EXPOSURE: ExposureDefinition = { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'either', comparison: { category: 'normal' } };

const YEARS = Array.from({ length: 15 }, (_, i) => i + 1);
const GAPS = Array.from({ length: MAX_RUN_GAP_MONTHS - MIN_RUN_GAP_MONTHS + 1 }, (_, i) => MIN_RUN_GAP_MONTHS + i);

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
        'Does the study define its exposure over time?',
        'Needed to check a person’s checkup history, or a workforce’s, against the study.',
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
            'Which test decides',
            'The test the study used to place people in a range at each checkup.',
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
            'Range of the exposed group',
            'The range the exposed people were in, for example the prediabetes range.',
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
            'Criteria set',
            'Whose cut-points the study used for the ranges: ADA, WHO or NICE.',
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
            'Yearly results in a row',
            'How many yearly checkups in a row had to be in that range.',
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
            'Longest gap allowed between checkups',
            'A longer gap breaks the run; 18 months is a missed yearly round.',
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
            'Range of the comparison group',
            'The range the comparison people stayed in, for example the normal range.',
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
              'Comparison: yearly results in a row',
              'Leave at “same as the exposed group” when the study compared the same span.',
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
