/**
 * "How this was worked out": each step from the inputs to the figures on the screen, with its
 * formula, the numbers put into it, the value it gives and the source of the formula, so a
 * clinician can check the basis of every figure (criterion 4 of the FDA guidance on clinical
 * decision support software: the user can review the basis of a recommendation).
 *
 * Nothing is computed here that the engine does not compute: the values come from the
 * {@link ComputeResult} and from the engine's own step functions (lib/engine/*), so the numbers
 * shown are exactly the numbers used. The formulas and sources repeat the engine modules' doc
 * comments:
 * - rate to risk p = 1 − exp(−λt) and rescaling p2 = 1 − (1 − p1)^(t2/t1): Miller & Homan 1994,
 *   Med Decis Making 14:52;
 * - population-average risk Ppop = (1 − pe)·P0 + pe·P1(P0), solved for P0 (algebra; monotone);
 * - risk odds ratio P1 = OR·P0 / (1 − P0 + OR·P0): Zhang & Yu 1998, JAMA 280:1690;
 * - rate ratio P1 = 1 − (1 − P0)^HR: Altman & Andersen 1999, BMJ 319:1492; a risk-set sampled
 *   case-control odds ratio estimates it (Greenland & Thomas 1982, Am J Epidemiol 116:547);
 * - a case-cohort odds ratio estimates the risk ratio (Rodrigues & Kirkwood 1990, Int J
 *   Epidemiol 19:205);
 * - limits through the same formula at a fixed P0: Cochrane Handbook §12.5.4.5;
 * - number needed 1/|RD| rounded up, interval through infinity: Cochrane Handbook §12.5.4.1;
 *   Altman 1998, BMJ 317:1309;
 * - icon counts round(P·D) with one denominator: Trevena et al. 2013, BMC Med Inform Decis Mak
 *   13(Suppl 2):S7; Galesic, Garcia-Retamero & Gigerenzer 2009, Health Psychol 28:210.
 */
import { groupPhrase } from '../context/scenarioContext';
import { referenceRiskFromPopulation } from '../engine/baseline';
import { roundPeople } from '../engine/iconArray';
import type { ComputeResult } from '../engine/types';
import type { Scenario } from '../scenario/schema';
import type { PopulationTable, Stratum } from '../tables/schema';

export interface ExplainStep {
  readonly id: 'baseline' | 'horizon' | 'conversion' | 'risk-ratio' | 'risk-difference' | 'number-needed' | 'icon-counts';
  readonly title: string;
  /** The formula in symbols. */
  readonly formula: string;
  /** The same formula with this scenario's numbers put in. */
  readonly numbers: string;
  /** What the step gives. */
  readonly result: string;
  /** Where the formula, or the input, comes from. */
  readonly source: string;
}

export interface ExplainInput {
  readonly scenario: Scenario;
  readonly result: ComputeResult;
  /** The table and stratum the baseline was looked up in, when it was. */
  readonly table?: Pick<PopulationTable, 'title' | 'source' | 'year' | 'illustrative' | 'exposurePrevalence'> | undefined;
  readonly stratum?: Stratum | undefined;
}

/** Four significant digits, without trailing zeros: 0.115384… → "0.1154". */
export function sig(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(4)));
}

const SOURCES = {
  rates: 'Miller & Homan 1994, Med Decis Making 14:52 (constant hazard)',
  population: 'Definition of a population average, solved for P0 (the left side rises with P0, so the answer is unique)',
  riskRatio: 'Definition of the risk ratio; limits at a fixed baseline: Cochrane Handbook §12.5.4.5',
  riskOddsRatio: 'Zhang & Yu 1998, JAMA 280:1690; limits at a fixed baseline: Cochrane Handbook §12.5.4.5',
  rateRatio: 'Proportional hazards, S1 = S0^HR (Altman & Andersen 1999, BMJ 319:1492); limits at a fixed baseline: Cochrane Handbook §12.5.4.5',
  riskSetOddsRatio:
    'Greenland & Thomas 1982, Am J Epidemiol 116:547 (a risk-set sampled odds ratio estimates the rate ratio); then proportional hazards (Altman & Andersen 1999, BMJ 319:1492)',
  caseCohortOddsRatio:
    'Rodrigues & Kirkwood 1990, Int J Epidemiol 19:205 (a case-cohort odds ratio estimates the risk ratio, assuming the subcohort was drawn from the whole cohort at its start, future cases included)',
  difference: 'Definition; Cochrane Handbook §12.5.4.5 for the interval at a fixed baseline',
  numberNeeded: 'Cochrane Handbook §12.5.4.1; Altman 1998, BMJ 317:1309 for an interval through infinity',
  iconCounts:
    'One denominator for the page (Trevena et al. 2013, BMC Med Inform Decis Mak 13(Suppl 2):S7); 100, or 1,000 when a count would round to 0 (Galesic et al. 2009, Health Psychol 28:210; the switching rule is the app’s)',
} as const;

