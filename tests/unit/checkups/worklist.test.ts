import { describe, expect, it } from 'vitest';
import { arrangeWorklist, worklistCategory, worklistFilterChoices, worklistKeys, worklistRow, worklistStrata } from '../../../lib/checkups/worklist';
import { C003, W001, W002 } from './fixtures';

describe('worklistRow', () => {
  it('formats the engine figures of W001 (demo file, as the command prints them)', () => {
    const row = worklistRow(W001, 0);
    // hand-computed: 0.015 → 1.5%; 0.02389 → 2.4%, 0.01797 → 1.8%, 0.03124 → 3.1%; 0.00889 → 0.89% (two significant figures under 1%)
    expect(row.cells.baseline).toBe('1.5%');
    expect(row.cells.exposed).toBe('2.4% (1.8% to 3.1%)');
    expect(row.cells.difference).toBe('0.89% (0.30% to 1.6%)');
    expect(row.cells.numberNeeded).toBe('NNTH 113 (95% CI: NNTH 62 to 337)');
    expect(row.cells.status).toBe('Fits the exposure');
    expect(row.cells.run).toBe('4 yearly (prediabetes)');
    expect(row.strata).toEqual({ site: 'North', department: 'Assembly', 'age band': '50–59', sex: 'female' });
  });

  it('shows a dash where the evidence does not apply', () => {
    const row = worklistRow(W002, 1);
    expect(row.cells.baseline).toBe('—');
    expect(row.cells.exposed).toBe('—');
    expect(row.cells.numberNeeded).toBe('—');
    expect(row.cells.status).toBe('Not enough results');
  });
});

describe('arrangeWorklist', () => {
  const rows = [worklistRow(W001, 0), worklistRow(W002, 1), worklistRow(C003, 2)];

  it('filters by status, category and stratum', () => {
    expect(arrangeWorklist(rows, { status: 'exposed' }, null).map((r) => r.worker)).toEqual(['W001']);
    expect(arrangeWorklist(rows, { category: 'prediabetes' }, null).map((r) => r.worker)).toEqual(['W001', 'W002']);
    expect(arrangeWorklist(rows, { stratum: { name: 'site', value: 'North' } }, null).map((r) => r.worker)).toEqual(['W001', 'C003']);
  });

  it('sorts numbers numerically with empty values last in both directions', () => {
    // baseline: W001 0.015, C003 0.01, W002 none
    expect(arrangeWorklist(rows, {}, { column: 'baseline', direction: 'ascending' }).map((r) => r.worker)).toEqual(['C003', 'W001', 'W002']);
    expect(arrangeWorklist(rows, {}, { column: 'baseline', direction: 'descending' }).map((r) => r.worker)).toEqual(['W001', 'C003', 'W002']);
    // age: W001 53, W002 56, C003 none
    expect(arrangeWorklist(rows, {}, { column: 'age', direction: 'descending' }).map((r) => r.worker)).toEqual(['W002', 'W001', 'C003']);
  });

  it('lists the filter choices found in the rows', () => {
    const choices = worklistFilterChoices(rows);
    expect(choices.categories).toEqual(['normal', 'prediabetes']);
    expect(choices.strata).toContainEqual({ name: 'site', value: 'South' });
    expect(choices.strata).toContainEqual({ name: 'age band', value: 'unknown' });
  });
});

describe('worklistKeys, worklistCategory and worklistStrata', () => {
  it('give W001’s sort keys and groups (the engine’s own unrounded figures; fixtures)', () => {
    expect(worklistKeys(W001)).toEqual({ worker: 'W001', age: 53, sex: 'female', category: 'prediabetes', run: 4, status: 'exposed', baseline: 0.015, exposed: 0.02389178285776514, difference: 0.008891782857765141, numberNeeded: 112.46338512716895, notes: null });
    expect(worklistCategory(W002)).toBe('prediabetes');
    expect(worklistStrata(C003)).toEqual({ site: 'North', 'age band': 'unknown', sex: 'unknown' });
  });

  it('writes the diabetes range in words, never as the code "diabetes-range"', () => {
    const inRange = { ...W002, status: 'diabetes-range' as const, latest: { date: '2024-05-17', category: 'diabetes-range' as const }, run: { ...W002.run, category: 'diabetes-range' as const } };
    expect(worklistCategory(inRange)).toBe('diabetes range');
    expect(worklistRow(inRange, 0).cells.run).toBe('2 yearly (diabetes range)');
  });
});
