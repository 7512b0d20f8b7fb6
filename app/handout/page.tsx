/**
 * /handout: the one printed page a patient takes home. The scenario comes in the URL query,
 * the same query the consultation screen uses (lib/link), so a `hundredfold link` query opens
 * its handout here.
 */
import type { Metadata } from 'next';
import { HandoutScreen } from '@/app/components/handout/HandoutScreen';
import '@/app/components/handout/handout.css';

export const metadata: Metadata = {
  title: 'Handout — Hundredfold',
  description: 'A one-page handout in plain language for the person in the consultation.',
};

type SearchParams = Record<string, string | string[] | undefined>;

/** Rebuilds the query as it arrived, repeated parameters included, for the link codec to judge. */
function queryString(params: SearchParams): string {
  const out = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    for (const v of Array.isArray(value) ? value : value === undefined ? [] : [value]) out.append(key, v);
  }
  const text = out.toString();
  return text ? `?${text}` : '';
}

export default async function HandoutPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  return <HandoutScreen query={queryString(await searchParams)} />;
}
