/**
 * One checkup's glycaemic category under one criteria set.
 *
 * Each test is compared in the unit it was entered in, against the body's threshold as the body
 * itself prints it in that unit (./criteria.ts: "7.0 mmol/L (126 mg/dL)", "48 mmol/mol (6.5%)"),
 * so a lab's 126 mg/dL under WHO is in the diabetes range as WHO's own text says. Only where the
 * body prints no form in that unit (NICE's 5.5 mmol/L has no mg/dL form) is the own-unit threshold
 * converted. Then:
 *
 *     value ≥ diabetesRangeFrom                 → diabetes-range
 *     prediabetesFrom ≤ value < diabetesRangeFrom → prediabetes
 *     value < prediabetesFrom                   → normal
 *     (no prediabetesFrom, value below the diabetes range → this test does not classify)
 *
 * The checkup takes the higher range of its tests (any one test in a range places the result in
 * it: ADA section 2 and WHO 2006/2011 accept either test; from memory). `decidedBy` names the test
 * that gave that range, or "both". Tests are discordant when both are present and place the
 * checkup in different ranges; under WHO an HbA1c below 6.5% is silent below the diabetes range,
 * so it is discordant only with a fasting glucose in the diabetes range.
 *
 * Notes (code `conversion-near-threshold`): a value that falls between the two published forms of
 * one cut-point (WHO's 126 mg/dL is 6.99 mmol/L, under its 7.0 mmol/L) is placed by the form in the
 * unit the lab printed, and the note says so; a value compared with a converted threshold (no
 * published form in its unit) that rounding would put on the other side gets a note too.
 *
 * Converted values within 1e-9 (relative) of a threshold count as at the threshold: that is
 * floating-point round-off from the conversion, not a clinical tolerance.
 */
import type { Warning } from '../result';
import { CRITERIA, type TestThresholds } from './criteria';
import type { CriteriaSet, GlycaemicCategory } from './exposure';
import { CONVERTED_DECIMALS, categoryLabel, rangeName, roundTo, TEST_LABELS, thresholdText, withUnit, writtenDecimals, type ValueUnit } from './format';
import { glucoseIn, type GlucoseUnit } from './glucose';
import { hba1cIn, type Hba1cUnit } from './hba1c';
import { inDateOrder } from './dates';
import { REPORTING_STEP } from './merge';
import type { Checkup } from './schema';

export type TestName = 'hba1c' | 'fpg';

export interface TestClassification {
  readonly test: TestName;
  /** The result in the body's unit, unrounded. */
  readonly value: number;
  readonly unit: ValueUnit;
  /** The result as entered. */
  readonly entered: { readonly value: number; readonly unit: ValueUnit };
  /**
   * The result as entered, as text in its own unit: as written when it has no more decimals than
   * {@link CONVERTED_DECIMALS} (one past what labs print), else rounded to those decimals — with
   * more when fewer would put it on the other side of a cut-point in that unit. A value a
   * spreadsheet computed (5.55555555555556 mmol/L from 100 mg/dL) reads "5.56 mmol/L", never
   * fourteen decimals, and 6.4999 % stays below 6.5 %.
   */
  readonly enteredText: string;
  /** True when the result was entered in the other unit and converted to the body's. */
  readonly converted: boolean;
  /**
   * The value in the body's unit as text: as entered, or converted and rounded to
   * {@link CONVERTED_DECIMALS} — with more decimals when fewer would put it on the other side of a
   * threshold (99 mg/dL is "5.495 mmol/L", never "5.5 mmol/L", under NICE's 5.5).
   */
  readonly text: string;
  /**
   * The range this test alone places the checkup in; null when the body does not use this test
   * below its diabetes range (WHO: HbA1c below 6.5%).
   */
  readonly category: GlycaemicCategory | null;
}

export interface ClassifiedCheckup {
  readonly date: string;
  readonly criteria: CriteriaSet;
  /** null when no test classifies under this body (WHO with only an HbA1c below 6.5%). */
  readonly category: GlycaemicCategory | null;
  readonly decidedBy: TestName | 'both' | null;
  readonly discordant: boolean;
  readonly hba1c: TestClassification | null;
  readonly fpg: TestClassification | null;
  /** Both units of each test, unrounded; null where the test is missing. */
  readonly hba1cPercent: number | null;
  readonly hba1cMmolMol: number | null;
  readonly fpgMgDl: number | null;
  readonly fpgMmolL: number | null;
  /** Notes about this checkup: not classified, discordant tests, a conversion near a threshold. */
  readonly notes: readonly Warning[];
}

