/**
 * Numbers written out as spoken English, so a readability score counts the syllables a
 * reader says: "100" is "one hundred" (3 syllables), "1,000" is "one thousand" (3).
 *
 * Short scale, without "and" ("one hundred twenty", the US reading; the British "and" would
 * add one syllable). Decimals are read digit by digit after "point" ("7.5" → "seven point
 * five"). Common practice of English number reading; no published source needed.
 */

const ONES = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve', 'thirteen', 'fourteen', 'fifteen', 'sixteen', 'seventeen', 'eighteen', 'nineteen'] as const;
const TENS = ['', '', 'twenty', 'thirty', 'forty', 'fifty', 'sixty', 'seventy', 'eighty', 'ninety'] as const;
const SCALES = ['', 'thousand', 'million', 'billion', 'trillion'] as const;

function underThousand(n: number): string[] {
  const words: string[] = [];
  const hundreds = Math.floor(n / 100);
  const rest = n % 100;
  if (hundreds > 0) words.push(ONES[hundreds] ?? '', 'hundred');
  if (rest >= 20) {
    const tens = TENS[Math.floor(rest / 10)] ?? '';
    const ones = rest % 10;
    words.push(ones > 0 ? `${tens}-${ONES[ones] ?? ''}` : tens);
  } else if (rest > 0) {
    words.push(ONES[rest] ?? '');
  }
  return words;
}

/**
 * The spoken words of a non-negative whole number below 10^15.
 * @example
 * integerWords(1000) //=> ["one", "thousand"]
 * integerWords(59) //=> ["fifty-nine"]
 */
export function integerWords(n: number): string[] {
  if (!Number.isSafeInteger(n) || n < 0 || n >= 1e15) return [];
  if (n === 0) return ['zero'];
  const groups: number[] = [];
  for (let rest = n; rest > 0; rest = Math.floor(rest / 1000)) groups.push(rest % 1000);
  const words: string[] = [];
  for (let i = groups.length - 1; i >= 0; i -= 1) {
    const group = groups[i] ?? 0;
    if (group === 0) continue;
    words.push(...underThousand(group));
    const scale = SCALES[i] ?? '';
    if (scale) words.push(scale);
  }
  return words;
}

/**
 * The spoken words of a numeral as written in text: digits with optional thousands commas
 * and an optional decimal part. Returns [] for anything else.
 * @example
 * numeralWords('7.5') //=> ["seven", "point", "five"]
 * numeralWords('1,000') //=> ["one", "thousand"]
 */
export function numeralWords(numeral: string): string[] {
  const match = /^(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d+))?$/.exec(numeral);
  if (!match) return [];
  const whole = integerWords(Number((match[1] ?? '').replaceAll(',', '')));
  if (whole.length === 0) return [];
  const decimals = match[2];
  if (decimals === undefined) return whole;
  return [...whole, 'point', ...[...decimals].map((digit) => ONES[Number(digit)] ?? '')];
}
