/**
 * Next.js configuration.
 *
 * - Security headers for every route, error responses included (scripts/security-headers.mjs
 *   explains each). The policy written here holds a placeholder where the inline scripts' hashes
 *   go; `npm run build` runs scripts/postbuild.mjs after `next build`, which hashes the inline
 *   scripts of the built pages and puts the hashes into the policy `next start` serves.
 * - HUNDREDFOLD_STATIC=1 (`npm run build:static`) exports a static site to out/ for any plain web
 *   server; headers are then the server's job (postbuild writes the lines, README "Static hosting").
 */
import { securityHeaders } from './scripts/security-headers.mjs';

const production = process.env.NODE_ENV === 'production';
const staticExport = process.env.HUNDREDFOLD_STATIC === '1';

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  ...(staticExport
    ? { output: 'export' }
    : {
        async headers() {
          return [{ source: '/:path*', headers: securityHeaders({ production, scriptHashes: production ? null : [] }) }];
        },
      }),
};

export default nextConfig;
