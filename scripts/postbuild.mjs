/**
 * The step `npm run build` and `npm run build:static` run after `next build`:
 *
 * 1. Hashes every inline <script> of every built page (SHA-256, CSP Level 3 "hash-source") and
 *    puts the hashes into the Content Security Policy in place of 'unsafe-inline'
 *    (scripts/security-headers.mjs). For `next start` the policy lives in the build's
 *    routes-manifest.json, where next.config.mjs left a placeholder; for the static folder it is
 *    written as nginx lines (out-headers/security-headers.conf) and as a `_headers` file.
 * 2. Builds the service worker (service-worker/sw.ts) with the list of files to precache: every
 *    page found in the build (so a page added later is picked up with no change here), every
 *    file under /_next/static (all chunks, the lazily loaded ones included, and the demo data
 *    bundled in them), and everything in public/ (icons, manifest). Written to public/sw.js for
 *    `next start`, or out/sw.js for the static folder.
 *
 * Fails (exit 1) with one line when something it relies on is missing, so a build never ships a
 * policy with the placeholder or a service worker with an empty list.
 */
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { join, relative, sep } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { SCRIPT_HASHES_PLACEHOLDER, securityHeaders } from './security-headers.mjs';

export const ROOT = fileURLToPath(new URL('..', import.meta.url));

/**
 * The text of every inline script (a <script> without `src`) in an HTML page, exactly as written:
 * a script element's content is raw text, so the hash is taken over these characters (UTF-8).
 * @param {string} html
 * @returns {string[]}
 */
export function inlineScripts(html) {
  const scripts = [];
  const pattern = /<script\b([^>]*)>([\s\S]*?)<\/script\s*>/gi;
  for (const match of html.matchAll(pattern)) {
    const attributes = match[1] ?? '';
    if (/\ssrc\s*=/i.test(` ${attributes}`)) continue;
    scripts.push(match[2] ?? '');
  }
  return scripts;
}

/**
 * The CSP hash-source of one script text: 'sha256-' and the base64 SHA-256 of its UTF-8 bytes
 * (CSP Level 3, §2.3.1 "hash-source"; W3C).
 * @param {string} text
 * @returns {string}
 */
export function hashSource(text) {
  return `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;
}

/**
 * The hash-sources of every inline script in the pages, each once, sorted (so the policy is the
 * same for the same build).
 * @param {readonly string[]} pages HTML texts
 * @returns {string[]}
 */
export function scriptHashes(pages) {
  return [...new Set(pages.flatMap((html) => inlineScripts(html).map(hashSource)))].sort();
}

/**
 * The address of each built page, from its file's path relative to the folder of pages:
 * `index.html` is `/`, `handout.html` is `/handout`, `a/b.html` is `/a/b`, `a/index.html` is
 * `/a`. Error pages (`404.html`, names starting with `_`) are not addresses a clinician opens.
 * @param {readonly string[]} files relative paths with `/` separators
 * @returns {Record<string, string>} address → file
 */
export function pageRoutes(files) {
  const routes = {};
  for (const file of files) {
    if (!file.endsWith('.html')) continue;
    const parts = file.slice(0, -'.html'.length).split('/');
    if (parts.some((part) => part.startsWith('_')) || file === '404.html' || file === '500.html') continue;
    if (parts[parts.length - 1] === 'index') parts.pop();
    routes[`/${parts.join('/')}`] = file;
  }
  return routes;
}

/**
 * nginx `add_header` lines for the security headers, each with `always` so error responses (404
 * and the rest) carry them too — without `always`, nginx adds headers to 2xx and 3xx only.
 * @param {{ key: string, value: string }[]} headers
 * @returns {string}
 */
export function nginxHeaderLines(headers) {
  return headers.map(({ key, value }) => `add_header ${key} "${value.replace(/"/g, '\\"')}" always;`).join('\n') + '\n';
}

/**
 * A `_headers` file (the format several static hosts read from the published folder): the
 * headers for every path.
 * @param {{ key: string, value: string }[]} headers
 * @returns {string}
 */
export function headersFile(headers) {
  return ['/*', ...headers.map(({ key, value }) => `  ${key}: ${value}`)].join('\n') + '\n';
}

/** Relative paths (with `/`) of every file under a folder. */
async function walk(folder) {
  const out = [];
  const visit = async (dir) => {
    for (const entry of await readdir(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) await visit(path);
      else out.push(relative(folder, path).split(sep).join('/'));
    }
  };
  await visit(folder);
  return out;
}

class BuildStepError extends Error {}

/** Puts the hashes into the policy `next start` serves: the headers of routes-manifest.json. */
async function patchRoutesManifest(distDir, hashes) {
  const path = join(distDir, 'routes-manifest.json');
  const manifest = JSON.parse(await readFile(path, 'utf8'));
  let replaced = 0;
  for (const route of manifest.headers ?? []) {
    for (const header of route.headers ?? []) {
      if (typeof header.value === 'string' && header.value.includes(SCRIPT_HASHES_PLACEHOLDER)) {
        header.value = header.value.replace(SCRIPT_HASHES_PLACEHOLDER, hashes.join(' '));
        replaced += 1;
      }
    }
  }
  if (replaced === 0) throw new BuildStepError(`no Content-Security-Policy placeholder in ${relative(ROOT, path)}: was the build made with next.config.mjs in production?`);
  await writeFile(path, JSON.stringify(manifest));
  return replaced;
}

