/**
 * The one reader of typed decimal numbers: the consultation form, the evidence editor and the
 * glucose rows read numbers through it, so "0,08" and "0.08" mean the same everywhere.
 *
 * Accepted: an optional sign, digits with a decimal point or a decimal comma ("0.08", "0,08",
 * ".08", "12", "12."), an exponent ("1e-3"). Grouping separators are not accepted, and "1,000"
 * (a comma before exactly three digits, after a leading digit other than 0) could be one
 * thousand or one, so it is refused rather than guessed; "0,125" is a decimal. Nothing else is guessed at: "12abc", "0x10", "Infinity" are
 * not numbers.
 *
 * Where the field asks for a risk or another proportion (`{ percent: true }`), a trailing "%"
 * is read as a percentage and divided by 100: "8%" → 0.08, "0,5 %" → 0.005. Elsewhere a "%" is
 * not a number, so a mistaken "%" in a ratio field is reported, not silently dropped.
 */

export interface DecimalOptions {
  /** The field holds a proportion (0 to 1): "8%" is read as 0.08. */
  readonly percent?: boolean;
}

const DECIMAL = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)(e[+-]?\d+)?$/i;
/** "1,000" or "12,500": a comma before exactly three digits could be a thousands separator. */
const AMBIGUOUS_COMMA = /^[+-]?[1-9]\d{0,2},\d{3}$/;
const PERCENT = /^(.*?)\s*%$/;

/** What the reader made of the text. */
export type DecimalReading =
  | { readonly kind: 'blank' }
  | { readonly kind: 'number'; readonly value: number; readonly fromPercent: boolean }
  | { readonly kind: 'invalid'; readonly text: string };

/**
 * Reads typed text as a decimal number.
 *
 * @example
 * readDecimal('0,08') //=> { kind: 'number', value: 0.08, fromPercent: false }
 * readDecimal('8%', { percent: true }) //=> { kind: 'number', value: 0.08, fromPercent: true }
 * readDecimal('8%') //=> { kind: 'invalid', text: '8%' }
 * readDecimal('  ') //=> { kind: 'blank' }
 */
export function readDecimal(text: string, options: DecimalOptions = {}): DecimalReading {
  const trimmed = text.trim();
  if (trimmed === '') return { kind: 'blank' };
  let body = trimmed;
  let fromPercent = false;
  const percent = PERCENT.exec(trimmed);
  if (percent) {
    if (!options.percent) return { kind: 'invalid', text: trimmed };
    body = percent[1] ?? '';
    fromPercent = true;
  }
  if (!DECIMAL.test(body) || AMBIGUOUS_COMMA.test(body)) return { kind: 'invalid', text: trimmed };
  const value = Number(body.replace(',', '.'));
  if (!Number.isFinite(value)) return { kind: 'invalid', text: trimmed };
  // Dividing by 100 in binary floating point gives 0.07 for "7%" exactly as typed "0.07" does
  // only after rounding to the digits typed; 15 significant digits removes the binary noise.
  return { kind: 'number', value: fromPercent ? Number((value / 100).toPrecision(15)) : value, fromPercent };
}

/**
 * Text to a number for a schema: blank → undefined (the schema then says "is required" or
 * leaves an optional field out), a decimal → its value, anything else → NaN (the schema then
 * says "must be a number").
 *
 * @example
 * numberFromText('0,5') //=> 0.5
 * numberFromText('') //=> undefined
 * numberFromText('12abc') //=> NaN
 * numberFromText('8%', { percent: true }) //=> 0.08
 */
export function numberFromText(text: string, options: DecimalOptions = {}): number | undefined {
  const reading = readDecimal(text, options);
  if (reading.kind === 'blank') return undefined;
  return reading.kind === 'number' ? reading.value : Number.NaN;
}
