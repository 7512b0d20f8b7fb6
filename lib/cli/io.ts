/**
 * What a command may touch: its arguments, its standard streams and the files it is named.
 * Commands receive this instead of reaching for `process`, so tests can run them in-process
 * and the real entry point stays a thin shell.
 *
 * Input is read strictly (docs/cli.md, "Input"): UTF-8 only — bytes that are not UTF-8 are
 * refused with their line, never replaced by "�" — a leading byte-order mark is dropped, and a
 * whole input (standard input or a file) is at most {@link MAX_INPUT_BYTES}.
 */
import { isUtf8 } from 'node:buffer';
import { open } from 'node:fs/promises';
import type { Readable, Writable } from 'node:stream';
import { escapeForTerminal } from './terminal';

export interface CommandIo {
  readonly args: readonly string[];
  readonly stdin: Readable;
  readonly stdout: Writable;
  readonly stderr: Writable;
  /**
   * Reads a named file as UTF-8 text. The real one is {@link readTextFile}: it rejects, with a
   * plain message, a file that is not UTF-8 or is larger than {@link MAX_INPUT_BYTES}.
   */
  readonly readFile: (path: string) => Promise<string>;
}

/** Exit codes: 0 success, 1 some ndjson lines failed, 2 bad input or usage. */
export const EXIT_OK = 0;
export const EXIT_SOME_FAILED = 1;
export const EXIT_BAD_INPUT = 2;

export type Command = (io: CommandIo) => Promise<number>;

/**
 * The most a command reads as one input, standard input or a file: 64 MiB. A scenario is well
 * under 100 kB and a glucose history or FHIR export of the 500 checkups the tool accepts a few
 * megabytes; `compute --ndjson` streams, so it has no whole-input cap, only a cap per line.
 */
export const MAX_INPUT_BYTES = 64 * 1024 * 1024;

/** Writes one line to stderr: the only way a command reports bad input or usage. Control characters are shown escaped. */
export function complain(io: CommandIo, line: string): number {
  io.stderr.write(`hundredfold: ${escapeForTerminal(line.replace(/\s+/g, ' ').trim())}\n`);
  return EXIT_BAD_INPUT;
}

/** "64 MiB" for a byte count that is a whole number of MiB, else "1.5 MiB". */
export function formatMiB(bytes: number): string {
  const mib = bytes / 1024 / 1024;
  return `${Number.isInteger(mib) ? mib : mib.toFixed(1)} MiB`;
}

/**
 * The offset of the first byte that does not belong to well-formed UTF-8 (RFC 3629 §4: no
 * overlong forms, no surrogates U+D800–U+DFFF, nothing above U+10FFFF), or -1 when all is well.
 */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i] ?? 0;
    if (b < 0x80) {
      i += 1;
      continue;
    }
    let need: number;
    let min: number;
    let max = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) {
      need = 1;
      min = 0x80;
    } else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      min = b === 0xe0 ? 0xa0 : 0x80;
      if (b === 0xed) max = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      min = b === 0xf0 ? 0x90 : 0x80;
      if (b === 0xf4) max = 0x8f;
    } else return i;
    for (let k = 1; k <= need; k += 1) {
      const c = bytes[i + k];
      if (c === undefined) return i;
      const lo = k === 1 ? min : 0x80;
      const hi = k === 1 ? max : 0xbf;
      if (c < lo || c > hi) return i;
    }
    i += need + 1;
  }
  return -1;
}

/** Where a byte offset falls, for messages: "line 3, byte 17 of the input". */
function lineOf(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i += 1) if (bytes[i] === 0x0a) line += 1;
  return line;
}

export type TextRead = { readonly ok: true; readonly text: string } | { readonly ok: false; readonly problem: string };

/**
 * Bytes to text, strictly: refused, with the line and the offending byte, when they are not
 * UTF-8 (a file saved as Latin-1 or UTF-16, or binary); a leading byte-order mark is dropped.
 *
 * @param what - how the input is named in the message, e.g. "the input" or `the file "x.json"`
 * @example
 * decodeUtf8Strict(Buffer.from([0x7b, 0xff, 0x7d]), 'the input')
 * //=> { ok: false, problem: 'the input is not UTF-8 text: byte 0xff at line 1, byte 2 …' }
 */