/** Bundles service-worker/sw.ts with the precache list in place of `self.__SW_MANIFEST`. */
async function buildServiceWorker({ globDirectory, globPatterns, globIgnores, dropUrls, modifyURLPrefix, rootRelative = false, routes, outfile }) {
  const { getManifest } = await import('@serwist/build');
  const templatedURLs = Object.fromEntries(Object.entries(routes).map(([url, file]) => [url, [file]]));
  const { manifestEntries, count, size, warnings } = await getManifest({
    globDirectory,
    globPatterns,
    globIgnores,
    modifyURLPrefix,
    templatedURLs,
    maximumFileSizeToCacheInBytes: 5 * 1024 * 1024,
    manifestTransforms: [
      (manifest) => ({
        manifest: manifest
          .filter((entry) => !dropUrls?.test(entry.url))
          .map((entry) => (rootRelative && !entry.url.startsWith('/') ? { ...entry, url: `/${entry.url}` } : entry)),
        warnings: [],
      }),
    ],
  });
  if (warnings.length > 0) throw new BuildStepError(`service worker: ${warnings.join('; ')}`);
  const entries = manifestEntries ?? [];
  for (const url of Object.keys(routes)) {
    if (!entries.some((entry) => entry.url === url)) throw new BuildStepError(`service worker: the page ${url} is missing from the precache list`);
  }
  const { build } = await import('esbuild');
  const result = await build({
    entryPoints: [join(ROOT, 'service-worker', 'sw.ts')],
    bundle: true,
    format: 'iife',
    platform: 'browser',
    target: 'es2020',
    minify: true,
    write: false,
    legalComments: 'none',
    define: { 'process.env.NODE_ENV': '"production"' },
    logLevel: 'silent',
  });
  const code = result.outputFiles[0]?.text ?? '';
  const marker = 'self.__SW_MANIFEST';
  if (code.split(marker).length !== 2) throw new BuildStepError('service worker: expected exactly one self.__SW_MANIFEST in the bundle');
  await writeFile(outfile, code.replace(marker, JSON.stringify(entries)));
  return { count, size };
}

/**
 * Runs the step for the build just made: `next start`'s (.next/) or, with HUNDREDFOLD_STATIC=1,
 * the static folder (out/).
 */
export async function postbuild({ root = ROOT, staticExport = process.env.HUNDREDFOLD_STATIC === '1' } = {}) {
  const report = [];
  if (staticExport) {
    const outDir = join(root, 'out');
    if (!existsSync(outDir)) throw new BuildStepError('out/ is missing: run `npm run build:static`, which exports the site first');
    const files = await walk(outDir);
    const htmlFiles = files.filter((f) => f.endsWith('.html'));
    const hashes = scriptHashes(await Promise.all(htmlFiles.map((f) => readFile(join(outDir, f), 'utf8'))));
    const headers = securityHeaders({ production: true, scriptHashes: hashes });
    const headersDir = join(root, 'out-headers');
    await mkdir(headersDir, { recursive: true });
    await writeFile(join(headersDir, 'security-headers.conf'), `# Generated by \`npm run build:static\` for this build of out/; see README "Static hosting".\n${nginxHeaderLines(headers)}`);
    await writeFile(join(outDir, '_headers'), headersFile(headers));
    report.push(`${hashes.length} inline script hashes in out-headers/security-headers.conf and out/_headers`);
    const routes = pageRoutes(htmlFiles);
    const sw = await buildServiceWorker({
      globDirectory: outDir,
      globPatterns: ['**/*'],
      // Pages are listed by their address (templatedURLs), not as .html files; the router's .txt
      // data files are never needed offline (a failed one falls back to loading the page).
      globIgnores: ['sw.js', '_headers', '**/*.map'],
      dropUrls: /\.(html|txt)$/,
      // File paths under out/ become addresses from the root; page addresses already are.
      modifyURLPrefix: {},
      rootRelative: true,
      routes,
      outfile: join(outDir, 'sw.js'),
    });
    report.push(`out/sw.js precaches ${sw.count} files (${Math.round(sw.size / 1024)} KiB), pages ${Object.keys(routes).join(', ')}`);
  } else {
    const distDir = join(root, '.next');
    const appDir = join(distDir, 'server', 'app');
    if (!existsSync(appDir)) throw new BuildStepError('.next/server/app is missing: run `npm run build`, which runs `next build` first');
    const htmlFiles = (await walk(appDir)).filter((f) => f.endsWith('.html'));
    const hashes = scriptHashes(await Promise.all(htmlFiles.map((f) => readFile(join(appDir, f), 'utf8'))));
    const replaced = await patchRoutesManifest(distDir, hashes);
    report.push(`${hashes.length} inline script hashes in the Content-Security-Policy (${replaced} header rule${replaced === 1 ? '' : 's'})`);
    const routes = Object.fromEntries(Object.entries(pageRoutes(htmlFiles)).map(([url, file]) => [url, `.next/server/app/${file}`]));
    const sw = await buildServiceWorker({
      globDirectory: root,
      globPatterns: ['.next/static/**/*', 'public/**/*'],
      globIgnores: ['public/sw.js', '**/*.map'],
      modifyURLPrefix: { '.next/static/': '/_next/static/', 'public/': '/' },
      routes,
      outfile: join(root, 'public', 'sw.js'),
    });
    report.push(`public/sw.js precaches ${sw.count} files (${Math.round(sw.size / 1024)} KiB), pages ${Object.keys(routes).join(', ')}`);
  }
  return report;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  postbuild().then(
    (report) => {
      for (const line of report) process.stdout.write(`postbuild: ${line}\n`);
    },
    (error) => {
      process.stderr.write(`postbuild: ${error instanceof BuildStepError ? error.message : (error?.stack ?? String(error))}\n`);
      process.exit(1);
    },
  );
}
