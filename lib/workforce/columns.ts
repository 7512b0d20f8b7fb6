/**
 * Finding a checkup file's columns by their header: case- and accent-insensitive, with the usual
 * synonyms, a unit in the header ("HbA1c (%)", "FPG mg/dL") or in its own column, strata (site,
 * department, any `group_*` column), and columns that look like names or national identifiers,
 * which are reported and left out of every output (pseudonymous ids only).
 *
 * A mapping it cannot settle — two candidate columns for one field, a value column with no unit,
 * a required column missing — is a {@link MappingProblem} naming the column; the command settles
 * it with `--map COLUMN=FIELD` (./types.ts {@link MappingOverrides}), the screen asks.
 */
import type { CheckupField, ColumnAssignment, ColumnMapping, FpgUnitName, Hba1cUnitName, MappingNote, MappingOverrides, MappingProblem } from './types';
import { CHECKUP_FIELDS } from './types';
import { foldHeader, unitInHeader } from '../text/headers';
import { GLUCOSE_UNITS } from '../glycaemia/glucose';
import { HBA1C_UNITS } from '../glycaemia/hba1c';

/** Lower case, accents removed, runs of spaces, "_", "-" and "." as one space, trimmed (lib/text/headers.ts, the rule every header reader uses). */
export function normaliseHeader(text: string): string {
  return foldHeader(text, { separators: true });
}

const SYNONYMS: Readonly<Record<Exclude<CheckupField, 'stratum' | 'ignore'>, readonly string[]>> = {
  worker: ['worker', 'worker id', 'workerid', 'employee', 'employee id', 'employee number', 'employee no', 'id', 'pseudonym', 'pseudonymous id', 'staff id', 'person id', 'personnel number', 'participant', 'participant id', 'subject', 'subject id'],
  date: ['date', 'checkup date', 'check up date', 'checkup', 'exam date', 'examination date', 'visit date', 'date of checkup', 'test date', 'sample date', 'collection date'],
  hba1c: ['hba1c', 'hb a1c', 'a1c', 'glycated haemoglobin', 'glycated hemoglobin', 'glycosylated haemoglobin', 'glycosylated hemoglobin', 'haemoglobin a1c', 'hemoglobin a1c'],
  'hba1c-unit': ['hba1c unit', 'hba1c units', 'a1c unit', 'a1c units', 'unit hba1c'],
  fpg: ['fasting glucose', 'fpg', 'fasting plasma glucose', 'glucose fasting', 'fasting blood glucose', 'fbg', 'fbs', 'fasting blood sugar', 'glucose'],
  'fpg-unit': ['fpg unit', 'fpg units', 'glucose unit', 'glucose units', 'fasting glucose unit', 'fasting glucose units', 'unit glucose'],
  age: ['age', 'age years', 'age at checkup', 'age in years'],
  'birth-year': ['birth year', 'year of birth', 'yob', 'born', 'birthyear'],
  'birth-date': ['birth date', 'date of birth', 'dob', 'birthdate'],
  sex: ['sex', 'gender'],
};

/** Headers taken as strata, by their normalised name. */
const STRATUM_HEADERS = ['site', 'department', 'dept', 'departement', 'departamento', 'abteilung', 'location', 'plant', 'team', 'shift', 'division', 'workplace', 'occupation', 'job'];
/** Other spellings of the stratum "department". */
const DEPARTMENT_SPELLINGS = ['dept', 'departement', 'departamento', 'abteilung'];
/** A column with one of these headers right after a value column without a unit is that value's unit column. */
const BARE_UNIT_HEADERS = ['unit', 'units', 'unite', 'einheit', 'unidad'];
/** A column `group_<name>` is the stratum `<name>`. */
const GROUP_PREFIX = 'group ';

/** Headers that name people or national identifiers: never read, never output (pseudonymous ids only). */
const IDENTIFYING_HEADERS = [
  'name',
  'names',
  'first name',
  'firstname',
  'given name',
  'last name',
  'lastname',
  'surname',
  'family name',
  'full name',
  'employee name',
  'worker name',
  'patient name',
  'national id',
  'national identifier',
  'national insurance number',
  'ni number',
  'nin',
  'ssn',
  'social security number',
  'social security',
  'nhs number',
  'insurance number',
  'passport',
  'passport number',
  'personal id number',
  'personal identity number',
  'tax id',
  'email',
  'e mail',
  'phone',
  'telephone',
  'address',
];

/** Reads a unit written in a header (lib/text/headers.ts); the rest of the header is returned without it. */
export function headerUnit(normalised: string): { readonly base: string; readonly unit: Hba1cUnitName | FpgUnitName | null } {
  const { unit, rest } = unitInHeader(normalised);
  const base = rest.replace(/[()[\]{},:;]/g, ' ').replace(/\s+/g, ' ');
  return { base: (unit === null ? base : base.replace(/\bin\s*$/, '')).trim(), unit };
}

function unitFits(field: 'hba1c' | 'fpg', unit: Hba1cUnitName | FpgUnitName): boolean {
  return field === 'hba1c' ? unit === '%' || unit === 'mmol/mol' : unit === 'mg/dL' || unit === 'mmol/L';
}