const RANK: Readonly<Record<GlycaemicCategory, number>> = { normal: 0, prediabetes: 1, 'diabetes-range': 2 };
const FLOAT_TOLERANCE = 1e-9;

function atOrAbove(value: number, threshold: number): boolean {
  return value >= threshold - FLOAT_TOLERANCE * Math.abs(threshold);
}

/**
 * The range a value in the body's unit falls in.
 *
 * @example
 * categoryFor(6.5, CRITERIA.ADA.hba1c)   //=> 'diabetes-range'
 * categoryFor(6.49, CRITERIA.ADA.hba1c)  //=> 'prediabetes'
 * categoryFor(6.0, CRITERIA.WHO.hba1c)   //=> null (WHO: HbA1c below 6.5% does not classify)
 */
export function categoryFor(value: number, thresholds: Pick<TestThresholds<string>, 'prediabetesFrom' | 'diabetesRangeFrom'>): GlycaemicCategory | null {
  if (atOrAbove(value, thresholds.diabetesRangeFrom)) return 'diabetes-range';
  if (thresholds.prediabetesFrom === null) return null;
  return atOrAbove(value, thresholds.prediabetesFrom) ? 'prediabetes' : 'normal';
}

/** Cut-points in one unit: the body's published form where it prints one, else the own-unit one converted. */
export interface CutPoints {
  readonly unit: ValueUnit;
  readonly prediabetesFrom: number | null;
  readonly diabetesRangeFrom: number;
  /** For each cut-point, whether the body prints it in this unit (false: converted). */
  readonly publishedPrediabetes: boolean;
  readonly publishedDiabetes: boolean;
}

function convert(test: TestName, value: number, from: ValueUnit, to: ValueUnit): number {
  return test === 'hba1c'
    ? hba1cIn(to as Hba1cUnit, { value, unit: from as Hba1cUnit })
    : glucoseIn(to as GlucoseUnit, { value, unit: from as GlucoseUnit });
}

/**
 * A test's cut-points in a unit, as the body writes them there.
 *
 * @example
 * cutPointsIn('fpg', CRITERIA.WHO.fpg, 'mg/dL') //=> { unit: 'mg/dL', prediabetesFrom: 110, diabetesRangeFrom: 126, … }
 */
export function cutPointsIn(test: TestName, thresholds: TestThresholds<ValueUnit>, unit: ValueUnit): CutPoints {
  if (unit === thresholds.unit) {
    return { unit, prediabetesFrom: thresholds.prediabetesFrom, diabetesRangeFrom: thresholds.diabetesRangeFrom, publishedPrediabetes: true, publishedDiabetes: true };
  }
  const published = thresholds.published?.unit === unit ? thresholds.published : undefined;
  const pre = thresholds.prediabetesFrom;
  const publishedPre = published?.prediabetesFrom ?? null;
  const publishedDia = published?.diabetesRangeFrom ?? null;
  return {
    unit,
    prediabetesFrom: pre === null ? null : (publishedPre ?? convert(test, pre, thresholds.unit, unit)),
    diabetesRangeFrom: publishedDia ?? convert(test, thresholds.diabetesRangeFrom, thresholds.unit, unit),
    publishedPrediabetes: pre === null || publishedPre !== null,
    publishedDiabetes: publishedDia !== null,
  };
}

/**
 * A value rounded for display to `decimals` (default {@link CONVERTED_DECIMALS}), with more, up to
 * 6, when fewer would put it on the other side of a cut-point of its unit.
 * @example
 * sidePreservingText(6.4999, CRITERIA.ADA.hba1c, 1) //=> "6.4999%" (6.5% would read as the diabetes range)
 * sidePreservingText(6.04, CRITERIA.ADA.hba1c, 1) //=> "6.0%"
 */
export function sidePreservingText(value: number, cuts: Pick<CutPoints, 'unit' | 'prediabetesFrom' | 'diabetesRangeFrom'>, decimals: number = CONVERTED_DECIMALS[cuts.unit]): string {
  const category = categoryFor(value, cuts);
  let shown = decimals;
  while (shown < 6 && categoryFor(roundTo(value, shown), cuts) !== category) shown += 1;
  return withUnit(roundTo(value, shown), cuts.unit);
}

