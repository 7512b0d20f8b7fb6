/**
 * What a FHIR import did, in words for the screen: how many checkups it gave, from how many
 * resources, and each skipped resource with its reason.
 */
import type { FhirGlucoseImport, FhirSkip } from './importGlucose';

/** "Entry 3 (id obs-7): status "preliminary": only final and amended results are used". */
export function skipLine(skip: FhirSkip): string {
  const where = skip.entry === null ? 'The Observation' : `Entry ${skip.entry}`;
  return `${where}${skip.id ? ` (id ${skip.id})` : ''}: ${skip.reason}`;
}

/**
 * @example
 * fhirImportSummary({ checkups: [c1, c2], skipped: [s1], resources: 4, sources: [...] })
 * //=> 'Read 4 resources: 2 checkups added, 1 resource skipped:'
 */
export function fhirImportSummary(result: FhirGlucoseImport): string {
  const r = result.resources;
  const c = result.checkups.length;
  const s = result.skipped.length;
  const head = `Read ${r} resource${r === 1 ? '' : 's'}: ${c} checkup${c === 1 ? '' : 's'} added`;
  return s === 0 ? `${head}.` : `${head}, ${s} resource${s === 1 ? '' : 's'} skipped:`;
}
