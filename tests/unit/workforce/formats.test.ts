import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { isRefusal, prepareCheckups, readXlsxSheet, runCheckups, runCheckupTable, type CheckupsOutcome, type RowProblem, type WorkerResult } from '@/lib/workforce';

// The demo workforce (demo/checkups/, illustrative, written by scripts/demo-checkups.mjs).
const DIR = new URL('../../../demo/checkups/', import.meta.url);
const TODAY = '2026-01-01';

function context() {
  const prepared = prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
  if (!prepared.ok) throw new Error('demo settings are valid');
  return prepared.value;
}

async function collect(run: (onWorker: (w: WorkerResult) => void, onProblems: (p: readonly RowProblem[]) => void) => Promise<CheckupsOutcome>) {
  const workers: WorkerResult[] = [];
  const problems: RowProblem[] = [];
  const outcome = await run((w) => workers.push(w), (p) => problems.push(...p));
  if (!outcome.ok) throw new Error('the demo file is usable');
  return { workers, problems, summary: outcome.summary };
}

function csv() {
  const text = readFileSync(new URL('checkups.csv', DIR), 'utf8');
  return collect((onWorker, onProblems) => runCheckups([text], { context: context(), reader: { today: TODAY }, format: 'delimited', onWorker, onProblems }));
}

async function xlsx() {
  const bytes = readFileSync(new URL('checkups.xlsx', DIR));
  const sheet = await readXlsxSheet(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  if (isRefusal(sheet)) throw new Error(sheet.message);
  return collect((onWorker, onProblems) => runCheckupTable(sheet.rows, { context: context(), reader: { today: TODAY }, onWorker, onProblems }));
}

function fhir() {
  const patients = readFileSync(new URL('fhir/Patient.ndjson', DIR), 'utf8');
  const observations = readFileSync(new URL('fhir/Observation.ndjson', DIR), 'utf8');
  // Fed in small pieces, as a Web Worker would slice a file.
  const pieces = (text: string) => text.match(/[\s\S]{1,700}/g) ?? [];
  const chunks = [{ file: 'Patient.ndjson' }, ...pieces(patients), { file: 'Observation.ndjson' }, ...pieces(observations)];
  return collect((onWorker, onProblems) => runCheckups(chunks, { context: context(), reader: { today: TODAY }, format: 'fhir-ndjson', onWorker, onProblems }));
}

/** A FHIR bulk export carries no site or department: compare without strata. */
const withoutStrata = (w: WorkerResult) => ({ ...w, strata: {}, problems: [] });

describe('the same workforce from CSV, XLSX and FHIR bulk NDJSON', () => {
  it('CSV and XLSX give identical workers, problems and summary', async () => {
    const [a, b] = [await csv(), await xlsx()];
    expect(b.workers).toEqual(a.workers);
    expect(b.problems).toEqual(a.problems);
    expect(b.summary).toEqual(a.summary);
    expect(a.workers).toHaveLength(40);
  });

  it('FHIR NDJSON gives the same workers and figures (no strata in a bulk export); its rows are one per Observation', async () => {
    const [a, c] = [await csv(), await fhir()];
    expect(c.workers.map(withoutStrata)).toEqual(a.workers.map(withoutStrata));
    expect(c.summary.byStatus).toEqual(a.summary.byStatus);
    expect(c.summary.expectedEvents).toEqual(a.summary.expectedEvents);
    expect(c.summary.byLatestCategory).toEqual(a.summary.byLatestCategory);
    // 40 Patients + 351 Observations read; the unit slip (an HbA1c of 42 "%") is the one skipped.
    expect(c.summary.rows).toEqual({ read: 391, used: 390, skipped: 1 });
    expect(c.problems).toEqual([expect.objectContaining({ file: 'Observation.ndjson', column: 'Observation' })]);
  });

  it('the demo shows every status, the unit slip as one skipped row, one worker in the diabetes range', async () => {
    const { summary, problems } = await csv();
    expect(summary.byStatus['diabetes-range']).toBe(1);
    for (const status of ['exposed', 'comparison', 'neither', 'insufficient'] as const) expect(summary.byStatus[status]).toBeGreaterThan(0);
    expect(summary.rows).toEqual({ read: 176, used: 175, skipped: 1 });
    expect(problems).toEqual([expect.objectContaining({ column: 'HbA1c (%)', code: 'out-of-range' })]);
    expect(Object.keys(summary.byStratum.site ?? {})).toEqual(['Harbour', 'North', 'South']);
  });

  it('a file that is not a workbook is refused with one sentence', async () => {
    const refused = await readXlsxSheet(new TextEncoder().encode('%PDF-1.7 not a workbook').buffer as ArrayBuffer);
    expect(isRefusal(refused) ? refused.message : '').toMatch(/cannot be read as an Excel workbook/);
  });

  it('a FHIR export with Patients but no usable Observation is refused whole', async () => {
    const patients = readFileSync(new URL('fhir/Patient.ndjson', DIR), 'utf8');
    const outcome = await runCheckups([patients], { context: context(), reader: { today: TODAY }, format: 'fhir-ndjson' });
    expect(outcome.ok ? '' : 'refusal' in outcome ? outcome.refusal.code : '').toBe('no-usable-rows');
  });

  it('cancelling stops the run and says so', async () => {
    const text = readFileSync(new URL('checkups.csv', DIR), 'utf8');
    const controller = new AbortController();
    controller.abort();
    const outcome = await runCheckups([text], { context: context(), reader: { today: TODAY }, format: 'delimited', signal: controller.signal });
    expect(outcome).toEqual({ ok: false, cancelled: true });
  });
});
