import { mkdtemp, readFile, rm, utimes, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PassThrough, Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '@/lib/cli/main';
import { buildCli, isStale } from '@/scripts/build-cli.mjs';
import { ensureBuilt, runCli, type CliRun } from './runCli';

// Bad input and usage (issue 2 §3): exit 2, exactly one line on stderr naming the field and the
// problem, nothing on stdout, never a stack trace. The field names and messages expected here
// are the scenario schema's own (lib/scenario/schema.ts). Scenarios are illustrative numbers.
//
// Every case runs in-process through main() with real files (fast); a handful also run as the
// real command, spawned, to show the process carries the same exit code and the one line.

const good = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
const withBaseline = (baseline: unknown) => JSON.stringify({ ...good, baseline });
const withEffect = (effect: Record<string, unknown>) => JSON.stringify({ ...good, effect: { ...good.effect, ...effect } });

let dir = '';
beforeAll(async () => {
  await ensureBuilt();
  dir = await mkdtemp(join(tmpdir(), 'hundredfold-bin-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** Runs main() in-process, as bin/hundredfold.mjs would, with real files. */
async function runInProcess(args: readonly string[], input: string): Promise<CliRun> {
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  let out = '';
  let err = '';
  stdout.on('data', (c: Buffer) => (out += c.toString('utf8')));
  stderr.on('data', (c: Buffer) => (err += c.toString('utf8')));
  const code = await main({ args, stdin: Readable.from([Buffer.from(input)]), stdout, stderr, readFile: (p) => readFile(p, 'utf8') });
  return { code, stdout: out, stderr: err };
}

function expectBadInput(r: CliRun, prefix: string) {
  expect(r.code).toBe(2);
  expect(r.stdout).toBe('');
  const lines = r.stderr.split('\n');
  expect(lines).toHaveLength(2); // one line, then the final newline
  expect(lines[1]).toBe('');
  expect(lines[0]?.startsWith(`hundredfold: ${prefix}`)).toBe(true);
  expect(r.stderr).not.toMatch(/^\s+at /m);
  expect(r.stderr).not.toMatch(/Error:/);
}

const BAD_INPUT: readonly (readonly [string, string, string])[] = [
    ['a risk of 0', withBaseline({ risk: 0, years: 10 }), 'baseline.risk: The baseline risk must be greater than 0'],
    ['a risk of 1', withBaseline({ risk: 1, years: 10 }), 'baseline.risk: The baseline risk must be less than 1'],
    ['a percentage for a risk', withBaseline({ risk: 8, years: 10 }), 'baseline.risk: The baseline risk must be less than 1'],
    ['a risk as a string', withBaseline({ risk: '0.08', years: 10 }), 'baseline.risk: The baseline risk must be a number'],
    ['"NaN" for a risk', withBaseline({ risk: 'NaN', years: 10 }), 'baseline.risk: The baseline risk must be a number'],
    ['"Infinity" for the upper limit', withEffect({ upper: 'Infinity' }), 'effect.upper: The upper limit must be a number'],
    ['negative years', withBaseline({ risk: 0.08, years: -5 }), 'baseline.years: The baseline period must be greater than 0'],
    ['a negative estimate', withEffect({ estimate: -1.5 }), 'effect.estimate: The estimate must be greater than 0'],
    ['lower above upper', withEffect({ lower: 2 }), 'effect.lower: The lower limit (2) must be less than the upper limit (1.9)'],
    ['the estimate outside its interval', withEffect({ estimate: 2.5 }), 'effect.estimate: The estimate (2.5) must lie within its interval'],
    ['a missing effect', JSON.stringify({ baseline: good.baseline }), 'effect:'],
    ['a missing upper limit', JSON.stringify({ ...good, effect: { measure: 'RR', estimate: 1.5, lower: 1.2 } }), 'effect.upper: The upper limit is required'],
    ['an unknown design', withEffect({ design: 'survey' }), 'effect.design: The study design must be one of cohort'],
    ['a misspelt field', JSON.stringify({ ...good, effect: { ...good.effect, estmate: 1.5 } }), 'effect.estmate: "estmate" is not a field here'],
    ['a rate without a horizon', withBaseline({ rate: 12, perPersonYears: 1000 }), 'horizonYears: The horizon is required'],
    ['a baseline that reaches 100%', JSON.stringify({ ...good, baseline: { risk: 0.9, years: 1 }, horizonYears: 100 }), 'baseline: Over 100 years'],
    ['invalid JSON', '{"baseline": {"risk": 0.08,', 'input: The input is not valid JSON'],
    ['NaN, which JSON does not allow', '{"baseline": {"risk": NaN, "years": 10}}', 'input: The input is not valid JSON'],
    ['no input at all', '', 'input: no scenario was given'],
];

const BAD_USAGE: readonly (readonly [readonly string[], string])[] = [
    [['compute', '--foo'], 'compute: unknown option "--foo"'],
    [['link', '--ndjson'], 'link: unknown option "--ndjson"'],
    [['compute', '--input', '/no/such/file.json'], '--input: cannot read "/no/such/file.json": there is no such file'],
    [['compute', '--ndjson', '--input', '/no/such/file.ndjson'], '--input: cannot read "/no/such/file.ndjson": there is no such file'],
    [['compute', '--input'], 'compute: the option --input needs a FILE'],
    [['frobnicate'], 'unknown command "frobnicate"'],
    [[], 'no command given'],
];

describe('bad input: exit 2, one stderr line naming the field (in-process)', () => {
  it.each(BAD_INPUT)('compute refuses %s', async (_what, input, prefix) => {
    expectBadInput(await runInProcess(['compute'], input), prefix);
  });
  it.each(BAD_INPUT)('link refuses %s', async (_what, input, prefix) => {
    // link only validates; a baseline the engine cannot use still makes a valid link.
    const r = await runInProcess(['link'], input);
    if (prefix.startsWith('baseline: Over')) expect(r.code).toBe(0);
    else expectBadInput(r, prefix);
  });
});

describe('bad usage: exit 2, one stderr line (in-process)', () => {
  it.each(BAD_USAGE)('%j', async (args, prefix) => {
    expectBadInput(await runInProcess(args, JSON.stringify(good)), prefix);
  });
});

describe.concurrent('bad input and usage, spawned: the real process exits 2 with the one line', () => {
  it.each([
    ['lower above upper', ['compute'], withEffect({ lower: 2 }), 'effect.lower: The lower limit (2) must be less than the upper limit (1.9)'],
    ['a string for a number', ['compute'], withBaseline({ risk: 'NaN', years: 10 }), 'baseline.risk: The baseline risk must be a number'],
    ['invalid JSON', ['compute'], '{"baseline": {"risk": 0.08,', 'input: The input is not valid JSON'],
    ['an unknown design, to link', ['link'], withEffect({ design: 'survey' }), 'effect.design: The study design must be one of'],
    ['an unknown option', ['compute', '--foo'], JSON.stringify(good), 'compute: unknown option "--foo"'],
    ['a missing file', ['compute', '--ndjson', '--input', '/no/such/file.ndjson'], '', '--input: cannot read "/no/such/file.ndjson": there is no such file'],
  ])('%s', async (_what, args, input, prefix) => {
    expectBadInput(await runCli(args, input), prefix);
  });
});


describe('the binary', () => {
  it('prints the usage for --help, exit 0', async () => {
    const r = await runCli(['--help']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).toMatch(/^Usage: hundredfold <command>/);
    expect(r.stdout).toContain('compute [--input FILE] [--ndjson]');
  });

  it('builds a bundle that runs on its own', async () => {
    const outfile = join(dir, 'bundle', 'hundredfold.mjs');
    await buildCli({ outfile });
    const { spawnSync } = await import('node:child_process');
    const run = spawnSync(process.execPath, [outfile, 'link'], { input: JSON.stringify(good), encoding: 'utf8' });
    expect(run.status).toBe(0);
    expect(run.stdout).toBe('/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9\n');
  });

  it('counts the bundle stale when missing or older than any source, fresh otherwise', async () => {
    const sources = join(dir, 'sources');
    await mkdir(join(sources, 'deep'), { recursive: true });
    const source = join(sources, 'deep', 'a.ts');
    const bundle = join(dir, 'stale.mjs');
    await writeFile(source, 'export {};');
    expect(isStale(bundle, [sources])).toBe(true); // missing
    await writeFile(bundle, '');
    await utimes(source, new Date(1_000_000), new Date(1_000_000));
    await utimes(bundle, new Date(2_000_000), new Date(2_000_000));
    expect(isStale(bundle, [sources])).toBe(false);
    await utimes(source, new Date(3_000_000), new Date(3_000_000));
    expect(isStale(bundle, [sources])).toBe(true);
  });
});
