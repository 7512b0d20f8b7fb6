/**
 * Two results for the same test on the same day: the same result (merge them, say so) or two
 * different results (refuse: the tool cannot choose between them).
 *
 * Labs often report one HbA1c in both % and mmol/mol, and one glucose in both units. Two readings
 * in different units are the same result when they agree within the rounding of the two reports:
 *
 *     |convert(a → unit of b) − b| ≤ ½·step(b) + ½·step(a)·factor
 *
 * with reporting steps (common practice) 0.1 % and 1 mmol/mol for HbA1c, 0.1 mmol/L and 1 mg/dL
 * for glucose, and factor the slope of the conversion (10.93 mmol/mol per %, 18.016 mg/dL per
 * mmol/L). Hand-computed: HbA1c 0.5 + 0.05·10.93 = 1.0465 mmol/mol; glucose 0.5 + 0.05·18.016 =
 * 1.4008 mg/dL. Readings in the same unit agree only when equal.
 */
import { GLUCOSE_MG_DL_PER_MMOL_L, glucoseIn } from './glucose';
import { hba1cIn, MASTER_EQUATION_SLOPE } from './hba1c';
import { withUnit, type ValueUnit } from './format';
import type { FpgReading, Hba1cReading } from './schema';
import { CRITERIA } from './criteria';
import type { CriteriaSet } from './exposure';

/** Reporting step per unit (common practice: how labs print these results). */
export const REPORTING_STEP = {
  '%': 0.1,
  'mmol/mol': 1,
  'mmol/L': 0.1,
  'mg/dL': 1,
} as const;

/** Largest difference, in mmol/mol, between an HbA1c in % and one in mmol/mol that are the same result. */
export const HBA1C_AGREEMENT_MMOL_MOL = REPORTING_STEP['mmol/mol'] / 2 + (REPORTING_STEP['%'] / 2) * MASTER_EQUATION_SLOPE;
/** Largest difference, in mg/dL, between a glucose in mmol/L and one in mg/dL that are the same result. */
export const GLUCOSE_AGREEMENT_MG_DL = REPORTING_STEP['mg/dL'] / 2 + (REPORTING_STEP['mmol/L'] / 2) * GLUCOSE_MG_DL_PER_MMOL_L;

export function hba1cReadingsAgree(a: Hba1cReading, b: Hba1cReading): boolean {
  if (a.unit === b.unit) return a.value === b.value;
  return Math.abs(hba1cIn('mmol/mol', a) - hba1cIn('mmol/mol', b)) <= HBA1C_AGREEMENT_MMOL_MOL;
}

export function fpgReadingsAgree(a: FpgReading, b: FpgReading): boolean {
  if (a.unit === b.unit) return a.value === b.value;
  return Math.abs(glucoseIn('mg/dL', a) - glucoseIn('mg/dL', b)) <= GLUCOSE_AGREEMENT_MG_DL;
}

/** "6.1 %" / "48 mmol/mol": a reading as written, for messages. */
export function readingText(reading: { readonly value: number; readonly unit: ValueUnit }): string {
  return withUnit(reading.value, reading.unit);
}

/**
 * Of two readings of one sample in two units, the one to keep: the one in the body's own unit
 * when the criteria set is known (issue 11 item 2: the result must not depend on which came
 * first), else the earlier one. Returns whether the later one was preferred.
 */
export function preferLater(test: 'hba1c' | 'fpg', earlier: { readonly unit: ValueUnit }, later: { readonly unit: ValueUnit }, criteria: CriteriaSet | undefined): boolean {
  if (criteria === undefined || earlier.unit === later.unit) return false;
  return later.unit === CRITERIA[criteria][test].unit;
}

/** The note's words for which reading of one sample in two units was kept. */
export function keptWords(kept: { readonly value: number; readonly unit: ValueUnit }, criteria: CriteriaSet | undefined): string {
  return criteria === undefined ? `${readingText(kept)} kept` : `${readingText(kept)} kept: ${CRITERIA[criteria].id} writes its thresholds in ${kept.unit}`;
}
