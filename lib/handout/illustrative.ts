/**
 * Whether a handout carries illustrative (invented) figures, and the band that says so across
 * the printed sheet. A demo table or a demo evidence entry must never look real on paper: the
 * band is printed at the top of the sheet, full width, in bold, framed (not a grey word or a
 * footnote), and repeated under the numbers.
 *
 * Illustrative means any of:
 * - the baseline's table is marked `illustrative` (every demo table is), or the scenario names a
 *   demo table by id (lib/tables/demo.ts);
 * - the study wording carries the demo entries' citation note or a demo entry's population
 *   (lib/evidence/demo.ts): a scenario keeps the entry's words, not its id.
 */
import { DEMO_EVIDENCE, ILLUSTRATIVE_EVIDENCE_NOTE } from '../evidence/demo';
import type { Scenario } from '../scenario/schema';
import { findDemoTable } from '../tables/demo';
import type { PopulationTable } from '../tables/schema';

export interface IllustrativeBand {
  /** Short, in capitals on paper: "Illustrative figures — not for patients". */
  readonly heading: string;
  readonly text: string;
  /** What is invented: "the population table", "the study", or both. */
  readonly what: readonly ('table' | 'study')[];
}

export const ILLUSTRATIVE_BAND_HEADING = 'Illustrative figures \u2014 not for patients';

function same(a: string | undefined, b: string | undefined): boolean {
  return a !== undefined && b !== undefined && a.trim().toLowerCase() === b.trim().toLowerCase();
}

/** Which parts of the scenario are invented demo content; empty when none is. */
export function illustrativeParts(scenario: Scenario, table: PopulationTable | undefined): ('table' | 'study')[] {
  const parts: ('table' | 'study')[] = [];
  const tableIsDemo = (table !== undefined && table.id === scenario.tableId && table.illustrative) || (scenario.tableId !== undefined && findDemoTable(scenario.tableId) !== undefined);
  if (tableIsDemo) parts.push('table');
  const wording = scenario.wording;
  const studyIsDemo =
    (wording?.citation ?? '').includes(ILLUSTRATIVE_EVIDENCE_NOTE) ||
    DEMO_EVIDENCE.some((entry) => same(wording?.citation, entry.wording.citation) || same(wording?.population, entry.wording.population));
  if (studyIsDemo) parts.push('study');
  return parts;
}

/**
 * The band, or undefined when nothing on the sheet is invented.
 * @example
 * illustrativeBand({ ...scenario, tableId: 'demo-heart-failure-10y' }, undefined)
 * //=> { heading: 'Illustrative figures — not for patients', text: 'Population table invented for a demonstration.', what: ['table'] }
 */
export function illustrativeBand(scenario: Scenario, table: PopulationTable | undefined): IllustrativeBand | undefined {
  const what = illustrativeParts(scenario, table);
  if (what.length === 0) return undefined;
  const subject = what.length === 2 ? 'Table and study' : what[0] === 'table' ? 'Population table' : 'Study';
  return { heading: ILLUSTRATIVE_BAND_HEADING, text: `${subject} invented for a demonstration.`, what };
}
