/**
 * Shared set-up of the handout's browser tests (handout.spec.ts, handout-sheet.spec.ts): a demo
 * scenario from the demo table and evidence entry (illustrative numbers), and opening /handout
 * with a scenario in the link's fragment, as the consultation screen's "Prepare handout" does.
 */
import { expect, type Page } from '@playwright/test';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { scenarioFragment } from '@/lib/link';
import type { Scenario } from '@/lib/scenario/schema';
import { baselineOf, DEMO_HEART_FAILURE_10Y } from '@/lib/tables';

/** A woman 3 years into the demo table's band starting at `ageFrom`, with the demo workforce evidence. */
export function demoScenario(ageFrom: number): Scenario {
  const stratum = DEMO_HEART_FAILURE_10Y.strata.find((s) => s.sex === 'female' && s.ageFrom === ageFrom);
  if (!stratum) throw new Error(`no demo stratum for women ${ageFrom}`);
  const entry = DEMO_WORKFORCE_HBA1C_HEART_FAILURE;
  return {
    baseline: baselineOf(DEMO_HEART_FAILURE_10Y, stratum),
    effect: entry.effect,
    horizonYears: 10,
    wording: entry.wording,
    person: { age: ageFrom + 3, sex: 'female' },
    tableId: DEMO_HEART_FAILURE_10Y.id,
  };
}

/** Text with every run of white space as one space (pdftotext breaks lines where the page does). */
export function squash(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

export async function openHandout(page: Page, scenario: Scenario): Promise<void> {
  await page.goto(`/handout${scenarioFragment(scenario)}`);
  await expect(page.getByTestId('handout-sheet')).toBeVisible();
}
