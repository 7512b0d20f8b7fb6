/**
 * The clinic's contact line, cut into pieces the sheet lays out so that a telephone number is
 * never broken across two lines: a reader copying "020 7946 0000" from two lines misdials.
 *
 * A telephone number here is a run that starts with "+", "(" or a digit, holds at least 6
 * digits, and goes on through digits, spaces, hyphens, dots, slashes and brackets (the
 * separators ITU-T E.123 and national conventions use; common practice). The sheet keeps each
 * such run on one line (CSS `white-space: nowrap`); the text itself is not changed.
 */

export interface ContactSegment {
  readonly text: string;
  /** True for a telephone number: print it on one line. */
  readonly keepTogether: boolean;
}

const PHONE = /[+(]?\d[\d\s().\-/]*\d/g;
const MIN_PHONE_DIGITS = 6;

/**
 * @example
 * contactSegments('Call 020 7946 0000, Mon–Fri')
 * //=> [{ text: 'Call ', keepTogether: false }, { text: '020 7946 0000', keepTogether: true }, { text: ', Mon–Fri', keepTogether: false }]
 */
export function contactSegments(contact: string): ContactSegment[] {
  const segments: ContactSegment[] = [];
  let at = 0;
  for (const match of contact.matchAll(PHONE)) {
    const text = match[0];
    const start = match.index;
    if (text.replace(/\D/g, '').length < MIN_PHONE_DIGITS) continue;
    if (start > at) segments.push({ text: contact.slice(at, start), keepTogether: false });
    segments.push({ text, keepTogether: true });
    at = start + text.length;
  }
  if (at < contact.length) segments.push({ text: contact.slice(at), keepTogether: false });
  return segments;
}
