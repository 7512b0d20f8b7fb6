import { PassThrough } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { glycaemia } from '@/lib/cli/commands/glycaemia';
import type { CommandIo } from '@/lib/cli/io';

// In-process runs with a fake CommandIo. Histories are illustrative, invented for the tests.
const TODAY = '2024-06-30';

interface Run {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

async function run(args: string[], stdin: string, files: Record<string, string> = {}): Promise<Run> {
  const input = new PassThrough();
  const output = new PassThrough();
  const errors = new PassThrough();
  let stdout = '';
  let stderr = '';
  output.on('data', (d: Buffer) => (stdout += d.toString()));
  errors.on('data', (d: Buffer) => (stderr += d.toString()));
  input.end(stdin);
  const io: CommandIo = {
    args,
    stdin: input,
    stdout: output,
    stderr: errors,
    readFile: async (path) => {
      const text = files[path];
      if (text === undefined) throw new Error(`ENOENT: no such file, open '${path}'`);
      return text;
    },
  };
  const code = await glycaemia(io, { today: TODAY });
  return { code, stdout, stderr };
}

const history = {
  criteria: 'ADA',
  checkups: [
    { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 92, unit: 'mg/dL' } },
    { date: '2021-03-02', hba1c: { value: 40, unit: 'mmol/mol' } },
    { date: '2022-02-25', fpg: { value: 5.8, unit: 'mmol/L' } },
  ],
};

function expectBadInput(r: Run, pattern: RegExp) {
  expect(r.code).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.split('\n').filter(Boolean)).toHaveLength(1);
  expect(r.stderr).toMatch(pattern);
}

describe('hundredfold glycaemia: JSON input', () => {
  it('prints each checkup sorted, with both units, nulls for missing values, and the run', async () => {
    const r = await run([], JSON.stringify(history));
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    expect(out.criteria).toBe('ADA');
    expect(out.checkups.map((c: { date: string }) => c.date)).toEqual(['2021-03-02', '2022-02-25', '2023-03-01']);
    expect(out.checkups[0]).toMatchObject({
      category: 'prediabetes',
      label: 'prediabetes range (ADA)',
      decidedBy: 'hba1c',
      discordant: false,
      hba1cMmolMol: 40,
      hba1cPercent: 5.8097, // (40 + 23.5) / 10.93 = 5.80970…, rounded to 4 decimals (hand-computed)
      fpgMgDl: null,
      fpgMmolL: null,
    });
    expect(out.checkups[1]).toMatchObject({ category: 'prediabetes', decidedBy: 'fpg', fpgMmolL: 5.8, fpgMgDl: 104.4928, hba1cPercent: null }); // 5.8 × 18.016
    expect(out.checkups[2]).toMatchObject({ category: 'prediabetes', decidedBy: 'hba1c', discordant: true, hba1cMmolMol: 43.173, fpgMmolL: 5.1066 }); // 10.93×6.1 − 23.5; 92/18.016
    expect(out.persistence).toMatchObject({ category: 'prediabetes', checkups: 3, yearlyResults: 3, from: '2021-03-02', to: '2023-03-01', gaps: [], brokenBy: null });
    expect(out.persistence.years).toBe(2); // 365 + 364 = 729 days; 729 / 365.25 = 1.9959…, to 2 decimals 2.00 (hand-computed)
    expect(out.diabetesRangeNote).toBeNull();
    expect(out).not.toHaveProperty('skipped');
  });

  it('reads --input FILE', async () => {
    const r = await run(['--input', 'h.json'], '', { 'h.json': JSON.stringify(history) });
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).checkups).toHaveLength(3);
  });

  it('lets --criteria fill a missing criteria field', async () => {
    const { criteria: _c, ...rest } = history;
    const r = await run(['--criteria', 'nice'], JSON.stringify(rest));
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).criteria).toBe('NICE');
  });

  it('reports the diabetes-range note and a gap', async () => {
    const r = await run(
      [],
      JSON.stringify({ criteria: 'WHO', checkups: [{ date: '2019-01-10', fpg: { value: 6.3, unit: 'mmol/L' } }, { date: '2023-03-01', fpg: { value: 7.4, unit: 'mmol/L' } }] }),
    );
    const out = JSON.parse(r.stdout);
    expect(out.diabetesRangeNote.code).toBe('diabetes-range-latest');
    expect(out.persistence.gaps).toEqual([{ from: '2019-01-10', to: '2023-03-01', months: 49, days: 1511 }]); // 2019-01-10 → 2023-03-01: 4 y 1 m 19 d; 1511 days (hand-computed)
    expect(r.stdout).not.toMatch(/\bdiabetes\b(?![ -]range)/i);
  });

  it('prints its usage with --help', async () => {
    const r = await run(['--help'], '');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Usage: hundredfold glycaemia/);
  });
});

