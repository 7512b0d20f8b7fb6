import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { lookupStratum } from '@/lib/tables/lookup';
import { evaluateWorker, prepareCheckups, summariseWorkforce, workerScenario, type CheckupRow, type CheckupsContext, type WorkerResult } from '@/lib/workforce';

// Invented workers (illustrative). The demo entry: HR 1.6 (1.2 to 2.1), exposure = HbA1c in the
// prediabetes range (ADA 5.7–6.4%) at 3 yearly results in a row, comparison = normal HbA1c over the
// same span. The demo table: 10-year risk, female 50–59 0.015, male 50–59 0.022 (invented).
const ENTRY = DEMO_WORKFORCE_HBA1C_HEART_FAILURE;

function context(entry: EvidenceEntry = ENTRY, horizonYears?: number): CheckupsContext {
  const prepared = prepareCheckups({ evidence: entry, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA', ...(horizonYears !== undefined ? { horizonYears } : {}) });
  if (!prepared.ok) throw new Error(prepared.issues[0]?.message);
  return prepared.value;
}

let line = 1;
type Extra = { [K in keyof CheckupRow]?: CheckupRow[K] | undefined };
function row(worker: string, date: string, hba1c: number | null, extra: Extra = {}): CheckupRow {
  line += 1;
  const merged: Record<string, unknown> = { line, worker, date, ...(hba1c !== null ? { hba1c: { value: hba1c, unit: '%' as const } } : {}), age: 52, sex: 'female', strata: { site: 'North' }, ...extra };
  for (const key of Object.keys(merged)) if (merged[key] === undefined) delete merged[key];
  return merged as unknown as CheckupRow;
}

function worker(id: string, values: readonly (readonly [string, number | null])[], extra: Extra = {}) {
  return { worker: id, rows: values.map(([date, v]) => row(id, date, v, extra)) };
}

// HR → risk over the same horizon: P1 = 1 − (1 − P0)^HR (Altman & Andersen 1999, as lib/engine); worked by hand below.

describe('evaluateWorker: each status on hand-worked histories', () => {
  it('exposed: 3 yearly HbA1c 5.9–6.1% (ADA prediabetes 5.7–6.4%), female 52 → the engine\'s figures', () => {
    const r = evaluateWorker(worker('W1', [['2022-03-01', 5.9], ['2023-03-01', 6.0], ['2024-03-01', 6.1]]), context());
    expect(r.status).toBe('exposed');
    expect(r.run).toEqual({ category: 'prediabetes', yearlyResults: 3, from: '2022-03-01', to: '2024-03-01' });
    expect(r.latest).toEqual({ date: '2024-03-01', category: 'prediabetes' });
    // P0 = 0.015 (female 50–59, 10 years = the horizon). P1 = 1 − 0.985^1.6: ln 0.985 = −0.0151136,
    // × 1.6 = −0.0241818, e^… = 0.976108 → 0.023892 (hand-computed).
    expect(r.referenceRisk).toBe(0.015);
    expect(r.exposedRisk?.estimate).toBeCloseTo(0.023892, 5);
    // Limits: 1 − 0.985^1.2 = 0.017973, 1 − 0.985^2.1 = 0.031240 (hand-computed the same way).
    expect(r.exposedRisk?.lower).toBeCloseTo(0.017973, 5);
    expect(r.exposedRisk?.upper).toBeCloseTo(0.03124, 5);
    expect(r.riskDifference?.estimate).toBeCloseTo(0.023892 - 0.015, 5);
    // NNTH = ⌈1 / 0.008892⌉ = ⌈112.46⌉ = 113 (hand-computed).
    expect(r.numberNeeded?.display).toBe(113);
    expect(r.age).toBe(52);
    expect(r.strata).toEqual({ site: 'North' });
  });

  it('comparison: 3 yearly HbA1c below 5.7% (ADA normal) → figures too', () => {
    const r = evaluateWorker(worker('W2', [['2022-03-01', 5.2], ['2023-03-01', 5.3], ['2024-03-01', 5.1]], { sex: 'male', age: 55 }), context());
    expect(r.status).toBe('comparison');
    // Male 50–59: P0 = 0.022; 1 − 0.978^1.6: ln 0.978 = −0.0222454, × 1.6 = −0.0355926 → 0.034967 (hand-computed).
    expect(r.referenceRisk).toBe(0.022);
    expect(r.exposedRisk?.estimate).toBeCloseTo(0.034967, 5);
  });

  it('diabetes-range: latest HbA1c 6.8% (ADA ≥ 6.5%) comes first, with a note that is not a diagnosis', () => {
    const r = evaluateWorker(worker('W3', [['2022-03-01', 6.0], ['2023-03-01', 6.1], ['2024-03-01', 6.8]]), context());
    expect(r.status).toBe('diabetes-range');
    expect(r.referenceRisk).toBeNull();
    expect(r.reasons[0]).toMatch(/diabetes range \(ADA\).*not a diagnosis/);
    expect(r.reasons.join(' ')).not.toMatch(/\bdiabetes\b(?! range)/);
  });

  it('insufficient: two yearly prediabetes-range results where 3 are needed, nothing earlier', () => {
    const r = evaluateWorker(worker('W4', [['2023-03-01', 6.0], ['2024-03-01', 6.1]]), context());
    expect(r.status).toBe('insufficient');
    expect(r.reasons[0]).toBe('Not enough yearly results yet.');
    expect(r.exposedRisk).toBeNull();
  });

  it('insufficient: a gap of 24 months (> 18) cuts the run to 2 results', () => {
    const r = evaluateWorker(worker('W5', [['2020-03-01', 6.0], ['2021-03-01', 6.0], ['2023-03-01', 6.1], ['2024-03-01', 6.2]]), context());
    expect(r.status).toBe('insufficient');
    expect(r.run.yearlyResults).toBe(2);
    expect(r.reasons[0]).toMatch(/gap/);
  });

  it('neither: 2 prediabetes-range results after normal ones (the range changed)', () => {
    const r = evaluateWorker(worker('W6', [['2021-03-01', 5.2], ['2022-03-01', 5.3], ['2023-03-01', 6.0], ['2024-03-01', 6.1]]), context());
    expect(r.status).toBe('neither');
    expect(r.reasons[0]).toBe("Fits neither the study's exposure nor its comparison group.");
    expect(r.reasons.some((t) => t.includes('Before the run, the result of 2022-03-01 is in the normal range (ADA).'))).toBe(true);
  });

  it('neither: the table has no band for age 25 (bands 30–79); says so in words', () => {
    const r = evaluateWorker(worker('W7', [['2022-03-01', 5.9], ['2023-03-01', 6.0], ['2024-03-01', 6.1]], { age: 25 }), context());
    expect(r.status).toBe('neither');
    expect(r.reasons[0]).toMatch(/population table cannot place this worker.*age 25/);
  });

  it('insufficient: fasting glucose only, when the study decided by HbA1c', () => {
    const rows = ['2022-03-01', '2023-03-01', '2024-03-01'].map((d) => row('W8', d, null, { fpg: { value: 110, unit: 'mg/dL' } }));
    const r = evaluateWorker({ worker: 'W8', rows }, context());
    // Latest category under ADA: FPG 110 mg/dL is prediabetes (100–125), but HbA1c decides the exposure.
    expect(r.latest?.category).toBe('prediabetes');
    expect(r.status).toBe('insufficient');
  });

  it('same-day rows are merged; a conflicting one is skipped and reported with its row', () => {
    const a = row('W9', '2024-03-01', 6.0);
    const b = row('W9', '2024-03-01', 6.3);
    const r = evaluateWorker({ worker: 'W9', rows: [a, b] }, context());
    expect(r.checkups).toBe(1);
    expect(r.skippedRows).toBe(1);
    expect(r.problems).toEqual([expect.objectContaining({ line: b.line, column: 'HbA1c', code: 'duplicate-date' })]);
  });

  it('age from a birth year is the checkup year minus the birth year, and says it may be one high', () => {
    const r = evaluateWorker(worker('W10', [['2022-03-01', 5.9], ['2023-03-01', 6.0], ['2024-03-01', 6.1]], { age: undefined, birthYear: 1970 }), context());
    // 2024 − 1970 = 54.
    expect(r.age).toBe(54);
    expect(r.reasons).toContain('The age comes from the birth year: it may be one year high.');
  });
});

describe('prepareCheckups', () => {
  it('refuses an entry without an exposure definition, naming it', () => {
    const { exposureDefinition: _unused, ...bare } = ENTRY;
    const r = prepareCheckups({ evidence: bare, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('no-exposure-definition');
  });
  it('refuses an unknown criteria set and a horizon of 0', () => {
    const r = prepareCheckups({ evidence: ENTRY, table: DEMO_HEART_FAILURE_10Y, criteria: 'XYZ', horizonYears: 0 });
    expect(r.ok ? [] : r.issues.map((i) => i.code)).toEqual(['invalid-choice', 'out-of-range']);
  });
});

// Random workers: 1–6 yearly checkups, HbA1c anywhere from normal to diabetes range, ages 30–79, either sex.
const workerArb = fc
  .record({
    values: fc.array(fc.integer({ min: 45, max: 75 }), { minLength: 1, maxLength: 6 }),
    age: fc.integer({ min: 30, max: 79 }),
    sex: fc.constantFrom('female' as const, 'male' as const),
    horizon: fc.option(fc.integer({ min: 1, max: 20 }), { nil: undefined }),
  })
  .map(({ values, age, sex, horizon }) => ({
    group: { worker: 'WX', rows: values.map((v, i) => row('WX', `${2018 + i}-04-01`, v / 10, { age, sex, strata: {} })) },
    horizon,
  }));

describe('per-worker figures are computeScenario\'s', () => {
  it('property: for exposed and comparison workers, every figure equals computeScenario on the worker\'s scenario built by hand', () => {
    fc.assert(
      fc.property(workerArb, ({ group, horizon }) => {
        const ctx = context(ENTRY, horizon);
        const r = evaluateWorker(group, ctx);
        fc.pre(r.status === 'exposed' || r.status === 'comparison');
        const last = group.rows.at(-1);
        const lookup = lookupStratum(DEMO_HEART_FAILURE_10Y, { age: last?.age, sex: last?.sex });
        if (!lookup.ok) throw new Error('the arbitrary stays inside the table');
        const expected = computeScenario({
          baseline: lookup.value.baseline,
          effect: ENTRY.effect,
          ...(horizon !== undefined ? { horizonYears: horizon } : {}),
          wording: ENTRY.wording,
          person: { age: last?.age, sex: last?.sex },
          tableId: DEMO_HEART_FAILURE_10Y.id,
        });
        if (!expected.ok) throw new Error('valid scenario');
        expect(r.referenceRisk).toBe(expected.value.referenceRisk);
        expect(r.exposedRisk).toEqual(expected.value.exposedRisk);
        expect(r.riskDifference).toEqual(expected.value.riskDifference);
        expect(r.numberNeeded).toEqual(expected.value.numberNeeded);
        expect(r.warnings).toEqual(expected.value.warnings);
        expect(workerScenario(r, ctx)).not.toBeNull();
      }),
      { numRuns: 150 },
    );
  });
});

describe('summary', () => {
  it('hand-worked: one exposed woman (P0 0.015) and one exposed man (P0 0.022), plus a comparison worker and a diabetes-range worker', () => {
    const ctx = context();
    const results = [
      evaluateWorker(worker('A', [['2022-03-01', 5.9], ['2023-03-01', 6.0], ['2024-03-01', 6.1]]), ctx),
      evaluateWorker(worker('B', [['2022-03-01', 5.9], ['2023-03-01', 6.0], ['2024-03-01', 6.1]], { sex: 'male', age: 55, strata: { site: 'South' } }), ctx),
      evaluateWorker(worker('C', [['2022-03-01', 5.0], ['2023-03-01', 5.1], ['2024-03-01', 5.2]], { age: 41 }), ctx),
      evaluateWorker(worker('D', [['2024-03-01', 7.1]], { age: 61 }), ctx),
    ];
    const s = summariseWorkforce(results, { read: 10, used: 10, skipped: 0 });
    expect(s.workers).toBe(4);
    expect(s.byStatus).toEqual({ exposed: 2, comparison: 1, neither: 0, 'diabetes-range': 1, insufficient: 0 });
    expect(s.byLatestCategory).toEqual({ prediabetes: 2, normal: 1, 'diabetes-range': 1 });
    expect(s.byStratum.site).toEqual({
      North: { exposed: 1, comparison: 1, neither: 0, 'diabetes-range': 1, insufficient: 0 },
      South: { exposed: 1, comparison: 0, neither: 0, 'diabetes-range': 0, insufficient: 0 },
    });
    expect(Object.keys(s.byStratum['age band'] ?? {})).toEqual(['40–49', '50–59', '60–69']);
    // E1 = 0.023892 + 0.034967 = 0.058859; E0 = 0.015 + 0.022 = 0.037 (hand-computed).
    expect(s.expectedEvents.exposedWorkers).toBe(2);
    expect(s.expectedEvents.atOwnRisk).toBeCloseTo(0.058859, 5);
    expect(s.expectedEvents.atComparisonRisk).toBeCloseTo(0.037, 10);
    // Excess 0.058859 − 0.037 = 0.021859; limits (0.017973 − 0.015) + (0.026342 − 0.022) = 0.007315 and
    // (0.031240 − 0.015) + (0.045641 − 0.022) = 0.039881 (hand-computed, HR 1.2 and 2.1 as above).
    expect(s.expectedEvents.excess.estimate).toBeCloseTo(0.021859, 5);
    expect(s.expectedEvents.excess.lower).toBeCloseTo(0.007315, 5);
    expect(s.expectedEvents.excess.upper).toBeCloseTo(0.039881, 5);
    // AF among the exposed = 0.021859 / 0.058859 = 0.3714 (hand-computed).
    expect(s.expectedEvents.attributableFractionAmongExposed).toBeCloseTo(0.3714, 3);
    expect(s.caution).toMatch(/not diagnoses, and not a prediction for any one worker/);
  });

  it('a stratum value that names an object property ("__proto__", "constructor") is counted like any other, and nothing else changes', () => {
    const ctx = context();
    const results = ['__proto__', 'constructor', '__proto__', 'North'].map((site, i) =>
      evaluateWorker(worker(`P${i}`, [['2022-03-01', 5.0], ['2023-03-01', 5.1], ['2024-03-01', 5.2]], { strata: { site } }), ctx),
    );
    const s = summariseWorkforce(results, { read: 12, used: 12, skipped: 0 });
    // Three yearly HbA1c below 5.7% (ADA normal): every worker is in the comparison group.
    const comparison = (n: number) => ({ exposed: 0, comparison: n, neither: 0, 'diabetes-range': 0, insufficient: 0 });
    expect(Object.keys(s.byStratum.site ?? {})).toEqual(['North', '__proto__', 'constructor']);
    expect(JSON.parse(JSON.stringify(s.byStratum.site))).toEqual(JSON.parse('{"North":' + JSON.stringify(comparison(1)) + ',"__proto__":' + JSON.stringify(comparison(2)) + ',"constructor":' + JSON.stringify(comparison(1)) + '}'));
    expect(Object.prototype).not.toHaveProperty('comparison');
    expect(({} as Record<string, unknown>).comparison).toBeUndefined();
  });

  it('no exposed worker: expected events 0 and no attributable fraction', () => {
    const s = summariseWorkforce([], { read: 0, used: 0, skipped: 0 });
    expect(s.expectedEvents).toEqual({ exposedWorkers: 0, atOwnRisk: 0, atComparisonRisk: 0, excess: { estimate: 0, lower: 0, upper: 0 }, attributableFractionAmongExposed: null });
  });

  it('property: the summary equals the sums and counts of the per-worker lines', () => {
    fc.assert(
      fc.property(fc.array(workerArb, { maxLength: 25 }), (workers) => {
        const ctx = context();
        const results: WorkerResult[] = workers.map(({ group }, i) => evaluateWorker({ ...group, worker: `W${i}` }, ctx));
        const s = summariseWorkforce(results, { read: 0, used: 0, skipped: 0 });
        const exposed = results.filter((r) => r.status === 'exposed');
        const sum = (f: (r: WorkerResult) => number) => exposed.reduce((t, r) => t + f(r), 0);
        expect(s.workers).toBe(results.length);
        for (const status of ['exposed', 'comparison', 'neither', 'diabetes-range', 'insufficient'] as const) {
          expect(s.byStatus[status]).toBe(results.filter((r) => r.status === status).length);
        }
        expect(s.expectedEvents.exposedWorkers).toBe(exposed.length);
        expect(s.expectedEvents.atOwnRisk).toBeCloseTo(sum((r) => r.exposedRisk?.estimate ?? Number.NaN), 12);
        expect(s.expectedEvents.atComparisonRisk).toBeCloseTo(sum((r) => r.referenceRisk ?? Number.NaN), 12);
        expect(s.expectedEvents.excess.lower).toBeCloseTo(sum((r) => r.riskDifference?.lower ?? Number.NaN), 12);
        expect(s.expectedEvents.excess.upper).toBeCloseTo(sum((r) => r.riskDifference?.upper ?? Number.NaN), 12);
        const bySex = Object.values(s.byStratum.sex ?? {}).reduce((t, c) => t + Object.values(c).reduce((a, b) => a + b, 0), 0);
        expect(bySex).toBe(results.length);
      }),
      { numRuns: 100 },
    );
  });
});
