'use client';
/**
 * Form controls wired to react-hook-form: a visible label, an optional hint, and the field's
 * error inline — linked with aria-describedby and announced politely (aria-live). An error shows
 * once the clinician has touched or changed the field, so an untouched blank field is not
 * scolded while the clinician is still working further up the form.
 */
import { useId, type ReactNode } from 'react';
import { useFormContext, useFormState, type FieldPath, type RegisterOptions } from 'react-hook-form';
import type { ConsultationFormValues } from './formModel';

export type FieldName = FieldPath<ConsultationFormValues>;

/** The DOM id of a field's control, derived from its name so links and tests can find it. */
export function fieldDomId(name: FieldName): string {
  return `field-${name.replace(/\./g, '-')}`;
}

function useVisibleError(name: FieldName): string | undefined {
  const { getFieldState } = useFormContext<ConsultationFormValues>();
  const formState = useFormState<ConsultationFormValues>({ name, exact: true });
  const state = getFieldState(name, formState);
  if (!state.error?.message) return undefined;
  return state.isTouched || state.isDirty ? state.error.message : undefined;
}

function describedBy(...ids: (string | false | undefined)[]): string | undefined {
  const list = ids.filter((id): id is string => typeof id === 'string' && id.length > 0);
  return list.length > 0 ? list.join(' ') : undefined;
}

function ErrorText({ id, message }: { id: string; message: string | undefined }) {
  return (
    <p id={id} className="field__error" aria-live="polite">
      {message ? <span>{message}</span> : null}
    </p>
  );
}

/** What every field derives from its name: the visible error, the control's id and its aria wiring. */
function useFieldWiring(name: FieldName, hasHint: boolean) {
  const error = useVisibleError(name);
  const id = fieldDomId(name);
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  return { error, id, hintId, errorId, describedBy: describedBy(hasHint ? hintId : undefined, error ? errorId : undefined) };
}

function Hint({ id, hint }: { id: string; hint: ReactNode }) {
  return hint ? (
    <p id={id} className="field__hint">
      {hint}
    </p>
  ) : null;
}

/** A labelled single control (text box or select) with its hint and inline error. */
function FieldFrame({ wiring, label, hint, size, children }: { wiring: ReturnType<typeof useFieldWiring>; label: string; hint: ReactNode; size: 'short' | 'long'; children: ReactNode }) {
  return (
    <div className={`field field--${size}${wiring.error ? ' field--invalid' : ''}`}>
      <label htmlFor={wiring.id} className="field__label">
        {label}
      </label>
      <Hint id={wiring.hintId} hint={hint} />
      {children}
      <ErrorText id={wiring.errorId} message={wiring.error} />
    </div>
  );
}

interface TextFieldProps {
  readonly name: FieldName;
  readonly label: string;
  readonly hint?: ReactNode;
  /** "decimal" for numbers (the default), "text" for words. */
  readonly kind?: 'decimal' | 'numeric' | 'text';
  readonly size?: 'short' | 'long';
  readonly deps?: FieldName[];
  readonly placeholder?: string;
}

export function TextField({ name, label, hint, kind = 'decimal', size = 'short', deps, placeholder }: TextFieldProps) {
  const { register } = useFormContext<ConsultationFormValues>();
  const wiring = useFieldWiring(name, Boolean(hint));
  const options: RegisterOptions<ConsultationFormValues, FieldName> = deps ? { deps } : {};
  return (
    <FieldFrame wiring={wiring} label={label} hint={hint} size={size}>
      <input
        id={wiring.id}
        type="text"
        inputMode={kind === 'text' ? 'text' : kind}
        autoComplete="off"
        spellCheck={kind === 'text'}
        className="field__input"
        placeholder={placeholder}
        aria-invalid={wiring.error ? true : undefined}
        aria-describedby={wiring.describedBy}
        {...register(name, options)}
      />
    </FieldFrame>
  );
}

export interface Choice {
  readonly value: string;
  readonly label: string;
  /** One plain sentence saying what the choice means. */
  readonly explanation?: string;
}

interface SelectFieldProps {
  readonly name: FieldName;
  readonly label: string;
  readonly hint?: ReactNode;
  readonly choices: readonly Choice[];
  readonly onChosen?: (value: string) => void;
}

export function SelectField({ name, label, hint, choices, onChosen }: SelectFieldProps) {
  const { register } = useFormContext<ConsultationFormValues>();
  const wiring = useFieldWiring(name, Boolean(hint));
  const registered = register(name, onChosen ? { onChange: (event: { target: { value: string } }) => onChosen(event.target.value) } : {});
  return (
    <FieldFrame wiring={wiring} label={label} hint={hint} size="long">
      <select id={wiring.id} className="field__input" aria-invalid={wiring.error ? true : undefined} aria-describedby={wiring.describedBy} {...registered}>
        {choices.map((choice) => (
          <option key={choice.value} value={choice.value}>
            {choice.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

interface RadioFieldProps {
  readonly name: FieldName;
  readonly legend: string;
  readonly hint?: ReactNode;
  readonly choices: readonly Choice[];
  readonly layout?: 'row' | 'column';
  readonly onChosen?: (value: string) => void;
}

export function RadioField({ name, legend, hint, choices, layout = 'column', onChosen }: RadioFieldProps) {
  const { register } = useFormContext<ConsultationFormValues>();
  const { error, id: base, hintId, errorId, describedBy: described } = useFieldWiring(name, Boolean(hint));
  const uid = useId();
  const registered = register(name, onChosen ? { onChange: (event: { target: { value: string } }) => onChosen(event.target.value) } : {});
  return (
    <fieldset
      className={`field field--choices field--${layout}${error ? ' field--invalid' : ''}`}
      aria-describedby={described}
    >
      <legend className="field__label">{legend}</legend>
      <Hint id={hintId} hint={hint} />
      <div className="choices">
        {choices.map((choice, i) => {
          const id = i === 0 ? base : `${base}-${i}`;
          const explainId = `${uid}-explain-${i}`;
          return (
            <div key={choice.value} className="choice">
              <input id={id} type="radio" value={choice.value} className="choice__input" aria-describedby={choice.explanation ? explainId : undefined} {...registered} />
              <label htmlFor={id} className="choice__label">
                {choice.label}
              </label>
              {choice.explanation ? (
                <p id={explainId} className="choice__explain">
                  {choice.explanation}
                </p>
              ) : null}
            </div>
          );
        })}
      </div>
      <ErrorText id={errorId} message={error} />
    </fieldset>
  );
}
