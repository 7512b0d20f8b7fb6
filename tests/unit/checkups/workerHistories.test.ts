/**
 * Many workers' histories read again from the file in one pass (batch handouts' own results,
 * lib/checkups/workerHistory.ts). Values are copied from demo/checkups/checkups.csv (line numbers
 * beside them); the FHIR bulk files hold the same checkups (scripts/demo-checkups.mjs writes all
 * three forms from one list).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { collectWorkersRows, collectWorkersRowsFromTable, workerCheckups, workersRowsFrom } from '@/lib/checkups/workerHistory';
import type { Checkup } from '@/lib/glycaemia/schema';
import { isRefusal } from '@/lib/workforce';

const DEMO_CSV = readFileSync('demo/checkups/checkups.csv', 'utf8');
const READER = { today: '2026-01-01' };
const WANTED = new Set(['W001', 'W007', 'W012', 'W999']);

const a1c = (value: number) => ({ value, unit: '%' as const });
const fpg = (value: number) => ({ value, unit: 'mmol/L' as const });
/** W007, demo/checkups/checkups.csv lines 30–34. */
const W007_CHECKUPS: Checkup[] = [
  { date: '2021-04-09', hba1c: a1c(6.1), fpg: fpg(5.6) },
  { date: '2022-05-20', hba1c: a1c(6.2), fpg: fpg(5.4) },
  { date: '2023-03-04', hba1c: a1c(6.4), fpg: fpg(5.2) },
  { date: '2024-04-15', hba1c: a1c(6.3), fpg: fpg(5.5) },
  { date: '2025-05-26', hba1c: a1c(6.4), fpg: fpg(5.3) },
];
/** W012, lines 53–56 (no 2021 checkup). */
const W012_CHECKUPS: Checkup[] = [
  { date: '2022-04-18', hba1c: a1c(5.9), fpg: fpg(5.4) },
  { date: '2023-05-02', hba1c: a1c(6), fpg: fpg(5.2) },
  { date: '2024-03-13', hba1c: a1c(6.2), fpg: fpg(5.5) },
  { date: '2025-04-24', hba1c: a1c(6.1), fpg: fpg(5.3) },
];

describe('workersRowsFrom: the wanted workers’ rows among rows already read (a saved session’s)', () => {
  it('the demo file’s rows as a session keeps them: the same rows, and so the same checkups, as reading the file again', async () => {
    const all = await collectWorkersRows([DEMO_CSV], { reader: READER, format: 'delimited' }, new Set(DEMO_CSV.split('\n').slice(1).map((l) => l.split(',')[0] ?? '')));
    if (isRefusal(all)) throw new Error(all.message);
    const kept = workersRowsFrom([...all.values()].flat(), WANTED);
    expect([...kept.keys()].sort()).toEqual(['W001', 'W007', 'W012']);
    expect(kept.get('W007')?.map((r) => r.line)).toEqual([30, 31, 32, 33, 34]);
    expect(workerCheckups(kept.get('W007') ?? [])).toEqual(W007_CHECKUPS);
    expect(workerCheckups(kept.get('W012') ?? [])).toEqual(W012_CHECKUPS);
  });
});

describe('collectWorkersRows: the wanted workers’ rows in one pass', () => {
  it('three workers of the demo file, read in three chunks cut mid-line: each gets only their own rows; a worker not in the file is absent', async () => {
    const cut1 = DEMO_CSV.indexOf('W007') + 1;
    const cut2 = DEMO_CSV.indexOf('W012,2023') + 6;
    const rows = await collectWorkersRows([DEMO_CSV.slice(0, cut1), DEMO_CSV.slice(cut1, cut2), DEMO_CSV.slice(cut2)], { reader: READER, format: 'delimited' }, WANTED);
    if (isRefusal(rows)) throw new Error(rows.message);
    expect([...rows.keys()].sort()).toEqual(['W001', 'W007', 'W012']);
    expect(rows.get('W001')?.map((r) => r.line)).toEqual([3, 4, 5, 6, 7]);
    expect(rows.get('W007')?.map((r) => r.line)).toEqual([30, 31, 32, 33, 34]);
    expect(rows.get('W012')?.map((r) => r.line)).toEqual([53, 54, 55, 56]);
    expect(workerCheckups(rows.get('W007') ?? [])).toEqual(W007_CHECKUPS);
    expect(workerCheckups(rows.get('W012') ?? [])).toEqual(W012_CHECKUPS);
  });

  it('rows of one worker spread through the file (not grouped) are all kept, in file order', async () => {
    const csv = 'Worker,Checkup date,HbA1c (%)\nA1,2021-03-01,5.9\nB2,2021-03-02,5.2\nA1,2022-03-01,6.0\nB2,2022-03-02,5.3\n';
    const rows = await collectWorkersRows([csv], { reader: READER, format: 'delimited' }, new Set(['A1', 'B2']));
    if (isRefusal(rows)) throw new Error(rows.message);
    expect(rows.get('A1')?.map((r) => r.line)).toEqual([2, 4]); // hand-counted lines of the text above
    expect(rows.get('B2')?.map((r) => r.line)).toEqual([3, 5]);
  });

  it('nobody wanted: an empty map, the file still read (a refusal would show)', async () => {
    const rows = await collectWorkersRows([DEMO_CSV], { reader: READER, format: 'delimited' }, new Set());
    expect(rows).toEqual(new Map());
  });

  it('a file without the columns is refused, not thrown', async () => {
    const got = await collectWorkersRows(['just,some\ncells,here\n'], { reader: READER, format: 'delimited' }, WANTED);
    expect(got instanceof Map).toBe(false);
    expect(isRefusal(got as object)).toBe(true);
  });

  it('FHIR bulk NDJSON (the demo export): W007 and W012 get the same checkups as in the CSV', async () => {
    const files = ['Patient', 'Observation'].flatMap((name) => [{ file: `${name}.ndjson` }, readFileSync(`demo/checkups/fhir/${name}.ndjson`, 'utf8')]);
    const rows = await collectWorkersRows(files, { reader: READER, format: 'fhir-ndjson' }, WANTED);
    if (isRefusal(rows)) throw new Error(rows.message);
    expect(workerCheckups(rows.get('W007') ?? [])).toEqual(W007_CHECKUPS);
    expect(workerCheckups(rows.get('W012') ?? [])).toEqual(W012_CHECKUPS);
    expect(rows.has('W999')).toBe(false);
  });

  it('a workbook sheet: the wanted workers’ rows from cells', () => {
    const table = [
      ['Worker', 'Checkup date', 'HbA1c (%)', 'Age', 'Sex'],
      ['A1', '2023-03-01', 6.1, 50, 'female'],
      ['B2', '2023-03-01', 5.2, 40, 'male'],
      ['C3', '2023-03-01', 5.4, 41, 'male'],
      ['A1', '2022-03-01', 5.9, 49, 'female'],
    ];
    const rows = collectWorkersRowsFromTable(table, READER, new Set(['A1', 'B2']));
    if (isRefusal(rows)) throw new Error(rows.message);
    expect([...rows.keys()]).toEqual(['A1', 'B2']);
    // date order, whatever the sheet's order (hand-worked)
    expect(workerCheckups(rows.get('A1') ?? [])).toEqual([
      { date: '2022-03-01', hba1c: { value: 5.9, unit: '%' } },
      { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } },
    ]);
  });
});
