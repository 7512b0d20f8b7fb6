import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { arrangeWorklist, WORKLIST_COLUMNS, type WorklistColumn, type WorklistRow } from '../../../lib/checkups/worklist';
import { EMPTY_RANK, arrangeWithRanks, orderByRanks, rankKeys, rememberOrders, sortedOrder, worklistOrders, worklistRanks } from '../../../lib/checkups/worklistOrder';
import { WORKER_STATUSES } from '../../../lib/workforce/types';

const numberKey = fc.option(fc.constantFrom(0, 0.01, 0.015, 0.2, 1, 53, 56), { nil: null });
const textKey = fc.option(fc.constantFrom('W1', 'W2', 'W10', 'w2', 'C003', 'prediabetes', 'normal', 'Ä'), { nil: null });

const rowArb = fc.record({
  numbers: fc.tuple(numberKey, numberKey, numberKey, numberKey, numberKey, numberKey),
  texts: fc.tuple(textKey, textKey, textKey, textKey),
  status: fc.constantFrom(...WORKER_STATUSES),
  site: fc.constantFrom('North', 'South'),
});

interface RowSpec {
  numbers: readonly [number | null, number | null, number | null, number | null, number | null, number | null];
  texts: readonly [string | null, string | null, string | null, string | null];
  status: (typeof WORKER_STATUSES)[number];
  site: string;
}

function rows(specs: readonly RowSpec[]): WorklistRow[] {
  return specs.map((s, index) => {
    const [age, run, baseline, exposed, difference, numberNeeded] = s.numbers;
    const [worker, sex, category, status] = s.texts;
    const keys: Record<WorklistColumn, string | number | null> = { worker, age, sex, category, run, status, baseline, exposed, difference, numberNeeded, notes: null };
    const cells = Object.fromEntries(WORKLIST_COLUMNS.map((c) => [c.key, String(keys[c.key])])) as Record<WorklistColumn, string>;
    return { index, worker: String(worker), status: s.status, category: String(category), strata: { site: s.site }, cells, keys };
  });
}

describe('worklist order by ranks', () => {
  it('ranks keys: equal keys equal ranks, empty last (hand-worked)', () => {
    expect([...rankKeys([3, null, 1, 3])]).toEqual([1, EMPTY_RANK, 0, 1]);
    expect([...rankKeys(['W10', 'W2', 'W1'])]).toEqual([2, 1, 0]); // numbers inside text compare as numbers
  });

  it('orders by a counting sort: stable, empty last both ways (hand-worked)', () => {
    expect([...orderByRanks(Int32Array.from([1, -1, 0, 1]), 'ascending')]).toEqual([2, 0, 3, 1]);
    expect([...orderByRanks(Int32Array.from([1, -1, 0, 1]), 'descending')]).toEqual([0, 3, 2, 1]);
    expect([...orderByRanks(new Int32Array(0), 'ascending')]).toEqual([]);
  });

  it('gives exactly arrangeWorklist’s rows for every column, direction and filter', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { maxLength: 40 }), fc.constantFrom(...WORKLIST_COLUMNS.map((c) => c.key)), fc.constantFrom('ascending' as const, 'descending' as const), fc.option(fc.constantFrom('North', 'South'), { nil: null }), (specs, column, direction, site) => {
        const list = rows(specs);
        const filter = { stratum: site === null ? null : { name: 'site', value: site } };
        const sort = { column, direction };
        const expected = arrangeWorklist(list, filter, sort).map((r) => r.index);
        expect(arrangeWithRanks(list, filter, sort, worklistRanks(list)).map((r) => r.index)).toEqual(expected);
      }),
      { numRuns: 1000 },
    );
  });

  it('falls back to the plain sort when the ranks are missing or for other rows', () => {
    const list = rows([{ numbers: [2, 1, 1, 1, 1, 1], texts: ['b', 'x', 'x', 'x'], status: 'exposed', site: 'North' }, { numbers: [1, 1, 1, 1, 1, 1], texts: ['a', 'x', 'x', 'x'], status: 'neither', site: 'South' }]);
    expect(arrangeWithRanks(list, {}, { column: 'age', direction: 'ascending' }, null).map((r) => r.index)).toEqual([1, 0]);
    expect(arrangeWithRanks(list, {}, { column: 'age', direction: 'ascending' }, { age: Int32Array.from([0]) }).map((r) => r.index)).toEqual([1, 0]);
    expect(arrangeWithRanks(list, { status: 'exposed' }, null, null).map((r) => r.index)).toEqual([0]);
  });
});

describe('worklist orders made ahead', () => {
  it('gives each column’s rows in arrangeWorklist’s order, both ways', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { maxLength: 30 }), (specs) => {
        const list = rows(specs);
        const orders = worklistOrders(worklistRanks(list));
        for (const { key } of WORKLIST_COLUMNS) {
          for (const direction of ['ascending', 'descending'] as const) {
            expect([...orders[key]![direction]]).toEqual(arrangeWorklist(list, {}, { column: key, direction }).map((r) => r.index));
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it('remembers an order once made or given, per ranks and direction', () => {
    const ranks = Int32Array.from([1, -1, 0, 1]);
    const first = sortedOrder(ranks, 'descending');
    expect([...first]).toEqual([0, 3, 2, 1]); // hand-worked, as orderByRanks' example
    expect(sortedOrder(ranks, 'descending')).toBe(first);
    const other = Int32Array.from([2, 0]);
    const given = { ascending: Int32Array.from([1, 0]), descending: Int32Array.from([0, 1]) };
    rememberOrders({ age: other }, { age: given });
    expect(sortedOrder(other, 'ascending')).toBe(given.ascending);
  });

  it('refuses orders that are not as long as their column', () => {
    expect(() => rememberOrders({ age: Int32Array.from([0, 1]) }, { age: { ascending: Int32Array.from([0]), descending: Int32Array.from([0, 1]) } })).toThrow(RangeError);
  });
});
