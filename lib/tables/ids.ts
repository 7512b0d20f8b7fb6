/** Ids for saved tables and evidence entries: made from a title, kept unique in a library. */
import { ID_PATTERN, MAX_ID } from './schema';

/**
 * An id made from a title: lower-case ASCII letters and digits joined by "-".
 *
 * @example
 * idFromTitle('Heart failure (10 y), Région Nord') //=> 'heart-failure-10-y-region-nord'
 * idFromTitle('!!!') //=> 'table'
 */
export function idFromTitle(title: string, fallback = 'table'): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, MAX_ID - 10)
    .replace(/-+$/, '');
  return slug && ID_PATTERN.test(slug) ? slug : fallback;
}

/**
 * `base`, or `base-2`, `base-3` … : the first not in `taken`.
 *
 * @example
 * uniqueId('hf', new Set(['hf', 'hf-2'])) //=> 'hf-3'
 */
export function uniqueId(base: string, taken: ReadonlySet<string>): string {
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) {
    const candidate = `${base}-${n}`;
    if (!taken.has(candidate)) return candidate;
  }
}
