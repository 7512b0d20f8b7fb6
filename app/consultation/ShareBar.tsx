'use client';
/**
 * "Copy link" and "Prepare handout". The link is the scenario through the link codec
 * (lib/link), so opening it shows exactly this screen; the handout opens the same fragment.
 * The scenario is in the fragment, which is never sent; plain anchors, not prefetching links.
 *
 * A valid glucose history goes to the handout through this tab's sessionStorage
 * (app/handout/historyHandOver.ts), tied to this scenario: it is stored whenever the history or
 * the scenario changes, and again when "Prepare handout" is chosen, so the sheet prints the
 * person's own results whichever way the handout is opened from this tab.
 */
import { useCallback, useEffect, useState } from 'react';
import { clearHistoryForHandout, saveHistoryForHandout } from '@/app/handout/historyHandOver';
import type { GlucoseHistory } from '@/lib/glycaemia/parse';
import { encodeScenarioLink, scenarioLinkIssues } from '@/lib/link';
import type { Scenario } from '@/lib/scenario/schema';

/**
 * @param handoutAllowed - false while the patient sentences lack words or the result is capped
 *   (lib/consultation/view.ts): then there is no handout to prepare.
 */
export function ShareBar({ scenario, handoutAllowed, history = null }: { scenario: Scenario; handoutAllowed: boolean; history?: GlucoseHistory | null }) {
  const [status, setStatus] = useState<{ text: string; link?: string }>({ text: '' });
  const path = encodeScenarioLink(scenario);

  const handOver = useCallback(() => {
    if (history && history.checkups.length > 0) saveHistoryForHandout(scenario, history);
    else clearHistoryForHandout();
  }, [scenario, history]);
  // Kept in step with the screen, so a handout opened in a new tab from here (which copies this
  // tab's sessionStorage) has it too.
  useEffect(handOver, [handOver]);

  async function copy() {
    const url = `${window.location.origin}${path}`;
    try {
      await navigator.clipboard.writeText(url);
      setStatus({ text: 'Link copied. It holds the whole scenario and no name or other identifier.' });
    } catch {
      setStatus({ text: 'The browser did not allow copying. Select the link below and copy it:', link: url });
    }
  }

  return (
    <div className="share">
      <div className="share__actions">
        <button type="button" className="button" onClick={copy} data-testid="copy-link">
          Copy link
        </button>
        {handoutAllowed ? (
          <a className="button button--secondary" href={encodeScenarioLink(scenario, '/handout')} onClick={handOver} data-testid="prepare-handout">
            Prepare handout
          </a>
        ) : null}
      </div>
      {scenarioLinkIssues(scenario).map((issue) => (
        <p key={issue.path.join('.')} className="link-problem" data-testid="link-leaves-out">
          {issue.message}
        </p>
      ))}
      <p className="share__status" role="status">
        {status.text}
      </p>
      {status.link ? (
        <p>
          <label htmlFor="share-link" className="visually-hidden">
            Link to this scenario
          </label>
          <input id="share-link" className="field__input share__link" readOnly value={status.link} onFocus={(e) => e.currentTarget.select()} />
        </p>
      ) : null}
    </div>
  );
}
