/**
 * A FHIR R4 Bundle of Observations (or a single Observation), as a record system exports it →
 * the checkup list a glucose history takes (lib/glycaemia/schema.ts), plus every resource that was
 * skipped and why. Nothing is dropped silently.
 *
 * Grouping: readings are gathered by day. An HbA1c and a fasting glucose on the same day form one
 * checkup. Two readings of one test on one day that are the same result (equal, or the one sample
 * reported in both units, agreeing within rounding: lib/glycaemia/merge.ts) are kept once and the
 * other is listed as skipped; readings that disagree are all skipped, because the import cannot
 * choose between them.
 *
 * A file that is not JSON, or not a Bundle or an Observation, is an issue; a valid file with no
 * usable Observation is not: it returns no checkups and the full skipped list.
 */
import { fail, ok, type Result } from '../result';
import { fpgReadingsAgree, hba1cReadingsAgree, preferLater, readingText } from '../glycaemia/merge';
import type { Checkup, FpgReading, Hba1cReading, HistoryOptions } from '../glycaemia/schema';
import { readObservation, type ObservationReading } from './observation';

/** A resource that was not used, and why. */
export interface FhirSkip {
  /** Index in Bundle.entry; null for a single Observation. */
  readonly entry: number | null;
  readonly id: string | null;
  readonly reason: string;
}

/** Which Bundle entry each of a checkup's results came from (null: none, or a single Observation). */
export interface CheckupSource {
  readonly date: string;
  readonly hba1c: number | null;
  readonly fpg: number | null;
}

export interface FhirGlucoseImport {
  /** One per day, earliest first. */
  readonly checkups: readonly Checkup[];
  /** Parallel to `checkups`: where each result came from, for messages. */
  readonly sources: readonly CheckupSource[];
  readonly skipped: readonly FhirSkip[];
  /** How many resources the file held. */
  readonly resources: number;
}

type Located = ObservationReading & { readonly entry: number | null };

/** Most conflicting values one skip reason lists; the rest are counted (issue 14 item 6). */
export const CONFLICT_LISTED = 3;

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function where(entry: number | null): string {
  return entry === null ? 'the Observation' : `entry ${entry}`;
}

/**
 * Import HbA1c and fasting glucose Observations.
 *
 * @example
 * importFhirGlucose({ resourceType: 'Bundle', type: 'searchset', entry: [{ resource: hba1cObservation }, { resource: patient }] }, { today: '2024-01-01' })
 * //=> { ok: true, value: { checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }], sources: [...],
 * //     skipped: [{ entry: 1, id: 'p1', reason: 'a Patient resource, not an Observation' }], resources: 2 } }
 */
