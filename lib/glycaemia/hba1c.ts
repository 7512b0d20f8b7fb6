/**
 * HbA1c units: NGSP/DCCT per cent (%) and IFCC mmol/mol.
 *
 * The master equation relating the two networks' results (Hoelzel et al. 2004, Clin Chem 50:166)
 * was published with IFCC in per cent, NGSP (%) = 0.915 · IFCC (%) + 2.15. With IFCC expressed in
 * mmol/mol (1 IFCC % = 10 mmol/mol) it reads, as in the methods guide,
 *
 *     IFCC (mmol/mol) = 10.93 · NGSP (%) − 23.50       (10 / 0.915 = 10.929; 21.5 / 0.915 = 23.497)
 *
 * and its exact algebraic inverse
 *
 *     NGSP (%) = (IFCC (mmol/mol) + 23.50) / 10.93 = 0.091491 · IFCC + 2.15004
 *
 * NGSP publishes the inverse with rounded coefficients, NGSP = 0.09148 · IFCC + 2.152; over
 * 9–195 mmol/mol the two differ by less than 0.002 % (tested). We use the exact inverse so that a
 * value converted one way and back is the same value, and every figure comes from one equation.
 *
 * Values are not rounded here: a threshold comparison uses the unrounded converted value (see
 * ./classify.ts); rounding is for display only (./format.ts).
 */

export const HBA1C_UNITS = ['%', 'mmol/mol'] as const;
export type Hba1cUnit = (typeof HBA1C_UNITS)[number];

/** Slope of the master equation, mmol/mol per % (Hoelzel et al. 2004). */
export const MASTER_EQUATION_SLOPE = 10.93;
/** Intercept of the master equation, mmol/mol (Hoelzel et al. 2004). */
export const MASTER_EQUATION_INTERCEPT_MMOL_MOL = -23.5;

/**
 * NGSP % → IFCC mmol/mol.
 *
 * @example
 * ngspPercentToIfccMmolMol(6.5) //=> 47.545 (ADA/WHO quote 48 mmol/mol, rounded)
 * ngspPercentToIfccMmolMol(7.0) //=> 53.01
 */
export function ngspPercentToIfccMmolMol(percent: number): number {
  return MASTER_EQUATION_SLOPE * percent + MASTER_EQUATION_INTERCEPT_MMOL_MOL;
}

/**
 * IFCC mmol/mol → NGSP %, the exact inverse of {@link ngspPercentToIfccMmolMol}.
 *
 * @example
 * ifccMmolMolToNgspPercent(48) //=> 6.5416… (quoted as 6.5%)
 * ifccMmolMolToNgspPercent(42) //=> 5.9927… (NICE quotes 6.0%)
 */
export function ifccMmolMolToNgspPercent(mmolPerMol: number): number {
  return (mmolPerMol - MASTER_EQUATION_INTERCEPT_MMOL_MOL) / MASTER_EQUATION_SLOPE;
}

/** An HbA1c result expressed in the wanted unit. */
export function hba1cIn(unit: Hba1cUnit, reading: { readonly value: number; readonly unit: Hba1cUnit }): number {
  if (reading.unit === unit) return reading.value;
  return unit === '%' ? ifccMmolMolToNgspPercent(reading.value) : ngspPercentToIfccMmolMol(reading.value);
}