function pct(value: number): string {
  return `${sig(value * 100)}%`;
}

function baselineStep({ scenario, result, table, stratum }: ExplainInput): ExplainStep {
  const { baseline } = scenario;
  if ('rate' in baseline) {
    const lambda = baseline.rate / baseline.perPersonYears;
    const pe = baseline.exposurePrevalence;
    return {
      id: 'baseline',
      title: pe === undefined ? 'Baseline: the event rate' : 'Baseline: the event rate, a population average',
      formula: pe === undefined ? 'λ = events ÷ person-years' : 'λ = events ÷ person-years; its risk over the horizon is then solved for P0 from Ppop = (1 − pe)·P0 + pe·P1(P0)',
      numbers: `λ = ${sig(baseline.rate)} ÷ ${sig(baseline.perPersonYears)}${pe === undefined ? '' : `; pe = ${sig(pe)}`}`,
      result: `λ = ${sig(lambda)} events per person-year`,
      source:
        (table ? tableSource(table, stratum) : 'Entered by the clinician') +
        (pe === undefined ? '' : `; ${SOURCES.population}; ${table ? prevalenceWords(pe, table, stratum) : 'the prevalence was entered by the clinician'}`),
    };
  }
  if ('populationRisk' in baseline) {
    const p0 = referenceRiskFromPopulation(result.conversion, baseline.populationRisk, scenario.effect.estimate, baseline.exposurePrevalence);
    return {
      id: 'baseline',
      title: 'Baseline: the comparison group’s risk inside a population average',
      formula: 'Ppop = (1 − pe)·P0 + pe·P1(P0), solved for P0, with P1 from the conversion below at the estimate',
      numbers: `${sig(baseline.populationRisk)} = (1 − ${sig(baseline.exposurePrevalence)})·P0 + ${sig(baseline.exposurePrevalence)}·P1(P0), ratio ${sig(scenario.effect.estimate)} (solved at the estimate; P0 is then held fixed for the interval's limits)`,
      result: `P0 = ${sig(p0)} (${pct(p0)}) over ${sig(baseline.years)} years`,
      source: table
        ? `${SOURCES.population}; population risk from ${tableSource(table, stratum)}; ${prevalenceWords(baseline.exposurePrevalence, table, stratum)}`
        : `${SOURCES.population}; the population risk and prevalence were entered by the clinician`,
    };
  }
  return {
    id: 'baseline',
    title: 'Baseline: the comparison group’s risk',
    formula: 'P0 over t years, as given',
    numbers: `P0 = ${sig(baseline.risk)} over t = ${sig(baseline.years)} years`,
    result: `P0 = ${pct(baseline.risk)} over ${sig(baseline.years)} years`,
    source: table ? tableSource(table, stratum) : 'Entered by the clinician',
  };
}

/** Which exposure prevalence corrected a table's population average: the stratum's, the table's, or the clinician's. */
function prevalenceWords(used: number, table: NonNullable<ExplainInput['table']>, stratum: Stratum | undefined): string {
  const value = `exposure prevalence ${sig(used)} (${pct(used)})`;
  if (stratum?.exposurePrevalence === used) return `${value} from the table, for this group`;
  if (stratum?.exposurePrevalence === undefined && table.exposurePrevalence === used) return `${value} from the table, for its whole population`;
  return `${value} entered by the clinician`;
}

