import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { exportEvidenceJson } from '@/lib/evidence/file';
import { DEMO_NESTED_CASE_CONTROL_GLUCOSE_CORONARY, DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { exportTableCsv } from '@/lib/tables/csv';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { BIN, ensureBuilt, ROOT, runCli } from './runCli';

// The demo workforce (demo/checkups/, illustrative) through the real command.
const DEMO = 'demo/checkups';
const SETTINGS = ['--criteria', 'ADA', '--table-id', 'demo-heart-failure-10y', '--evidence-id', 'demo-workforce-hba1c-heart-failure', '--today', '2026-01-01'];

function lines(stdout: string): Record<string, unknown>[] {
  return stdout
    .trim()
    .split('\n')
    .map((l) => JSON.parse(l) as Record<string, unknown>);
}

beforeAll(async () => {
  await ensureBuilt();
}, 120_000);

describe('hundredfold checkups (spawned)', () => {
  it('CSV: one line per worker in order of first appearance, the summary last, the unit slip on stderr, exit 1', async () => {
    const run = await runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS]);
    expect(run.code).toBe(1);
    const out = lines(run.stdout);
    expect(out).toHaveLength(41);
    expect(out.slice(0, 40).map((l) => l.worker)).toEqual(Array.from({ length: 40 }, (_, i) => `W${String(i + 1).padStart(3, '0')}`));
    const first = out[0] ?? {};
    for (const key of ['worker', 'age', 'sex', 'checkups', 'latest', 'run', 'status', 'reasons', 'referenceRisk', 'exposedRisk', 'riskDifference', 'numberNeeded', 'warnings']) expect(first).toHaveProperty(key);
    const summary = (out[40] as { summary: Record<string, unknown> }).summary;
    expect(summary).toMatchObject({ workers: 40, rows: { read: 176, used: 175, skipped: 1 } });
    for (const key of ['byStatus', 'byStratum', 'expectedEvents', 'caution']) expect(summary).toHaveProperty(key);
    // The problem line: "row N, column NAME: message"; the slip is on line 146 (the note line and the header are lines 1 and 2).
    expect(run.stderr).toBe('row 146, column HbA1c (%): The HbA1c value in % must be between 3 and 20 (got 42); 42 looks like a value in mmol/mol: check the unit\n');
  });

  it('XLSX and FHIR NDJSON give the same worker lines (FHIR without strata)', async () => {
    const [csv, xlsx, fhir] = await Promise.all([
      runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS]),
      runCli(['checkups', `${DEMO}/checkups.xlsx`, ...SETTINGS]),
      runCli(['checkups', `${DEMO}/fhir/Patient.ndjson`, `${DEMO}/fhir/Observation.ndjson`, ...SETTINGS]),
    ]);
    expect(xlsx.stdout).toBe(csv.stdout);
    expect(xlsx.code).toBe(1);
    const strip = (l: Record<string, unknown>) => ({ ...l, strata: {} });
    expect(lines(fhir.stdout).slice(0, 40).map(strip)).toEqual(lines(csv.stdout).slice(0, 40).map(strip));
    expect(fhir.stderr).toMatch(/^Observation\.ndjson: row \d+, column Observation: The HbA1c value in % must be between 3 and 20 \(got 42\)/);
  });

  it('--format csv with --summary FILE: a header, one row per worker, the summary in the file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hf-checkups-'));
    const summaryFile = join(dir, 'summary.json');
    const run = await runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS, '--format', 'csv', '--summary', summaryFile]);
    expect(run.code).toBe(1);
    const rows = run.stdout.trim().split('\n');
    expect(rows[0]).toMatch(/^worker,age,sex,checkups,latest_date,latest_category,.*,stratum_site,stratum_department$/);
    expect(rows).toHaveLength(41);
    const summary = JSON.parse(readFileSync(summaryFile, 'utf8')) as { workers: number };
    expect(summary.workers).toBe(40);
  });

  it('an ungrouped file (workers interleaved) gives the same lines in order of first appearance', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hf-checkups-'));
    const [note, header, ...body] = readFileSync(`${DEMO}/checkups.csv`, 'utf8').trim().split('\n');
    // Round-robin by year: every worker's 2021 row, then every 2022 row, … (a stable sort by year).
    const shuffled = [...body].sort((a, b) => a.split(',')[1]!.slice(0, 4).localeCompare(b.split(',')[1]!.slice(0, 4)));
    const file = join(dir, 'ungrouped.csv');
    writeFileSync(file, `${[note, header, ...shuffled].join('\n')}\n`);
    const [grouped, ungrouped] = await Promise.all([runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS]), runCli(['checkups', file, ...SETTINGS])]);
    const byWorker = (out: string) => lines(out).slice(0, 40).sort((a, b) => String(a.worker).localeCompare(String(b.worker)));
    expect(byWorker(ungrouped.stdout)).toEqual(byWorker(grouped.stdout));
    // Order of first appearance: the workers seen in 2021 first.
    expect(lines(ungrouped.stdout)[0]?.worker).toBe('W001');
  });

  it('an evidence file and a table file work like the ids', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hf-checkups-'));
    writeFileSync(join(dir, 'evidence.json'), exportEvidenceJson([DEMO_WORKFORCE_HBA1C_HEART_FAILURE, DEMO_NESTED_CASE_CONTROL_GLUCOSE_CORONARY]));
    writeFileSync(join(dir, 'table.csv'), exportTableCsv(DEMO_HEART_FAILURE_10Y));
    const [ids, files] = await Promise.all([
      runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS]),
      runCli(['checkups', `${DEMO}/checkups.csv`, '--criteria', 'ADA', '--table', join(dir, 'table.csv'), '--evidence', join(dir, 'evidence.json'), '--evidence-id', DEMO_WORKFORCE_HBA1C_HEART_FAILURE.id, '--today', '2026-01-01']),
    ]);
    expect(files.stdout).toBe(ids.stdout);
    const many = await runCli(['checkups', `${DEMO}/checkups.csv`, '--criteria', 'ADA', '--table-id', 'demo-heart-failure-10y', '--evidence', join(dir, 'evidence.json')]);
    expect(many.code).toBe(2);
    expect(many.stderr).toMatch(/holds 2 entries; choose one with --evidence-id/);
  });

  it('row problems: control characters escaped, at most 50 lines then a count, exit 1', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hf-checkups-'));
    const bad = Array.from({ length: 60 }, (_, i) => `W${i},2024-03-01,x\u001b[31m,5.0`);
    const file = join(dir, 'bad.csv');
    writeFileSync(file, `worker,date,HbA1c (%),FPG (mmol/L)\nW0,2024-03-01,5.5,5.0\n${bad.join('\n')}\n`);
    const run = await runCli(['checkups', file, ...SETTINGS]);
    expect(run.code).toBe(1);
    const err = run.stderr.trim().split('\n');
    expect(err).toHaveLength(51);
    expect(err[0]).toBe('row 3, column HbA1c (%): "x\\x1b[31m" is not a number');
    expect(err[50]).toBe('… and 10 more row problems not listed');
    expect(run.stderr).not.toContain('\u001b');
  });

  it('standard input ("-") is streamed: the same lines as the file; bytes that are not UTF-8 are refused with their line, exit 2', async () => {
    const text = readFileSync(`${DEMO}/checkups.csv`, 'utf8');
    const [fromFile, fromStdin] = await Promise.all([runCli(['checkups', `${DEMO}/checkups.csv`, ...SETTINGS]), runCli(['checkups', '-', ...SETTINGS], text)]);
    expect(fromStdin.code).toBe(1);
    expect(fromStdin.stdout).toBe(fromFile.stdout);
    const bad = await new Promise<{ code: number | null; stdout: string; stderr: string }>((resolve, reject) => {
      const child = spawn(process.execPath, [BIN, 'checkups', '-', ...SETTINGS], { cwd: ROOT, stdio: 'pipe' });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (c: Buffer) => (stdout += c.toString('utf8')));
      child.stderr.on('data', (c: Buffer) => (stderr += c.toString('utf8')));
      child.on('error', reject);
      child.on('close', (code) => resolve({ code, stdout, stderr }));
      // Line 3 holds a Latin-1 "é" (0xe9), which is not UTF-8.
      child.stdin.end(Buffer.concat([Buffer.from('worker,date,HbA1c (%)\nW1,2024-01-01,6.1\nW2,2024-01-01,6.0,'), Buffer.from([0xe9]), Buffer.from('\n')]));
    });
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toBe('hundredfold: checkups: standard input is not UTF-8 text: byte 0xe9 at line 3 is not part of a UTF-8 character, and nothing is guessed. Save it as UTF-8\n');
  });

  it('exit 2 with one line: unsettled mapping, no usable row, unknown option, missing settings, a PDF', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hf-checkups-'));
    writeFileSync(join(dir, 'nounit.csv'), 'id,date,HbA1c\nW1,2024-03-01,6.1\n');
    writeFileSync(join(dir, 'allbad.csv'), 'id,date,HbA1c (%)\nW1,2024-03-01,x\n');
    writeFileSync(join(dir, 'paper.csv'), '%PDF-1.7\n…');
    const cases: [string[], RegExp][] = [
      [['checkups', join(dir, 'nounit.csv'), ...SETTINGS], /Column "HbA1c": the HbA1c has no unit/],
      [['checkups', join(dir, 'allbad.csv'), ...SETTINGS], /None of the file's 1 data row could be used/],
      [['checkups', `${DEMO}/checkups.csv`, ...SETTINGS, '--bogus'], /unknown option "--bogus"/],
      [['checkups', `${DEMO}/checkups.csv`, '--table-id', 'demo-heart-failure-10y', '--evidence-id', 'demo-workforce-hba1c-heart-failure'], /--criteria ADA, WHO or NICE is required/],
      [['checkups', join(dir, 'paper.csv'), ...SETTINGS], /is a PDF, not a checkup file/],
    ];
    for (const [args, message] of cases) {
      const run = await runCli(args);
      expect(run.code).toBe(2);
      expect(run.stdout).toBe('');
      // One refusal line (a file whose every row is bad also lists those rows first).
      const refusals = run.stderr.trim().split('\n').filter((l) => l.startsWith('hundredfold: '));
      expect(refusals).toHaveLength(1);
      expect(refusals[0]).toMatch(message);
    }
    // Settled with --map, the same file is read.
    const mapped = await runCli(['checkups', join(dir, 'nounit.csv'), ...SETTINGS, '--map', 'HbA1c=hba1c:%']);
    expect(mapped.code).toBe(0);
  });
});