describe('hundredfold glycaemia: bad input exits 2 with one line naming checkup and field', () => {
  const one = (checkup: unknown) => JSON.stringify({ criteria: 'ADA', checkups: [checkup] });

  it('unknown unit', async () => {
    expectBadInput(await run([], one({ date: '2023-03-01', hba1c: { value: 6.1, unit: 'mg%' } })), /checkups\[0\] \(2023-03-01\) hba1c\.unit: The HbA1c unit must be/);
  });
  it('negative value', async () => {
    expectBadInput(await run([], one({ date: '2023-03-01', fpg: { value: -5, unit: 'mmol/L' } })), /checkups\[0\] \(2023-03-01\) fpg\.value: The fasting glucose value in mmol\/L must be between 1 and 50/);
  });
  it('absurd value', async () => {
    expectBadInput(await run([], one({ date: '2023-03-01', hba1c: { value: 480, unit: 'mmol/mol' } })), /hba1c\.value: .*between 9 and 195/);
  });
  it('impossible date', async () => {
    expectBadInput(await run([], one({ date: '2023-02-29', fpg: { value: 5, unit: 'mmol/L' } })), /checkups\[0\] \(2023-02-29\) date: The date 2023-02-29 is not a real calendar day/);
  });
  it('future date', async () => {
    expectBadInput(await run([], one({ date: '2024-07-01', fpg: { value: 5, unit: 'mmol/L' } })), /date: The date 2024-07-01 is after today \(2024-06-30\)/);
  });
  it('duplicate date with different values', async () => {
    const r = await run(
      [],
      JSON.stringify({ criteria: 'ADA', checkups: [{ date: '2023-03-01', fpg: { value: 101, unit: 'mg/dL' } }, { date: '2023-03-01', fpg: { value: 118, unit: 'mg/dL' } }] }),
    );
    expectBadInput(r, /checkups\[1\] \(2023-03-01\) fpg\.value: Checkup \[1\] \(2023-03-01\) has a different fasting glucose \(118 mg\/dL\) from checkup \[0\]/);
  });
  it('a value that is not a number', async () => {
    expectBadInput(await run([], one({ date: '2023-03-01', hba1c: { value: '6,1', unit: '%' } })), /hba1c\.value: The HbA1c value must be a number/);
  });
  it('a checkup with neither test', async () => {
    expectBadInput(await run([], one({ date: '2023-03-01' })), /checkups\[0\] \(2023-03-01\): The checkup has neither an HbA1c nor a fasting glucose/);
  });
  it('several problems still make one line', async () => {
    const r = await run([], JSON.stringify({ criteria: 'ADA', checkups: [{ date: 'x', fpg: { value: 5, unit: 'mmol/L' } }, { date: '2023-03-01', hba1c: { value: 0, unit: '%' } }] }));
    expectBadInput(r, /checkups\[0\] \(x\) date: .*; checkups\[1\] \(2023-03-01\) hba1c\.value: /);
  });
  it('malformed JSON, a missing criteria set, conflicting criteria', async () => {
    expectBadInput(await run([], '{"criteria": "ADA", "checkups": ['), /the input is not valid JSON/);
    expectBadInput(await run([], JSON.stringify({ checkups: history.checkups })), /criteria: The criteria set is required/);
    expectBadInput(await run(['--criteria', 'WHO'], JSON.stringify(history)), /the input says criteria "ADA" but --criteria says WHO/);
  });
  it('usage errors', async () => {
    expectBadInput(await run(['--criteria', 'IDF'], '{}'), /--criteria must be ADA, WHO or NICE \(got "IDF"\)/);
    expectBadInput(await run(['--criteria'], '{}'), /--criteria needs a value/);
    expectBadInput(await run(['--verbose'], '{}'), /unknown option "--verbose"/);
    expectBadInput(await run(['--input', 'missing.json'], ''), /cannot read --input missing\.json: ENOENT/);
    expectBadInput(await run(['--fhir'], '{}'), /--fhir needs --criteria ADA, WHO or NICE/);
  });
});

