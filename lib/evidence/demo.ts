/**
 * Demo evidence entries for the consultation screen.
 *
 * ILLUSTRATIVE ENTRIES — NOT REAL STUDIES. The settings, designs and numbers below were
 * invented for this program; no figure was taken from any publication. Each estimate was
 * chosen near the geometric mean of its limits, as a real report's would be, so the engine
 * raises no rounding warning. Each entry says so in its citation, its population and
 * `illustrative: true`, and the screen repeats it. Ids are stable.
 */
import type { EvidenceEntry } from './schema';

/** The citation every demo entry carries. */
export const ILLUSTRATIVE_EVIDENCE_NOTE = 'Illustrative entry — not a real study; numbers invented for the Hundredfold demo';

/** An invented workforce cohort: prediabetes-range HbA1c at yearly checkups vs normal HbA1c, heart failure. */
export const DEMO_WORKFORCE_HBA1C_HEART_FAILURE: EvidenceEntry = {
  id: 'demo-workforce-hba1c-heart-failure',
  title: 'Prediabetes-range HbA1c and heart failure, workforce cohort (demo)',
  // Invented: HR 1.6 (1.2 to 2.1); √(1.2 × 2.1) = 1.587, close to 1.6 (hand-computed).
  effect: { measure: 'HR', estimate: 1.6, lower: 1.2, upper: 2.1, level: 0.95, design: 'cohort', followUpYears: 8, adjusted: true },
  wording: {
    outcome: 'heart failure needing hospital care',
    exposure: 'HbA1c in the prediabetes range at yearly checkups',
    comparison: 'normal HbA1c',
    population: 'employees aged 30 to 64 seen at yearly workplace health checkups (invented cohort)',
    citation: ILLUSTRATIVE_EVIDENCE_NOTE,
  },
  // As worded: HbA1c decides; the comparison group had a normal HbA1c over the same span (3 yearly results).
  exposureDefinition: { category: 'prediabetes', criteria: 'ADA', minYears: 3, test: 'hba1c', comparison: { category: 'normal' } },
  illustrative: true,
  notes: 'Invented cohort for the demo. Adjusted for age, sex, blood pressure and smoking (invented).',
};

/** An invented case-control study nested in a cohort, controls by risk-set sampling: an OR that estimates a rate ratio. */
export const DEMO_NESTED_CASE_CONTROL_GLUCOSE_CORONARY: EvidenceEntry = {
  id: 'demo-nested-case-control-glucose-coronary',
  title: 'Prediabetes-range fasting glucose and coronary events, nested case-control (demo)',
  // Invented: OR 1.4 (1.1 to 1.8); √(1.1 × 1.8) = 1.407, close to 1.4 (hand-computed).
  effect: { measure: 'OR', estimate: 1.4, lower: 1.1, upper: 1.8, level: 0.95, design: 'risk-set-case-control', followUpYears: 10, adjusted: true },
  wording: {
    outcome: 'a first coronary event',
    exposure: 'fasting glucose in the prediabetes range at two or more yearly checkups',
    comparison: 'normal fasting glucose',
    population: 'adults in an invented primary-care cohort; controls sampled from those still event-free when each case occurred',
    citation: ILLUSTRATIVE_EVIDENCE_NOTE,
  },
  // As worded: fasting glucose decides, at two or more yearly checkups; the comparison group's fasting glucose was normal.
  exposureDefinition: { category: 'prediabetes', criteria: 'WHO', minYears: 2, test: 'fpg', comparison: { category: 'normal' } },
  illustrative: true,
  notes: 'Invented study for the demo. With risk-set sampling the odds ratio estimates the rate ratio.',
};

/** An invented cross-sectional survey: an OR for a condition found at the same visit. */
export const DEMO_CROSS_SECTIONAL_HBA1C_BLOOD_PRESSURE: EvidenceEntry = {
  id: 'demo-cross-sectional-hba1c-blood-pressure',
  title: 'Prediabetes-range HbA1c and raised blood pressure, cross-sectional survey (demo)',
  // Invented: OR 1.3 (1.05 to 1.6); √(1.05 × 1.6) = 1.296, close to 1.3 (hand-computed).
  effect: { measure: 'OR', estimate: 1.3, lower: 1.05, upper: 1.6, level: 0.95, design: 'cross-sectional', adjusted: false },
  wording: {
    outcome: 'raised blood pressure found at the checkup',
    exposure: 'HbA1c in the prediabetes range',
    comparison: 'normal HbA1c',
    population: 'adults at a one-off community health check in an invented town',
    citation: ILLUSTRATIVE_EVIDENCE_NOTE,
  },
  // As worded: one HbA1c at the survey; the comparison group's HbA1c was normal.
  exposureDefinition: { category: 'prediabetes', criteria: 'NICE', minYears: 1, test: 'hba1c', comparison: { category: 'normal' } },
  illustrative: true,
  notes: 'Invented survey for the demo. A cross-sectional odds ratio compares how common the outcome is now, not new cases over time.',
};

/** Every demo entry, in the order the screen lists them. */
export const DEMO_EVIDENCE: readonly EvidenceEntry[] = [
  DEMO_WORKFORCE_HBA1C_HEART_FAILURE,
  DEMO_NESTED_CASE_CONTROL_GLUCOSE_CORONARY,
  DEMO_CROSS_SECTIONAL_HBA1C_BLOOD_PRESSURE,
];

/** A demo entry by id, or undefined. */
export function findDemoEvidence(id: string): EvidenceEntry | undefined {
  return DEMO_EVIDENCE.find((e) => e.id === id);
}
