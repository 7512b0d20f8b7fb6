/**
 * Matching column headers by name: one rule for every reader that finds columns by their header —
 * the glucose paste box (lib/glycaemia/paste.ts) and the workforce checkup files
 * (lib/workforce/columns.ts). Each keeps its own list of names; how a header is folded before it
 * is compared, and how a unit written in it is found, are here.
 *
 * Folding: compatibility decomposition (NFKD: "ﬁ" → "fi", a full-width "％" → "%"), combining
 * marks removed ("Glycémie" → "glycemie"), lower case, runs of white space as one space, trimmed;
 * with `separators`, "_", "-" and "." count as spaces too ("worker_id" → "worker id").
 *
 * Units: mmol/mol (also "mmol per mol", IFCC), mg/dL, mmol/L, % (also "percent", "pct", NGSP,
 * DCCT), the HbA1c and glucose units lib/glycaemia reads. IFCC reports HbA1c in mmol/mol,
 * NGSP/DCCT in % (common practice).
 */
import type { GlucoseUnit } from '../glycaemia/glucose';
import type { Hba1cUnit } from '../glycaemia/hba1c';

export type HeaderUnit = Hba1cUnit | GlucoseUnit;

/**
 * Folds header text for comparing by name.
 *
 * @example
 * foldHeader('  Glycémie   À JEUN ')              //=> 'glycemie a jeun'
 * foldHeader('Worker_ID', { separators: true })  //=> 'worker id'
 */
export function foldHeader(text: string, options: { readonly separators?: boolean } = {}): string {
  const folded = text.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();
  return folded.replace(options.separators ? /[\s_.-]+/g : /\s+/g, ' ').trim();
}

/** How each unit is written in folded header text, in the order they are looked for. */
const HEADER_UNITS: readonly (readonly [HeaderUnit, RegExp])[] = [
  ['mmol/mol', /mmol\s*\/\s*mol|mmol per mol|mmol mol\b|\bifcc\b/],
  ['mg/dL', /mg\s*\/\s*dl\b|mg per dl\b|mg dl\b/],
  ['mmol/L', /mmol\s*\/\s*l\b|mmol per l\b|mmol l\b/],
  ['%', /%|percent|\bpct\b|\bngsp\b|\bdcct\b/],
];
const ANY_UNIT = new RegExp(HEADER_UNITS.map(([, pattern]) => pattern.source).join('|'), 'g');

/**
 * The unit a folded header names, and the header without it.
 *
 * @example
 * unitInHeader('hba1c (%)')        //=> { unit: '%', rest: 'hba1c ( )' }
 * unitInHeader('fpg mg/dl')        //=> { unit: 'mg/dL', rest: 'fpg  ' }
 * unitInHeader('fasting glucose')  //=> { unit: null, rest: 'fasting glucose' }
 */
export function unitInHeader(folded: string): { readonly unit: HeaderUnit | null; readonly rest: string } {
  for (const [unit, pattern] of HEADER_UNITS) if (pattern.test(folded)) return { unit, rest: folded.replace(ANY_UNIT, ' ') };
  return { unit: null, rest: folded };
}
