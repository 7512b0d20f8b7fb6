/**
 * Builds the `hundredfold` command: bundles lib/cli/entry.ts (with lib/ and its packages) into
 * one file, dist/hundredfold.mjs, for Node 20 as an ES module. `npm run build:cli` and npm's
 * `prepare` run this file; bin/hundredfold.mjs calls {@link buildCli} itself when the bundle is
 * missing or older than its sources, so `npx hundredfold …` always runs the current code.
 *
 * The bundle is written to a temporary file and renamed into place, so a command started while
 * another is rebuilding never reads half a file. Its modification time is set to the moment the
 * build started, so a source saved during the build still counts as newer.
 */
import { mkdir, rename, rm, utimes, writeFile } from 'node:fs/promises';
import { readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const ROOT = fileURLToPath(new URL('..', import.meta.url));
export const ENTRY = join(ROOT, 'lib', 'cli', 'entry.ts');
export const DIST_FILE = join(ROOT, 'dist', 'hundredfold.mjs');
/** What the bundle is made from: a change to any of these makes it stale. */
export const SOURCES = [
  join(ROOT, 'lib'),
  join(ROOT, 'scripts', 'build-cli.mjs'),
  join(ROOT, 'tsconfig.json'),
  join(ROOT, 'package-lock.json'),
];

/** The newest modification time among files under these paths (files or folders), in ms. */
export function newestMtimeMs(paths) {
  let newest = 0;
  const visit = (path) => {
    let stat;
    try {
      stat = statSync(path);
    } catch {
      return; // A source that does not exist cannot be newer.
    }
    if (stat.isDirectory()) {
      for (const name of readdirSync(path)) visit(join(path, name));
    } else if (stat.mtimeMs > newest) {
      newest = stat.mtimeMs;
    }
  };
  for (const path of paths) visit(path);
  return newest;
}

/** True when the bundle is missing or older than any of its sources. */
export function isStale(distFile = DIST_FILE, sources = SOURCES) {
  let builtMs;
  try {
    builtMs = statSync(distFile).mtimeMs;
  } catch {
    return true;
  }
  return newestMtimeMs(sources) > builtMs;
}

/** How lib/ code is bundled for Node, by the command and by the benchmarks that time it as shipped. */
export const NODE_BUNDLE_OPTIONS = Object.freeze({
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  tsconfig: join(ROOT, 'tsconfig.json'),
  write: false,
  logLevel: 'silent',
});

/**
 * Bundles the command. Throws an Error whose message is esbuild's first error when the sources
 * do not build.
 */
export async function buildCli({ entry = ENTRY, outfile = DIST_FILE } = {}) {
  const startedMs = Date.now();
  const { build } = await import('esbuild');
  let result;
  try {
    result = await build({
      ...NODE_BUNDLE_OPTIONS,
      entryPoints: [entry],
      outfile,
      legalComments: 'none',
      // Packages written as CommonJS may call require(); give the ES module one.
      banner: { js: "import { createRequire as __hundredfoldRequire } from 'node:module'; const require = __hundredfoldRequire(import.meta.url);" },
    });
  } catch (error) {
    const first = error && Array.isArray(error.errors) ? error.errors[0] : undefined;
    const where = first?.location ? `${first.location.file}:${first.location.line}: ` : '';
    throw new Error(first ? `${where}${first.text}` : String(error?.message ?? error));
  }
  const [file] = result.outputFiles;
  await mkdir(dirname(outfile), { recursive: true });
  const temporary = `${outfile}.${process.pid}.${startedMs}.tmp`;
  try {
    await writeFile(temporary, file.contents);
    const started = new Date(startedMs);
    await utimes(temporary, started, started);
    await rename(temporary, outfile);
  } finally {
    await rm(temporary, { force: true });
  }
  return outfile;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  buildCli().then(
    (outfile) => {
      if (!process.argv.includes('--quiet')) process.stdout.write(`built ${outfile.slice(ROOT.length)}\n`);
    },
    (error) => {
      process.stderr.write(`build-cli: ${error.message}\n`);
      process.exitCode = 1;
    },
  );
}
