/**
 * Paper sizes the handout prints on, portrait, chosen by the person printing. Sizes from
 * ISO 216 (A4, 210 × 297 mm) and ANSI/ASME Y14.1 (US Letter, 8.5 × 11 in = 215.9 × 279.4 mm).
 *
 * Each size also says how dates are written where it is the office paper: A4 regions (Europe,
 * most of the world) write the day before the month, "12 May 2025"; US Letter regions (the
 * United States, where "May 12, 2025" is the usual long form) the month first (common practice).
 */
export const PAPER_SIZES = {
  a4: { label: 'A4', cssSize: 'A4 portrait', widthMm: 210, heightMm: 297, dateOrder: 'day-month-year' },
  letter: { label: 'US Letter', cssSize: 'letter portrait', widthMm: 215.9, heightMm: 279.4, dateOrder: 'month-day-year' },
} as const;

export type PaperSize = keyof typeof PAPER_SIZES;
export const PAPER_SIZE_KEYS = Object.keys(PAPER_SIZES) as PaperSize[];
export type DateOrder = (typeof PAPER_SIZES)[PaperSize]['dateOrder'];

/** Page margin on every side, in millimetres: inside what common office printers can reach (common practice). */
export const PAGE_MARGIN_MM = 10;

/**
 * The CSS page rule for a paper size.
 * @example
 * pageRule('a4') //=> "@page { size: A4 portrait; margin: 10mm; }"
 */
export function pageRule(paper: PaperSize): string {
  return `@page { size: ${PAPER_SIZES[paper].cssSize}; margin: ${PAGE_MARGIN_MM}mm; }`;
}

export function isPaperSize(value: unknown): value is PaperSize {
  return value === 'a4' || value === 'letter';
}
