/**
 * What `compute` and `link` share: their options, reading one scenario from standard input or
 * a file, turning an issue into the one stderr line, and writing output that respects a slow
 * reader (backpressure) and a reader that has gone away (EPIPE).
 */
import type { Writable } from 'node:stream';
import { formatPath, type Issue, type Result } from '../../result';
import { parseScenario, type Scenario } from '../../scenario/parse';
import { readStreamText, type CommandIo } from '../io';
import { parseJsonStrict } from '../json';

/** An option that stands alone (`--ndjson`) or takes a value (`--input FILE` or `--input=FILE`). */
export type OptionKind = 'flag' | 'value';

export interface OptionSpec {
  readonly [name: string]: { readonly kind: OptionKind; readonly placeholder?: string };
}

export type ParsedOptions =
  | { readonly ok: true; readonly help: boolean; readonly values: Readonly<Record<string, string | true>> }
  | { readonly ok: false; readonly problem: string };

function describeOptions(spec: OptionSpec): string {
  return Object.entries(spec)
    .map(([name, { kind, placeholder }]) => (kind === 'value' ? `--${name} ${placeholder ?? 'VALUE'}` : `--${name}`))
    .join(', ');
}

/**
 * Reads `--name`, `--name value` and `--name=value`; `--help` and `-h` ask for help. Anything
 * else (an unknown option, a stray argument, an option given twice, a value missing) is a
 * usage problem, described in one sentence.
 */
export function parseOptions(command: string, args: readonly string[], spec: OptionSpec): ParsedOptions {
  const values: Record<string, string | true> = {};
  let help = false;
  const known = describeOptions(spec);
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i] ?? '';
    if (arg === '--help' || arg === '-h') {
      help = true;
      continue;
    }
    if (!arg.startsWith('--')) {
      return { ok: false, problem: `${command}: unexpected argument "${arg}"; the options are ${known}` };
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq < 0 ? undefined : eq);
    const option = spec[name];
    if (option === undefined) {
      return { ok: false, problem: `${command}: unknown option "${arg.slice(0, eq < 0 ? undefined : eq)}"; the options are ${known}` };
    }
    if (name in values) return { ok: false, problem: `${command}: the option --${name} is given more than once` };
    if (option.kind === 'flag') {
      if (eq >= 0) return { ok: false, problem: `${command}: the option --${name} takes no value` };
      values[name] = true;
      continue;
    }
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      value = args[i + 1];
      i += 1;
    }
    if (value === undefined || value === '') {
      return { ok: false, problem: `${command}: the option --${name} needs a ${option.placeholder ?? 'value'}` };
    }
    values[name] = value;
  }
  return { ok: true, help, values };
}

/** The one stderr line for an input that failed validation: the field, then the problem. */
export function issueLine(issues: readonly Issue[]): string {
  const [first] = issues;
  if (first === undefined) return 'input: the input was refused';
  const more = issues.length - 1;
  const tail = more > 0 ? ` (and ${more} more problem${more === 1 ? '' : 's'})` : '';
  return `${formatPath(first.path)}: ${first.message}${tail}`;
}

/** A plain reason for a file that cannot be read, from Node's error code. */
export function fileProblem(file: string, error: unknown): string {
  const code = typeof error === 'object' && error !== null ? (error as { code?: unknown }).code : undefined;
  const reason =
    code === 'ENOENT'
      ? 'there is no such file'
      : code === 'EISDIR'
        ? 'it is a directory, not a file'
        : code === 'EACCES' || code === 'EPERM'
          ? 'permission denied'
          : error instanceof Error
            ? error.message
            : String(error);
  return `--input: cannot read ${JSON.stringify(file)}: ${reason}`;
}

/** Editors on some systems start UTF-8 files with a byte-order mark, which JSON does not allow. */
export function withoutBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

export type InputText = { readonly ok: true; readonly text: string } | { readonly ok: false; readonly problem: string };

/** The whole input as text: the file named by --input ("-" for stdin), else stdin. */
export async function readInputText(io: CommandIo, file: string | undefined): Promise<InputText> {
  if (file === undefined || file === '-') {
    const read = await readStreamText(io.stdin);
    if (!read.ok) return { ok: false, problem: `input: ${read.problem}` };
    const text = read.text;
    if (text.trim() === '') {
      return { ok: false, problem: 'input: no scenario was given; pipe one in as JSON or name a file with --input FILE' };
    }
    return { ok: true, text: withoutBom(text) };
  }
  try {
    const text = withoutBom(await io.readFile(file));
    if (text.trim() === '') return { ok: false, problem: `input: the file ${JSON.stringify(file)} is empty; it should hold one scenario as JSON` };
    return { ok: true, text };
  } catch (error) {
    return { ok: false, problem: fileProblem(file, error) };
  }
}

/**
 * One scenario from JSON text, as every command reads it: strict JSON (./../json.ts: no repeated
 * key, no oversized object), then the scenario schema.
 */
export function parseScenarioText(text: string): Result<Scenario> {
  const json = parseJsonStrict(text);
  return json.ok ? parseScenario(json.value) : json;
}

/**
 * Writes text, waiting while the reader is slow. Resolves to false once the stream can take no
 * more (closed, or its reader has gone: EPIPE), so the caller can stop quietly.
 */
export function writeText(stream: Writable, text: string | Uint8Array): Promise<boolean> {
  if (stream.destroyed || stream.writableEnded) return Promise.resolve(false);
  if (stream.write(text)) return Promise.resolve(true);
  return new Promise((resolve) => {
    const settle = (open: boolean) => () => {
      stream.off('drain', onDrain);
      stream.off('error', onGone);
      stream.off('close', onGone);
      resolve(open);
    };
    const onDrain = settle(true);
    const onGone = settle(false);
    stream.once('drain', onDrain);
    stream.once('error', onGone);
    stream.once('close', onGone);
  });
}