/** An entered value as text ({@link TestClassification.enteredText}), against the cut-points in its unit. */
function enteredValueText(entered: { readonly value: number; readonly unit: ValueUnit }, cuts: CutPoints): string {
  return writtenDecimals(entered.value) <= CONVERTED_DECIMALS[entered.unit] ? withUnit(entered.value, entered.unit) : sidePreservingText(entered.value, cuts);
}

function roundToStep(value: number, step: number): number {
  return Math.round(value / step) * step;
}

function classifyTest(
  test: TestName,
  entered: { readonly value: number; readonly unit: ValueUnit },
  value: number,
  thresholds: TestThresholds<ValueUnit>,
  body: string,
): { result: TestClassification; note: Warning | null } {
  const converted = entered.unit !== thresholds.unit;
  const cuts = cutPointsIn(test, thresholds, entered.unit);
  // The category comes from the value as entered, against the body's form in that unit.
  const category = categoryFor(entered.value, cuts);
  const enteredText = enteredValueText(entered, cuts);
  const text = converted ? sidePreservingText(value, thresholds) : enteredText;
  const result: TestClassification = { test, value, unit: thresholds.unit, entered, enteredText, converted, text, category };
  if (!converted) return { result, note: null };
  const ownCategory = categoryFor(value, thresholds);
  const pairs = [
    { own: thresholds.prediabetesFrom, there: cuts.prediabetesFrom, published: cuts.publishedPrediabetes },
    { own: thresholds.diabetesRangeFrom, there: cuts.diabetesRangeFrom, published: cuts.publishedDiabetes },
  ].filter((p): p is { own: number; there: number; published: boolean } => p.own !== null && p.there !== null);
  const nearest = pairs.reduce((best, p) => (Math.abs(p.own - value) < Math.abs(best.own - value) ? p : best));
  if (ownCategory !== category) {
    // Between the two published forms of one cut-point: the form in the lab's unit decides.
    return {
      result,
      note: {
        code: 'conversion-near-threshold',
        message: `The ${TEST_LABELS[test]} ${enteredText} is ${text}, within rounding of the ${thresholdText(nearest.own, thresholds.unit)} limit, which ${body} also publishes as ${thresholdText(nearest.there, entered.unit)}: the value falls between the two published forms of one cut-point, so it is placed by the form in the unit the lab printed (${entered.unit}), in the ${category === null ? 'range below' : rangeName(category)}`,
      },
    };
  }
  if (nearest.published) return { result, note: null };
  const rounded = roundToStep(value, REPORTING_STEP[thresholds.unit]);
  if (categoryFor(rounded, thresholds) === ownCategory) return { result, note: null };
  return {
    result,
    note: {
      code: 'conversion-near-threshold',
      message: `The ${TEST_LABELS[test]} ${enteredText} is ${text}, within rounding of the ${thresholdText(nearest.own, thresholds.unit)} limit, which ${body} gives in ${thresholds.unit} only: it was compared after conversion, and a lab result printed in ${thresholds.unit} could fall on the other side`,
    },
  };
}

/**
 * Values possible in both units of a test (lib/glycaemia/schema.ts's plausible ranges overlap):
 * HbA1c 9–20 (9–20 % and 9–195 mmol/mol), fasting glucose 18–50 (1–50 mmol/L and 18–900 mg/dL).
 */
export const AMBIGUOUS_VALUES = { hba1c: { min: 9, max: 20 }, fpg: { min: 18, max: 50 } } as const;

const OTHER_UNIT: Readonly<Record<ValueUnit, ValueUnit>> = { '%': 'mmol/mol', 'mmol/mol': '%', 'mg/dL': 'mmol/L', 'mmol/L': 'mg/dL' };
/** The unit in which a value from the overlap is very low (the other, very high). */
const LOW_READING_UNIT: Readonly<Record<TestName, ValueUnit>> = { hba1c: 'mmol/mol', fpg: 'mg/dL' };

/**
 * A unit slip (issue 11 item 8): a value possible in both units whose category changes with the
 * unit gets a note asking to confirm the unit ("12 mmol/mol is a very low HbA1c: is it 12%?").
 */
