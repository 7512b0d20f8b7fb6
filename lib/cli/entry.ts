/**
 * The real process behind `hundredfold`: wires argv and the standard streams into
 * {@link main} and sets the exit code. Bundled by scripts/build-cli.mjs into
 * dist/hundredfold.mjs, which bin/hundredfold.mjs runs.
 *
 * Nothing here may print a stack trace: a reader that goes away (`| head`) ends the process
 * quietly, and any other failure is one line on stderr.
 *
 * The same file, started as a worker thread, computes --ndjson batches instead.
 */
import { computeBatch } from './commands/compute';
import { isNdjsonWorker, registerWorkerScript, serveBatches } from './commands/ndjsonPool';
import { EXIT_BAD_INPUT, readTextFile } from './io';
import { escapeForTerminal } from './terminal';
import { main } from './main';

function oneLine(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  return `hundredfold: internal error: ${escapeForTerminal(message.replace(/\s+/g, ' ').trim())}\n`;
}

function runCommand(): void {
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    // The reader closed the pipe: what it wanted has been written; stop without a word.
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    process.stderr.write(`hundredfold: cannot write the output: ${error.message}\n`);
    process.exit(EXIT_BAD_INPUT);
  });
  process.stderr.on('error', () => {
    // Nowhere left to report to.
  });
  process.on('uncaughtException', (error) => {
    process.stderr.write(oneLine(error));
    process.exit(EXIT_BAD_INPUT);
  });

  main({
    args: process.argv.slice(2),
    stdin: process.stdin,
    stdout: process.stdout,
    stderr: process.stderr,
    readFile: readTextFile,
  }).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      process.stderr.write(oneLine(error));
      process.exitCode = EXIT_BAD_INPUT;
    },
  );
}

if (isNdjsonWorker()) {
  // A worker thread of `compute --ndjson` (./commands/ndjsonPool.ts), started from this same file.
  serveBatches(computeBatch);
} else {
  registerWorkerScript(new URL(import.meta.url), computeBatch);
  runCommand();
}
