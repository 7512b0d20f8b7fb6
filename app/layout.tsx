import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { UpdateBanner } from './components/UpdateBanner';
import './globals.css';

export const metadata: Metadata = {
  title: 'Hundredfold — absolute risk from published evidence',
  description: 'Turns a published relative effect and a population baseline into absolute risks for people like the one in the chair.',
  referrer: 'no-referrer',
  robots: { index: false, follow: false },
  applicationName: 'Hundredfold',
  // The web app manifest and the app's own mark (public/, drawn by scripts/make-icons.mjs).
  manifest: '/manifest.webmanifest',
  // The tab icon is /favicon.ico, which browsers ask for by default; no <link rel="icon">, because
  // Chromium fetches a linked icon again each time the address changes (the scenario is written to
  // the address as it is typed), which would be a request per keystroke.
  icons: { apple: [{ url: '/apple-touch-icon.png', sizes: '180x180' }] },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#0e5a55' };

/**
 * The shell every page shares. System fonts only: nothing is fetched from another origin.
 * UpdateBanner registers the service worker that keeps the app working offline and offers
 * "Reload to update" when a new version is ready.
 */
export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <body>
        {children}
        <UpdateBanner />
      </body>
    </html>
  );
}
