/**
 * A plain static file server for the folder `npm run build:static` makes, as the README's
 * nginx lines configure one: a path is looked up as the file, then with `.html`, then as a
 * folder's `index.html` (nginx `try_files $uri $uri.html $uri/`), else `404.html` with status
 * 404; every response carries the `/*` headers of the folder's `_headers` file (the file the
 * build writes). Nothing else: no rewriting, no compression, no caching rules.
 *
 * It is what the static-export browser test serves (tests/static/); a clinic can use it to try
 * the folder locally: `node scripts/serve-static.mjs out --port 8080`. Not a production server.
 */
import { createServer } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { extname, join, normalize, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.webmanifest': 'application/manifest+json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.txt': 'text/plain; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
  '.ndjson': 'application/x-ndjson',
  '.xlsx': 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  '.woff2': 'font/woff2',
};

/**
 * The headers under `/*` in a `_headers` file (Netlify/Cloudflare format: a path line, then
 * indented `Name: value` lines).
 * @param {string} text
 * @returns {[string, string][]}
 */
export function readHeadersFile(text) {
  const out = [];
  let inAll = false;
  for (const line of text.split(/\r?\n/)) {
    if (line.trim() === '' || line.trimStart().startsWith('#')) continue;
    if (!/^\s/.test(line)) {
      inAll = line.trim() === '/*';
      continue;
    }
    if (!inAll) continue;
    const at = line.indexOf(':');
    if (at > 0) out.push([line.slice(0, at).trim(), line.slice(at + 1).trim()]);
  }
  return out;
}

async function isFile(path) {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}

/**
 * @param {string} root the folder to serve
 * @returns {Promise<import('node:http').Server>}
 */
export async function staticServer(root) {
  const folder = resolve(root);
  const headers = readHeadersFile(await readFile(join(folder, '_headers'), 'utf8'));
  return createServer(async (request, response) => {
    for (const [name, value] of headers) response.setHeader(name, value);
    let pathname;
    try {
      pathname = decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname);
    } catch {
      response.writeHead(400).end();
      return;
    }
    const base = normalize(join(folder, pathname));
    if (base !== folder && !base.startsWith(folder + sep)) {
      response.writeHead(404).end();
      return;
    }
    const candidates = [base, `${base}.html`, join(base, 'index.html')];
    let found;
    for (const candidate of candidates) {
      if (await isFile(candidate)) {
        found = candidate;
        break;
      }
    }
    const status = found ? 200 : 404;
    const file = found ?? join(folder, '404.html');
    if (pathname === '/sw.js') response.setHeader('Cache-Control', 'no-cache');
    response.setHeader('Content-Type', TYPES[extname(file)] ?? 'application/octet-stream');
    try {
      const body = await readFile(file);
      response.writeHead(status);
      response.end(request.method === 'HEAD' ? undefined : body);
    } catch {
      response.writeHead(404).end();
    }
  });
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [root = 'out', ...rest] = process.argv.slice(2);
  const portAt = rest.indexOf('--port');
  const port = portAt >= 0 ? Number(rest[portAt + 1]) : 8080;
  const server = await staticServer(root);
  server.listen(port, '127.0.0.1', () => process.stdout.write(`Serving ${root} at http://127.0.0.1:${port}/\n`));
}
