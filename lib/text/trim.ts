/**
 * Trimming typed text, one rule each for the places that need one.
 */

/**
 * Text as typed, trimmed; blank → undefined (so optional fields stay absent).
 * @example
 * optionalText('  a stroke ') //=> "a stroke"
 * optionalText('   ') //=> undefined
 */
export function optionalText(text: string | undefined): string | undefined {
  const trimmed = (text ?? '').trim();
  return trimmed === '' ? undefined : trimmed;
}

/**
 * A phrase that goes inside a sentence: trimmed, with trailing full stops and spaces removed,
 * so "a stroke." does not end a sentence in the middle ("…have a stroke. in the next 10 years").
 * @example
 * phraseText(' adults at a health check. ') //=> "adults at a health check"
 * phraseText(undefined) //=> ""
 */
export function phraseText(text: string | undefined): string {
  return (text ?? '').trim().replace(/[.\s]+$/, '');
}
