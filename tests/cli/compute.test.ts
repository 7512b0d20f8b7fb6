import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PassThrough, Readable, Writable } from 'node:stream';
import { spawn } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeBatch, computeNdjson } from '@/lib/cli/commands/compute';
import { parseOptions, writeText } from '@/lib/cli/commands/scenarioInput';
import type { CommandIo } from '@/lib/cli/io';
import { computeScenario } from '@/lib/engine/compute';
import { parseScenario } from '@/lib/scenario/parse';
import { BIN, ensureBuilt, ROOT, runCli } from './runCli';

// Expected outputs are the engine's own results computed in this process (lib/engine/compute.ts,
// tested against published values in tests/unit/engine/); these tests check that the command
// carries them through unchanged, in the shape issue 2 §3 gives. Scenarios are illustrative
// numbers, not from a real population or study.

const riskScenario = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
const rateScenario = {
  baseline: { rate: 12, perPersonYears: 1000 },
  horizonYears: 5,
  effect: { measure: 'HR', estimate: 0.8, lower: 0.7, upper: 0.92, design: 'trial' },
};
const populationScenario = {
  baseline: { populationRisk: 0.1, exposurePrevalence: 0.3, years: 10 },
  effect: { measure: 'OR', estimate: 2, lower: 1.5, upper: 2.7, design: 'case-control', adjusted: true },
};

/** The result as the engine gives it, through JSON as the command prints it. */
function expected(scenario: unknown): unknown {
  const parsed = parseScenario(scenario);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  const result = computeScenario(parsed.value);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return JSON.parse(JSON.stringify(result.value)) as unknown;
}

