import type { Checkup } from '../../../lib/glycaemia/schema';
import type { WorkerResult } from '../../../lib/workforce/types';

/** W001 of demo/checkups/checkups.csv as `hundredfold checkups` prints it (ADA, demo-heart-failure-10y, demo-workforce-hba1c-heart-failure). */
export const W001: WorkerResult = {
  worker: 'W001',
  age: 53,
  sex: 'female',
  checkups: 4,
  latest: { date: '2024-04-12', category: 'prediabetes' },
  run: { category: 'prediabetes', yearlyResults: 4, from: '2021-04-06', to: '2024-04-12' },
  status: 'exposed',
  reasons: ["Fits the study's exposure.", 'The study needed 3 yearly results in the prediabetes range (ADA, by HbA1c); this history has 4, from 2021-04-06 to 2024-04-12.'],
  referenceRisk: 0.015,
  exposedRisk: { estimate: 0.02389178285776514, lower: 0.01797289126481762, upper: 0.03124025537855701 },
  riskDifference: { estimate: 0.008891782857765141, lower: 0.002972891264817621, upper: 0.01624025537855701 },
  numberNeeded: {
    direction: 'harm',
    estimate: 112.46338512716895,
    display: 113,
    crossesNull: false,
    interval: { from: { direction: 'harm', value: 336.37288111892894, display: 337 }, to: { direction: 'harm', value: 61.57538638957367, display: 62 } },
    text: 'NNTH 113 (95% CI: NNTH 62 to 337)',
  },
  horizonYears: 10,
  warnings: [],
  strata: { site: 'North', department: 'Assembly' },
  problems: [],
  skippedRows: 0,
};

/** W002 of the same run: two yearly results, not enough. */
export const W002: WorkerResult = {
  worker: 'W002',
  age: 56,
  sex: 'male',
  checkups: 2,
  latest: { date: '2024-05-17', category: 'prediabetes' },
  run: { category: 'prediabetes', yearlyResults: 2, from: '2023-04-06', to: '2024-05-17' },
  status: 'insufficient',
  reasons: ['Not enough yearly results yet.', 'There are no earlier results.'],
  referenceRisk: null,
  exposedRisk: null,
  riskDifference: null,
  numberNeeded: null,
  horizonYears: null,
  warnings: [],
  strata: { site: 'South', department: 'Assembly' },
  problems: [],
  skippedRows: 0,
};

/** Invented: a comparison worker with a lower reference risk, no age. */
export const C003: WorkerResult = {
  ...W002,
  worker: 'C003',
  age: null,
  sex: null,
  status: 'comparison',
  latest: { date: '2024-01-10', category: 'normal' },
  referenceRisk: 0.01,
  strata: { site: 'North' },
};

/** W001's five checkups, demo/checkups/checkups.csv lines 3–7 (HbA1c %, fasting glucose mmol/L). */
export const W001_CHECKUPS: Checkup[] = [
  { date: '2021-04-06', hba1c: { value: 5.9, unit: '%' }, fpg: { value: 5.4, unit: 'mmol/L' } },
  { date: '2022-05-17', hba1c: { value: 6, unit: '%' }, fpg: { value: 5.2, unit: 'mmol/L' } },
  { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.5, unit: 'mmol/L' } },
  { date: '2024-04-12', hba1c: { value: 6, unit: '%' }, fpg: { value: 5.3, unit: 'mmol/L' } },
  { date: '2025-05-23', hba1c: { value: 6.2, unit: '%' }, fpg: { value: 5.6, unit: 'mmol/L' } },
];
