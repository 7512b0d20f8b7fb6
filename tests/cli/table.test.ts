import { describe, expect, it } from 'vitest';
import { PassThrough, Readable } from 'node:stream';
import { table } from '@/lib/cli/commands/table';
import { main } from '@/lib/cli/main';
import { exportTableCsv } from '@/lib/tables/csv';
import { DEMO_CORONARY_RATE, DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';

/** Runs a command in-process with fake streams and an in-memory file system. */
async function run(args: string[], files: Record<string, string> = {}, command = table) {
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  let out = '';
  let err = '';
  stdout.on('data', (c: Buffer) => (out += c.toString('utf8')));
  stderr.on('data', (c: Buffer) => (err += c.toString('utf8')));
  const code = await command({
    args,
    stdin: Readable.from([]),
    stdout,
    stderr,
    readFile: async (path) => {
      const text = files[path];
      if (text === undefined) throw Object.assign(new Error(`ENOENT: no such file, open '${path}'`), { code: 'ENOENT' });
      return text;
    },
  });
  return { code, out, err };
}

// Figures below are invented for the tests (illustrative numbers).
const BAD = `# title: Bad table
# outcome: o
# horizon_years: 10
# population: p
# source: s
# year: 2024
sex;age_from;age_to;risk
female;30;39;0,08
female;45;49;0.1
male;30;39;1.5
`;

describe('hundredfold table check FILE', () => {
  it('prints a one-line summary and exits 0 for a valid risk table', async () => {
    const r = await run(['check', 'hf.csv'], { 'hf.csv': exportTableCsv(DEMO_HEART_FAILURE_10Y) });
    expect(r).toEqual({
      code: 0,
      out: 'OK: "Heart failure needing hospital care within 10 years (demo)" (id demo-heart-failure-10y): 10 strata, female and male, ages 30 to 79, risks over 10 years (illustrative numbers)\n',
      err: '',
    });
  });

  it('summarises a rate table', async () => {
    const r = await run(['check', 'rates.csv'], { 'rates.csv': exportTableCsv(DEMO_CORONARY_RATE) });
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/rates per person-years/);
  });

  it('prints every problem, one per line with row and column, and exits 2', async () => {
    const r = await run(['check', 'bad.csv'], { 'bad.csv': BAD });
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err.split('\n')).toEqual([
      'bad.csv: Row 8, column risk: "0,08" has a comma inside a number; write numbers with a decimal point and no thousands separator (e.g. 0.08, 1000). In a spreadsheet, set the decimal separator to "." before saving as CSV',
      'bad.csv: Row 9, column age_from: Ages 40 to 44 are missing for female: row 8 ends at 39 and row 9 starts at 45',
      'bad.csv: Row 10, column risk: The risk must be less than 1 (risks are fractions: for 8% enter 0.08)',
      'hundredfold: bad.csv is not a valid table (3 problems listed); nothing was read',
      '',
    ]);
  });

  it('reports an empty file', async () => {
    const r = await run(['check', 'empty.csv'], { 'empty.csv': '' });
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^empty\.csv: The file is empty/);
  });

  it('is reached through the dispatcher', async () => {
    const r = await run(['table', 'check', 'hf.csv'], { 'hf.csv': exportTableCsv(DEMO_HEART_FAILURE_10Y) }, main);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^OK: /);
  });

  it.each([
    [[], /no table command given/],
    [['verify', 'x.csv'], /unknown table command "verify"/],
    [['check'], /no file given/],
    [['check', 'a.csv', 'b.csv'], /one file at a time/],
    [['check', '--json'], /unknown option "--json"/],
    [['check', 'missing.csv'], /cannot read "missing\.csv" \(ENOENT\)/],
  ])('usage error %j: one line on stderr, nothing on stdout, exit 2', async (args, message) => {
    const r = await run(args);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toMatch(message);
    expect(r.err.trimEnd().split('\n')).toHaveLength(1);
  });

  it('prints its usage on --help', async () => {
    const r = await run(['--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Usage: hundredfold table check FILE/);
  });
});