export function importFhirGlucose(json: unknown, options: HistoryOptions): Result<FhirGlucoseImport> {
  if (!isObject(json)) return fail([{ code: 'fhir-not-resource', path: [], message: 'The file is not a FHIR resource (expected a JSON object with a resourceType)' }]);
  const type = json.resourceType;
  const skipped: FhirSkip[] = [];
  const readings: Located[] = [];
  let resources = 0;

  const take = (resource: unknown, entry: number | null) => {
    resources += 1;
    const outcome = readObservation(resource, options);
    if (outcome.ok) readings.push({ ...outcome, entry });
    else skipped.push({ entry, id: outcome.id, reason: outcome.reason });
  };

  if (type === 'Observation') {
    take(json, null);
  } else if (type === 'Bundle') {
    const entries = json.entry;
    if (entries !== undefined && !Array.isArray(entries)) {
      return fail([{ code: 'fhir-bundle', path: ['entry'], message: 'Bundle.entry must be a list of entries' }]);
    }
    (entries ?? []).forEach((item: unknown, index: number) => {
      if (!isObject(item) || item.resource === undefined) {
        resources += 1;
        skipped.push({ entry: index, id: null, reason: 'the entry holds no resource' });
        return;
      }
      take(item.resource, index);
    });
  } else {
    return fail([
      {
        code: 'fhir-not-resource',
        path: ['resourceType'],
        message: `Expected a FHIR Bundle or Observation, got ${typeof type === 'string' ? `a ${type}` : 'no resourceType'}`,
      },
    ]);
  }

  // Group by day and test, keeping input order within each group.
  const days = new Map<string, { hba1c: Located[]; fpg: Located[] }>();
  for (const r of readings) {
    const day = days.get(r.date) ?? { hba1c: [], fpg: [] };
    day[r.test].push(r);
    days.set(r.date, day);
  }

  function settle<R extends Hba1cReading | FpgReading>(
    group: readonly Located[],
    agree: (a: R, b: R) => boolean,
    label: string,
  ): { reading: R; entry: number | null } | null {
    const [head, ...others] = group;
    if (!head) return null;
    if (others.every((r) => agree(head.reading as R, r.reading as R))) {
      // One sample in two units: keep the reading in the criteria set's own unit when it is known,
      // whichever came first (issue 11 item 2); else the first.
      const first = others.find((r) => preferLater(r.test, head.reading, r.reading, options.criteria)) ?? head;
      const rest = group.filter((r) => r !== first);
      const own = first !== head || (options.criteria !== undefined && rest.some((r) => r.reading.unit !== first.reading.unit)) ? `; kept in ${first.reading.unit}, the unit the criteria set writes its thresholds in` : '; kept once';
      for (const r of rest) {
        skipped.push({
          entry: r.entry,
          id: r.id,
          reason: `the same ${label} result as ${where(first.entry)} on ${r.date} (${readingText(r.reading)} and ${readingText(first.reading)})${own}`,
        });
      }
      return { reading: first.reading as R, entry: first.entry };
    }
    // Summarised once per day (issue 14 item 6): the first reading's reason names at most
    // CONFLICT_LISTED values and the span of the rest; every other reading points at it. Linear in
    // the number of readings, where listing every value in every reason was quadratic.
    const listed = group.slice(0, CONFLICT_LISTED).map((r) => `${readingText(r.reading)} in ${where(r.entry)}`);
    let values = listed.join(', ');
    if (group.length > CONFLICT_LISTED) {
      let low = Infinity;
      let high = -Infinity;
      for (const r of group) {
        low = Math.min(low, r.reading.value);
        high = Math.max(high, r.reading.value);
      }
      const units = new Set(group.map((r) => r.reading.unit));
      const span = units.size === 1 ? `, from ${readingText({ ...head.reading, value: low })} to ${readingText({ ...head.reading, value: high })}` : '';
      values += ` and ${(group.length - CONFLICT_LISTED).toLocaleString('en')} more${span}`;
    }
    const summary = `different ${label} results on ${head.date} (${values}): the import cannot choose one`;
    group.forEach((r, i) => {
      skipped.push({
        entry: r.entry,
        id: r.id,
        reason: i === 0 || group.length <= CONFLICT_LISTED ? summary : `one of ${group.length.toLocaleString('en')} different ${label} results on ${r.date} (see ${where(head.entry)}): the import cannot choose one`,
      });
    });
    return null;
  }

  const checkups: Checkup[] = [];
  const sources: CheckupSource[] = [];
  for (const date of [...days.keys()].sort()) {
    const day = days.get(date);
    if (!day) continue;
    const hba1c = settle<Hba1cReading>(day.hba1c, hba1cReadingsAgree, 'HbA1c');
    const fpg = settle<FpgReading>(day.fpg, fpgReadingsAgree, 'fasting glucose');
    if (!hba1c && !fpg) continue;
    checkups.push({ date, ...(hba1c ? { hba1c: hba1c.reading } : {}), ...(fpg ? { fpg: fpg.reading } : {}) });
    sources.push({ date, hba1c: hba1c?.entry ?? null, fpg: fpg?.entry ?? null });
  }
  skipped.sort((a, b) => (a.entry ?? -1) - (b.entry ?? -1));
  return ok({ checkups, sources, skipped, resources });
}

/** Parse JSON text, then import it. Malformed JSON is an issue, never a throw. */
export function importFhirGlucoseJson(textInput: string, options: HistoryOptions): Result<FhirGlucoseImport> {
  let value: unknown;
  try {
    value = JSON.parse(textInput);
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'unreadable';
    return fail([{ code: 'invalid-json', path: [], message: `The FHIR file is not valid JSON (${detail})` }]);
  }
  return importFhirGlucose(value, options);
}
