/**
 * The worklist as columns (lib/checkups/worklistColumns.ts): filtering and sorting by position
 * give exactly arrangeWorklist's rows; the filters' choices are worklistFilterChoices'; rows
 * made when read are worklistRow's.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { arrangeWorklist, worklistFilterChoices, worklistRow, WORKLIST_COLUMNS, type WorklistColumn, type WorklistFilter, type WorklistRow } from '@/lib/checkups/worklist';
import { arrangeColumns, attachColumns, columnsFilterChoices, columnsOfRows, fileOrder, keepIndex, lazyWorklistRows, NO_VALUE, WorklistColumnsBuilder, worklistColumnsOf } from '@/lib/checkups/worklistColumns';
import { orderByRanks, worklistRanks } from '@/lib/checkups/worklistOrder';
import { WORKER_STATUSES } from '@/lib/workforce';
import { C003, W001, W002 } from './fixtures';

const numberKey = fc.option(fc.constantFrom(0, 0.01, 0.2, 1, 53, 56), { nil: null });
const textKey = fc.option(fc.constantFrom('W1', 'W2', 'W10', 'C003', 'normal'), { nil: null });
const categoryArb = fc.constantFrom('normal', 'prediabetes', 'diabetes range', 'no checkup');
/** Groups as a file gives them: some workers lack a site, some have a department too. */
const strataArb = fc.record({ site: fc.constantFrom('North', 'South', 'W2', 'W10'), department: fc.constantFrom('Assembly', 'Office') }, { requiredKeys: [], noNullPrototype: true });

const rowArb = fc.record({ status: fc.constantFrom(...WORKER_STATUSES), category: categoryArb, strata: strataArb, numbers: fc.tuple(numberKey, numberKey), worker: textKey });

type RowSpec = typeof rowArb extends fc.Arbitrary<infer T> ? T : never;

function rows(specs: readonly RowSpec[]): WorklistRow[] {
  return specs.map((s, index) => {
    const keys: Record<WorklistColumn, string | number | null> = { worker: s.worker, age: s.numbers[0], sex: null, category: s.category, run: s.numbers[1], status: s.status, baseline: s.numbers[1], exposed: s.numbers[0], difference: null, numberNeeded: null, notes: null };
    const cells = Object.fromEntries(WORKLIST_COLUMNS.map((c) => [c.key, String(keys[c.key])])) as Record<WorklistColumn, string>;
    return { index, worker: String(s.worker), status: s.status, category: s.category, strata: s.strata, cells, keys };
  });
}

const filterArb: fc.Arbitrary<WorklistFilter> = fc.record(
  {
    status: fc.option(fc.constantFrom(...WORKER_STATUSES), { nil: null }),
    category: fc.option(fc.constantFrom('normal', 'prediabetes', 'diabetes range', 'not in any row'), { nil: null }),
    stratum: fc.option(fc.record({ name: fc.constantFrom('site', 'department', 'shift'), value: fc.constantFrom('North', 'South', 'W10', 'Assembly', 'Nowhere') }), { nil: null }),
  },
  { requiredKeys: [] },
);

describe('arrangeColumns', () => {
  it('gives exactly arrangeWorklist’s rows, for every filter, column and direction (and the file’s order unsorted)', () => {
    fc.assert(
      fc.property(
        fc.array(rowArb, { maxLength: 30 }),
        filterArb,
        fc.option(fc.record({ column: fc.constantFrom(...WORKLIST_COLUMNS.map((c) => c.key)), direction: fc.constantFrom('ascending' as const, 'descending' as const) }), { nil: null }),
        (specs, filter, sort) => {
          const list = rows(specs);
          const expected = arrangeWorklist(list, filter, sort).map((r) => r.index);
          const order = sort ? orderByRanks(worklistRanks(list)[sort.column], sort.direction) : null;
          expect([...arrangeColumns(worklistColumnsOf(list), filter, order)]).toEqual(expected);
        },
      ),
      { numRuns: 1000 },
    );
  });

  it('filters by position (hand-worked from the fixtures): W001 exposed at North, W002 insufficient at South, C003 comparison at North', () => {
    const list = [worklistRow(W001, 0), worklistRow(W002, 1), worklistRow(C003, 2)];
    const columns = worklistColumnsOf(list);
    expect([...arrangeColumns(columns, { status: 'exposed' }, null)]).toEqual([0]);
    expect([...arrangeColumns(columns, { stratum: { name: 'site', value: 'North' } }, null)]).toEqual([0, 2]); // W001 and C003 at North, W002 at South
    expect([...arrangeColumns(columns, {}, Int32Array.from([2, 0, 1]))]).toEqual([2, 0, 1]);
    expect([...arrangeColumns(columns, { category: 'not a category' }, null)]).toEqual([]);
    expect(keepIndex(columns, { stratum: { name: 'shift', value: 'night' } })(0)).toBe(false);
  });
});

