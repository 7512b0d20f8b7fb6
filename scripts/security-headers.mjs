/**
 * The security headers every response carries, in one place for the three ways the app is served:
 * `next start` (next.config.mjs, then scripts/postbuild.mjs fills in the script hashes), the static
 * folder from `npm run build:static` (postbuild writes the lines for nginx and a `_headers` file),
 * and the tests that check both.
 *
 * The Content Security Policy keeps the app on its own origin: no script, style, font, image or
 * connection from anywhere else, so nothing a clinician types can leave the browser for a third
 * party.
 *
 * - script-src: 'self' plus the SHA-256 hash of each inline script in the built pages (the App
 *   Router writes its hydration data as inline scripts; the pages are static, so the scripts are
 *   fixed at build time and their hashes fit — CSP Level 3, "hash-source"). No 'unsafe-inline'.
 *   Until postbuild has hashed the built pages the policy allows no inline script at all, so a
 *   build that skipped the step fails closed (the page does not hydrate) rather than open.
 * - No 'unsafe-eval' in production. `next dev` needs eval and inline scripts for its error overlay
 *   and fast refresh, so both are allowed only outside production, with the dev server's websocket.
 * - style-src keeps 'unsafe-inline': React style attributes and the chart library set inline styles.
 * - worker-src 'self' for the service worker (service-worker/sw.ts); manifest-src 'self' for the
 *   web app manifest.
 * - Referrer-Policy no-referrer: a scenario link is never sent anywhere as a referrer.
 *
 * HTTPS and Strict-Transport-Security are the job of the front end that terminates TLS (README,
 * "Static hosting and headers"), not of the app.
 */

/** The placeholder postbuild replaces with the hashes; never appears in a policy that is served. */
export const SCRIPT_HASHES_PLACEHOLDER = "'hundredfold-script-hashes'";

/**
 * The Content-Security-Policy value.
 * @param {{ production: boolean, scriptHashes?: readonly string[] | null }} options
 *   scriptHashes: CSP hash-sources such as "'sha256-…'"; null keeps the placeholder (next.config.mjs
 *   at build time, before the pages exist).
 * @returns {string}
 */
export function contentSecurityPolicy({ production, scriptHashes = [] }) {
  const inline = !production ? " 'unsafe-inline' 'unsafe-eval'" : scriptHashes === null ? ` ${SCRIPT_HASHES_PLACEHOLDER}` : scriptHashes.map((h) => ` ${h}`).join('');
  return [
    "default-src 'self'",
    `script-src 'self'${inline}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${production ? '' : ' ws: wss:'}`,
    "worker-src 'self'",
    "manifest-src 'self'",
    "media-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

/**
 * Every security header, as `{ key, value }` pairs (the shape next.config.mjs `headers()` takes).
 * @param {{ production: boolean, scriptHashes?: readonly string[] | null }} options
 * @returns {{ key: string, value: string }[]}
 */
export function securityHeaders(options) {
  return [
    { key: 'Content-Security-Policy', value: contentSecurityPolicy(options) },
    { key: 'Referrer-Policy', value: 'no-referrer' },
    { key: 'X-Content-Type-Options', value: 'nosniff' },
    { key: 'X-Frame-Options', value: 'DENY' },
    { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
    { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  ];
}
