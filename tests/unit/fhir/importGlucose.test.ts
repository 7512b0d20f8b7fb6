import { describe, expect, it } from 'vitest';
import { importFhirGlucose, importFhirGlucoseJson } from '@/lib/fhir/importGlucose';
import { readObservation } from '@/lib/fhir/observation';
import { fhirImportSummary, skipLine } from '@/lib/fhir/summary';
import { parseGlucoseHistory } from '@/lib/glycaemia/parse';

/*
 * Bundles built here in the shape of FHIR R4 exports (Observation with LOINC code, UCUM
 * valueQuantity, effectiveDateTime; Bundle.entry[].resource). The codes are those in
 * lib/fhir/loinc.ts, checked against HL7 implementation-guide examples. Values are illustrative,
 * invented for the tests.
 */

const TODAY = { today: '2024-06-30' };
const LOINC = 'http://loinc.org';
const UCUM = 'http://unitsofmeasure.org';

interface ObsOptions {
  id?: string;
  code?: string;
  system?: string;
  status?: string;
  /** null leaves effectiveDateTime out. */
  date?: string | null;
  value?: unknown;
  unit?: string;
  ucumSystem?: string | undefined;
  extra?: Record<string, unknown>;
}

function obs({ id, code = '4548-4', system = LOINC, status = 'final', date = '2023-03-01', value = 6.1, unit = '%', ucumSystem = UCUM, extra = {} }: ObsOptions = {}) {
  return {
    resourceType: 'Observation',
    ...(id ? { id } : {}),
    status,
    category: [{ coding: [{ system: 'http://terminology.hl7.org/CodeSystem/observation-category', code: 'laboratory' }] }],
    code: { coding: [{ system, code, display: 'test display' }] },
    subject: { reference: 'Patient/example' },
    ...(date !== null ? { effectiveDateTime: date } : {}),
    valueQuantity: { value, unit, ...(ucumSystem ? { system: ucumSystem } : {}), code: unit },
    ...extra,
  };
}

function bundle(...resources: unknown[]) {
  return { resourceType: 'Bundle', type: 'searchset', entry: resources.map((resource) => ({ fullUrl: 'urn:uuid:x', resource })) };
}

function imported(json: unknown) {
  const r = importFhirGlucose(json, TODAY);
  if (!r.ok) throw new Error(`expected an import, got ${JSON.stringify(r.issues)}`);
  return r.value;
}