function unitSlipNote(test: TestName, entered: { readonly value: number; readonly unit: ValueUnit }, category: GlycaemicCategory | null, thresholds: TestThresholds<ValueUnit>, body: string): Warning | null {
  const range = AMBIGUOUS_VALUES[test];
  if (entered.value < range.min || entered.value > range.max) return null;
  const other = OTHER_UNIT[entered.unit];
  const otherCategory = categoryFor(entered.value, cutPointsIn(test, thresholds, other));
  if (otherCategory === category) return null;
  const asEntered = withUnit(entered.value, entered.unit);
  const asOther = withUnit(entered.value, other);
  const where = otherCategory === null ? `not classified (${body})` : `in the ${rangeName(otherCategory)} (${body})`;
  const message =
    entered.unit === LOW_READING_UNIT[test]
      ? `${asEntered} is a very low ${TEST_LABELS[test]}: is it ${asOther}? As ${asOther} it would be ${where}; confirm the unit the lab printed`
      : `${asEntered} is a very high ${TEST_LABELS[test]}: is it ${asOther}? As ${asOther} it would be ${where}; confirm the unit the lab printed`;
  return { code: 'unit-check', message };
}

/** Everything in a {@link ClassifiedCheckup} but its date: what the readings and the criteria set decide. */
type ReadingsClassification = Omit<ClassifiedCheckup, 'date'>;

function classifyReadings(hba1cReading: Checkup['hba1c'], fpgReading: Checkup['fpg'], criteria: CriteriaSet): ReadingsClassification {
  const body = CRITERIA[criteria];
  const notes: Warning[] = [];
  let hba1c: TestClassification | null = null;
  let fpg: TestClassification | null = null;
  if (hba1cReading) {
    const { result, note } = classifyTest('hba1c', hba1cReading, hba1cIn(body.hba1c.unit, hba1cReading), body.hba1c, body.id);
    hba1c = result;
    if (note) notes.push(note);
    const slip = unitSlipNote('hba1c', hba1cReading, result.category, body.hba1c, body.id);
    if (slip) notes.push(slip);
  }
  if (fpgReading) {
    const { result, note } = classifyTest('fpg', fpgReading, glucoseIn(body.fpg.unit, fpgReading), body.fpg, body.id);
    fpg = result;
    if (note) notes.push(note);
    const slip = unitSlipNote('fpg', fpgReading, result.category, body.fpg, body.id);
    if (slip) notes.push(slip);
  }

  const classifying = [hba1c, fpg].filter((t): t is TestClassification & { category: GlycaemicCategory } => t !== null && t.category !== null);
  let category: GlycaemicCategory | null = null;
  let decidedBy: ClassifiedCheckup['decidedBy'] = null;
  if (classifying.length > 0) {
    const top = Math.max(...classifying.map((t) => RANK[t.category]));
    const deciders = classifying.filter((t) => RANK[t.category] === top);
    category = deciders[0]?.category ?? null;
    decidedBy = deciders.length === 2 ? 'both' : (deciders[0]?.test ?? null);
  } else {
    notes.push({
      code: 'not-classified',
      message: `Under ${body.id} criteria an HbA1c below 6.5% (48 mmol/mol) does not place a result in the normal or the prediabetes range; a fasting glucose is needed to classify this checkup`,
    });
  }

  let discordant = false;
  if (hba1c && fpg) {
    if (hba1c.category !== null && fpg.category !== null) discordant = hba1c.category !== fpg.category;
    else discordant = (hba1c.category === 'diabetes-range') !== (fpg.category === 'diabetes-range');
  }
  if (discordant && hba1c && fpg) {
    const words = (t: TestClassification) => (t.category === null ? 'below the diabetes range' : `in the ${rangeName(t.category)}`);
    notes.push({
      code: 'discordant-tests',
      message: `HbA1c and fasting glucose disagree: HbA1c is ${words(hba1c)}, fasting glucose ${words(fpg)} (${body.id}); the checkup is shown in the higher range, ${categoryLabel(category, criteria)}`,
    });
  }

  const percent = hba1cReading ? hba1cIn('%', hba1cReading) : null;
  const mmolMol = hba1cReading ? hba1cIn('mmol/mol', hba1cReading) : null;
  const mgDl = fpgReading ? glucoseIn('mg/dL', fpgReading) : null;
  const mmolL = fpgReading ? glucoseIn('mmol/L', fpgReading) : null;
  return {
    criteria,
    category,
    decidedBy,
    discordant,
    hba1c,
    fpg,
    hba1cPercent: percent,
    hba1cMmolMol: mmolMol,
    fpgMgDl: mgDl,
    fpgMmolL: mmolL,
    notes,
  };
}

/** Most pairs of readings remembered per criteria set before starting over: memory stays flat. */
export const MAX_REMEMBERED_READINGS = 4096;

/** Position of a reading's unit in the memory's slots: 0 or 1; 2 for a missing reading; −1 for an unknown unit. */
function unitSlot(reading: { readonly unit: string } | undefined, first: string, second: string): number {
  if (!reading) return 2;
  return reading.unit === first ? 0 : reading.unit === second ? 1 : -1;
}