interface Guess {
  readonly field: CheckupField | null;
  readonly unit: Hba1cUnitName | FpgUnitName | null;
  readonly stratum: string | null;
  readonly identifying: boolean;
}

/** What one header is taken to be, before looking at the others. */
export function guessColumn(header: string): Guess {
  const normalised = normaliseHeader(header);
  if (IDENTIFYING_HEADERS.includes(normalised)) return { field: null, unit: null, stratum: null, identifying: true };
  if (normalised.startsWith(GROUP_PREFIX) && normalised.length > GROUP_PREFIX.length) {
    return { field: 'stratum', unit: null, stratum: normalised.slice(GROUP_PREFIX.length).replace(/ /g, '_'), identifying: false };
  }
  if (STRATUM_HEADERS.includes(normalised)) return { field: 'stratum', unit: null, stratum: DEPARTMENT_SPELLINGS.includes(normalised) ? 'department' : normalised, identifying: false };
  const { base, unit } = headerUnit(normalised);
  for (const field of Object.keys(SYNONYMS) as (keyof typeof SYNONYMS)[]) {
    if (!SYNONYMS[field].includes(base)) continue;
    if ((field === 'hba1c' || field === 'fpg') && unit !== null && !unitFits(field, unit)) continue;
    return { field, unit: field === 'hba1c' || field === 'fpg' ? unit : null, stratum: null, identifying: false };
  }
  // "HbA1c result", "fasting glucose value": a value column with a trailing word.
  const stripped = base.replace(/\b(result|value|level|test)\b/g, ' ').replace(/\s+/g, ' ').trim();
  if (stripped !== base) {
    for (const field of ['hba1c', 'fpg'] as const) {
      if (SYNONYMS[field].includes(stripped) && (unit === null || unitFits(field, unit))) return { field, unit, stratum: null, identifying: false };
    }
  }
  return { field: null, unit: null, stratum: null, identifying: false };
}

const FIELD_WORDS: Readonly<Record<CheckupField, string>> = {
  worker: 'the worker id',
  date: 'the checkup date',
  hba1c: 'the HbA1c',
  'hba1c-unit': 'the HbA1c unit',
  fpg: 'the fasting glucose',
  'fpg-unit': 'the fasting glucose unit',
  age: 'the age',
  'birth-year': 'the birth year',
  'birth-date': 'the birth date',
  sex: 'the sex',
  stratum: 'a stratum',
  ignore: 'nothing (left out)',
};

/** Units a value field can be given in with --map ("hba1c:%"): lib/glycaemia's own unit lists. */
const MAP_UNITS: Readonly<Record<'hba1c' | 'fpg', readonly (Hba1cUnitName | FpgUnitName)[]>> = { hba1c: HBA1C_UNITS, fpg: GLUCOSE_UNITS };

/**
 * The --map values accepted, for messages: "worker, date, hba1c:%, hba1c:mmol/mol, hba1c, …" —
 * every field of {@link CHECKUP_FIELDS}, a value field also with each of its units.
 */
export const MAP_VALUES: readonly string[] = CHECKUP_FIELDS.flatMap((field) =>
  field === 'hba1c' || field === 'fpg' ? [...MAP_UNITS[field].map((unit) => `${field}:${unit}`), field] : [field],
);

/** Reads one --map value ("hba1c:%", "stratum", "ignore"); null when it is not one of {@link MAP_VALUES}. */
export function parseMapValue(value: string): Guess | null {
  const [rawField, rawUnit] = value.split(':', 2).map((s) => s.trim());
  const field = CHECKUP_FIELDS.find((f) => f === rawField?.toLowerCase());
  if (!field) return null;
  let unit: Hba1cUnitName | FpgUnitName | null = null;
  if (rawUnit !== undefined) {
    if (field !== 'hba1c' && field !== 'fpg') return null;
    const found = headerUnit(normaliseHeader(rawUnit)).unit;
    if (found === null || !unitFits(field, found)) return null;
    unit = found;
  }
  return { field: field === 'ignore' ? null : field, unit, stratum: null, identifying: false };
}

export interface MappingProposal {
  /** Every column with what it was taken to be (also when there are problems: the screen shows it). */
  readonly mapping: ColumnMapping;
  /** Problems that refuse the file until settled. */
  readonly problems: readonly MappingProblem[];
  readonly notes: readonly MappingNote[];
}

const SINGLE_FIELDS: readonly CheckupField[] = ['worker', 'date', 'hba1c', 'hba1c-unit', 'fpg', 'fpg-unit', 'age', 'birth-year', 'birth-date', 'sex'];

/**
 * Proposes what each column is, applying the overrides (header text → field, as --map gives it).
 *
 * @example
 * proposeMapping(['Worker', 'Checkup date', 'HbA1c (%)', 'FPG (mmol/L)', 'Age', 'Sex', 'Site'])
 * //=> { mapping: { columns: [{ header: 'Worker', field: 'worker', … }, …, { header: 'Site', field: 'stratum', stratum: 'site', … }] }, problems: [], notes: [] }
 * proposeMapping(['id', 'date', 'HbA1c'])
 * //=> { problems: [{ code: 'unit-unknown', column: 'HbA1c', message: 'Column "HbA1c": the HbA1c has no unit …' }], … }
 */
