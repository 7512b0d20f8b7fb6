/**
 * One FHIR R4 Observation → one HbA1c or fasting glucose reading with its date, or the reason it
 * cannot be used. Read defensively: an export is untrusted JSON, so every field is checked here
 * and nothing throws.
 *
 * Rules (FHIR R4 Observation; LOINC codes in ./loinc.ts):
 * - status must be "final", "amended" or "corrected" (R4 defines "corrected" as a kind of
 *   "amended": a final result changed to correct an error; FHIR R4 ObservationStatus value set,
 *   from memory); every other status (registered, preliminary, cancelled, entered-in-error,
 *   unknown) is skipped with its name.
 * - code: a LOINC coding for HbA1c or fasting glucose; a random glucose is not a fasting one.
 * - valueQuantity with a numeric value, no comparator ("<", ">" mark a limit, not a result), and
 *   a UCUM unit — `code` when given, else `unit` — that fits the test: "%" or "mmol/mol" for
 *   HbA1c, "mg/dL" or "mmol/L" for glucose, read by lib/glycaemia/schema.ts's canonicalUnit (the
 *   same spellings as typed input: "mg/dl", "mmol/l", annotations such as "%{HbA1c}").
 * - effectiveDateTime with at least a full day; a time part is dropped and the day kept as
 *   written (the day in the record's own time zone).
 * - the value and day then pass the same checks as any typed checkup (lib/glycaemia/schema.ts).
 */
import { canonicalUnit, checkupDateSchema, fpgReadingSchema, hba1cReadingSchema, type FpgReading, type Hba1cReading, type HistoryOptions } from '../glycaemia/schema';
import { atFileDigits } from '../text/significant';
import { LOINC_SYSTEMS, loincKind, type LoincKind } from './loinc';

export const USABLE_STATUSES = ['final', 'amended', 'corrected'] as const;
export const UCUM_SYSTEM = 'http://unitsofmeasure.org';

export type ObservationReading =
  | { readonly ok: true; readonly date: string; readonly test: 'hba1c'; readonly reading: Hba1cReading; readonly id: string | null }
  | { readonly ok: true; readonly date: string; readonly test: 'fpg'; readonly reading: FpgReading; readonly id: string | null };

export type ObservationOutcome = ObservationReading | { readonly ok: false; readonly id: string | null; readonly reason: string };

type Json = Record<string, unknown>;

function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function text(value: unknown): string | null {
  return typeof value === 'string' ? value : null;
}


function loincCodes(code: unknown): string[] {
  if (!isObject(code) || !Array.isArray(code.coding)) return [];
  return code.coding
    .filter(isObject)
    .filter((c) => typeof c.system === 'string' && (LOINC_SYSTEMS as readonly string[]).includes(c.system))
    .map((c) => text(c.code))
    .filter((c): c is string => c !== null);
}

function pickTest(codes: readonly string[]): LoincKind | null {
  const kinds = codes.map(loincKind);
  return kinds.find((k) => k.kind === 'test') ?? kinds[0] ?? null;
}

/**
 * Read one Observation.
 *
 * @example
 * readObservation({ resourceType: 'Observation', status: 'final', code: { coding: [{ system: 'http://loinc.org', code: '4548-4' }] },
 *   effectiveDateTime: '2023-03-01T08:10:00+01:00', valueQuantity: { value: 6.1, unit: '%', system: 'http://unitsofmeasure.org', code: '%' } }, { today: '2024-01-01' })
 * //=> { ok: true, date: '2023-03-01', test: 'hba1c', reading: { value: 6.1, unit: '%' }, id: null }
 */
export function readObservation(resource: unknown, options: HistoryOptions): ObservationOutcome {
  if (!isObject(resource)) return { ok: false, id: null, reason: 'not a FHIR resource (not a JSON object)' };
  const id = text(resource.id);
  const skip = (reason: string): ObservationOutcome => ({ ok: false, id, reason });
  const type = text(resource.resourceType);
  if (type !== 'Observation') return skip(type ? `a ${type} resource, not an Observation` : 'no resourceType');

  const status = text(resource.status);
  if (status === null) return skip('no status');
  if (!(USABLE_STATUSES as readonly string[]).includes(status)) return skip(`status "${status}": only final, amended and corrected results are used`);

  const codes = loincCodes(resource.code);
  const kind = pickTest(codes);
  if (!kind) return skip('no LOINC code');
  switch (kind.kind) {
    case 'non-fasting-glucose':
      return skip(`LOINC ${kind.code} is a glucose not marked as fasting; only fasting glucose (1558-6, 14771-0) is used`);
    case 'hba1c-mass':
      return skip(`LOINC ${kind.code} is HbA1c as a mass concentration; only HbA1c in % or mmol/mol is used`);
    case 'other':
      return skip(`LOINC ${codes.join(', ')} is not an HbA1c or fasting glucose code`);
    case 'test':
      break;
  }
  const test = kind.test;

  const quantity = resource.valueQuantity;
  if (!isObject(quantity)) {
    const absent = isObject(resource.dataAbsentReason) ? ' (the record gives a reason the value is absent)' : '';
    return skip(`no valueQuantity${absent}`);
  }
  if (quantity.comparator !== undefined) return skip(`the value is a limit ("${String(quantity.comparator)}"), not a measured result`);
  if (typeof quantity.value !== 'number' || !Number.isFinite(quantity.value)) return skip('valueQuantity.value is not a number');
  // At 15 significant digits, as every file's numbers are read (lib/text/significant.ts): a system that wrote a double in full (6.1000000000000005) meant 6.1.
  const value = atFileDigits(quantity.value);
  const system = text(quantity.system);
  if (system !== null && system !== UCUM_SYSTEM) return skip(`the unit is not a UCUM unit (system ${system})`);
  const unitText = text(quantity.code) ?? text(quantity.unit);
  if (unitText === null) return skip('valueQuantity has no unit');
  const unit = canonicalUnit(unitText);
  const allowed = test === 'hba1c' ? ['%', 'mmol/mol'] : ['mg/dL', 'mmol/L'];
  if (!unit || !allowed.includes(unit)) {
    return skip(`unit "${unitText}" is not ${test === 'hba1c' ? 'an HbA1c unit (% or mmol/mol)' : 'a glucose unit (mg/dL or mmol/L)'}`);
  }

  const when = text(resource.effectiveDateTime);
  if (when === null) {
    const other = ['effectivePeriod', 'effectiveInstant', 'effectiveTiming'].find((k) => resource[k] !== undefined);
    return skip(other ? `no effectiveDateTime (only ${other})` : 'no effectiveDateTime');
  }
  if (!/^\d{4}-\d{2}-\d{2}(T.*)?$/.test(when)) return skip(`effectiveDateTime "${when}" does not give a full day (YYYY-MM-DD)`);
  const date = when.slice(0, 10);
  const dateCheck = checkupDateSchema(options).safeParse(date);
  if (!dateCheck.success) return skip(dateCheck.error.issues[0]?.message ?? `effectiveDateTime "${when}" is not usable`);

  if (test === 'hba1c') {
    const reading = hba1cReadingSchema.safeParse({ value, unit });
    if (!reading.success) return skip(reading.error.issues[0]?.message ?? 'the HbA1c value is not usable');
    return { ok: true, date, test, reading: reading.data, id };
  }
  const reading = fpgReadingSchema.safeParse({ value, unit });
  if (!reading.success) return skip(reading.error.issues[0]?.message ?? 'the glucose value is not usable');
  return { ok: true, date, test, reading: reading.data, id };
}
