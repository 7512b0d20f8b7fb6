/**
 * `hundredfold compute [--input FILE] [--ndjson]`: scenarios in, results out, through the same
 * validation (lib/scenario/parse.ts) and engine (lib/engine/compute.ts) as the app.
 *
 * - One scenario: the whole input is one JSON scenario; the {@link ComputeResult} is printed as
 *   indented JSON. A scenario the engine refuses (e.g. a baseline that works out to 0% or 100%
 *   over the horizon) is bad input like any other: exit 2, one line on stderr, nothing on stdout.
 * - `--ndjson`: one scenario per line in, one result per line out, in the same order, as the
 *   input arrives (nothing is held back beyond the chunk being read). A bad line gives
 *   `{"line": N, "error": {"code", "path", "message"}}` in its place (its first issue) and the
 *   rest go on. N counts every physical line from 1. Blank lines (empty or only white space)
 *   are skipped with no output: they are what a trailing newline or a spacer in a hand-made
 *   file looks like, not a scenario. Exit 1 when any line failed, 0 when none did.
 *   Long inputs are shared with worker threads (./ndjsonPool.ts); the output is the same.
 */
import { open } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import { computeScenario } from '../../engine/compute';
import type { Issue } from '../../result';
import { parseScenarioJson } from '../../scenario/parse';
import { complain, EXIT_OK, EXIT_SOME_FAILED, type CommandIo } from '../io';
import { startPool, type Batch, type Pool } from './ndjsonPool';
import { fileProblem, issueLine, parseOptions, readInputText, withoutBom, writeText, type OptionSpec } from './scenarioInput';

export const COMPUTE_USAGE = `Usage: hundredfold compute [--input FILE] [--ndjson]

Reads one scenario as JSON from stdin (or FILE) and prints its result as JSON.
  --input FILE   read FILE instead of stdin ("-" means stdin)
  --ndjson       one scenario per line in, one result per line out, in order; a bad line
                 gives {"line": N, "error": {"code", "path", "message"}} in its place;
                 blank lines are skipped
Exit codes: 0 done, 1 some --ndjson lines failed, 2 bad input or usage.`;

const OPTIONS: OptionSpec = { input: { kind: 'value', placeholder: 'FILE' }, ndjson: { kind: 'flag' } };

/** The JSON text of one scenario's result, or its issues. */
export function computeJson(text: string, indent?: number): { ok: true; json: string } | { ok: false; issues: readonly Issue[] } {
  const scenario = parseScenarioJson(text);
  if (!scenario.ok) return { ok: false, issues: scenario.issues };
  const result = computeScenario(scenario.value);
  if (!result.ok) return { ok: false, issues: result.issues };
  return { ok: true, json: JSON.stringify(result.value, null, indent) };
}

/** The line that stands in for a bad --ndjson input line. */
export function errorLine(line: number, issue: Issue): string {
  return JSON.stringify({ line, error: { code: issue.code, path: issue.path, message: issue.message } });
}

/** Any non-space character: a line without one is blank. */
const NOT_BLANK = /\S/;

/** The output for one --ndjson line (without its newline), or undefined for a blank line. */
function computeLine(raw: string, lineNumber: number): { out: string; failed: boolean } | undefined {
  const line = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
  if (!NOT_BLANK.test(line)) return undefined;
  try {
    const computed = computeJson(line);
    if (computed.ok) return { out: computed.json, failed: false };
    const issue = computed.issues[0] ?? { code: 'invalid', path: [], message: 'The line was refused' };
    return { out: errorLine(lineNumber, issue), failed: true };
  } catch (error) {
    // A bug in the engine, not bad input: report it on this line and go on with the rest.
    const message = `Internal error: ${error instanceof Error ? error.message : String(error)}`;
    return { out: errorLine(lineNumber, { code: 'internal-error', path: [], message }), failed: true };
  }
}

export interface BatchOutput {
  /** One output line per non-blank input line, each ending in "\n". */
  readonly output: string;
  /** True when any line failed. */
  readonly failed: boolean;
}

