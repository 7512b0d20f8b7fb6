/**
 * A phrase at the start of a line or sentence: first letter upper case, the rest as written.
 * @example
 * capitalise('women aged 40 to 49') //=> "Women aged 40 to 49"
 */
export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
