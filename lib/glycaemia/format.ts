/**
 * How glycaemic values and categories are written for people: one place, so the screen, the
 * command line and the messages agree. Rounding happens here and only for display; every
 * comparison uses unrounded values.
 *
 * The word "diabetes" only ever appears as "diabetes range": one result is not a diagnosis.
 */
import { CRITERIA } from './criteria';
import type { CriteriaSet, GlycaemicCategory } from './exposure';

export type ValueUnit = '%' | 'mmol/mol' | 'mg/dL' | 'mmol/L';

/**
 * Decimals for a converted value: one more than labs report (0.1 %, 1 mmol/mol, 0.1 mmol/L,
 * 1 mg/dL; common practice), so that a converted 47.5 mmol/mol is not shown as the 48 it is not.
 */
export const CONVERTED_DECIMALS: Readonly<Record<ValueUnit, number>> = {
  '%': 2,
  'mmol/mol': 1,
  'mmol/L': 2,
  'mg/dL': 1,
};

/** Rounds to a number of decimals, for display and output only (half away from zero). */
export function roundTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return (Math.sign(value) * Math.round(Math.abs(value) * factor)) / factor;
}

/**
 * A value with its unit, with at least the decimals labs and the bodies write (so 6 reads
 * "6.0%", as a lab prints it) and every decimal that was entered: "6.1%", "48 mmol/mol",
 * "5.6 mmol/L", "101 mg/dL".
 */
export function withUnit(value: number, unit: ValueUnit): string {
  const written = String(value);
  const text = /e/i.test(written) ? written : value.toFixed(Math.max(THRESHOLD_DECIMALS[unit], writtenDecimals(value)));
  return unit === '%' ? `${text}%` : `${text} ${unit}`;
}

/** Decimals a number is written with (its shortest text, ECMA-262 Number::toString; 0 in exponent form). */
export function writtenDecimals(value: number): number {
  const written = String(value);
  const point = written.indexOf('.');
  return point < 0 || /e/i.test(written) ? 0 : written.length - point - 1;
}

/** Decimals the bodies write their thresholds with: 5.7 %, 48 mmol/mol, 7.0 mmol/L, 126 mg/dL. */
export const THRESHOLD_DECIMALS: Readonly<Record<ValueUnit, number>> = { '%': 1, 'mmol/mol': 0, 'mmol/L': 1, 'mg/dL': 0 };

/** A threshold as the bodies write it: "7.0 mmol/L", "6.5%". */
export function thresholdText(value: number, unit: ValueUnit): string {
  const text = value.toFixed(THRESHOLD_DECIMALS[unit]);
  return unit === '%' ? `${text}%` : `${text} ${unit}`;
}

/** A converted value, rounded to {@link CONVERTED_DECIMALS}, with its unit. */
export function convertedText(value: number, unit: ValueUnit): string {
  return withUnit(roundTo(value, CONVERTED_DECIMALS[unit]), unit);
}

/** The body's short name: "ADA". */
export function bodyName(criteria: CriteriaSet): string {
  return CRITERIA[criteria].id;
}

/**
 * A category in words, with the body's name.
 *
 * @example
 * categoryLabel('prediabetes', 'ADA')     //=> 'prediabetes range (ADA)'
 * categoryLabel('prediabetes', 'WHO')     //=> 'prediabetes range (WHO: impaired fasting glucose)'
 * categoryLabel('diabetes-range', 'NICE') //=> 'diabetes range (NICE)'
 * categoryLabel(null, 'WHO')              //=> 'not classified (WHO)'
 */
export function categoryLabel(category: GlycaemicCategory | null, criteria: CriteriaSet): string {
  const body = bodyName(criteria);
  switch (category) {
    case 'normal':
      return `normal range (${body})`;
    case 'prediabetes':
      return criteria === 'ADA' ? `prediabetes range (${body})` : `prediabetes range (${body}: ${CRITERIA[criteria].prediabetesTerm})`;
    case 'diabetes-range':
      return `diabetes range (${body})`;
    case null:
      return `not classified (${body})`;
  }
}

/** The category in words without the body: "prediabetes range". */
export function rangeName(category: GlycaemicCategory): string {
  return category === 'diabetes-range' ? 'diabetes range' : `${category} range`;
}

export const TEST_LABELS = { hba1c: 'HbA1c', fpg: 'fasting glucose' } as const;

/** "1 yearly result" / "3 yearly results". */
export function yearlyResults(count: number): string {
  return `${count} yearly result${count === 1 ? '' : 's'}`;
}
