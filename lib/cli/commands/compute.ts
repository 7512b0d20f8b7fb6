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
 *   A line longer than {@link MAX_LINE_CHARS} characters, or whose bytes are not UTF-8, gets an
 *   error in its place like any bad line (codes `line-too-long`, `not-utf8`); an over-long line
 *   is not held in memory. Line ends are looked for only in the newly read bytes, so one very
 *   long line costs time in proportion to its length.
 */
import { isUtf8 } from 'node:buffer';
import { open } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import { computeScenario } from '../../engine/compute';
import type { Issue } from '../../result';
import { complain, EXIT_OK, EXIT_SOME_FAILED, firstInvalidUtf8, type CommandIo } from '../io';
import { startPool, type Batch, type Pool } from './ndjsonPool';
import { fileProblem, issueLine, parseOptions, parseScenarioText, readInputText, writeText, type OptionSpec } from './scenarioInput';

export const COMPUTE_USAGE = `Usage: hundredfold compute [--input FILE] [--ndjson]

Reads one scenario as JSON from stdin (or FILE) and prints its result as JSON.
  --input FILE   read FILE instead of stdin ("-" means stdin)
  --ndjson       one scenario per line in, one result per line out, in order; a bad line
                 gives {"line": N, "error": {"code", "path", "message"}} in its place;
                 blank lines are skipped; a line may hold at most 1,048,576 characters
Exit codes: 0 done, 1 some --ndjson lines failed, 2 bad input or usage.`;

const OPTIONS: OptionSpec = { input: { kind: 'value', placeholder: 'FILE' }, ndjson: { kind: 'flag' } };

/** The JSON text of one scenario's result, or its issues. */
export function computeJson(text: string, indent?: number): { ok: true; json: string } | { ok: false; issues: readonly Issue[] } {
  const scenario = parseScenarioText(text);
  if (!scenario.ok) return { ok: false, issues: scenario.issues };
  const result = computeScenario(scenario.value);
  if (!result.ok) return { ok: false, issues: result.issues };
  return { ok: true, json: JSON.stringify(result.value, null, indent) };
}

/** The line that stands in for a bad --ndjson input line. */
export function errorLine(line: number, issue: Issue): string {
  return JSON.stringify({ line, error: { code: issue.code, path: issue.path, message: issue.message } });
}

/**
 * The longest --ndjson line read, in characters (UTF-16 code units): 1 MiB. A scenario line is
 * at most about 20,000 (five wording fields of 500 characters, each at most six once
 * JSON-escaped: hand-computed 5 × 500 × 6 = 15,000, plus the numbers and keys).
 */
export const MAX_LINE_CHARS = 1024 * 1024;

/** The error standing in for a line longer than {@link MAX_LINE_CHARS}. */
export function lineTooLong(lineNumber: number): string {
  return errorLine(lineNumber, {
    code: 'line-too-long',
    path: [],
    message: `Line ${lineNumber.toLocaleString('en-GB')} is longer than ${MAX_LINE_CHARS.toLocaleString('en-GB')} characters, the most a line may hold (a scenario takes a few hundred); check that the file has one scenario per line`,
  });
}

/** Any non-space character: a line without one is blank. */
const NOT_BLANK = /\S/;