describe('WorklistColumnsBuilder', () => {
  it('codes each value by first appearance, and marks a group a worker lacks (hand-worked)', () => {
    const builder = new WorklistColumnsBuilder();
    builder.add({ status: 'exposed', category: 'prediabetes', strata: { site: 'North' } });
    builder.add({ status: 'neither', category: 'normal', strata: { department: 'Office' } });
    builder.add({ status: 'exposed', category: 'prediabetes', strata: { site: 'South', department: 'Office' } });
    const columns = builder.finish();
    expect(columns.count).toBe(3);
    expect([...columns.status]).toEqual([0, 2, 0]); // WORKER_STATUSES: exposed, comparison, neither, …
    expect(columns.categories).toEqual(['prediabetes', 'normal']);
    expect([...columns.category]).toEqual([0, 1, 0]);
    expect(columns.strata.map((s) => ({ name: s.name, values: s.values, codes: [...s.codes] }))).toEqual([
      { name: 'site', values: ['North', 'South'], codes: [0, NO_VALUE, 1] },
      { name: 'department', values: ['Office'], codes: [NO_VALUE, 0, 0] },
    ]);
  });

  it('keeps its columns right past its first allocation (3,000 rows, a group first seen late)', () => {
    const builder = new WorklistColumnsBuilder();
    for (let i = 0; i < 3000; i++) builder.add({ status: WORKER_STATUSES[i % 5]!, category: `c${i % 7}`, strata: i >= 2500 ? { site: `s${i % 3}` } : {} });
    const columns = builder.finish();
    expect(columns.status[2999]).toBe(2999 % 5);
    expect(columns.categories[columns.category[2999]!]).toBe(`c${2999 % 7}`);
    const site = columns.strata[0]!;
    expect(site.codes[2499]).toBe(NO_VALUE);
    expect(site.values[site.codes[2999]!]).toBe(`s${2999 % 3}`);
  });
});

describe('columnsFilterChoices', () => {
  it('equals worklistFilterChoices of the same rows', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { maxLength: 30 }), (specs) => {
        const list = rows(specs);
        expect(columnsFilterChoices(worklistColumnsOf(list))).toEqual(worklistFilterChoices(list));
      }),
      { numRuns: 300 },
    );
  });
});

describe('lazyWorklistRows and attachColumns', () => {
  it('gives worklistRow’s rows, made when read, at their place in the run', () => {
    const lazy = lazyWorklistRows([W002, C003], 5);
    expect(lazy.map((r) => [r.index, r.status])).toEqual([
      [5, 'insufficient'],
      [6, 'comparison'],
    ]);
    const made = worklistRow(C003, 6);
    const row = lazy[1]!;
    expect({ index: row.index, worker: row.worker, status: row.status, category: row.category, strata: row.strata, cells: row.cells, keys: row.keys }).toEqual(made);
    expect(JSON.parse(JSON.stringify(row))).toEqual(JSON.parse(JSON.stringify(made)));
  });

  it('finds the columns given to the rows, and refuses columns for another number of rows', () => {
    const list = lazyWorklistRows([W001, W002]);
    expect(columnsOfRows(list)).toBeUndefined();
    const columns = worklistColumnsOf([worklistRow(W001, 0), worklistRow(W002, 1)]);
    expect(columnsOfRows(attachColumns(list, columns))).toBe(columns);
    expect(() => attachColumns(lazyWorklistRows([W001]), columns)).toThrow(RangeError);
  });
});

describe('fileOrder', () => {
  it('gives every position in order, once made the same array (what an unfiltered, unsorted list shows)', () => {
    const columns = worklistColumnsOf([worklistRow(W001, 0), worklistRow(W002, 1), worklistRow(C003, 2)]);
    expect([...fileOrder(columns)]).toEqual([0, 1, 2]);
    expect(fileOrder(columns)).toBe(fileOrder(columns));
    expect(arrangeColumns(columns, {}, null)).toBe(fileOrder(columns));
  });
});
