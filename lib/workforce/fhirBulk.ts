/**
 * FHIR R4 bulk export NDJSON (the Bulk Data Access IG's `$export` output: one resource per line,
 * usually one file per resource type) → checkup rows.
 *
 * - Patient: `id` is the worker id (pseudonymous; `name`, `identifier`, `telecom` and `address`
 *   are never read); `gender` "female"/"male" gives the sex (other values leave it unknown);
 *   `birthDate` gives the age at each checkup (a year alone, or year and month, gives a birth year).
 * - Observation: read by lib/fhir `readObservation` — LOINC code, UCUM unit, status, day and the
 *   same value checks as any typed checkup; `subject.reference` "Patient/<id>" (relative, or the
 *   end of an absolute URL) names the worker.
 * - Every other resource type, and every Observation that cannot be used, is a row problem with
 *   its line and the reason; nothing is dropped silently.
 *
 * Patients may come before or after their Observations (separate files, any order), so rows are
 * handed over at {@link FhirBulkReader.end}, in order of each worker's first Observation.
 * Text may be pushed in chunks of any size; {@link FhirBulkReader.startFile} starts a new file's
 * line count.
 */
import { readObservation } from '../fhir/observation';
import type { HistoryOptions } from '../glycaemia/schema';
import { parseIsoDate } from '../glycaemia/dates';
import { MAX_WORKER_ID } from './rows';
import type { CheckupRow, ReadStep, RowCounts, RowProblem } from './types';

/** Longest NDJSON line accepted (characters): one resource; far above any real Observation or Patient. */
export const MAX_NDJSON_LINE = 1_000_000;

interface PatientInfo {
  readonly sex?: 'female' | 'male';
  readonly birthDate?: string;
  readonly birthYear?: number;
}

type Json = Record<string, unknown>;

function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** "Patient/W017", "https://host/fhir/Patient/W017", "Patient/W017/_history/2" → "W017". */
export function patientIdFromReference(reference: unknown): string | null {
  if (typeof reference !== 'string') return null;
  const match = /(?:^|\/)Patient\/([A-Za-z0-9\-.]{1,64})(?:\/_history\/[^/]+)?$/.exec(reference);
  return match?.[1] ?? null;
}

export class FhirBulkReader {
  private carry = '';
  private line = 0;
  private file: string | undefined;
  private readonly patients = new Map<string, PatientInfo>();
  private readonly observations: { line: number; file: string | undefined; worker: string; date: string; reading: Pick<CheckupRow, 'hba1c' | 'fpg'> }[] = [];
  private read = 0;
  private skipped = 0;
  private used = 0;

  constructor(private readonly options: HistoryOptions) {}

  /** Starts a new file: its lines count from 1 and problems name it. */
  startFile(name: string): void {
    this.carry = '';
    this.line = 0;
    this.file = name;
  }

  push(chunk: string): ReadStep {
    const text = this.carry + chunk;
    const lines = text.split('\n');
    this.carry = lines.pop() ?? '';
    const problems: RowProblem[] = [];
    if (this.carry.length > MAX_NDJSON_LINE) {
      this.line++;
      this.carry = '';
      this.read++;
      this.skipped++;
      problems.push(this.problem(this.line, null, 'line-too-long', `the line is longer than ${MAX_NDJSON_LINE.toLocaleString('en-GB')} characters; one resource per line is expected`));
    }
    for (const raw of lines) this.readLine(raw, problems);
    return { rows: [], problems };
  }

  private problem(line: number, column: string | null, code: string, message: string): RowProblem {
    return { line, column, code, message, ...(this.file !== undefined ? { file: this.file } : {}) };
  }

