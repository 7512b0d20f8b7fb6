/**
 * JSON as the command reads it: `JSON.parse`, plus what it lets through silently and the command
 * refuses — a key given twice in one object (JSON.parse keeps the last, so one of two values a
 * file gives for the same field would vanish unseen; RFC 8259 §4 says names SHOULD be unique)
 * and an object with more than {@link MAX_OBJECT_KEYS} keys (no input this command reads has
 * more than a few dozen; a huge one is a damaged or hostile file, refused in one line).
 */
import { fail, formatPath, ok, type Result } from '../result';

/** The most keys one JSON object may have: far above any real input (a scenario has under 30). */
export const MAX_OBJECT_KEYS = 10_000;

type Frame =
  | { readonly kind: 'object'; readonly keys: Set<string>; expectKey: boolean; key: string | undefined; readonly at: string | number | undefined }
  | { readonly kind: 'array'; index: number; readonly at: string | number | undefined };

function pathOf(stack: readonly Frame[]): (string | number)[] {
  const path: (string | number)[] = [];
  for (let i = 1; i < stack.length; i += 1) {
    const at = stack[i]?.at;
    if (at !== undefined) path.push(at);
  }
  return path;
}

/** Where the next value sits in its parent: the object's current key or the array's index. */
function slot(top: Frame | undefined): string | number | undefined {
  if (top === undefined) return undefined;
  return top.kind === 'object' ? top.key : top.index;
}

/**
 * Scans valid JSON text once (linear, no recursion, so any depth) for a repeated key or an
 * oversized object; undefined when there is none.
 */
function structureProblem(text: string): { path: (string | number)[]; message: string } | undefined {
  const stack: Frame[] = [];
  let i = 0;
  const n = text.length;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === 0x22) {
      // A string: find its closing quote, stepping over escapes.
      let j = i + 1;
      let escaped = false;
      while (j < n) {
        const d = text.charCodeAt(j);
        if (d === 0x5c) {
          escaped = true;
          j += 2;
          continue;
        }
        if (d === 0x22) break;
        j += 1;
      }
      const top = stack[stack.length - 1];
      if (top?.kind === 'object' && top.expectKey) {
        const raw = text.slice(i + 1, j);
        const key = escaped ? (JSON.parse(`"${raw}"`) as string) : raw;
        if (top.keys.has(key)) {
          const where = pathOf(stack);
          return {
            path: [...where, key],
            message: `The input gives "${key}" twice in ${where.length === 0 ? 'the same object' : formatPath(where)}; each field may appear once, since which value was meant cannot be told`,
          };
        }
        top.keys.add(key);
        if (top.keys.size > MAX_OBJECT_KEYS) {
          return {
            path: pathOf(stack),
            message: `An object in the input has more than ${MAX_OBJECT_KEYS.toLocaleString('en-GB')} fields; none of the inputs this command reads has more than a few dozen, so the file is damaged or not the expected kind`,
          };
        }
        top.key = key;
        top.expectKey = false;
      }
      i = j + 1;
      continue;
    }
    if (c === 0x7b || c === 0x5b) {
      const at = slot(stack[stack.length - 1]);
      stack.push(c === 0x7b ? { kind: 'object', keys: new Set(), expectKey: true, key: undefined, at } : { kind: 'array', index: 0, at });
    } else if (c === 0x7d || c === 0x5d) {
      stack.pop();
    } else if (c === 0x2c) {
      const top = stack[stack.length - 1];
      if (top?.kind === 'object') top.expectKey = true;
      else if (top?.kind === 'array') top.index += 1;
    }
    i += 1;
  }
  return undefined;
}

/**
 * Parses JSON text as the command does: malformed JSON, a repeated key and an oversized object
 * are issues (`invalid-json`, with the path where known), never a throw.
 *
 * @example
 * parseJsonStrict('{"risk": 0.08, "risk": 0.8}')
 * //=> { ok: false, issues: [{ code: 'invalid-json', path: ['risk'], message: 'The input gives "risk" twice in the same object; …' }] }
 */
export function parseJsonStrict(text: string): Result<unknown> {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'it is nested too deeply to read';
    return fail([{ code: 'invalid-json', path: [], message: `The input is not valid JSON (${detail})` }]);
  }
  if (typeof value !== 'object' || value === null) return ok(value);
  const problem = structureProblem(text);
  if (problem !== undefined) return fail([{ code: 'invalid-json', ...problem }]);
  return ok(value);
}
