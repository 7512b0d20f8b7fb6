'use client';
/**
 * One family of form controls wired to react-hook-form, for any form (the consultation form
 * here; the evidence editor and the glucose rows can use the same): a visible label, an
 * optional hint, an optional flag (e.g. a wording left over from a saved entry), and the
 * field's error inline — linked with aria-describedby and announced politely (aria-live). An
 * error shows once the field has been touched or changed, so an untouched blank field is not
 * scolded while the user is still working further up the form.
 *
 * Each component is generic over the form's values: `TextField<MyValues>` checks `name`
 * against that form. The default is the consultation form.
 */
import { createContext, useContext, useEffect, useId, useRef, useSyncExternalStore, type ReactNode } from 'react';
import { useFormContext, useFormState, useWatch, type FieldPath, type FieldValues, type RegisterOptions } from 'react-hook-form';
import type { Choice } from '@/lib/consultation/choices';
import type { ConsultationFormValues } from '@/lib/consultation/formValues';

export type FieldName<T extends FieldValues = ConsultationFormValues> = FieldPath<T>;

/**
 * On a narrow screen the result is below the form, so after every change a link to it appears
 * right under the field that changed (issue 12 item 11): in the page's flow, so it never covers
 * another control, and one tap away wherever the clinician is on the page. The screen tells the
 * store which field changed last and whether there is a result yet; each field asks only
 * whether it is that field, so a change redraws two fields at most.
 */
export interface ResultLinkStore {
  subscribe(listener: () => void): () => void;
  /** The link's words under this field, or null when it is not the field that changed last. */
  linkFor(name: string): string | null;
  changed(name: string | undefined): void;
  setText(text: string): void;
}

export function createResultLinkStore(initialText: string): ResultLinkStore {
  let last: string | undefined;
  let text = initialText;
  const listeners = new Set<() => void>();
  const notify = () => listeners.forEach((listener) => listener());
  return {
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    linkFor: (name) => (name === last ? text : null),
    changed(name) {
      if (name === last) return;
      last = name;
      notify();
    },
    setText(next) {
      if (next === text) return;
      text = next;
      notify();
    },
  };
}

export const ResultLinkContext = createContext<ResultLinkStore | null>(null);

const noSubscription = () => () => {};

function ResultLink({ name }: { name: string }) {
  const store = useContext(ResultLinkContext);
  const text = useSyncExternalStore(
    store?.subscribe ?? noSubscription,
    () => store?.linkFor(name) ?? null,
    () => null,
  );
  const ref = useRef<HTMLAnchorElement>(null);
  // When it appears below the bottom of the screen (the field was at the very bottom), the page
  // moves just enough to show it; where it is already in view, nothing moves.
  const shown = text !== null;
  useEffect(() => {
    if (shown) ref.current?.scrollIntoView({ block: 'nearest' });
  }, [shown]);
  return text ? (
    <a ref={ref} className="see-result see-result--inline" href="#result" data-testid="see-result-inline">
      {text}
    </a>
  ) : null;
}

/** The DOM id of a field's control, derived from its name so links and tests can find it. */
export function fieldDomId(name: string, prefix = 'field-'): string {
  return `${prefix}${name.replace(/\./g, '-')}`;
}

/**
 * The start of every field id inside it: "field-" for the consultation form; another form on
 * the same page (the library's evidence editor) gives its own, so no two controls share an id.
 */
export const FieldIdPrefix = createContext('field-');

function useVisibleError<T extends FieldValues>(name: FieldPath<T>): string | undefined {
  const { getFieldState } = useFormContext<T>();
  const formState = useFormState<T>({ name, exact: true });
  const state = getFieldState(name, formState);
  if (!state.error?.message) return undefined;
  return state.isTouched || state.isDirty || formState.isSubmitted ? state.error.message : undefined;
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
function useFieldWiring<T extends FieldValues>(name: FieldPath<T>, hasHint: boolean, hasFlag: boolean) {
  const error = useVisibleError<T>(name);
  const id = fieldDomId(name, useContext(FieldIdPrefix));
  const hintId = `${id}-hint`;
  const flagId = `${id}-flag`;
  const errorId = `${id}-error`;
  return { error, id, hintId, flagId, errorId, describedBy: describedBy(hasHint ? hintId : undefined, hasFlag ? flagId : undefined, error ? errorId : undefined) };
}

type Wiring = ReturnType<typeof useFieldWiring>;

function Hint({ id, hint }: { id: string; hint: ReactNode }) {
  return hint ? (
    <p id={id} className="field__hint">
      {hint}
    </p>
  ) : null;
}

function Flag({ id, flag }: { id: string; flag: ReactNode }) {
  return flag ? (
    <div id={id} className="field__flag-box">
      {flag}
    </div>
  ) : null;
}

/**
 * The same family without react-hook-form, for rows whose state a screen holds itself (the
 * glucose history's checkups, app/components/glucose): the same frame — visible label, the
 * inline error linked with aria-describedby and announced politely — around a controlled text
 * box or select. The caller gives the id, the value, the error (from a lib view model) and any
 * hint ids kept elsewhere on the page.
 */
interface PlainFieldProps {
  readonly id: string;
  readonly label: string;
  readonly value: string;
  readonly onChange: (value: string) => void;
  /** The error to show under the control; none when undefined. */
  readonly error?: string | undefined;
  /** Ids of hints shown elsewhere (one hint for every row), read before the error. */
  readonly hintIds?: readonly string[];
  readonly className?: string;
}

function PlainFrame({ id, label, error, className, children }: { id: string; label: string; error: string | undefined; className: string | undefined; children: ReactNode }) {
  return (
    <div className={`field${className ? ` ${className}` : ''}${error ? ' field--invalid' : ''}`}>
      <label htmlFor={id} className="field__label">
        {label}
      </label>
      {children}
      <ErrorText id={`${id}-error`} message={error} />
    </div>
  );
}

export function PlainTextField({ id, label, value, onChange, error, hintIds = [], className, kind = 'text' }: PlainFieldProps & { readonly kind?: 'decimal' | 'text' }) {
  return (
    <PlainFrame id={id} label={label} error={error} className={className}>
      <input
        id={id}
        className="field__input"
        type="text"
        autoComplete="off"
        inputMode={kind === 'decimal' ? 'decimal' : undefined}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(...hintIds, error ? `${id}-error` : undefined)}
      />
    </PlainFrame>
  );
}

