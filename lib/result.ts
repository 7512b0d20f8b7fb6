/**
 * Errors and warnings as data: the one policy for the whole engine.
 *
 * Every function at an edge (a form, the URL, the command line, an import) returns a
 * {@link Result}: either the valid value or a list of {@link Issue}s, each with a stable
 * code, the path of the field it concerns and a plain message saying what is allowed.
 * Nothing here throws for bad input; the UI and the CLI only render these objects.
 */

/** A stable, machine-readable issue code. Documented in DEVELOPERS.md; never renamed. */
export type IssueCode =
  | 'invalid-json'
  | 'required'
  | 'not-a-number'
  | 'not-a-whole-number'
  | 'wrong-type'
  | 'out-of-range'
  | 'invalid-choice'
  | 'unknown-field'
  | 'too-long'
  | 'baseline-form'
  | 'horizon-required'
  | 'interval-order'
  | 'estimate-outside-interval'
  | 'invalid-link'
  | (string & {});

/** One problem with an input: which field, what went wrong, what is allowed. */
export interface Issue {
  readonly code: IssueCode;
  /** Field path from the root of the input, e.g. ["effect", "lower"]. Empty for the whole input. */
  readonly path: readonly (string | number)[];
  readonly message: string;
}

/** A caution about a valid input or its result. Never printed to a console: it travels with the result. */
export interface Warning {
  readonly code: string;
  readonly message: string;
}

export type Result<T> =
  | { readonly ok: true; readonly value: T }
  | { readonly ok: false; readonly issues: readonly Issue[] };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T = never>(issues: readonly Issue[]): Result<T> {
  return { ok: false, issues };
}

/** A dotted field path for messages: ["effect", "lower"] → "effect.lower"; [] → "input". */
export function formatPath(path: readonly (string | number)[]): string {
  if (path.length === 0) return 'input';
  return path
    .map((part, i) => (typeof part === 'number' ? `[${part}]` : i === 0 ? part : `.${part}`))
    .join('');
}