  private readLine(raw: string, problems: RowProblem[]): void {
    this.line++;
    const text = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (text.trim() === '') return;
    this.read++;
    let resource: unknown;
    try {
      resource = JSON.parse(text);
    } catch {
      this.skipped++;
      problems.push(this.problem(this.line, null, 'invalid-json', 'the line is not valid JSON (NDJSON holds one resource per line)'));
      return;
    }
    if (!isObject(resource)) {
      this.skipped++;
      problems.push(this.problem(this.line, null, 'wrong-type', 'the line is not a FHIR resource (a JSON object)'));
      return;
    }
    if (resource.resourceType === 'Patient') {
      this.readPatient(resource, problems);
      return;
    }
    if (resource.resourceType !== 'Observation') {
      this.skipped++;
      const type = typeof resource.resourceType === 'string' ? resource.resourceType.slice(0, 40) : null;
      problems.push(this.problem(this.line, 'resourceType', 'other-resource', type ? `a ${type} resource: only Patient and Observation are read` : 'no resourceType'));
      return;
    }
    const worker = patientIdFromReference(isObject(resource.subject) ? resource.subject.reference : undefined);
    if (worker === null) {
      this.skipped++;
      problems.push(this.problem(this.line, 'Observation.subject', 'required', 'the Observation has no subject.reference "Patient/<id>"'));
      return;
    }
    const outcome = readObservation(resource, this.options);
    if (!outcome.ok) {
      this.skipped++;
      problems.push(this.problem(this.line, 'Observation', 'not-usable', outcome.reason));
      return;
    }
    this.used++;
    this.observations.push({
      line: this.line,
      file: this.file,
      worker,
      date: outcome.date,
      reading: outcome.test === 'hba1c' ? { hba1c: outcome.reading } : { fpg: outcome.reading },
    });
  }

  private readPatient(resource: Json, problems: RowProblem[]): void {
    const id = typeof resource.id === 'string' ? resource.id : null;
    if (id === null || id === '' || id.length > MAX_WORKER_ID) {
      this.skipped++;
      problems.push(this.problem(this.line, 'Patient.id', 'required', 'the Patient has no usable id'));
      return;
    }
    const info: { sex?: 'female' | 'male'; birthDate?: string; birthYear?: number } = {};
    if (resource.gender === 'female' || resource.gender === 'male') info.sex = resource.gender;
    const birth = typeof resource.birthDate === 'string' ? resource.birthDate : null;
    if (birth !== null) {
      if (/^\d{4}-\d{2}-\d{2}$/.test(birth) && parseIsoDate(birth) && birth <= this.options.today) info.birthDate = birth;
      else if (/^\d{4}(-\d{2})?$/.test(birth)) info.birthYear = Number(birth.slice(0, 4));
      else {
        problems.push(this.problem(this.line, 'Patient.birthDate', 'invalid-date', 'the birth date is not a FHIR date (YYYY, YYYY-MM or YYYY-MM-DD); the age is left unknown'));
      }
    }
    this.used++;
    this.patients.set(id, info);
  }

  /** No more text: the rows, each Observation with its Patient's sex and birth date. */
  end(): ReadStep {
    const problems: RowProblem[] = [];
    if (this.carry !== '') {
      const rest = this.carry;
      this.carry = '';
      this.readLine(rest, problems);
    }
    const rows: CheckupRow[] = [];
    const order = new Map<string, number>();
    for (const o of this.observations) if (!order.has(o.worker)) order.set(o.worker, order.size);
    const sorted = [...this.observations].sort((a, b) => (order.get(a.worker) ?? 0) - (order.get(b.worker) ?? 0));
    for (const o of sorted) {
      const patient = this.patients.get(o.worker);
      rows.push({
        line: o.line,
        worker: o.worker,
        date: o.date,
        ...o.reading,
        ...(patient?.sex ? { sex: patient.sex } : {}),
        ...(patient?.birthDate ? { birthDate: patient.birthDate } : {}),
        ...(patient?.birthYear !== undefined ? { birthYear: patient.birthYear } : {}),
        strata: {},
      });
    }
    return { rows, problems };
  }

  counts(): RowCounts {
    return { read: this.read, used: this.used, skipped: this.skipped };
  }
}
