/**
 * LOINC codes for the two tests a glucose history uses, as record systems export them in FHIR R4
 * Observation.code. The code says which test; the unit is always read from valueQuantity (UCUM),
 * never assumed from the code (./observation.ts).
 *
 * Codes and display names checked against HL7 implementation-guide examples and value sets
 * (LOINC displays as they print them): the "Diabetes Example Test Codes" value set of the
 * HL7 Vulcan Real World Data guide (HbA1c codes), the Swiss CH EPREG example Observation
 * (14771-0), the Philippine PH Core example Observation (1558-6) and the US Core serum glucose
 * example (2345-7), a French hospital data-warehouse profile (14749-6). 2339-0 and 15074-8 are
 * from memory.
 */

export const LOINC_SYSTEMS = [
  'http://loinc.org',
  // LOINC's OID, used by some exports converted from HL7 v2/CDA (common practice).
  'urn:oid:2.16.840.1.113883.6.1',
] as const;

/** HbA1c as a fraction of total haemoglobin, in % (NGSP) or mmol/mol (IFCC). */
export const HBA1C_CODES: Readonly<Record<string, string>> = {
  '4548-4': 'Hemoglobin A1c/Hemoglobin.total in Blood',
  '4549-2': 'Hemoglobin A1c/Hemoglobin.total in Blood by Electrophoresis',
  '17855-8': 'Hemoglobin A1c/Hemoglobin.total in Blood by calculation',
  '17856-6': 'Hemoglobin A1c/Hemoglobin.total in Blood by HPLC',
  '59261-8': 'Hemoglobin A1c/Hemoglobin.total in Blood by IFCC protocol',
};

/** Fasting plasma glucose, by mass (mg/dL) or by moles (mmol/L). */
export const FASTING_GLUCOSE_CODES: Readonly<Record<string, string>> = {
  '1558-6': 'Fasting glucose [Mass/volume] in Serum or Plasma',
  '14771-0': 'Fasting glucose [Moles/volume] in Serum or Plasma',
};

/**
 * Glucose codes that do not say the sample was fasting: recognised only to say why they are
 * skipped (a random glucose is not a fasting glucose).
 */
export const NON_FASTING_GLUCOSE_CODES: Readonly<Record<string, string>> = {
  '2345-7': 'Glucose [Mass/volume] in Serum or Plasma',
  '14749-6': 'Glucose [Moles/volume] in Serum or Plasma',
  '2339-0': 'Glucose [Mass/volume] in Blood',
  '15074-8': 'Glucose [Moles/volume] in Blood',
};

/** HbA1c as a mass concentration (not a fraction): not comparable with any criteria set. */
export const HBA1C_MASS_CODES: Readonly<Record<string, string>> = {
  '41995-2': 'Hemoglobin A1c [Mass/volume] in Blood',
};

export type LoincTest = 'hba1c' | 'fpg';

export type LoincKind =
  | { readonly kind: 'test'; readonly test: LoincTest; readonly code: string }
  | { readonly kind: 'non-fasting-glucose'; readonly code: string }
  | { readonly kind: 'hba1c-mass'; readonly code: string }
  | { readonly kind: 'other'; readonly code: string };

/** What one LOINC code means here. */
export function loincKind(code: string): LoincKind {
  if (code in HBA1C_CODES) return { kind: 'test', test: 'hba1c', code };
  if (code in FASTING_GLUCOSE_CODES) return { kind: 'test', test: 'fpg', code };
  if (code in NON_FASTING_GLUCOSE_CODES) return { kind: 'non-fasting-glucose', code };
  if (code in HBA1C_MASS_CODES) return { kind: 'hba1c-mass', code };
  return { kind: 'other', code };
}