describe('hundredfold glycaemia --fhir', () => {
  const obs = (code: string, value: number, unit: string, date: string, status = 'final', id?: string) => ({
    resourceType: 'Observation',
    ...(id ? { id } : {}),
    status,
    code: { coding: [{ system: 'http://loinc.org', code }] },
    effectiveDateTime: date,
    valueQuantity: { value, unit, system: 'http://unitsofmeasure.org', code: unit },
  });
  const bundle = (...resources: unknown[]) => JSON.stringify({ resourceType: 'Bundle', type: 'searchset', entry: resources.map((resource) => ({ resource })) });

  it('classifies a Bundle and lists what it skipped', async () => {
    const r = await run(
      ['--fhir', '--criteria', 'NICE'],
      bundle(
        obs('59261-8', 44, 'mmol/mol', '2022-03-01T08:00:00Z'),
        obs('14771-0', 5.7, 'mmol/L', '2023-03-01'),
        obs('4548-4', 6.2, '%', '2023-03-01'),
        obs('4548-4', 6.9, '%', '2023-05-01', 'preliminary', 'prelim'),
        { resourceType: 'Patient', id: 'p' },
      ),
    );
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.criteria).toBe('NICE');
    expect(out.checkups).toHaveLength(2);
    expect(out.checkups[1]).toMatchObject({ date: '2023-03-01', category: 'prediabetes', decidedBy: 'both', hba1cPercent: 6.2, fpgMmolL: 5.7 });
    expect(out.persistence).toMatchObject({ category: 'prediabetes', checkups: 2 });
    expect(out.skipped).toEqual([
      { entry: 3, id: 'prelim', reason: 'status "preliminary": only final, amended and corrected results are used' },
      { entry: 4, id: 'p', reason: 'a Patient resource, not an Observation' },
    ]);
    expect(out.resources).toBe(5);
  });

  it.each([5001, 7001])('summarises %d conflicting same-day readings once per day, in output that stays small (issue 14 item 6)', async (n) => {
    // n different HbA1c values on one day (illustrative: 5.0% + i·0.0001, all within 3–20%), plus one
    // usable reading on another day so the command prints a report.
    const conflicting = Array.from({ length: n }, (_, i) => obs('4548-4', Number((5 + i * 0.0001).toFixed(4)), '%', '2023-03-01'));
    const r = await run(['--fhir', '--criteria', 'ADA'], bundle(obs('4548-4', 5.5, '%', '2022-03-01'), ...conflicting));
    expect(r.code).toBe(0);
    // Before the fix every skipped reading listed all n values: 5,001 gave 510 MB. Now each reason is
    // bounded, so the output is linear: under 200 bytes a reading.
    expect(r.stdout.length).toBeLessThan(200 * (n + 1));
    const out = JSON.parse(r.stdout) as { skipped: { entry: number; reason: string }[]; checkups: unknown[] };
    expect(out.checkups).toHaveLength(1);
    expect(out.skipped).toHaveLength(n);
    expect(out.skipped[0]?.reason).toContain(`and ${(n - 3).toLocaleString('en')} more, from 5.0% to `);
    expect(out.skipped[1]?.reason).toBe(`one of ${n.toLocaleString('en')} different HbA1c results on 2023-03-01 (see entry 1): the import cannot choose one`);
  }, 60_000);

  it('exits 2 when no Observation is usable, saying why', async () => {
    expectBadInput(
      await run(['--fhir', '--criteria', 'ADA'], bundle(obs('2345-7', 104, 'mg/dL', '2023-03-01'))),
      /no usable HbA1c or fasting glucose Observation in the FHIR input \(1 resource\); entry 0: LOINC 2345-7 is a glucose not marked as fasting/,
    );
  });

  it('exits 2 on a file that is not a Bundle or Observation, or not JSON', async () => {
    expectBadInput(await run(['--fhir', '--criteria', 'ADA'], JSON.stringify({ resourceType: 'Patient' })), /Expected a FHIR Bundle or Observation, got a Patient/);
    expectBadInput(await run(['--fhir', '--criteria', 'ADA'], 'not json'), /The FHIR file is not valid JSON/);
  });
});
