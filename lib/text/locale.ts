/**
 * The one locale every word and number the program writes is in: English ("en"), digits
 * grouped by thousands ("1,000"), a decimal point. Typed input may use a decimal comma
 * (./decimal.ts reads both); output always uses the point.
 */
export const TEXT_LOCALE = 'en';
