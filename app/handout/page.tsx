/**
 * /handout: the one printed page a patient takes home. The scenario comes in the URL query,
 * the same query the consultation screen uses (lib/link), so a `hundredfold link` query opens
 * its handout here. The page is static; the query is read in the browser.
 */
import type { Metadata } from 'next';
import { HandoutFromAddress } from './HandoutFromAddress';
import '@/app/components/handout/handout.css';

export const metadata: Metadata = {
  title: 'Handout — Hundredfold',
  description: 'A one-page handout in plain language for the person in the consultation.',
};

/** Static: the scenario is read from the address in the browser only (HandoutFromAddress). */
export default function HandoutPage() {
  return <HandoutFromAddress />;
}
