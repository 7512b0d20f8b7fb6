'use client';
/**
 * /handout's scenario, from the address fragment (./useScenarioLink.ts): the handout screen once
 * the address is read, with a note on whatever part of the link was left out. The page itself
 * is static; the scenario never reaches the server.
 */
import { useMemo } from 'react';
import { HandoutScreen } from '@/app/components/handout/HandoutScreen';
import { readScenarioLink, scenarioFragment } from '@/lib/link';
import { LinkNotice } from './LinkNotice';
import { useScenarioLink } from './useScenarioLink';

export function HandoutFromLink() {
  const link = useScenarioLink();
  const reading = useMemo(() => (link === undefined ? undefined : readScenarioLink(link)), [link]);
  if (link === undefined || reading === undefined) {
    return (
      <main className="handout-page">
        <p className="controls" role="status">
          Reading the link…
        </p>
      </main>
    );
  }
  // What could be kept is handed on as a clean fragment; otherwise the link as it came, so the
  // screen lists why it cannot make a handout.
  const query = reading.result.ok ? scenarioFragment(reading.result.value) : link;
  return (
    <>
      <LinkNotice reading={reading} refused="The handout cannot be made from this link:" className="controls" />
      <HandoutScreen query={query} />
    </>
  );
}