export function PlainSelectField({ id, label, value, onChange, error, hintIds = [], className, choices }: PlainFieldProps & { readonly choices: readonly Choice[] }) {
  return (
    <PlainFrame id={id} label={label} error={error} className={className}>
      <select
        id={id}
        className="field__input"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(...hintIds, error ? `${id}-error` : undefined)}
      >
        {choices.map((choice) => (
          <option key={choice.value} value={choice.value}>
            {choice.label}
          </option>
        ))}
      </select>
    </PlainFrame>
  );
}

/** A labelled single control (text box or select) with its hint, flag and inline error. */
function FieldFrame({ name, wiring, label, hint, flag, size, children }: { name: string; wiring: Wiring; label: string; hint: ReactNode; flag: ReactNode; size: 'short' | 'long'; children: ReactNode }) {
  return (
    <div className={`field field--${size}${wiring.error ? ' field--invalid' : ''}${flag ? ' field--flagged' : ''}`}>
      <label htmlFor={wiring.id} className="field__label">
        {label}
      </label>
      <Hint id={wiring.hintId} hint={hint} />
      {children}
      <Flag id={wiring.flagId} flag={flag} />
      <ErrorText id={wiring.errorId} message={wiring.error} />
      <ResultLink name={name} />
    </div>
  );
}

interface CommonProps<T extends FieldValues> {
  readonly name: FieldPath<T>;
  readonly label: string;
  readonly hint?: ReactNode;
  /** Something the user must look at, shown under the control (and linked to it). */
  readonly flag?: ReactNode;
}

interface TextFieldProps<T extends FieldValues> extends CommonProps<T> {
  /** "decimal" for numbers (the default), "numeric" for whole numbers, "text" for words, "multiline" for a paragraph. */
  readonly kind?: 'decimal' | 'numeric' | 'text' | 'multiline';
  readonly size?: 'short' | 'long';
  readonly deps?: FieldPath<T>[];
  readonly placeholder?: string;
}

export function TextField<T extends FieldValues = ConsultationFormValues>({ name, label, hint, flag, kind = 'decimal', size = 'short', deps, placeholder }: TextFieldProps<T>) {
  const { register } = useFormContext<T>();
  const wiring = useFieldWiring<T>(name, Boolean(hint), Boolean(flag));
  const options: RegisterOptions<T, FieldPath<T>> = deps ? { deps } : {};
  return (
    <FieldFrame name={name} wiring={wiring} label={label} hint={hint} flag={flag} size={size}>
      {kind === 'multiline' ? (
        <textarea
          id={wiring.id}
          rows={3}
          className="field__input"
          placeholder={placeholder}
          aria-invalid={wiring.error ? true : undefined}
          aria-describedby={wiring.describedBy}
          {...register(name, options)}
        />
      ) : (
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
      )}
    </FieldFrame>
  );
}

export type { Choice };

interface ChoiceFieldProps<T extends FieldValues> extends CommonProps<T> {
  readonly choices: readonly Choice[];
  readonly onChosen?: (value: string) => void;
}

/**
 * A select whose shown value follows the form's value on every render, so an option added in
 * the same render as the value (a table taken from the library) is shown chosen at once.
 */
export function SelectField<T extends FieldValues = ConsultationFormValues>({ name, label, hint, flag, choices, onChosen }: ChoiceFieldProps<T>) {
  const { register, control } = useFormContext<T>();
  const value: unknown = useWatch({ control, name });
  const wiring = useFieldWiring<T>(name, Boolean(hint), Boolean(flag));
  const registered = register(name, onChosen ? { onChange: (event: { target: { value: string } }) => onChosen(event.target.value) } : {});
  return (
    <FieldFrame name={name} wiring={wiring} label={label} hint={hint} flag={flag} size="long">
      <select
        id={wiring.id}
        className="field__input"
        aria-invalid={wiring.error ? true : undefined}
        aria-describedby={wiring.describedBy}
        {...registered}
        value={typeof value === 'string' ? value : ''}
      >
        {choices.map((choice) => (
          <option key={choice.value} value={choice.value}>
            {choice.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

interface RadioFieldProps<T extends FieldValues> extends Omit<ChoiceFieldProps<T>, 'label' | 'flag'> {
  readonly legend: string;
  readonly layout?: 'row' | 'column';
}

export function RadioField<T extends FieldValues = ConsultationFormValues>({ name, legend, hint, choices, layout = 'column', onChosen }: RadioFieldProps<T>) {
  const { register } = useFormContext<T>();
  const { error, id: base, hintId, errorId, describedBy: described } = useFieldWiring<T>(name, Boolean(hint), false);
  const uid = useId();
  const registered = register(name, onChosen ? { onChange: (event: { target: { value: string } }) => onChosen(event.target.value) } : {});
  return (
    <fieldset className={`field field--choices field--${layout}${error ? ' field--invalid' : ''}`} aria-describedby={described}>
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
      <ResultLink name={name} />
    </fieldset>
  );
}