describe('importFhirGlucose: usable observations', () => {
  it('reads each listed LOINC code with its UCUM unit, in mixed units', () => {
    const v = imported(
      bundle(
        obs({ id: 'a', code: '4548-4', value: 6.1, unit: '%', date: '2021-03-01T08:10:00+01:00' }),
        obs({ id: 'b', code: '17856-6', value: 5.9, unit: '%', date: '2020-03-02' }),
        obs({ id: 'c', code: '59261-8', value: 44, unit: 'mmol/mol', date: '2022-03-01T07:55:00Z' }),
        obs({ id: 'd', code: '1558-6', value: 104, unit: 'mg/dL', date: '2021-03-01' }),
        obs({ id: 'e', code: '14771-0', value: 5.8, unit: 'mmol/L', date: '2022-03-01' }),
      ),
    );
    expect(v.checkups).toEqual([
      { date: '2020-03-02', hba1c: { value: 5.9, unit: '%' } },
      { date: '2021-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 104, unit: 'mg/dL' } },
      { date: '2022-03-01', hba1c: { value: 44, unit: 'mmol/mol' }, fpg: { value: 5.8, unit: 'mmol/L' } },
    ]);
    expect(v.sources).toEqual([
      { date: '2020-03-02', hba1c: 1, fpg: null },
      { date: '2021-03-01', hba1c: 0, fpg: 3 },
      { date: '2022-03-01', hba1c: 2, fpg: 4 },
    ]);
    expect(v.skipped).toEqual([]);
    expect(v.resources).toBe(5);
  });

  it('relies on the unit, not the code: an IFCC code reported in % is read as %', () => {
    expect(imported(bundle(obs({ code: '59261-8', value: 6.3, unit: '%' }))).checkups[0]?.hba1c).toEqual({ value: 6.3, unit: '%' });
  });

  it('accepts UCUM\'s lower-case litre (mg/dl, mmol/l) and a unit without a system', () => {
    const v = imported(
      bundle(
        obs({ code: '1558-6', value: 99, unit: 'mg/dl', date: '2020-01-01' }),
        obs({ code: '14771-0', value: 5.4, unit: 'mmol/l', date: '2021-01-01', ucumSystem: undefined }),
      ),
    );
    expect(v.checkups.map((c) => c.fpg)).toEqual([
      { value: 99, unit: 'mg/dL' },
      { value: 5.4, unit: 'mmol/L' },
    ]);
  });

  it('reads a single Observation', () => {
    const v = imported(obs({ code: '14771-0', value: 6.2, unit: 'mmol/L' }));
    expect(v.checkups).toEqual([{ date: '2023-03-01', fpg: { value: 6.2, unit: 'mmol/L' } }]);
    expect(v.sources).toEqual([{ date: '2023-03-01', hba1c: null, fpg: null }]);
  });

  it('accepts amended results and LOINC\'s OID as the system', () => {
    const v = imported(bundle(obs({ status: 'amended' }), obs({ system: 'urn:oid:2.16.840.1.113883.6.1', date: '2022-01-01' })));
    expect(v.checkups).toHaveLength(2);
  });

  it('gives the same checkup list the JSON path takes', () => {
    const v = imported(bundle(obs({ date: '2021-03-01' }), obs({ code: '1558-6', value: 101, unit: 'mg/dL', date: '2022-03-01' })));
    const r = parseGlucoseHistory({ criteria: 'ADA', checkups: v.checkups }, TODAY);
    expect(r.ok).toBe(true);
  });
});

describe('values written as doubles in full', () => {
  it('are read at 15 significant digits (lib/text/significant.ts): 5.6999999999999993% is 5.7%', () => {
    const r = readObservation(obs({ value: 5.6999999999999993 }), TODAY);
    expect(r.ok && r.reading).toEqual({ value: 5.7, unit: '%' });
  });
});

describe('importFhirGlucose: every skipped resource is reported with why', () => {
  it.each([
    ['preliminary', 'status "preliminary": only final, amended and corrected results are used'],
    ['registered', 'status "registered": only final, amended and corrected results are used'],
    ['cancelled', 'status "cancelled": only final, amended and corrected results are used'],
    ['entered-in-error', 'status "entered-in-error": only final, amended and corrected results are used'],
    ['unknown', 'status "unknown": only final, amended and corrected results are used'],
  ])('skips status %s', (status, reason) => {
    expect(imported(bundle(obs({ id: 'x', status }))).skipped).toEqual([{ entry: 0, id: 'x', reason }]);
  });

  it('skips unknown codes, random glucose, HbA1c by mass, and codings that are not LOINC', () => {
    const v = imported(
      bundle(
        obs({ code: '2093-3', value: 200, unit: 'mg/dL' }), // cholesterol
        obs({ code: '2345-7', value: 104, unit: 'mg/dL' }), // glucose, not fasting
        obs({ code: '41995-2', value: 1.2, unit: 'g/dL' }),
        obs({ code: '4548-4', system: 'http://snomed.info/sct' }),
      ),
    );
    expect(v.checkups).toEqual([]);
    expect(v.skipped.map((s) => [s.entry, s.reason])).toEqual([
      [0, 'LOINC 2093-3 is not an HbA1c or fasting glucose code'],
      [1, 'LOINC 2345-7 is a glucose not marked as fasting; only fasting glucose (1558-6, 14771-0) is used'],
      [2, 'LOINC 41995-2 is HbA1c as a mass concentration; only HbA1c in % or mmol/mol is used'],
      [3, 'no LOINC code'],
    ]);
  });

  it('skips other resource types and empty entries', () => {
    const v = imported({
      resourceType: 'Bundle',
      entry: [{ resource: { resourceType: 'Patient', id: 'p1' } }, { fullUrl: 'urn:uuid:y' }, { resource: obs() }],
    });
    expect(v.skipped).toEqual([
      { entry: 0, id: 'p1', reason: 'a Patient resource, not an Observation' },
      { entry: 1, id: null, reason: 'the entry holds no resource' },
    ]);
    expect(v.checkups).toHaveLength(1);
    expect(v.resources).toBe(3);
  });

  it('skips values that cannot be used, saying why', () => {
    const v = imported(
      bundle(
        obs({ unit: 'mg/dL' }), // HbA1c code with a glucose unit
        obs({ value: '6.1' }),
        obs({ extra: { valueQuantity: { value: 5.0, comparator: '<', unit: '%', system: UCUM, code: '%' } } }),
        obs({ extra: { valueQuantity: undefined, dataAbsentReason: { text: 'sample haemolysed' } } }),
        obs({ ucumSystem: 'http://example.org/units' }),
        obs({ value: 61, unit: '%' }),
      ),
    );
    expect(v.skipped.map((s) => s.reason)).toEqual([
      'unit "mg/dL" is not an HbA1c unit (% or mmol/mol)',
      'valueQuantity.value is not a number',
      'the value is a limit ("<"), not a measured result',
      'no valueQuantity (the record gives a reason the value is absent)',
      'the unit is not a UCUM unit (system http://example.org/units)',
      'The HbA1c value in % must be between 3 and 20 (got 61); 61 looks like a value in mmol/mol: check the unit',
    ]);
  });

  it('skips unusable dates, saying why', () => {
    const v = imported(
      bundle(
        obs({ date: null }),
        obs({ date: null, extra: { effectivePeriod: { start: '2023-01-01' } } }),
        obs({ date: '2023-03' }),
        obs({ date: '2023-02-30' }),
        obs({ date: '2025-01-01' }),
      ),
    );
    expect(v.skipped.map((s) => s.reason)).toEqual([
      'no effectiveDateTime',
      'no effectiveDateTime (only effectivePeriod)',
      'effectiveDateTime "2023-03" does not give a full day (YYYY-MM-DD)',
      'The date 2023-02-30 is not a real calendar day',
      'The date 2025-01-01 is after today (2024-06-30): a checkup cannot be in the future',
    ]);
  });

  it('keeps one same-day result reported in both units, and lists the other', () => {
    // 6.1 % = 43.17 mmol/mol; a lab printing 43 agrees within 1.05 mmol/mol (hand-computed).
    const v = imported(bundle(obs({ id: 'pct', value: 6.1, unit: '%' }), obs({ id: 'ifcc', code: '59261-8', value: 43, unit: 'mmol/mol' })));
    expect(v.checkups).toEqual([{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }]);
    expect(v.skipped).toEqual([
      { entry: 1, id: 'ifcc', reason: 'the same HbA1c result as entry 0 on 2023-03-01 (43 mmol/mol and 6.1%); kept once' },
    ]);
  });

  it('skips every one of two different same-day results, since it cannot choose', () => {
    const v = imported(bundle(obs({ value: 6.1 }), obs({ value: 6.6 }), obs({ code: '1558-6', value: 98, unit: 'mg/dL' })));
    expect(v.checkups).toEqual([{ date: '2023-03-01', fpg: { value: 98, unit: 'mg/dL' } }]);
    expect(v.skipped.map((s) => s.entry)).toEqual([0, 1]);
    expect(v.skipped[0]?.reason).toBe('different HbA1c results on 2023-03-01 (6.1% in entry 0, 6.6% in entry 1): the import cannot choose one');
  });

  it('returns no checkups, and the full list, when nothing is usable', () => {
    const v = imported(bundle(obs({ status: 'preliminary' })));
    expect(v.checkups).toEqual([]);
    expect(v.skipped).toHaveLength(1);
    expect(imported({ resourceType: 'Bundle', type: 'collection' })).toEqual({ checkups: [], sources: [], skipped: [], resources: 0 });
  });
});

describe('importFhirGlucose: files that are not a Bundle or an Observation', () => {
  it.each([
    [null, 'fhir-not-resource'],
    [[], 'fhir-not-resource'],
    ['Bundle', 'fhir-not-resource'],
    [{ resourceType: 'Patient' }, 'fhir-not-resource'],
    [{ entry: [] }, 'fhir-not-resource'],
    [{ resourceType: 'Bundle', entry: {} }, 'fhir-bundle'],
  ])('refuses %j', (json, code) => {
    const r = importFhirGlucose(json, TODAY);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.issues[0]?.code).toBe(code);
  });

  it('turns malformed JSON into an issue', () => {
    const r = importFhirGlucoseJson('{"resourceType": "Bundle",', TODAY);
    expect(!r.ok && r.issues[0]?.code).toBe('invalid-json');
  });

  it('readObservation never throws on odd shapes', () => {
    for (const odd of [undefined, 1, 'x', { resourceType: 'Observation' }, { resourceType: 'Observation', status: 'final', code: 'x' }, { resourceType: 'Observation', status: 'final', code: { coding: [null, 1, { system: LOINC }] } }]) {
      expect(readObservation(odd, TODAY).ok).toBe(false);
    }
  });
});

