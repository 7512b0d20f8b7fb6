#!/usr/bin/env node
/**
 * Writes the demo workforce checkup file in its three forms (`node scripts/demo-checkups.mjs`):
 *
 *   demo/checkups/checkups.csv                 CSV, a "#" note line, then a header and one row per checkup
 *   demo/checkups/checkups.xlsx                the same rows in a workbook (sheet "Checkups")
 *   demo/checkups/fhir/Patient.ndjson          FHIR R4 bulk export: one Patient per line
 *   demo/checkups/fhir/Observation.ndjson      one HbA1c (LOINC 4548-4, %) or fasting glucose
 *                                              (LOINC 14771-0, mmol/L) Observation per line
 *
 * ILLUSTRATIVE DATA: 40 invented workers with pseudonymous ids (W001 … W040), invented results,
 * three invented sites. No real person, workplace or result. Deterministic (no randomness), so the
 * files only change when this script does.
 *
 * What the demo shows (ADA criteria, demo evidence "demo-workforce-hba1c-heart-failure": HbA1c in
 * the prediabetes range at 3 yearly results in a row, comparison normal HbA1c over the same span):
 * - workers with HbA1c in the prediabetes range for 3–5 years (exposed), normal for 3–5 years
 *   (comparison), a range that changed (neither), two results only or a gap over 18 months
 *   (insufficient);
 * - one worker whose latest HbA1c is in the diabetes range (W023);
 * - one unit slip: W031's 2023 HbA1c is written 42 in the % column (a mmol/mol value; no fasting
 *   glucose that day): that row is reported and skipped, the rest go on.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import writeExcelFile from 'write-excel-file/node';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const OUT = join(ROOT, 'demo', 'checkups');
const NOTE = 'Illustrative data: invented workers and results for the Hundredfold demo; not real people';

const SITES = ['North', 'South', 'Harbour'];
const DEPARTMENTS = ['Assembly', 'Office', 'Logistics'];

/**
 * Each worker: [HbA1c per year 2021…2025 (null: no checkup that year)], birth year, sex.
 * HbA1c in %; ADA: normal < 5.7, prediabetes 5.7–6.4, diabetes range ≥ 6.5 (lib/glycaemia/criteria.ts).
 */
const PROFILES = [
  // exposed: prediabetes range 3–5 years in a row
  [[5.9, 6.0, 6.1, 6.0, 6.2], 1971, 'female'],
  [[null, null, 5.8, 5.9, 6.1], 1968, 'male'],
  [[6.0, 6.1, 6.1, 6.3, 6.2], 1975, 'male'],
  [[5.8, 5.9, 5.8, 6.0, 5.9], 1980, 'female'],
  [[null, 6.2, 6.0, 6.1, 6.3], 1966, 'male'],
  [[5.7, 5.8, 5.9, 5.9, 6.0], 1985, 'female'],
  [[6.1, 6.2, 6.4, 6.3, 6.4], 1962, 'male'],
  [[null, null, 6.0, 6.1, 6.0], 1990, 'female'],
  [[5.9, 6.0, 5.9, 6.1, 6.1], 1973, 'male'],
  [[6.2, 6.1, 6.3, 6.2, 6.4], 1969, 'female'],
  [[5.8, 5.8, 5.9, 5.9, 5.9], 1978, 'male'],
  [[null, 5.9, 6.0, 6.2, 6.1], 1964, 'female'],
  // comparison: normal range 3–5 years in a row
  [[5.2, 5.3, 5.1, 5.3, 5.2], 1982, 'female'],
  [[5.0, 5.1, 5.0, 5.2, 5.1], 1987, 'male'],
  [[5.4, 5.5, 5.4, 5.5, 5.6], 1970, 'female'],
  [[null, null, 5.3, 5.2, 5.4], 1992, 'male'],
  [[5.1, 5.2, 5.2, 5.3, 5.1], 1976, 'male'],
  [[5.5, 5.4, 5.5, 5.6, 5.5], 1965, 'female'],
  [[null, 5.0, 5.1, 5.1, 5.2], 1988, 'female'],
  [[5.3, 5.3, 5.4, 5.4, 5.5], 1972, 'male'],
  [[4.9, 5.0, 5.0, 5.1, 5.0], 1991, 'female'],
  [[5.2, 5.1, 5.3, 5.2, 5.4], 1967, 'male'],
  // diabetes range at the latest checkup (W023)
  [[6.1, 6.2, 6.3, 6.4, 6.8], 1963, 'male'],
  [[5.4, 5.3, 5.5, 5.4, 5.5], 1984, 'female'],
  [[5.1, 5.2, 5.1, 5.2, 5.3], 1979, 'male'],
  [[5.6, 5.5, 5.6, 5.5, 5.6], 1974, 'female'],
  // neither: the range changed, so the run is too short
  [[5.3, 5.4, 5.5, 5.8, 5.9], 1977, 'male'],
  [[5.9, 6.0, 5.6, 5.5, 5.4], 1970, 'female'],
  [[5.5, 5.6, 5.8, 5.7, 5.6], 1983, 'male'],
  [[6.0, 5.5, 6.1, 5.6, 6.0], 1969, 'female'],
  // the unit slip (W031): 2023 written 42 in the % column; the other results are normal
  [[5.2, 5.3, 'slip', 5.2, 5.3], 1981, 'male'],
  // insufficient: two results only
  [[null, null, null, 5.9, 6.0], 1995, 'female'],
  [[null, null, null, 5.2, 5.1], 1993, 'male'],
  [[null, null, null, 6.1, 6.2], 1989, 'male'],
  // insufficient: a gap of more than 18 months (no checkup in 2022 and 2023)
  [[5.9, null, null, 6.0, 6.1], 1972, 'female'],
  [[5.2, null, null, 5.3, 5.2], 1986, 'male'],
  [[6.0, 6.1, null, null, 6.2], 1967, 'female'],
  // more comparison and exposed workers
  [[5.0, 5.1, 5.1, 5.2, 5.1], 1994, 'female'],
  [[5.8, 5.9, 6.0, 6.0, 6.1], 1976, 'male'],
  [[5.3, 5.2, 5.4, 5.3, 5.3], 1961, 'female'],
];

