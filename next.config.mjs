/**
 * Security headers for every route, above all a Content Security Policy that keeps the app on
 * its own origin: no script, style, font, image or connection from anywhere else, so nothing a
 * clinician types can leave the browser for a third party.
 *
 * - No 'unsafe-eval' in production. `next dev` needs eval for its error overlay and fast
 *   refresh, so it is added only outside production, with the dev server's websocket.
 * - script-src keeps 'unsafe-inline': the App Router writes its hydration data as inline
 *   scripts. Nonces would need a per-request proxy and dynamic rendering of a page that is
 *   otherwise static, so they are not used; with every other source limited to 'self' and no
 *   third-party script at all, the remaining risk is an injection through our own markup.
 * - style-src keeps 'unsafe-inline': React style attributes and the chart library set inline
 *   styles.
 * - The scenario travels in the URL query; Referrer-Policy no-referrer keeps it from being
 *   sent anywhere as a referrer.
 */
const production = process.env.NODE_ENV === 'production';

const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${production ? '' : " 'unsafe-eval'"}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  `connect-src 'self'${production ? '' : ' ws: wss:'}`,
  "worker-src 'self' blob:",
  "manifest-src 'self'",
  "media-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const securityHeaders = [
  { key: 'Content-Security-Policy', value: contentSecurityPolicy },
  { key: 'Referrer-Policy', value: 'no-referrer' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
  { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders }];
  },
};

export default nextConfig;