describe('fhirImportSummary and skipLine', () => {
  it('say what the import did', () => {
    const v = imported(bundle(obs({ date: '2021-03-01' }), obs({ id: 'x', status: 'preliminary' }), { resourceType: 'Patient' }));
    expect(fhirImportSummary(v)).toBe('Read 3 resources: 1 checkup added, 2 resources skipped:');
    expect(v.skipped.map(skipLine)).toEqual(['Entry 1 (id x): status "preliminary": only final, amended and corrected results are used', 'Entry 2: a Patient resource, not an Observation']);
    expect(fhirImportSummary(imported(obs()))).toBe('Read 1 resource: 1 checkup added.');
    expect(skipLine({ entry: null, id: null, reason: 'no status' })).toBe('The Observation: no status');
  });
});

describe('FHIR R4 corrected results and UCUM annotations (issue 11 item 11)', () => {
  it('accepts status corrected, a kind of amended in R4 (from memory)', () => {
    const v = imported(bundle(obs({ id: 'c', status: 'corrected' })));
    expect(v.checkups).toEqual([{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }]);
    expect(v.skipped).toEqual([]);
  });

  it('accepts a UCUM annotation such as %{HbA1c} and mmol/mol{Hb}', () => {
    expect(imported(bundle(obs({ unit: '%{HbA1c}' }))).checkups[0]?.hba1c).toEqual({ value: 6.1, unit: '%' });
    expect(imported(bundle(obs({ code: '59261-8', value: 43, unit: 'mmol/mol{Hb}' }))).checkups[0]?.hba1c).toEqual({ value: 43, unit: 'mmol/mol' });
  });
});