/** The output for one --ndjson line (without its newline), or undefined for a blank line. */
function computeLine(raw: string, lineNumber: number): { out: string; failed: boolean } | undefined {
  const line = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
  if (line.length > MAX_LINE_CHARS) return { out: lineTooLong(lineNumber), failed: true };
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

const NEWLINE = 0x0a;
/** Bytes held for one line before it is known to be too long (4 bytes per character at most). */
const MAX_LINE_BYTES = MAX_LINE_CHARS * 4;

/** The output for a line whose bytes are not UTF-8: nothing is guessed. */
function notUtf8(lineNumber: number, bytes: Uint8Array): string {
  const at = firstInvalidUtf8(bytes);
  return errorLine(lineNumber, {
    code: 'not-utf8',
    path: [],
    message: `Line ${lineNumber.toLocaleString('en-GB')} is not UTF-8 text: byte 0x${(bytes[at] ?? 0).toString(16).padStart(2, '0')} at position ${at + 1} is not part of a UTF-8 character; save the file as UTF-8`,
  });
}

/**
 * Streams --ndjson: cuts the input into batches of whole lines as it arrives, computes each
 * (on this thread, or on worker threads once the input proves long), and writes the results
 * in input order, waiting for the reader when it is slow.
 *
 * The input is read as bytes. Each new chunk is searched for line ends once; the bytes after
 * the last line end wait (as a list of chunks, never re-scanned) for the rest of their line,
 * unless they pass {@link MAX_LINE_BYTES}, when the line is given up and its error written.
 *
 * @returns the exit code: 0 all lines computed, 1 some failed
 */
export async function computeNdjson(source: Readable, io: CommandIo): Promise<number> {
  let failed = false;
  let writable = true;
  let nextLine = 1;
  /** Bytes of the unfinished line, in arrival order. */
  let pending: Buffer[] = [];
  let pendingBytes = 0;
  /** True while skipping the rest of a line already reported as too long. */
  let skipping = false;
  let first = true;
  let pool: Pool | undefined;
  let poolTried = false;

  const write = async (batch: Batch) => {
    failed ||= batch.failed;
    if (writable && batch.output.length > 0) writable = await writeText(io.stdout, batch.output);
  };

  /** Everything queued on workers, written, so that what follows keeps its place. */
  const flush = async () => {
    if (pool !== undefined) for (const done of pool.drain()) await write(await done);
  };

  const dispatchText = async (whole: string) => {
    // A byte-order mark, as some editors write, is dropped from the start of the input.
    const text = first && whole.charCodeAt(0) === 0xfeff ? whole.slice(1) : whole;
    first = false;
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

  /** Whole lines as bytes (each ending in "\n", the last possibly not at the end of input). */
  const dispatch = async (bytes: Buffer) => {
    if (isUtf8(bytes)) {
      await dispatchText(bytes.toString('utf8'));
      return;
    }
    // Some line is not UTF-8: line by line, so the good ones still count and keep their order.
    let start = 0;
    while (start < bytes.length) {
      let end = bytes.indexOf(NEWLINE, start);
      end = end < 0 ? bytes.length : end + 1;
      const line = bytes.subarray(start, end);
      if (isUtf8(line)) await dispatchText(line.toString('utf8'));
      else {
        await flush();
        await write({ output: `${notUtf8(nextLine, line)}\n`, failed: true });
        nextLine += 1;
        first = false;
      }
      start = end;
    }
  };

  const takePending = (tail: Buffer): Buffer => {
    const whole = pending.length === 0 ? tail : Buffer.concat([...pending, tail]);
    pending = [];
    pendingBytes = 0;
    return whole;
  };

  try {
    for await (const raw of source as AsyncIterable<Buffer | string>) {
      const chunk = typeof raw === 'string' ? Buffer.from(raw, 'utf8') : raw;
      const firstEnd = chunk.indexOf(NEWLINE);
      if (firstEnd < 0) {
        // No line end in this chunk: the line goes on (or is being skipped).
        if (skipping) continue;
        pending.push(chunk);
        pendingBytes += chunk.length;
        if (pendingBytes > MAX_LINE_BYTES) {
          pending = [];
          pendingBytes = 0;
          skipping = true;
          await flush();
          await write({ output: `${lineTooLong(nextLine)}\n`, failed: true });
          nextLine += 1;
          first = false;
        }
        continue;
      }
      let from = 0;
      if (skipping) {
        // The rest of the reported line ends here.
        skipping = false;
        from = firstEnd + 1;
      }
      const lastEnd = chunk.lastIndexOf(NEWLINE);
      if (lastEnd >= from) await dispatch(takePending(chunk.subarray(from, lastEnd + 1)));
      const tail = chunk.subarray(lastEnd + 1);
      if (tail.length > 0) {
        pending.push(tail);
        pendingBytes += tail.length;
      }
      if (!writable) break; // The reader has gone (e.g. `| head`): stop quietly.
    }
    if (writable && !skipping && pendingBytes > 0) await dispatch(takePending(Buffer.alloc(0)));
    await flush();
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
