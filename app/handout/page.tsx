/**
 * /handout: the one printed page a patient takes home. The scenario comes in the URL fragment,
 * the same one the consultation screen writes (lib/link), read in the browser
 * (app/link/HandoutFromLink.tsx), so the page is static and the server never sees the scenario;
 * a `hundredfold link` fragment after /handout opens its handout here.
 */
import type { Metadata } from 'next';
import { HandoutFromLink } from '@/app/link/HandoutFromLink';
import '@/app/components/handout/handout.css';

export const metadata: Metadata = {
  title: 'Handout — Hundredfold',
  description: 'A one-page handout in plain language for the person in the consultation.',
};

export default function HandoutPage() {
  return <HandoutFromLink />;
}
