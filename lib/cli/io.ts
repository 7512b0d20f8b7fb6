/**
 * What a command may touch: its arguments, its standard streams and the files it is named.
 * Commands receive this instead of reaching for `process`, so tests can run them in-process
 * and the real entry point stays a thin shell.
 */
import type { Readable, Writable } from 'node:stream';

export interface CommandIo {
  readonly args: readonly string[];
  readonly stdin: Readable;
  readonly stdout: Writable;
  readonly stderr: Writable;
  /** Reads a named file as UTF-8 text. */
  readonly readFile: (path: string) => Promise<string>;
}

/** Exit codes: 0 success, 1 some ndjson lines failed, 2 bad input or usage. */
export const EXIT_OK = 0;
export const EXIT_SOME_FAILED = 1;
export const EXIT_BAD_INPUT = 2;

export type Command = (io: CommandIo) => Promise<number>;

/** Writes one line to stderr: the only way a command reports bad input or usage. */
export function complain(io: CommandIo, line: string): number {
  io.stderr.write(`hundredfold: ${line.replace(/\s+/g, ' ').trim()}\n`);
  return EXIT_BAD_INPUT;
}

/** Reads the whole of standard input as UTF-8 text. */
export async function readAll(stream: Readable): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks).toString('utf8');
}
