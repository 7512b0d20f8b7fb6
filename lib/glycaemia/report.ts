/**
 * The machine-readable report of a classified history: what `hundredfold glycaemia` prints, and
 * what any other consumer can take as JSON. Missing values are null, never absent.
 *
 * Numbers: a value as entered is printed exactly; a converted value is rounded to 4 decimals
 * (without floating-point noise; for values as labs print them — 0.1 %, whole mmol/mol, 0.1
 * mmol/L, whole mg/dL — the rounded value stays on the same side of every threshold, checked by
 * enumeration over the plausible ranges; a value typed with more decimals can land on a
 * threshold once rounded); `years` to 2 decimals. Categories were decided on unrounded values
 * (./classify.ts), and each test's `text` keeps enough decimals to stay on its side.
 */
import type { Warning } from '../result';
import { classifyHistory, type ClassifiedCheckup, type TestClassification } from './classify';
import { CRITERIA } from './criteria';
import { describeCheckup, describePersistence, GLYCAEMIA_CAUTION } from './describe';
import type { CriteriaSet, GlycaemicCategory } from './exposure';
import { categoryLabel, roundTo } from './format';
import { diabetesRangeNote } from './match';
import type { GlucoseHistory } from './parse';
import { persistence, type Gap, type RunBreak } from './persistence';

export const OUTPUT_DECIMALS = 4;

export interface CheckupReport {
  readonly date: string;
  readonly category: GlycaemicCategory | null;
  /** The category in words with the body's name: "prediabetes range (ADA)". */
  readonly label: string;
  readonly criteria: CriteriaSet;
  readonly decidedBy: 'hba1c' | 'fpg' | 'both' | null;
  readonly discordant: boolean;
  readonly hba1cPercent: number | null;
  readonly hba1cMmolMol: number | null;
  readonly fpgMgDl: number | null;
  readonly fpgMmolL: number | null;
  /** Each test's own range under the body (null: missing, or does not classify). */
  readonly hba1cCategory: GlycaemicCategory | null;
  readonly fpgCategory: GlycaemicCategory | null;
  readonly text: string;
  readonly notes: readonly Warning[];
}

export interface PersistenceReport {
  readonly category: GlycaemicCategory | null;
  readonly label: string | null;
  readonly criteria: CriteriaSet;
  readonly checkups: number;
  readonly yearlyResults: number;
  readonly years: number;
  readonly from: string | null;
  readonly to: string | null;
  readonly gaps: readonly Gap[];
  readonly brokenBy: RunBreak | null;
  readonly text: string;
}

export interface GlycaemiaReport {
  readonly criteria: CriteriaSet;
  readonly criteriaName: string;
  readonly criteriaSource: string;
  readonly checkups: readonly CheckupReport[];
  readonly persistence: PersistenceReport;
  /** Present (not null) when the latest result is in the diabetes range. */
  readonly diabetesRangeNote: Warning | null;
  /** Same-day entries merged on input. */
  readonly notes: readonly Warning[];
  readonly caution: string;
}

function shown(value: number | null, test: TestClassification | null, entered: boolean): number | null {
  if (value === null) return null;
  return entered && test ? value : roundTo(value, OUTPUT_DECIMALS);
}

function checkupReport(c: ClassifiedCheckup): CheckupReport {
  const hba1cUnit = c.hba1c?.entered.unit;
  const fpgUnit = c.fpg?.entered.unit;
  return {
    date: c.date,
    category: c.category,
    label: categoryLabel(c.category, c.criteria),
    criteria: c.criteria,
    decidedBy: c.decidedBy,
    discordant: c.discordant,
    hba1cPercent: shown(c.hba1cPercent, c.hba1c, hba1cUnit === '%'),
    hba1cMmolMol: shown(c.hba1cMmolMol, c.hba1c, hba1cUnit === 'mmol/mol'),
    fpgMgDl: shown(c.fpgMgDl, c.fpg, fpgUnit === 'mg/dL'),
    fpgMmolL: shown(c.fpgMmolL, c.fpg, fpgUnit === 'mmol/L'),
    hba1cCategory: c.hba1c?.category ?? null,
    fpgCategory: c.fpg?.category ?? null,
    text: describeCheckup(c),
    notes: c.notes,
  };
}

/**
 * Classify a validated history under its criteria set and report it.
 *
 * @example
 * glycaemiaReport({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }], notes: [] })
 * //=> { criteria: 'ADA', checkups: [{ date: '2023-03-01', category: 'prediabetes', label: 'prediabetes range (ADA)', decidedBy: 'hba1c',
 * //     hba1cPercent: 6.1, hba1cMmolMol: 43.173, fpgMgDl: null, fpgMmolL: null, … }], persistence: { category: 'prediabetes', checkups: 1, … }, … }
 */
export function glycaemiaReport(history: GlucoseHistory): GlycaemiaReport {
  const body = CRITERIA[history.criteria];
  const classified = classifyHistory(history.checkups, history.criteria);
  const run = persistence(classified, history.criteria);
  return {
    criteria: history.criteria,
    criteriaName: body.name,
    criteriaSource: body.source,
    checkups: classified.map(checkupReport),
    persistence: {
      category: run.category,
      label: run.category === null ? null : categoryLabel(run.category, run.criteria),
      criteria: run.criteria,
      checkups: run.checkups,
      yearlyResults: run.yearlyResults,
      years: roundTo(run.years, 2),
      from: run.from,
      to: run.to,
      gaps: run.gaps,
      brokenBy: run.brokenBy,
      text: describePersistence(run),
    },
    diabetesRangeNote: diabetesRangeNote(classified),
    notes: history.notes,
    caution: GLYCAEMIA_CAUTION,
  };
}