/** Per criteria set: for each pair of units (or a missing test), HbA1c value → fasting glucose value → classification. */
const REMEMBERED: Record<CriteriaSet, { size: number; readonly slots: Map<number, Map<number, ReadingsClassification>>[] }> = {
  ADA: { size: 0, slots: [] },
  WHO: { size: 0, slots: [] },
  NICE: { size: 0, slots: [] },
};

/** Forgets every remembered classification (the next ones are worked out afresh). */
export function forgetRememberedReadings(): void {
  for (const memory of Object.values(REMEMBERED)) {
    memory.slots.length = 0;
    memory.size = 0;
  }
}

function freezeDeep<T>(value: T): T {
  if (typeof value !== 'object' || value === null || Object.isFrozen(value)) return value;
  for (const key of Object.keys(value)) freezeDeep((value as Record<string, unknown>)[key]);
  return Object.freeze(value);
}

/**
 * {@link classifyReadings}, remembered: a workforce repeats the same few hundred readings on
 * thousands of checkups, and the classification depends only on the readings and the criteria
 * set. A remembered answer is frozen (it is shared by every checkup with those readings); its
 * `entered` readings are copies `{ value, unit }`. A value of 0 (which could be −0, a different
 * number the memory's keys do not tell apart) or an unknown unit is classified afresh.
 */
function rememberedReadings(hba1cReading: Checkup['hba1c'], fpgReading: Checkup['fpg'], criteria: CriteriaSet): ReadingsClassification {
  const memory = REMEMBERED[criteria];
  const hSlot = unitSlot(hba1cReading, '%', 'mmol/mol');
  const fSlot = unitSlot(fpgReading, 'mg/dL', 'mmol/L');
  const hValue = hba1cReading ? hba1cReading.value : Number.NaN;
  const fValue = fpgReading ? fpgReading.value : Number.NaN;
  if (memory === undefined || hSlot < 0 || fSlot < 0 || hValue === 0 || fValue === 0) return classifyReadings(hba1cReading, fpgReading, criteria);
  const slot = hSlot * 3 + fSlot;
  let byHba1c = memory.slots[slot];
  if (byHba1c === undefined) {
    byHba1c = new Map();
    memory.slots[slot] = byHba1c;
  }
  let byFpg = byHba1c.get(hValue);
  const known = byFpg?.get(fValue);
  if (known !== undefined) return known;
  const fresh = freezeDeep(
    classifyReadings(hba1cReading ? { value: hValue, unit: hba1cReading.unit } : undefined, fpgReading ? { value: fValue, unit: fpgReading.unit } : undefined, criteria),
  );
  if (memory.size >= MAX_REMEMBERED_READINGS) {
    memory.slots.length = 0;
    memory.size = 0;
    return rememberedReadings(hba1cReading, fpgReading, criteria);
  }
  if (byFpg === undefined) {
    byFpg = new Map();
    byHba1c.set(hValue, byFpg);
  }
  byFpg.set(fValue, fresh);
  memory.size += 1;
  return fresh;
}

/**
 * Classify one checkup under one criteria set. What the readings decide is remembered per pair
 * of readings (the same answer, frozen and shared); the date is the checkup's own.
 *
 * @example
 * classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 92, unit: 'mg/dL' } }, 'ADA')
 * //=> { category: 'prediabetes', decidedBy: 'hba1c', discordant: true, hba1cMmolMol: 43.173, … }
 */
export function classifyCheckup(checkup: Checkup, criteria: CriteriaSet): ClassifiedCheckup {
  const r = rememberedReadings(checkup.hba1c, checkup.fpg, criteria);
  return {
    date: checkup.date,
    criteria: r.criteria,
    category: r.category,
    decidedBy: r.decidedBy,
    discordant: r.discordant,
    hba1c: r.hba1c,
    fpg: r.fpg,
    hba1cPercent: r.hba1cPercent,
    hba1cMmolMol: r.hba1cMmolMol,
    fpgMgDl: r.fpgMgDl,
    fpgMmolL: r.fpgMmolL,
    notes: r.notes,
  };
}

/** Classify every checkup, sorted by date (earliest first). */
export function classifyHistory(checkups: readonly Checkup[], criteria: CriteriaSet): ClassifiedCheckup[] {
  return inDateOrder(checkups).map((c) => classifyCheckup(c, criteria));
}