/** Fasting glucose in mmol/L that goes with an HbA1c (invented; ADA fasting prediabetes from 100 mg/dL = 5.55 mmol/L). */
function fastingFor(hba1c, w, y) {
  if (hba1c >= 6.5) return 7.4;
  const base = hba1c >= 5.7 ? 5.2 : 4.8;
  return Math.round((base + ((w * 7 + y * 3) % 5) / 10) * 10) / 10;
}

function checkups() {
  const rows = [];
  PROFILES.forEach(([values, birthYear, sex], i) => {
    const w = i + 1;
    const worker = `W${String(w).padStart(3, '0')}`;
    const site = SITES[i % 3];
    const department = DEPARTMENTS[Math.floor(i / 3) % 3];
    values.forEach((value, y) => {
      if (value === null) return;
      const year = 2021 + y;
      const month = 3 + ((w + y) % 3);
      const day = 1 + ((w * 5 + y * 11) % 27);
      const date = `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
      const slip = value === 'slip';
      const hba1c = slip ? 42 : value;
      rows.push({ worker, date, hba1c, fpg: slip ? null : fastingFor(value, w, y), age: year - birthYear, birthYear, sex, site, department });
    });
  });
  return rows;
}

const HEADER = ['Worker', 'Checkup date', 'HbA1c (%)', 'Fasting glucose (mmol/L)', 'Age', 'Sex', 'Site', 'Department'];

function csv(rows) {
  const lines = [`# ${NOTE}`, HEADER.join(',')];
  for (const r of rows) lines.push([r.worker, r.date, r.hba1c, r.fpg ?? '', r.age, r.sex, r.site, r.department].join(','));
  return `${lines.join('\n')}\n`;
}

async function xlsx(rows, file) {
  const data = [[`# ${NOTE}`], HEADER, ...rows.map((r) => [r.worker, new Date(`${r.date}T00:00:00Z`), r.hba1c, r.fpg, r.age, r.sex, r.site, r.department])];
  await writeExcelFile(data, { sheet: 'Checkups', dateFormat: 'yyyy-mm-dd' }).toFile(file);
}

const TAG = { system: 'urn:hundredfold:demo', code: 'illustrative', display: NOTE };

function fhir(rows) {
  const patients = new Map();
  for (const r of rows) if (!patients.has(r.worker)) patients.set(r.worker, r);
  // Birthday on 1 January: the age at each checkup is then the checkup's year minus the birth year, as in the CSV.
  const patientLines = [...patients.values()].map((r) =>
    JSON.stringify({ resourceType: 'Patient', id: r.worker, meta: { tag: [TAG] }, gender: r.sex, birthDate: `${r.birthYear}-01-01` }),
  );
  const observations = [];
  let n = 0;
  for (const r of rows) {
    const base = { resourceType: 'Observation', status: 'final', meta: { tag: [TAG] }, subject: { reference: `Patient/${r.worker}` }, effectiveDateTime: `${r.date}T08:30:00+01:00` };
    n += 1;
    observations.push(
      JSON.stringify({
        ...base,
        id: `obs-${n}-a1c`,
        code: { coding: [{ system: 'http://loinc.org', code: '4548-4', display: 'Hemoglobin A1c/Hemoglobin.total in Blood' }] },
        valueQuantity: { value: r.hba1c, unit: '%', system: 'http://unitsofmeasure.org', code: '%' },
      }),
    );
    if (r.fpg === null) continue;
    observations.push(
      JSON.stringify({
        ...base,
        id: `obs-${n}-fpg`,
        code: { coding: [{ system: 'http://loinc.org', code: '14771-0', display: 'Fasting glucose [Moles/volume] in Serum or Plasma' }] },
        valueQuantity: { value: r.fpg, unit: 'mmol/L', system: 'http://unitsofmeasure.org', code: 'mmol/L' },
      }),
    );
  }
  return { patients: `${patientLines.join('\n')}\n`, observations: `${observations.join('\n')}\n` };
}

const rows = checkups();
mkdirSync(join(OUT, 'fhir'), { recursive: true });
writeFileSync(join(OUT, 'checkups.csv'), csv(rows));
await xlsx(rows, join(OUT, 'checkups.xlsx'));
const bulk = fhir(rows);
writeFileSync(join(OUT, 'fhir', 'Patient.ndjson'), bulk.patients);
writeFileSync(join(OUT, 'fhir', 'Observation.ndjson'), bulk.observations);
process.stdout.write(`wrote ${rows.length} checkups of ${PROFILES.length} workers to ${OUT}\n`);