function tableSource(table: NonNullable<ExplainInput['table']>, stratum: Stratum | undefined): string {
  const group = stratum ? `; group: ${groupPhrase(stratum)}` : '';
  const said = /illustrative numbers, not from a real population/i.test(table.source);
  const note = table.illustrative && !said ? ' — illustrative numbers, not from a real population' : '';
  return `Table “${table.title}”: ${table.source} (${table.year})${group}${note}`;
}

function horizonStep({ scenario, result }: ExplainInput): ExplainStep {
  const { baseline } = scenario;
  const h = result.horizonYears;
  if ('rate' in baseline) {
    const lambda = baseline.rate / baseline.perPersonYears;
    if (baseline.exposurePrevalence !== undefined) {
      return {
        id: 'horizon',
        title: `Baseline risk over the horizon of ${sig(h)} years`,
        formula: 'Ppop = 1 − exp(−λ·H); then P0 from Ppop = (1 − pe)·P0 + pe·P1(P0)',
        numbers: `Ppop = 1 − exp(−${sig(lambda)} × ${sig(h)}); pe = ${sig(baseline.exposurePrevalence)}, ratio ${sig(scenario.effect.estimate)}`,
        result: `P0 = ${sig(result.referenceRisk)} (${pct(result.referenceRisk)})`,
        source: `${SOURCES.rates}; ${SOURCES.population}`,
      };
    }
    return {
      id: 'horizon',
      title: `Baseline risk over the horizon of ${sig(h)} years`,
      formula: 'P0 = 1 − exp(−λ·H)',
      numbers: `P0 = 1 − exp(−${sig(lambda)} × ${sig(h)})`,
      result: `P0 = ${sig(result.referenceRisk)} (${pct(result.referenceRisk)})`,
      source: SOURCES.rates,
    };
  }
  const years = baseline.years;
  const start =
    'populationRisk' in baseline
      ? referenceRiskFromPopulation(result.conversion, baseline.populationRisk, scenario.effect.estimate, baseline.exposurePrevalence)
      : baseline.risk;
  if (years === h) {
    return {
      id: 'horizon',
      title: `Baseline risk over the horizon of ${sig(h)} years`,
      formula: 'No change: the horizon equals the baseline’s period',
      numbers: `H = t = ${sig(h)} years`,
      result: `P0 = ${sig(result.referenceRisk)} (${pct(result.referenceRisk)})`,
      source: 'Nothing to convert',
    };
  }
  return {
    id: 'horizon',
    title: `Baseline risk over the horizon of ${sig(h)} years`,
    formula: 'P0(H) = 1 − (1 − P0(t))^(H / t)',
    numbers: `P0(${sig(h)}) = 1 − (1 − ${sig(start)})^(${sig(h)} / ${sig(years)})`,
    result: `P0 = ${sig(result.referenceRisk)} (${pct(result.referenceRisk)})`,
    source: SOURCES.rates,
  };
}

function conversionStep({ scenario, result }: ExplainInput): ExplainStep {
  const { measure, estimate, lower, upper } = scenario.effect;
  const p0 = sig(result.referenceRisk);
  const p1 = result.exposedRisk;
  const values = `P1 = ${sig(p1.estimate)} (${pct(p1.estimate)}); at the limits ${sig(p1.lower)} to ${sig(p1.upper)} (${pct(p1.lower)} to ${pct(p1.upper)})`;
  const capped = result.warnings.some((w) => w.code === 'risk-ratio-exceeds-certainty') ? '; capped at 1, a risk cannot exceed certainty' : '';
  switch (result.conversion) {
    case 'risk-ratio': {
      const fromCaseCohort = measure === 'OR';
      return {
        id: 'conversion',
        title: fromCaseCohort ? 'Exposed risk: a case-cohort odds ratio read as a risk ratio' : 'Exposed risk from the risk ratio',
        formula: 'P1 = ratio · P0, for the estimate and each limit',
        numbers: `P1 = ${sig(estimate)} × ${p0}; limits ${sig(lower)} × ${p0} and ${sig(upper)} × ${p0}`,
        result: `${values}${capped}`,
        source: fromCaseCohort ? `${SOURCES.caseCohortOddsRatio}; ${SOURCES.riskRatio}` : SOURCES.riskRatio,
      };
    }
    case 'risk-odds-ratio':
      return {
        id: 'conversion',
        title: 'Exposed risk from the odds ratio',
        formula: 'P1 = OR·P0 / (1 − P0 + OR·P0), for the estimate and each limit',
        numbers: `P1 = ${sig(estimate)} × ${p0} / (1 − ${p0} + ${sig(estimate)} × ${p0}); limits with OR = ${sig(lower)} and ${sig(upper)}`,
        result: values,
        source: SOURCES.riskOddsRatio,
      };
    case 'rate-ratio': {
      const riskSet = measure === 'OR';
      return {
        id: 'conversion',
        title: riskSet ? 'Exposed risk: a risk-set sampled odds ratio read as a rate ratio' : 'Exposed risk from the hazard ratio',
        formula: 'P1 = 1 − (1 − P0)^ratio, for the estimate and each limit',
        numbers: `P1 = 1 − (1 − ${p0})^${sig(estimate)}; limits with ratio ${sig(lower)} and ${sig(upper)}`,
        result: values,
        source: riskSet ? SOURCES.riskSetOddsRatio : SOURCES.rateRatio,
      };
    }
  }
}

