/**
 * Imports lib/ code as a production build ships it: bundled by esbuild (platform node, ESM,
 * the project's tsconfig paths), written to a temporary file and imported from there. Under tsx,
 * esbuild's keepNames wraps every closure in a renaming call that no shipped build pays, so the
 * benchmarks time the bundle instead.
 */
import { rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { build } from 'esbuild';
import { NODE_BUNDLE_OPTIONS, ROOT } from '../scripts/build-cli.mjs';


/**
 * @param entrySource - an ES module that re-exports what to time, with paths from the repo root,
 *   e.g. "export * from './lib/tables/csv';"
 * @param tag - names the temporary file
 */
export async function importBundled<T>(entrySource: string, tag: string): Promise<T> {
  const result = await build({ ...NODE_BUNDLE_OPTIONS, stdin: { contents: entrySource, resolveDir: ROOT, loader: 'ts' } });
  const file = join(tmpdir(), `hundredfold-bench-${tag}-${process.pid}.mjs`);
  await writeFile(file, result.outputFiles[0]?.contents ?? '');
  try {
    return (await import(pathToFileURL(file).href)) as T;
  } finally {
    await rm(file, { force: true });
  }
}
