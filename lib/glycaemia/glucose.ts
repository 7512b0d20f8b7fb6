/**
 * Plasma glucose units: mg/dL and mmol/L.
 *
 *     mg/dL = mmol/L × 18.016        mmol/L = mg/dL / 18.016
 *
 * 18.016 is the molar mass of glucose, C6H12O6, 180.16 g/mol, divided by 10 (dL per L): 1 mmol/L
 * = 180.16 mg/L = 18.016 mg/dL (methods guide; IUPAC atomic weights, common practice). The bodies
 * round their quoted equivalents differently (ADA: 100 mg/dL "5.6 mmol/L"; WHO: 7.0 mmol/L
 * "126 mg/dL"), which is why each body's thresholds are applied in its own unit (./classify.ts).
 *
 * Values are not rounded here; rounding is for display only.
 */

export const GLUCOSE_UNITS = ['mg/dL', 'mmol/L'] as const;
export type GlucoseUnit = (typeof GLUCOSE_UNITS)[number];

/** mg/dL per mmol/L: the molar mass of glucose (180.16 g/mol) / 10. */
export const GLUCOSE_MG_DL_PER_MMOL_L = 18.016;

/**
 * @example
 * glucoseMmolLToMgDl(7.0) //=> 126.112 (WHO 1999 quotes 126 mg/dL)
 */
export function glucoseMmolLToMgDl(mmolPerL: number): number {
  return mmolPerL * GLUCOSE_MG_DL_PER_MMOL_L;
}

/**
 * @example
 * glucoseMgDlToMmolL(100) //=> 5.5506… (ADA quotes 5.6 mmol/L)
 */
export function glucoseMgDlToMmolL(mgPerDl: number): number {
  return mgPerDl / GLUCOSE_MG_DL_PER_MMOL_L;
}

/** A glucose result expressed in the wanted unit. */
export function glucoseIn(unit: GlucoseUnit, reading: { readonly value: number; readonly unit: GlucoseUnit }): number {
  if (reading.unit === unit) return reading.value;
  return unit === 'mg/dL' ? glucoseMmolLToMgDl(reading.value) : glucoseMgDlToMmolL(reading.value);
}
