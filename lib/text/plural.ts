/**
 * The singular or plural noun for a count: 1 takes the singular, every other count the plural
 * (English; common practice).
 * @example
 * plural(1, 'person', 'people') //=> "person"
 * plural(0, 'row', 'rows') //=> "rows"
 */
export function plural(count: number, singular: string, pluralForm: string): string {
  return count === 1 ? singular : pluralForm;
}
