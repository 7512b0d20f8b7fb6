/**
 * Lists of problems from an imported file, kept readable: at most {@link MAX_LISTED_PROBLEMS}
 * listed, the rest counted in one last line, and each message cut to {@link MAX_PROBLEM_CHARS}
 * characters so a file with one enormous cell never floods the page.
 */
import type { Issue } from '../result';

/** Most problems listed for one file; beyond it one last problem says how many more there were. */
export const MAX_LISTED_PROBLEMS = 1000;
/** Longest problem message shown, in characters (about three lines of text). */
export const MAX_PROBLEM_CHARS = 300;

/**
 * `text` cut to at most `max` characters, ending "…" when cut (never inside a surrogate pair).
 *
 * @example
 * cutText('abcdef', 4) //=> 'abc…'
 */
export function cutText(text: string, max = MAX_PROBLEM_CHARS): string {
  if (text.length <= max) return text;
  let end = Math.max(0, max - 1);
  const c = text.charCodeAt(end - 1);
  if (c >= 0xd800 && c <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}

function plural(n: number, one: string, many: string): string {
  return `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;
}

/** The last line of a capped list: "… and 12 more problems not listed; fix the ones above and check again". */
export function moreProblems(count: number): Issue {
  return { code: 'too-many-problems', path: [], message: `… and ${plural(count, 'more problem', 'more problems')} not listed; fix the ones above and check again` };
}

/**
 * At most `max` of `issues`, each message cut to {@link MAX_PROBLEM_CHARS}, then one
 * `too-many-problems` line counting the rest.
 *
 * @example
 * capProblems([a, b, c], 2) //=> [a, b, { code: 'too-many-problems', message: '… and 1 more problem not listed; …' }]
 */
export function capProblems<T extends Issue>(issues: readonly T[], max = MAX_LISTED_PROBLEMS): (T | Issue)[] {
  const listed: (T | Issue)[] = issues.slice(0, max).map((i) => (i.message.length > MAX_PROBLEM_CHARS ? { ...i, message: cutText(i.message) } : i));
  if (issues.length > max) listed.push(moreProblems(issues.length - max));
  return listed;
}