let dir = '';
beforeAll(async () => {
  await ensureBuilt();
  dir = await mkdtemp(join(tmpdir(), 'hundredfold-compute-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('hundredfold compute (spawned)', () => {
  it('reads one scenario on stdin and prints its result as JSON, with the contract keys', async () => {
    const r = await runCli(['compute'], JSON.stringify(riskScenario));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as Record<string, unknown>;
    expect(out).toEqual(expected(riskScenario));
    // Issue 2 §3: these keys at least.
    for (const key of ['horizonYears', 'referenceRisk', 'exposedRisk', 'riskRatio', 'riskDifference', 'numberNeeded', 'iconArray', 'warnings']) {
      expect(out).toHaveProperty(key);
    }
    expect(out.numberNeeded).toMatchObject({ direction: 'harm', display: 25, crossesNull: false });
    // Hand-computed: P0 = 0.08, so 8 of 100; P1 = 1.5 × 0.08 = 0.12, so 12 of 100.
    expect(out.iconArray).toMatchObject({ denominator: 100, referenceEvents: 8, exposedEvents: 12 });
  });

  it('reads the same scenario from --input FILE and --input=FILE, with a byte-order mark', async () => {
    const file = join(dir, 'rate.json');
    await writeFile(file, `\uFEFF${JSON.stringify(rateScenario, null, 2)}\n`);
    const [spaced, joined] = await Promise.all([runCli(['compute', '--input', file]), runCli(['compute', `--input=${file}`])]);
    expect(spaced.code).toBe(0);
    expect(JSON.parse(spaced.stdout)).toEqual(expected(rateScenario));
    expect(joined.stdout).toBe(spaced.stdout);
  });

  it('--ndjson: one result per line in order, a bad line replaced by its error, blank lines skipped, exit 1', async () => {
    const lines = [
      JSON.stringify(riskScenario),
      '{"baseline": ',
      '',
      JSON.stringify({ ...riskScenario, effect: { ...riskScenario.effect, lower: 2 } }),
      '   ',
      JSON.stringify(rateScenario),
      JSON.stringify({ baseline: { risk: 0.9, years: 1 }, horizonYears: 100, effect: riskScenario.effect }),
      JSON.stringify(populationScenario),
    ];
    const r = await runCli(['compute', '--ndjson'], `${lines.join('\r\n')}\r\n`);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(1);
    const out = r.stdout.trimEnd().split('\n').map((l) => JSON.parse(l) as unknown);
    expect(out).toHaveLength(6); // 8 lines, 2 blank
    expect(out[0]).toEqual(expected(riskScenario));
    expect(out[1]).toMatchObject({ line: 2, error: { code: 'invalid-json', path: [] } });
    expect(out[2]).toMatchObject({ line: 4, error: { code: 'interval-order', path: ['effect', 'lower'] } });
    expect(out[3]).toEqual(expected(rateScenario));
    // 1 − (1 − 0.9)^100 rounds to 1 in doubles: the engine refuses it (hand-computed).
    expect(out[4]).toMatchObject({ line: 7, error: { code: 'baseline-degenerate', path: ['baseline'] } });
    expect(out[5]).toEqual(expected(populationScenario));
    for (const bad of [out[1], out[2], out[4]]) {
      expect(Object.keys(bad as object)).toEqual(['line', 'error']);
      expect(Object.keys((bad as { error: object }).error)).toEqual(['code', 'path', 'message']);
    }
  });

  it('--ndjson: exit 0 when every line computes, the last line without a newline', async () => {
    const r = await runCli(['compute', '--ndjson'], [riskScenario, rateScenario].map((s) => JSON.stringify(s)).join('\n'));
    expect(r.code).toBe(0);
    expect(r.stdout.split('\n')).toEqual([JSON.stringify(expected(riskScenario)), JSON.stringify(expected(rateScenario)), '']);
  });

  it('--ndjson: a long file gives the same bytes on one thread and with worker threads', async () => {
    const file = join(dir, 'long.ndjson');
    const scenarios = [riskScenario, rateScenario, populationScenario];
    const lines: string[] = [];
    for (let i = 0; i < 5000; i += 1) {
      const s = scenarios[i % 3] as typeof riskScenario;
      lines.push(i === 4321 ? 'not json' : JSON.stringify({ ...s, effect: { ...s.effect, estimate: s.effect.estimate + (i % 7) / 1000 } }));
    }
    await writeFile(file, `${lines.join('\n')}\n`);
    const [one, two] = await Promise.all([
      runCli(['compute', '--ndjson', '--input', file], undefined, { HUNDREDFOLD_THREADS: '1' }),
      runCli(['compute', '--ndjson', '--input', file], undefined, { HUNDREDFOLD_THREADS: '2' }),
    ]);
    expect(one.code).toBe(1);
    expect(two.code).toBe(1);
    expect(two.stdout).toBe(one.stdout);
    const out = one.stdout.split('\n');
    expect(out).toHaveLength(5001);
    expect(JSON.parse(out[4321] ?? '')).toMatchObject({ line: 4322, error: { code: 'invalid-json' } });
    expect(JSON.parse(out[4999] ?? '')).toEqual(expected(JSON.parse(lines[4999] ?? '')));
  });

  it('stops quietly, exit 0 and nothing on stderr, when the reader goes away (EPIPE)', async () => {
    const file = join(dir, 'epipe.ndjson');
    await writeFile(file, `${Array.from({ length: 5000 }, () => JSON.stringify(riskScenario)).join('\n')}\n`);
    const result = await new Promise<{ code: number | null; stderr: string }>((resolve) => {
      const child = spawn(process.execPath, [BIN, 'compute', '--ndjson', '--input', file], { cwd: ROOT });
      let stderr = '';
      child.stderr.on('data', (c: Buffer) => (stderr += c.toString('utf8')));
      child.stdout.once('data', () => child.stdout.destroy());
      child.on('close', (code) => resolve({ code, stderr }));
    });
    expect(result.stderr).toBe('');
    expect(result.code).toBe(0);
  });

  it('prints its usage for --help, exit 0', async () => {
    const r = await runCli(['compute', '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Usage: hundredfold compute');
    expect(r.stderr).toBe('');
  });
});

describe('compute --ndjson in-process', () => {
  function io(stdout: Writable): CommandIo {
    return { args: [], stdin: Readable.from([]), stdout, stderr: new PassThrough(), readFile: () => Promise.reject(new Error('no files')) };
  }

  it('waits for a slow reader and still writes every line in order (backpressure)', async () => {
    const chunks: string[] = [];
    let writes = 0;
    const slow = new Writable({
      highWaterMark: 16,
      write(chunk: Buffer, _encoding, done) {
        writes += 1;
        chunks.push(chunk.toString('utf8'));
        setTimeout(done, 1);
      },
    });
    const line = JSON.stringify(riskScenario);
    // Many small chunks, some splitting a line, as a pipe may deliver them.
    const text = `${Array.from({ length: 300 }, () => line).join('\n')}\n`;
    const pieces: string[] = [];
    for (let i = 0; i < text.length; i += 997) pieces.push(text.slice(i, i + 997));
    const code = await computeNdjson(Readable.from(pieces.map((p) => Buffer.from(p))), io(slow));
    expect(code).toBe(0);
    const out = chunks.join('').split('\n');
    expect(out).toHaveLength(301);
    expect(new Set(out.slice(0, 300)).size).toBe(1);
    expect(writes).toBeGreaterThan(1);
  });

  it('keeps a multi-byte character whole when a chunk boundary splits it', async () => {
    let written = '';
    const sink = new Writable({
      write(chunk: Buffer, _e, done) {
        written += chunk.toString('utf8');
        done();
      },
    });
    const bytes = Buffer.from(`${JSON.stringify({ ...riskScenario, wording: { outcome: 'Δ – 😀' } })}\nnot json\n`);
    const at = bytes.indexOf(Buffer.from('😀')) + 2; // inside the 4-byte sequence
    const code = await computeNdjson(Readable.from([bytes.subarray(0, at), bytes.subarray(at)]), io(sink));
    expect(code).toBe(1);
    expect(written.split('\n')[1]).toContain('"line":2');
  });

  it('numbers lines from the batch start and skips blank lines', () => {
    const batch = computeBatch(`\n${JSON.stringify(riskScenario)}\n  \t\n{}\n`, 10);
    const out = batch.output.trimEnd().split('\n');
    expect(batch.failed).toBe(true);
    expect(out).toHaveLength(2);
    expect(JSON.parse(out[1] ?? '')).toMatchObject({ line: 13, error: { code: 'required', path: ['baseline'] } });
  });

  it('writeText resolves false on a stream that has gone', async () => {
    const gone = new PassThrough();
    gone.destroy();
    await expect(writeText(gone, 'x')).resolves.toBe(false);
  });
});

describe('parseOptions', () => {
  const spec = { input: { kind: 'value', placeholder: 'FILE' }, ndjson: { kind: 'flag' } } as const;

  it('reads --name value, --name=value and flags', () => {
    expect(parseOptions('compute', ['--input', 'a.json', '--ndjson'], spec)).toEqual({ ok: true, help: false, values: { input: 'a.json', ndjson: true } });
    expect(parseOptions('compute', ['--input=a=b.json'], spec)).toEqual({ ok: true, help: false, values: { input: 'a=b.json' } });
    expect(parseOptions('compute', ['-h'], spec)).toMatchObject({ ok: true, help: true });
  });

  it.each([
    [['--foo'], 'unknown option "--foo"'],
    [['--foo=1'], 'unknown option "--foo"'],
    [['stray'], 'unexpected argument "stray"'],
    [['--input'], '--input needs a FILE'],
    [['--input='], '--input needs a FILE'],
    [['--ndjson=yes'], '--ndjson takes no value'],
    [['--ndjson', '--ndjson'], 'more than once'],
  ])('refuses %j', (args, problem) => {
    const parsed = parseOptions('compute', args, spec);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.problem).toContain(problem);
  });
});
