#!/usr/bin/env node
/**
 * `hundredfold`: runs the bundled command, dist/hundredfold.mjs. In a checkout (lib/ and the
 * build script present) it first rebuilds the bundle, quietly, when it is missing or older than
 * any of its sources, so `npx hundredfold …` always runs the code as it stands.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const bundle = join(root, 'dist', 'hundredfold.mjs');
const buildScript = join(root, 'scripts', 'build-cli.mjs');

function fail(message) {
  process.stderr.write(`hundredfold: ${message.replace(/\s+/g, ' ').trim()}\n`);
  process.exit(2);
}

if (existsSync(join(root, 'lib')) && existsSync(buildScript)) {
  const { buildCli, isStale } = await import(pathToFileURL(buildScript).href);
  if (isStale()) {
    try {
      await buildCli();
    } catch (error) {
      fail(`the command could not be built from lib/ (${error instanceof Error ? error.message : String(error)})`);
    }
  }
}
if (!existsSync(bundle)) fail('the command is not built; run "npm run build:cli"');
await import(pathToFileURL(bundle).href);
