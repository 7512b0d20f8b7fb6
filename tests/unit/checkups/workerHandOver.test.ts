/**
 * "Open one worker": the worker's rows read again from the file, their checkups, and the
 * hand-over record's round trip and refusals. Values are copied from demo/checkups/checkups.csv
 * (W001, lines 3–7), named beside each check.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { collectWorkersRows, collectWorkersRowsFromTable, workerCheckups } from '@/lib/checkups/workerHistory';
import { OPEN_WORKER_MESSAGES, readWorkerHandOver, WORKER_HANDOVER_FORMAT, workerHandOverRecord } from '@/lib/checkups/workerHandOver';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import type { Scenario } from '@/lib/scenario/schema';
import { isRefusal } from '@/lib/workforce';
import { W001_CHECKUPS } from './fixtures';

const DEMO_CSV = readFileSync('demo/checkups/checkups.csv', 'utf8');
const READER = { today: '2026-01-01' };

/** One worker's rows, as the screen's worker asks for them (a set of one); none when the worker has no row. */
async function collectWorkerRows(chunks: readonly string[], options: Parameters<typeof collectWorkersRows>[1], worker: string) {
  const rows = await collectWorkersRows(chunks, options, new Set([worker]));
  return rows instanceof Map ? (rows.get(worker) ?? []) : rows;
}
function collectWorkerRowsFromTable(table: Parameters<typeof collectWorkersRowsFromTable>[0], reader: typeof READER, worker: string) {
  const rows = collectWorkersRowsFromTable(table, reader, new Set([worker]));
  return rows instanceof Map ? (rows.get(worker) ?? []) : rows;
}


const SCENARIO: Scenario = {
  baseline: { risk: 0.015, years: 10 },
  effect: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.effect,
  wording: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording,
  person: { age: 54, sex: 'female' },
  tableId: 'demo-heart-failure-10y',
};

describe('collectWorkerRows and workerCheckups', () => {
  it('W001 of the demo file, read in two chunks split mid-line: five rows, five checkups as in the file', async () => {
    const cut = DEMO_CSV.indexOf('W002') + 2;
    const rows = await collectWorkerRows([DEMO_CSV.slice(0, cut), DEMO_CSV.slice(cut)], { reader: READER, format: 'delimited' }, 'W001');
    if (isRefusal(rows)) throw new Error(rows.message);
    expect(rows.map((r) => r.line)).toEqual([3, 4, 5, 6, 7]);
    expect(workerCheckups(rows)).toEqual(W001_CHECKUPS);
  });

  it('a worker not in the file gets no rows', async () => {
    expect(await collectWorkerRows([DEMO_CSV], { reader: READER, format: 'delimited' }, 'W999')).toEqual([]);
  });

  it('a file without the columns is refused, not thrown', async () => {
    const got = await collectWorkerRows(['just,some\ncells,here\n'], { reader: READER, format: 'delimited' }, 'W001');
    expect(isRefusal(got as object)).toBe(true);
  });

  it('a workbook sheet: the same rows from cells', () => {
    const table = [
      ['Worker', 'Checkup date', 'HbA1c (%)', 'Age', 'Sex'],
      ['A1', '2023-03-01', 6.1, 50, 'female'],
      ['B2', '2023-03-01', 5.2, 40, 'male'],
      ['A1', '2022-03-01', 5.9, 49, 'female'],
    ];
    const rows = collectWorkerRowsFromTable(table, READER, 'A1');
    if (isRefusal(rows)) throw new Error(rows.message);
    // date order, whatever the file's order (hand-worked)
    expect(workerCheckups(rows)).toEqual([
      { date: '2022-03-01', hba1c: { value: 5.9, unit: '%' } },
      { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } },
    ]);
  });

  it('same-day rows are merged as the engine merges them (one HbA1c row, one glucose row → one checkup)', async () => {
    const csv = 'Worker,Checkup date,HbA1c (%),Fasting glucose (mmol/L)\nA1,2023-03-01,6.1,\nA1,2023-03-01,,5.8\n';
    const rows = await collectWorkerRows([csv], { reader: READER, format: 'delimited' }, 'A1');
    if (isRefusal(rows)) throw new Error(rows.message);
    expect(workerCheckups(rows)).toEqual([{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.8, unit: 'mmol/L' } }]);
  });
});