/**
 * Every step, in order: baseline, horizon, conversion, risk ratio at this baseline, risk
 * difference, number needed, icon-array counts.
 *
 * @example
 * explainSteps({ scenario: { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } }, result })
 *   .find((s) => s.id === 'risk-difference')?.numbers
 * //=> "RD = 0.12 − 0.08; limits 0.096 − 0.08 and 0.152 − 0.08"
 */
export function explainSteps(input: ExplainInput): ExplainStep[] {
  const { result } = input;
  const p0 = sig(result.referenceRisk);
  const { exposedRisk: p1, riskRatio: rr, riskDifference: rd, numberNeeded: nn, iconArray: counts } = result;
  const d = counts.denominator;
  const rounded = (p: number) => `round(${sig(p)} × ${d}) = ${roundPeople(p * d)}`;
  const nnNumbers =
    rd.estimate === 0 ? 'RD = 0, so no number needed (infinitely many)' : `1 / |${sig(rd.estimate)}| = ${sig(1 / Math.abs(rd.estimate))}, rounded up`;
  return [
    baselineStep(input),
    horizonStep(input),
    conversionStep(input),
    {
      id: 'risk-ratio',
      title: 'Risk ratio at this baseline',
      formula: 'RR = P1 / P0, for the estimate and each limit',
      numbers: `RR = ${sig(p1.estimate)} / ${p0}; limits ${sig(p1.lower)} / ${p0} and ${sig(p1.upper)} / ${p0}`,
      result: `RR = ${sig(rr.estimate)} (${sig(rr.lower)} to ${sig(rr.upper)})`,
      source: SOURCES.riskRatio,
    },
    {
      id: 'risk-difference',
      title: 'Risk difference',
      formula: 'RD = P1 − P0, for the estimate and each limit',
      numbers: `RD = ${sig(p1.estimate)} − ${p0}; limits ${sig(p1.lower)} − ${p0} and ${sig(p1.upper)} − ${p0}`,
      result: `RD = ${sig(rd.estimate)} (${sig(rd.lower)} to ${sig(rd.upper)}), i.e. ${sig(rd.estimate * 100)} percentage points`,
      source: SOURCES.difference,
    },
    {
      id: 'number-needed',
      title: 'Number needed to harm or to benefit',
      formula: 'NN = 1 / |RD|, rounded up; the interval from the reciprocals of the RD limits',
      numbers: nnNumbers,
      result: nn.text,
      source: SOURCES.numberNeeded,
    },
    {
      id: 'icon-counts',
      title: `People in the pictures, out of ${d.toLocaleString('en')}`,
      formula: 'count = round(P × D)',
      numbers: `${rounded(result.referenceRisk)}; ${rounded(p1.estimate)}; range ${rounded(p1.lower)} to ${rounded(p1.upper)}`,
      result: `${counts.referenceEvents} and ${counts.exposedEvents} out of ${d.toLocaleString('en')} (range ${counts.exposedLower} to ${counts.exposedUpper}); denominator ${counts.automatic ? 'chosen automatically' : 'chosen by the clinician'}`,
      source: SOURCES.iconCounts,
    },
  ];
}