export function proposeMapping(headers: readonly string[], overrides: MappingOverrides = {}): MappingProposal {
  const problems: MappingProblem[] = [];
  const notes: MappingNote[] = [];
  const trimmed = headers.map((h) => h.trim());
  const normalised = trimmed.map(normaliseHeader);

  const overrideByColumn = new Map<number, Guess>();
  for (const [column, value] of Object.entries(overrides)) {
    const target = normaliseHeader(column);
    const index = normalised.indexOf(target);
    if (index < 0) {
      problems.push({ code: 'unknown-map', column, message: `--map names a column "${column}" that the file does not have; its columns are ${trimmed.map((h) => `"${h}"`).join(', ')}` });
      continue;
    }
    const guess = parseMapValue(value);
    if (!guess) {
      problems.push({ code: 'unknown-map', column, message: `Column "${column}": "${value}" is not a field; use one of ${MAP_VALUES.join(', ')}` });
      continue;
    }
    overrideByColumn.set(index, guess.field === 'stratum' ? { ...guess, stratum: target.replace(/^group /, '').replace(/ /g, '_') } : guess);
  }

  const columns: ColumnAssignment[] = trimmed.map((header, index) => {
    const guess = overrideByColumn.get(index) ?? guessColumn(header);
    return { index, header, field: guess.field, unit: guess.unit, stratum: guess.stratum, identifying: overrideByColumn.has(index) ? false : guess.identifying };
  });

  // "HbA1c, unit, FPG, unit": a bare unit column belongs to the value column just before it.
  columns.forEach((column, i) => {
    const before = columns[i - 1];
    if (column.field !== null || overrideByColumn.has(i) || !BARE_UNIT_HEADERS.includes(normalised[i] ?? '')) return;
    if (before && (before.field === 'hba1c' || before.field === 'fpg') && before.unit === null) {
      columns[i] = { ...column, field: before.field === 'hba1c' ? 'hba1c-unit' : 'fpg-unit' };
    }
  });

  const seenHeaders = new Map<string, number>();
  normalised.forEach((n, i) => {
    if (n === '') return;
    const earlier = seenHeaders.get(n);
    if (earlier !== undefined) {
      problems.push({ code: 'duplicate-column', column: trimmed[i] ?? '', message: `Columns ${earlier + 1} and ${i + 1} have the same header "${trimmed[i]}"; rename one` });
    } else seenHeaders.set(n, i);
  });

  for (const field of SINGLE_FIELDS) {
    const candidates = columns.filter((c) => c.field === field);
    if (candidates.length > 1) {
      const names = candidates.map((c) => `"${c.header}"`).join(' and ');
      problems.push({
        code: 'ambiguous-column',
        column: candidates[0]?.header ?? null,
        message: `Columns ${names} could each be ${FIELD_WORDS[field]}; say which with --map (e.g. --map "${candidates[1]?.header}=ignore")`,
      });
    }
  }
  const has = (field: CheckupField) => columns.some((c) => c.field === field);
  if (!has('worker')) problems.push({ code: 'missing-column', column: null, message: 'No column gives the worker id (a header such as worker, employee or id); name it with --map COLUMN=worker' });
  if (!has('date')) problems.push({ code: 'missing-column', column: null, message: 'No column gives the checkup date (a header such as date or checkup date); name it with --map COLUMN=date' });
  if (!has('hba1c') && !has('fpg')) {
    problems.push({ code: 'missing-column', column: null, message: 'No column gives an HbA1c or a fasting glucose (headers such as HbA1c (%) or fasting glucose (mmol/L)); name it with --map COLUMN=hba1c:% or COLUMN=fpg:mmol/L' });
  }
  for (const test of ['hba1c', 'fpg'] as const) {
    const column = columns.find((c) => c.field === test);
    if (column && column.unit === null && !has(`${test}-unit`)) {
      const example = test === 'hba1c' ? 'hba1c:% or hba1c:mmol/mol' : 'fpg:mmol/L or fpg:mg/dL';
      problems.push({
        code: 'unit-unknown',
        column: column.header,
        message: `Column "${column.header}": ${FIELD_WORDS[test]} has no unit in its header and there is no unit column; say which with --map "${column.header}=${example.split(' or ')[0]}" (${example})`,
      });
    }
  }
  for (const c of columns) {
    if (c.identifying) {
      notes.push({ code: 'identifying-column', column: c.header, message: `Column "${c.header}" looks like names or a national identifier: it is left out of every output (the tool needs pseudonymous ids only)` });
    } else if (c.field === null && !overrideByColumn.has(c.index) && c.header !== '') {
      notes.push({ code: 'unused-column', column: c.header, message: `Column "${c.header}" is not used` });
    }
  }
  return { mapping: { columns }, problems, notes };
}

/** The column assigned to a field, if any. */
export function columnFor(mapping: ColumnMapping, field: CheckupField): ColumnAssignment | undefined {
  return mapping.columns.find((c) => c.field === field);
}
