/**
 * Demo population tables for the consultation screen.
 *
 * ILLUSTRATIVE NUMBERS, NOT FROM A REAL POPULATION. Every figure below was invented for this
 * program to look plausible (rising with age, higher in men); none was taken from a registry,
 * a publication or any other source. Each table says so in its `source`, `population` and
 * `illustrative: true`, and the screen repeats it. A clinic replaces them with its own tables
 * (docs/table-format.md). Ids are stable: links and saved scenarios refer to them.
 */
import type { PopulationTable, Stratum, StratumSex } from './schema';

/** The line every demo table carries, and the screen shows beside it. */
export const ILLUSTRATIVE_TABLE_NOTE = 'Illustrative numbers, not from a real population';

const BANDS_30_79: readonly (readonly [number, number])[] = [
  [30, 39],
  [40, 49],
  [50, 59],
  [60, 69],
  [70, 79],
];

function riskStrata(sex: StratumSex, risks: readonly number[]): Stratum[] {
  return BANDS_30_79.map(([ageFrom, ageTo], i) => ({ sex, ageFrom, ageTo, risk: risks[i] ?? Number.NaN }));
}

function rateStrata(sex: StratumSex, ratesPer1000: readonly number[]): Stratum[] {
  return BANDS_30_79.map(([ageFrom, ageTo], i) => ({ sex, ageFrom, ageTo, rate: ratesPer1000[i] ?? Number.NaN, perPersonYears: 1000 }));
}

/** 10-year risk of a first hospital admission for heart failure, by sex and 10-year band 30–79. Invented. */
export const DEMO_HEART_FAILURE_10Y: PopulationTable = {
  id: 'demo-heart-failure-10y',
  title: 'Heart failure needing hospital care within 10 years (demo)',
  outcome: 'a first hospital admission for heart failure',
  horizonYears: 10,
  population: 'Adults aged 30 to 79 in an invented region (illustrative)',
  source: `${ILLUSTRATIVE_TABLE_NOTE}; invented for the Hundredfold demo`,
  year: 2024,
  illustrative: true,
  strata: [
    // Invented values: female 0.2%, 0.6%, 1.5%, 4%, 9%; male 0.3%, 0.9%, 2.2%, 5.5%, 12%.
    ...riskStrata('female', [0.002, 0.006, 0.015, 0.04, 0.09]),
    ...riskStrata('male', [0.003, 0.009, 0.022, 0.055, 0.12]),
  ],
};

/** First coronary events per 1000 person-years, by sex and 10-year band 30–79. Invented. */
export const DEMO_CORONARY_RATE: PopulationTable = {
  id: 'demo-coronary-rate',
  title: 'First coronary events per 1000 person-years (demo)',
  outcome: 'a first coronary event (heart attack or new angina needing hospital care)',
  horizonYears: 10,
  population: 'Working-age and older adults in an invented district (illustrative)',
  source: `${ILLUSTRATIVE_TABLE_NOTE}; invented for the Hundredfold demo`,
  year: 2024,
  illustrative: true,
  strata: [
    // Invented values, events per 1000 person-years.
    ...rateStrata('female', [0.3, 1.0, 2.5, 5.5, 10]),
    ...rateStrata('male', [0.8, 2.4, 5.5, 9.5, 15]),
  ],
};

/** 5-year risk of a first stroke, both sexes together, bands 40–49 … 80 and over. Invented. */
export const DEMO_STROKE_5Y: PopulationTable = {
  id: 'demo-stroke-5y',
  title: 'First stroke within 5 years, women and men together (demo)',
  outcome: 'a first stroke',
  horizonYears: 5,
  population: 'Adults aged 40 and over in an invented region (illustrative)',
  source: `${ILLUSTRATIVE_TABLE_NOTE}; invented for the Hundredfold demo`,
  year: 2024,
  illustrative: true,
  strata: [
    // Invented values: 0.4%, 1%, 2.5%, 6%, 12%; the top band is open ("80 and over" = 80–120).
    { sex: 'any', ageFrom: 40, ageTo: 49, risk: 0.004 },
    { sex: 'any', ageFrom: 50, ageTo: 59, risk: 0.01 },
    { sex: 'any', ageFrom: 60, ageTo: 69, risk: 0.025 },
    { sex: 'any', ageFrom: 70, ageTo: 79, risk: 0.06 },
    { sex: 'any', ageFrom: 80, ageTo: 120, risk: 0.12 },
  ],
};

/** Every demo table, in the order the screen lists them. */
export const DEMO_TABLES: readonly PopulationTable[] = [DEMO_HEART_FAILURE_10Y, DEMO_CORONARY_RATE, DEMO_STROKE_5Y];

/** A demo table by id, or undefined. */
export function findDemoTable(id: string): PopulationTable | undefined {
  return DEMO_TABLES.find((t) => t.id === id);
}
