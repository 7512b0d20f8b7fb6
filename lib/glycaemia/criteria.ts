/**
 * The three criteria sets for glycaemic categories, each with its thresholds as the body writes
 * them: in its own unit, and in the other unit where it prints an equivalent ("7.0 mmol/L
 * (126 mg/dL)", "48 mmol/mol (6.5%)"; methods guide, "Glycaemic categories"). A result is compared
 * in the unit it was entered in, against the body's published form in that unit (./classify.ts);
 * only where the body prints no form in that unit is the own-unit threshold converted.
 *
 * Published forms in the other unit (from memory for each document's exact wording):
 * | body | HbA1c                               | FPG                                           |
 * |------|-------------------------------------|-----------------------------------------------|
 * | ADA  | 5.7% (39 mmol/mol), 6.5% (48)       | 100 mg/dL (5.6 mmol/L), 126 mg/dL (7.0)       |
 * | WHO  | 6.5% (48 mmol/mol)                  | 6.1 mmol/L (110 mg/dL), 7.0 mmol/L (126)      |
 * | NICE | 42 mmol/mol (6.0%), 48 (6.5%)       | 5.5 mmol/L (no mg/dL form), 7.0 (126 mg/dL, as WHO) |
 *
 * Ranges are half-open: "prediabetes 5.7–6.4%" means 5.7 ≤ HbA1c < 6.5, because the next range
 * starts at 6.5; a converted 6.45% is therefore in the prediabetes range, not in a hole between
 * two ranges.
 *
 * | body | HbA1c prediabetes  | HbA1c diabetes range | FPG prediabetes     | FPG diabetes range |
 * |------|--------------------|----------------------|---------------------|--------------------|
 * | ADA  | 5.7 ≤ % < 6.5      | % ≥ 6.5              | 100 ≤ mg/dL < 126   | mg/dL ≥ 126        |
 * | WHO  | — (see below)      | % ≥ 6.5              | 6.1 ≤ mmol/L < 7.0  | mmol/L ≥ 7.0       |
 * | NICE | 42 ≤ mmol/mol < 48 | mmol/mol ≥ 48        | 5.5 ≤ mmol/L < 7.0  | mmol/L ≥ 7.0       |
 *
 * Sources:
 * - ADA: Standards of Care in Diabetes, section 2 "Diagnosis and Classification" (2021–2025
 *   editions), criteria for prediabetes and for the diagnosis of diabetes (from memory for the
 *   section's table numbers). ADA states HbA1c in %, FPG in mg/dL, giving mmol/mol and mmol/L in
 *   brackets.
 * - WHO: "Definition and diagnosis of diabetes mellitus and intermediate hyperglycaemia", WHO/IDF
 *   consultation 2006 (FPG, in mmol/L, with impaired fasting glucose 6.1–6.9); "Use of glycated
 *   haemoglobin (HbA1c) in the diagnosis of diabetes mellitus", WHO consultation 2011 (HbA1c
 *   6.5% as the cut point).
 *   Under WHO an HbA1c below 6.5% does NOT place a result in the normal or the prediabetes range:
 *   WHO 2011 made no recommendation on HbA1c for intermediate hyperglycaemia, and says a value
 *   below 6.5% does not exclude diabetes diagnosed by glucose tests (from memory for the wording).
 *   Such an HbA1c is reported as "does not classify" and the fasting glucose, if present, decides.
 * - NICE: PH38 "Type 2 diabetes: prevention in people at high risk" (2012), which uses mmol/mol
 *   and mmol/L: FPG 5.5–6.9 mmol/L or HbA1c 42–47 mmol/mol (6.0–6.4%) marks high risk. The
 *   methods table gives NICE no diabetes range. PH38 calls the intermediate range "non-diabetic
 *   hyperglycaemia" (from memory); we show it as the prediabetes range with that term. We use PH38's own referral thresholds, FPG
 *   ≥ 7.0 mmol/L or HbA1c ≥ 48 mmol/mol (6.5%) meaning "possible type 2 diabetes, to be
 *   confirmed", which PH38 takes from WHO 1999/2011 (from memory).
 */
import type { CriteriaSet } from './exposure';
import type { GlucoseUnit } from './glucose';
import type { Hba1cUnit } from './hba1c';

/** One test's thresholds in one body's unit. `null` = this test does not define the range. */
export interface TestThresholds<U extends string> {
  readonly unit: U;
  /** Lowest value in the prediabetes range; null when the body does not use this test for it. */
  readonly prediabetesFrom: number | null;
  /** Lowest value in the diabetes range. */
  readonly diabetesRangeFrom: number;
  /**
   * The same cut-points as the body prints them in the test's other unit; a cut-point is null
   * where the body prints no form in that unit (it is then converted from the own unit).
   */
  readonly published?: {
    readonly unit: string;
    readonly prediabetesFrom: number | null;
    readonly diabetesRangeFrom: number | null;
  };
}

export interface CriteriaDefinition {
  readonly id: CriteriaSet;
  /** The body's name as shown beside every category. */
  readonly name: string;
  /** What the body calls its intermediate range. */
  readonly prediabetesTerm: string;
  readonly hba1c: TestThresholds<Hba1cUnit>;
  readonly fpg: TestThresholds<GlucoseUnit>;
  /** The documents the thresholds come from, for the clinician's review. */
  readonly source: string;
}

export const CRITERIA: Readonly<Record<CriteriaSet, CriteriaDefinition>> = {
  ADA: {
    id: 'ADA',
    name: 'American Diabetes Association (ADA)',
    prediabetesTerm: 'prediabetes',
    hba1c: { unit: '%', prediabetesFrom: 5.7, diabetesRangeFrom: 6.5, published: { unit: 'mmol/mol', prediabetesFrom: 39, diabetesRangeFrom: 48 } },
    fpg: { unit: 'mg/dL', prediabetesFrom: 100, diabetesRangeFrom: 126, published: { unit: 'mmol/L', prediabetesFrom: 5.6, diabetesRangeFrom: 7.0 } },
    source: 'ADA Standards of Care in Diabetes, section 2 (2021–2025)',
  },
  WHO: {
    id: 'WHO',
    name: 'World Health Organization (WHO)',
    prediabetesTerm: 'impaired fasting glucose',
    hba1c: { unit: '%', prediabetesFrom: null, diabetesRangeFrom: 6.5, published: { unit: 'mmol/mol', prediabetesFrom: null, diabetesRangeFrom: 48 } },
    fpg: { unit: 'mmol/L', prediabetesFrom: 6.1, diabetesRangeFrom: 7.0, published: { unit: 'mg/dL', prediabetesFrom: 110, diabetesRangeFrom: 126 } },
    source: 'WHO/IDF 2006 (fasting glucose); WHO 2011 (HbA1c)',
  },
  NICE: {
    id: 'NICE',
    name: 'National Institute for Health and Care Excellence (NICE)',
    prediabetesTerm: 'non-diabetic hyperglycaemia',
    hba1c: { unit: 'mmol/mol', prediabetesFrom: 42, diabetesRangeFrom: 48, published: { unit: '%', prediabetesFrom: 6.0, diabetesRangeFrom: 6.5 } },
    fpg: { unit: 'mmol/L', prediabetesFrom: 5.5, diabetesRangeFrom: 7.0, published: { unit: 'mg/dL', prediabetesFrom: null, diabetesRangeFrom: 126 } },
    source: 'NICE PH38 (2012); diabetes range from its referral thresholds (from WHO)',
  },
};
