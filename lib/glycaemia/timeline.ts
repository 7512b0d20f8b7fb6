/**
 * What the small timeline chart draws, computed here so the chart only draws: one series per test
 * present, each value in the criteria body's unit (as classified), the body's thresholds as
 * reference lines, axis ranges, and a text alternative that says the same as the chart.
 *
 * x is the day number (days since 1970-01-01), so checkups sit at their true distance in time and
 * a gap looks like a gap. The y range covers every value and every threshold, widened by 10% of
 * the span (at least one unit step) and then rounded outwards to that step.
 */
import type { ClassifiedCheckup, TestClassification, TestName } from './classify';
import { CRITERIA } from './criteria';
import { compareByDate, dayNumber } from './dates';
import type { CriteriaSet, GlycaemicCategory } from './exposure';
import { categoryLabel, thresholdText, type ValueUnit } from './format';

export interface TimelinePoint {
  readonly day: number;
  readonly date: string;
  /** In the body's unit, unrounded (the chart's y). */
  readonly value: number;
  /** The value as shown elsewhere: "6.1%", "5.495 mmol/L". */
  readonly text: string;
  readonly category: GlycaemicCategory | null;
  readonly label: string;
}

export interface ReferenceLine {
  readonly value: number;
  readonly label: string;
}

export interface TimelineSeries {
  readonly test: TestName;
  readonly title: string;
  readonly unit: ValueUnit;
  readonly points: readonly TimelinePoint[];
  readonly thresholds: readonly ReferenceLine[];
  readonly yDomain: readonly [number, number];
  /** The chart's text alternative: every point and every line, in words. */
  readonly summary: string;
}

export interface Timeline {
  readonly criteria: CriteriaSet;
  readonly series: readonly TimelineSeries[];
  readonly xDomain: readonly [number, number];
  readonly ticks: readonly number[];
  /** Day number → date text for the axis. */
  readonly tickLabels: Readonly<Record<number, string>>;
}

/** Days of margin either side of the first and last checkup. */
const X_MARGIN_DAYS = 45;
/** y-axis rounding step per unit. */
const Y_STEP: Readonly<Record<ValueUnit, number>> = { '%': 0.5, 'mmol/mol': 5, 'mmol/L': 0.5, 'mg/dL': 10 };

function yDomain(values: readonly number[], unit: ValueUnit): [number, number] {
  const step = Y_STEP[unit];
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const pad = Math.max((hi - lo) * 0.1, step);
  return [Math.max(0, Math.floor((lo - pad) / step) * step), Math.ceil((hi + pad) / step) * step];
}

function series(test: TestName, classified: readonly ClassifiedCheckup[], criteria: CriteriaSet): TimelineSeries | null {
  const body = CRITERIA[criteria];
  const thresholds = test === 'hba1c' ? body.hba1c : body.fpg;
  const unit = thresholds.unit;
  const points: TimelinePoint[] = [];
  for (const c of classified) {
    const t: TestClassification | null = c[test];
    if (!t) continue;
    points.push({ day: dayNumber(c.date), date: c.date, value: t.value, text: t.text, category: t.category, label: categoryLabel(t.category, criteria) });
  }
  if (points.length === 0) return null;
  const lines: ReferenceLine[] = [];
  if (thresholds.prediabetesFrom !== null) {
    lines.push({ value: thresholds.prediabetesFrom, label: `prediabetes range from ${thresholdText(thresholds.prediabetesFrom, unit)}` });
  }
  lines.push({ value: thresholds.diabetesRangeFrom, label: `diabetes range from ${thresholdText(thresholds.diabetesRangeFrom, unit)}` });
  const title = `${test === 'hba1c' ? 'HbA1c' : 'Fasting glucose'} (${unit})`;
  const summary = `${title} under ${body.id}: ${points.map((p) => `${p.date} ${p.text}, ${p.label}`).join('; ')}. Lines mark the ${lines.map((l) => l.label).join(' and the ')}.`;
  return {
    test,
    title,
    unit,
    points,
    thresholds: lines,
    yDomain: yDomain([...points.map((p) => p.value), ...lines.map((l) => l.value)], unit),
    summary,
  };
}

/**
 * @example
 * glucoseTimeline(classifyHistory(history, 'ADA'), 'ADA')
 * //=> { series: [{ test: 'hba1c', title: 'HbA1c (%)', points: [...], thresholds: [{ value: 5.7, … }, { value: 6.5, … }], yDomain: [5, 7] , … }], … }
 */
export function glucoseTimeline(classified: readonly ClassifiedCheckup[], criteria: CriteriaSet): Timeline | null {
  if (classified.length === 0) return null;
  const sorted = [...classified].sort(compareByDate);
  const all = (['hba1c', 'fpg'] as const).map((t) => series(t, sorted, criteria)).filter((s): s is TimelineSeries => s !== null);
  const days = sorted.map((c) => dayNumber(c.date));
  const tickLabels: Record<number, string> = {};
  sorted.forEach((c, i) => {
    const day = days[i];
    if (day !== undefined) tickLabels[day] = c.date;
  });
  return {
    criteria,
    series: all,
    xDomain: [Math.min(...days) - X_MARGIN_DAYS, Math.max(...days) + X_MARGIN_DAYS],
    ticks: days,
    tickLabels,
  };
}