export function decodeUtf8Strict(bytes: Uint8Array, what: string): TextRead {
  if (!isUtf8(bytes)) {
    const at = Math.max(0, firstInvalidUtf8(bytes));
    const bom16 = (bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff);
    const hint = bom16 ? ' It looks like UTF-16; save it as UTF-8' : ' Save it as UTF-8';
    const byte = (bytes[at] ?? 0).toString(16).padStart(2, '0');
    return {
      ok: false,
      problem: `${what} is not UTF-8 text: byte 0x${byte} at line ${lineOf(bytes, at)} (byte ${at + 1}) is not part of a UTF-8 character, and nothing is guessed.${hint}`,
    };
  }
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8');
  return { ok: true, text: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text };
}

function tooLarge(what: string): string {
  return `${what} is larger than ${formatMiB(MAX_INPUT_BYTES)}, the most a command reads at once; for many scenarios use "compute --ndjson", which streams`;
}

/**
 * Reads the whole of a stream (standard input) as strict UTF-8 text, up to
 * {@link MAX_INPUT_BYTES}; beyond that it stops reading and says so.
 */
export async function readStreamText(stream: Readable, what = 'the input'): Promise<TextRead> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of stream) {
    const bytes = typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer);
    size += bytes.length;
    if (size > MAX_INPUT_BYTES) {
      stream.destroy();
      return { ok: false, problem: tooLarge(what) };
    }
    chunks.push(bytes);
  }
  return decodeUtf8Strict(Buffer.concat(chunks), what);
}

/**
 * A stream (standard input) as strict UTF-8 text, chunk by chunk, with no cap on the whole: for
 * commands that read as they go (`checkups -`). A leading byte-order mark is dropped. Bytes that
 * are not UTF-8 reject the iteration with an Error whose message is the sentence to show (with
 * the line) and whose code is `HUNDREDFOLD_INPUT`.
 */
export async function* streamTextChunks(stream: Readable, what = 'the input'): AsyncGenerator<string> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let line = 1;
  const refuse = (bytes: Uint8Array, tail: string): Error => {
    const at = Math.max(0, firstInvalidUtf8(bytes));
    const byte = (bytes[at] ?? 0).toString(16).padStart(2, '0');
    const where = at < bytes.length ? `byte 0x${byte} at line ${line + lineOf(bytes, at) - 1} is not part of a UTF-8 character` : `it ends in the middle of a UTF-8 character${tail}`;
    return Object.assign(new Error(`${what} is not UTF-8 text: ${where}, and nothing is guessed. Save it as UTF-8`), { code: 'HUNDREDFOLD_INPUT' });
  };
  for await (const chunk of stream) {
    const bytes: Uint8Array = typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer);
    let text: string;
    try {
      text = decoder.decode(bytes, { stream: true });
    } catch {
      throw refuse(bytes, '');
    }
    for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) line += 1;
    if (text !== '') yield text;
  }
  let last: string;
  try {
    last = decoder.decode();
  } catch {
    throw refuse(new Uint8Array(0), ` (line ${line})`);
  }
  if (last !== '') yield last;
}

/**
 * The real {@link CommandIo.readFile}: a file as strict UTF-8 text, byte-order mark dropped.
 * Rejects like `fs.readFile` (ENOENT, EISDIR, …), and with code `EFBIG` (larger than
 * {@link MAX_INPUT_BYTES}) or `EILSEQ` (not UTF-8), whose message is the sentence to show.
 */
export async function readTextFile(path: string): Promise<string> {
  const handle = await open(path, 'r');
  try {
    const info = await handle.stat();
    if (info.isDirectory()) throw Object.assign(new Error('it is a directory, not a file'), { code: 'EISDIR' });
    if (info.size > MAX_INPUT_BYTES) throw Object.assign(new Error(tooLarge('it')), { code: 'EFBIG' });
    const bytes = await handle.readFile();
    if (bytes.length > MAX_INPUT_BYTES) throw Object.assign(new Error(tooLarge('it')), { code: 'EFBIG' });
    const read = decodeUtf8Strict(bytes, 'it');
    if (!read.ok) throw Object.assign(new Error(read.problem), { code: 'EILSEQ' });
    return read.text;
  } finally {
    await handle.close();
  }
}
