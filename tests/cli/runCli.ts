/**
 * Runs the real `hundredfold` command (node bin/hundredfold.mjs …) as a child process, as a
 * user's shell would, for the CLI tests. {@link ensureBuilt} builds the bundle once up front so
 * that parallel spawns do not each rebuild it.
 */
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { buildCli, isStale } from '@/scripts/build-cli.mjs';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const BIN = fileURLToPath(new URL('../../bin/hundredfold.mjs', import.meta.url));

export interface CliRun {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

export async function ensureBuilt(): Promise<void> {
  if (isStale()) await buildCli();
}

/** Runs the command with `input` on stdin (nothing, if omitted) and collects what it prints. */
export function runCli(args: readonly string[], input?: string, env: Readonly<Record<string, string>> = {}): Promise<CliRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd: ROOT, env: { ...process.env, ...env }, stdio: 'pipe' });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (c: Buffer) => out.push(c));
    child.stderr.on('data', (c: Buffer) => err.push(c));
    child.on('error', reject);
    child.on('close', (code) => {
      resolve({ code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8') });
    });
    child.stdin.on('error', () => {
      // The command may exit before reading all of its input (e.g. a usage error).
    });
    child.stdin.end(input ?? '');
  });
}
