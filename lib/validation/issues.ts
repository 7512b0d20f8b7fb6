/**
 * Turns zod's failures into the project's {@link Issue}s: a stable code, the field path and a
 * plain message. Shared by every schema in lib/ (scenario, tables, evidence, templates,
 * storage records, glucose history) so that the form, the URL, the command line and every
 * import report problems the same way. Codes are listed in DEVELOPERS.md.
 */
import type { z } from 'zod';
import type { Issue, IssueCode } from '../result';

type ZodIssue = z.core.$ZodIssue;

function codeFor(issue: ZodIssue): IssueCode {
  switch (issue.code) {
    case 'invalid_type':
      if (!('input' in issue) || issue.input === undefined) return 'required';
      if (issue.expected === 'int') return 'not-a-whole-number';
      return issue.expected === 'number' ? 'not-a-number' : 'wrong-type';
    case 'too_small':
    case 'too_big':
      return issue.origin === 'string' ? 'too-long' : 'out-of-range';
    case 'invalid_value':
      // A choice given nothing is a missing field, like any other (needs reportInput: true).
      if ('input' in issue && issue.input === undefined) return 'required';
      return 'invalid-choice';
    case 'invalid_union':
      return 'invalid-choice';
    case 'unrecognized_keys':
      return 'unknown-field';
    case 'custom': {
      const code = (issue.params as { code?: unknown } | undefined)?.code;
      return typeof code === 'string' ? code : 'invalid';
    }
    default:
      return 'invalid';
  }
}

/**
 * Maps zod issues to project issues. Unknown keys become one issue per key, naming it, so
 * nothing the user typed is silently dropped.
 */
export function toIssues(zodIssues: readonly ZodIssue[]): Issue[] {
  const out: Issue[] = [];
  for (const issue of zodIssues) {
    const path = issue.path.filter((p): p is string | number => typeof p !== 'symbol');
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        out.push({ code: 'unknown-field', path: [...path, key], message: `"${key}" is not a field here; check its spelling` });
      }
      continue;
    }
    // Messages from zod's own defaults start lower-case and are technical; ours are set in the schemas.
    out.push({ code: codeFor(issue), path, message: issue.message });
  }
  return out;
}

/**
 * For a union whose options are told apart by which key is present (the baseline forms),
 * report the issues of the option the user evidently meant rather than zod's generic
 * "invalid input".
 *
 * @param issue - the union's failure
 * @param formKeys - for each union option, in order, the key that selects it
 * @param value - the value that failed (the union's input)
 */
export function pickUnionBranch(
  issue: ZodIssue,
  formKeys: readonly string[],
  value: unknown,
): ZodIssue[] | undefined {
  if (issue.code !== 'invalid_union' || typeof value !== 'object' || value === null) return undefined;
  const index = formKeys.findIndex((key) => key in value);
  if (index < 0) return undefined;
  const branch = issue.errors[index];
  if (!branch) return undefined;
  return branch.map((inner) => ({ ...inner, path: [...issue.path, ...inner.path] }) as ZodIssue);
}