/**
 * Computes a batch of whole --ndjson lines: `text` is lines each ending in "\n" (the last may
 * lack it at the end of the input), the first of them numbered `firstLine`.
 */
export function computeBatch(text: string, firstLine: number): BatchOutput {
  const parts: string[] = [];
  let failed = false;
  let lineNumber = firstLine;
  let start = 0;
  while (start < text.length) {
    let end = text.indexOf('\n', start);
    if (end < 0) end = text.length;
    const done = computeLine(text.slice(start, end), lineNumber);
    if (done !== undefined) {
      parts.push(done.out, '\n');
      failed ||= done.failed;
    }
    lineNumber += 1;
    start = end + 1;
  }
  return { output: parts.join(''), failed };
}

function countLines(text: string): number {
  let count = 0;
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) count += 1;
  return count;
}

/** Lines computed on the main thread before worker threads are worth starting. */
const LINES_BEFORE_WORKERS = 2000;

/**
 * Streams --ndjson: cuts the input into batches of whole lines as it arrives, computes each
 * (on this thread, or on worker threads once the input proves long), and writes the results
 * in input order, waiting for the reader when it is slow.
 *
 * @returns the exit code: 0 all lines computed, 1 some failed
 */
export async function computeNdjson(source: Readable, io: CommandIo): Promise<number> {
  source.setEncoding('utf8');
  let failed = false;
  let writable = true;
  let nextLine = 1;
  let rest = '';
  let first = true;
  let pool: Pool | undefined;
  let poolTried = false;

  const write = async (batch: Batch) => {
    failed ||= batch.failed;
    if (writable && batch.output.length > 0) writable = await writeText(io.stdout, batch.output);
  };

  const dispatch = async (text: string) => {
    const firstLine = nextLine;
    nextLine += countLines(text);
    if (pool === undefined && !poolTried && firstLine > LINES_BEFORE_WORKERS) {
      poolTried = true;
      pool = startPool();
    }
    if (pool === undefined) {
      await write(computeBatch(text, firstLine));
      return;
    }
    // Results come back in dispatch order; write each as soon as its turn comes.
    for (const done of pool.submit(text, firstLine)) await write(await done);
  };

  try {
    for await (const chunk of source as AsyncIterable<string>) {
      let text = rest === '' ? chunk : rest + chunk;
      if (first) {
        text = withoutBom(text);
        first = false;
      }
      const cut = text.lastIndexOf('\n');
      if (cut < 0) {
        rest = text;
        continue;
      }
      rest = text.slice(cut + 1);
      await dispatch(text.slice(0, cut + 1));
      if (!writable) break; // The reader has gone (e.g. `| head`): stop quietly.
    }
    if (writable && rest !== '') await dispatch(first ? withoutBom(rest) : rest);
    if (pool !== undefined) for (const done of pool.drain()) await write(await done);
  } finally {
    await pool?.close();
  }
  return failed ? EXIT_SOME_FAILED : EXIT_OK;
}

export async function compute(io: CommandIo): Promise<number> {
  const options = parseOptions('compute', io.args, OPTIONS);
  if (!options.ok) return complain(io, options.problem);
  if (options.help) {
    await writeText(io.stdout, `${COMPUTE_USAGE}\n`);
    return EXIT_OK;
  }
  const file = options.values.input === true ? undefined : options.values.input;

  if (options.values.ndjson === true) {
    if (file === undefined || file === '-') return computeNdjson(io.stdin, io);
    let stream: Readable;
    try {
      const handle = await open(file, 'r');
      stream = handle.createReadStream({ highWaterMark: 1 << 16 });
    } catch (error) {
      return complain(io, fileProblem(file, error));
    }
    try {
      return await computeNdjson(stream, io);
    } catch (error) {
      // A file that opens but cannot be read (e.g. a directory) fails on the first read.
      stream.destroy();
      return complain(io, fileProblem(file, error));
    }
  }

  const input = await readInputText(io, file);
  if (!input.ok) return complain(io, input.problem);
  const computed = computeJson(input.text, 2);
  if (!computed.ok) return complain(io, issueLine(computed.issues));
  await writeText(io.stdout, `${computed.json}\n`);
  return EXIT_OK;
}