describe('workerHandOverRecord / readWorkerHandOver', () => {
  const record = workerHandOverRecord({ scenario: SCENARIO, evidenceId: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id, criteria: 'ADA', checkups: W001_CHECKUPS });

  it('round trip: the scenario, the entry and the history come back as they went', () => {
    const got = readWorkerHandOver(record, '2026-01-01');
    expect(got?.ok).toBe(true);
    if (!got?.ok) return;
    expect(got.value.scenario).toEqual(SCENARIO);
    expect(got.value.evidenceId).toBe('demo-workforce-hba1c-heart-failure');
    expect(got.value.history.criteria).toBe('ADA');
    expect(got.value.history.checkups).toEqual(W001_CHECKUPS);
  });

  it('the entry\'s exposure definition goes with the scenario, so the consultation screen checks the history against it', () => {
    const definition = DEMO_WORKFORCE_HBA1C_HEART_FAILURE.exposureDefinition;
    expect(definition).toBeDefined();
    const withDefinition = workerHandOverRecord({ scenario: SCENARIO, evidenceId: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id, exposureDefinition: definition, criteria: 'ADA', checkups: W001_CHECKUPS });
    const got = readWorkerHandOver(withDefinition, '2026-01-01');
    expect(got?.ok && got.value.scenario.exposureDefinition).toEqual(definition);
    expect(got?.ok && { ...got.value.scenario, exposureDefinition: undefined }).toEqual({ ...SCENARIO, exposureDefinition: undefined });
  });

  it('holds no worker id', () => {
    expect(record).not.toContain('W001');
  });

  it('nothing stored: undefined', () => {
    expect(readWorkerHandOver(null, '2026-01-01')).toBeUndefined();
    expect(readWorkerHandOver('', '2026-01-01')).toBeUndefined();
  });

  it('damaged, another format, or an extra field: refused with a plain sentence', () => {
    expect(readWorkerHandOver('{"format":', '2026-01-01')).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'invalid-json', path: [] })] });
    expect(readWorkerHandOver(JSON.stringify({ format: 'other', version: 1 }), '2026-01-01')).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'wrong-format' })] });
    const extra = { ...JSON.parse(record), worker: 'W001' };
    expect(readWorkerHandOver(JSON.stringify(extra), '2026-01-01')?.ok).toBe(false);
    expect(JSON.parse(record).format).toBe(WORKER_HANDOVER_FORMAT);
  });

  it('a scenario or a history that is no longer valid is refused with the field path', () => {
    const badScenario = { ...JSON.parse(record), scenario: { ...SCENARIO, baseline: { risk: 8, years: 10 } } };
    const got = readWorkerHandOver(JSON.stringify(badScenario), '2026-01-01');
    expect(got?.ok).toBe(false);
    if (got && !got.ok) expect(got.issues[0]?.path.slice(0, 2)).toEqual(['scenario', 'baseline']);
    // today before the last checkup (2025-05-23): a checkup in the future
    const early = readWorkerHandOver(record, '2024-01-01');
    expect(early?.ok).toBe(false);
    if (early && !early.ok) expect(early.issues[0]?.path[0]).toBe('history');
  });
});

describe('OPEN_WORKER_MESSAGES', () => {
  // The words the worklist shows; the browser test checks the "opened" one on screen.
  it('name the worker and say what to do', () => {
    expect(OPEN_WORKER_MESSAGES.opened('W001')).toBe('W001 is open in the consultation screen, in a new tab.');
    expect(OPEN_WORKER_MESSAGES.unreadable('W001', null)).toBe('W001 could not be opened: the file could not be read again (unknown reason).');
    expect(OPEN_WORKER_MESSAGES.refused('W001')).toBe('W001 could not be opened: the new tab was closed or refused the hand-over. Choose Open again.');
  });
});
