import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createCheckupTextReader, guessColumn, isRefusal, proposeMapping, readCheckupTable, type CheckupRow, type ReadOutcome, type RowProblem } from '@/lib/workforce';

// Invented rows (illustrative). Today is fixed so the future-date check is stable.
const TODAY = '2025-06-30';
const HEADER = 'Worker,Checkup date,HbA1c (%),Fasting glucose (mmol/L),Age,Sex,Site';

/** Reads text in the given chunks; returns rows, problems, and the refusal if any. */
function readAll(chunks: readonly string[], options: Parameters<typeof createCheckupTextReader>[0] = { today: TODAY }) {
  const reader = createCheckupTextReader(options);
  const rows: CheckupRow[] = [];
  const problems: RowProblem[] = [];
  const take = (o: ReadOutcome) => {
    if (isRefusal(o)) return o;
    rows.push(...o.rows);
    problems.push(...o.problems);
    return null;
  };
  for (const c of chunks) {
    const refused = take(reader.push(c));
    if (refused) return { rows, problems, refusal: refused, counts: reader.counts() };
  }
  const refused = take(reader.end());
  return { rows, problems, refusal: refused, counts: reader.counts(), header: reader.header };
}

describe('columns by header', () => {
  it('finds the usual synonyms, case- and accent-insensitive, with units in the header', () => {
    const p = proposeMapping(['Employee ID', 'Date de l’examen', 'HBA1C [mmol/mol]', 'FPG mg/dL', 'Year of birth', 'Gender', 'Département', 'group_shift']);
    expect(p.mapping.columns.map((c) => [c.field, c.unit, c.stratum])).toEqual([
      ['worker', null, null],
      [null, null, null],
      ['hba1c', 'mmol/mol', null],
      ['fpg', 'mg/dL', null],
      ['birth-year', null, null],
      ['sex', null, null],
      ['stratum', null, 'department'],
      ['stratum', null, 'shift'],
    ]);
    // "Date de l’examen" is not a known synonym: the date is missing, named in the problem.
    expect(p.problems.map((x) => x.code)).toEqual(['missing-column']);
  });

  it('a value column without a unit is an error naming the column; --map settles it', () => {
    const p = proposeMapping(['id', 'date', 'HbA1c']);
    expect(p.problems).toEqual([expect.objectContaining({ code: 'unit-unknown', column: 'HbA1c' })]);
    expect(p.problems[0]?.message).toMatch(/Column "HbA1c".*--map "HbA1c=hba1c:%"/);
    expect(proposeMapping(['id', 'date', 'HbA1c'], { hba1c: 'hba1c:mmol/mol' }).problems).toEqual([]);
  });

  it('a unit column stands in for the unit in the header', () => {
    expect(proposeMapping(['id', 'date', 'HbA1c', 'HbA1c unit']).problems).toEqual([]);
  });

  it('two candidate columns for one field are an error naming both', () => {
    const p = proposeMapping(['worker', 'employee id', 'date', 'HbA1c (%)']);
    expect(p.problems).toEqual([expect.objectContaining({ code: 'ambiguous-column', column: 'worker' })]);
    expect(p.problems[0]?.message).toContain('"worker" and "employee id"');
    expect(proposeMapping(['worker', 'employee id', 'date', 'HbA1c (%)'], { 'Employee ID': 'ignore' }).problems).toEqual([]);
  });

  it('columns that look like names or national identifiers are left out and reported', () => {
    const p = proposeMapping(['worker', 'Surname', 'NHS number', 'date', 'HbA1c (%)']);
    expect(p.problems).toEqual([]);
    expect(p.mapping.columns.filter((c) => c.identifying).map((c) => c.header)).toEqual(['Surname', 'NHS number']);
    expect(p.notes.filter((n) => n.code === 'identifying-column')).toHaveLength(2);
  });

  it('an unknown --map value or column is a problem', () => {
    expect(proposeMapping(['worker', 'date', 'HbA1c (%)'], { nope: 'worker' }).problems[0]?.code).toBe('unknown-map');
    expect(proposeMapping(['worker', 'date', 'HbA1c (%)'], { worker: 'hba1c:mg/dL' }).problems[0]?.code).toBe('unknown-map');
  });

  it('a unit that does not fit the test is not taken', () => {
    expect(guessColumn('HbA1c (mmol/L)').field).toBeNull();
  });
});

describe('reading rows', () => {
  it('reads good rows with their file line numbers, skipping a "#" note line', () => {
    const { rows, problems, counts } = readAll([`# Illustrative\n${HEADER}\nW1,2024-03-01,6.1,5.9,52,F,North\nW1,2025-03-01,6.2,,53,female,North\n`]);
    expect(problems).toEqual([]);
    expect(rows).toEqual([
      { line: 3, worker: 'W1', date: '2024-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 5.9, unit: 'mmol/L' }, age: 52, sex: 'female', strata: { site: 'North' } },
      { line: 4, worker: 'W1', date: '2025-03-01', hba1c: { value: 6.2, unit: '%' }, age: 53, sex: 'female', strata: { site: 'North' } },
    ]);
    expect(counts).toEqual({ read: 2, used: 2, skipped: 0 });
  });

  it('every kind of bad row gives its message with row and column, and the rest go on', () => {
    const lines = [
      HEADER,
      'W1,2024-03-01,6.1,5.9,52,F,North', // 2 good
      ',2024-03-01,6.1,5.9,52,F,North', // 3 empty worker
      'W1,02/03/2024,6.1,5.9,52,F,North', // 4 ambiguous date
      'W1,2024-02-30,6.1,5.9,52,F,North', // 5 not a real day
      'W1,2026-01-01,6.1,5.9,52,F,North', // 6 future date
      'W1,2024-04-01,six,5.9,52,F,North', // 7 not a number
      'W1,2024-05-01,42,5.9,52,F,North', // 8 unit slip: 42 is a mmol/mol value
      'W1,2024-06-01,,,52,F,North', // 9 neither test
      'W1,2024-07-01,6.1,5.9,130,F,North', // 10 age out of range
      'W1,2024-08-01,6.1,5.9,52,X,North', // 11 sex not female/male
      'Anna Example,2024-09-01,6.1,5.9,52,F,North', // 12 a name as the worker id
      'W1,2024-10-01,"6,1",5.9,52,F,North', // 13 decimal comma in a comma-delimited file
      'W1,2024-11-01,6.1%,5.9,52,F,North', // 14 a % sign in the cell
      'W2,2024-03-01,6.0,5.8,40,M,South', // 15 good
    ];
    const { rows, problems, counts } = readAll([`${lines.join('\n')}\n`]);
    expect(rows.map((r) => r.line)).toEqual([2, 15]);
    expect(problems.map((p) => [p.line, p.column, p.code])).toEqual([
      [3, 'Worker', 'required'],
      [4, 'Checkup date', 'ambiguous-date'],
      [5, 'Checkup date', 'invalid-date'],
      [6, 'Checkup date', 'invalid-date'],
      [7, 'HbA1c (%)', 'not-a-number'],
      [8, 'HbA1c (%)', 'out-of-range'],
      [9, 'HbA1c (%)', 'required'],
      [10, 'Age', 'out-of-range'],
      [11, 'Sex', 'invalid-choice'],
      [12, 'Worker', 'looks-like-name'],
      [13, 'HbA1c (%)', 'decimal-comma'],
      [14, 'HbA1c (%)', 'percent'],
    ]);
    expect(problems.find((p) => p.line === 8)?.message).toMatch(/42 looks like a value in mmol\/mol: check the unit/);
    expect(problems.find((p) => p.line === 6)?.message).toMatch(/after today/);
    // The name is never repeated in the message.
    expect(problems.find((p) => p.line === 12)?.message).not.toContain('Anna');
    expect(counts).toEqual({ read: 14, used: 2, skipped: 12 });
  });

  it('a unit column: each row\'s unit, and a row with an unknown unit is reported on the unit column', () => {
    const text = 'id;date;HbA1c;unit\nW1;2024-03-01;44;mmol/mol\nW1;2025-03-01;6,2;%\nW1;2025-04-01;6,2;mg/dL\n';
    const { rows, problems } = readAll([text]);
    expect(rows.map((r) => r.hba1c)).toEqual([
      { value: 44, unit: 'mmol/mol' },
      { value: 6.2, unit: '%' },
    ]);
    expect(problems).toEqual([expect.objectContaining({ line: 4, column: 'unit', code: 'unit-unknown' })]);
  });

  it('detects a decimal comma in a semicolon file, and tabs as the delimiter', () => {
    expect(readAll(['worker;date;FPG (mmol/L)\nW1;2024-03-01;5,9\n']).rows[0]?.fpg).toEqual({ value: 5.9, unit: 'mmol/L' });
    expect(readAll(['worker\tdate\tFPG (mg/dL)\nW1\t2024-03-01\t104\n']).rows[0]?.fpg).toEqual({ value: 104, unit: 'mg/dL' });
  });

  it('counts a quoted line break in the line numbers', () => {
    const { rows } = readAll(['worker,date,HbA1c (%),Site\nW1,2024-03-01,6.1,"North\nwing"\nW2,2024-03-01,6.0,South\n']);
    expect(rows.map((r) => [r.worker, r.line, r.strata.site])).toEqual([
      ['W1', 2, 'North\nwing'],
      ['W2', 4, 'South'],
    ]);
  });

  it('refuses a file with no header, and an unsettled mapping, whole with one message', () => {
    const empty = readAll(['\n\n# only a note\n']);
    expect(empty.refusal?.code).toBe('no-header');
    const unsettled = readAll(['id,date,HbA1c\nW1,2024-03-01,6.1\n']);
    expect(unsettled.refusal?.code).toBe('mapping');
    expect(unsettled.refusal?.message).toMatch(/Column "HbA1c"/);
    expect(unsettled.rows).toEqual([]);
  });

  it('property: however the text is cut into chunks, the rows and problems are the same', () => {
    const text = `\uFEFF# note\r\n${HEADER}\r\nW1,2024-03-01,6.1,5.9,52,F,"North, east"\r\nW1,2025-03-01,x,5.9,53,F,North\r\nW2,2024-03-01,5.2,,40,M,South\r\nW3,2024-03-02,5.3,4.9,41,M,"a ""quoted"" site"`;
    const whole = readAll([text]);
    expect(whole.rows).toHaveLength(3);
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 12 }), (cuts) => {
        const sorted = [...cuts].sort((a, b) => a - b);
        const chunks = [0, ...sorted].map((from, i) => text.slice(from, sorted[i] ?? text.length));
        const parts = readAll(chunks);
        expect(parts.rows).toEqual(whole.rows);
        expect(parts.problems).toEqual(whole.problems);
      }),
      { numRuns: 300 },
    );
  });
});

describe('reading a workbook\'s cells', () => {
  it('reads typed cells (numbers, dates) and names rows by the sheet\'s row numbers', () => {
    const table = [['# note', null, null], ['Worker', 'Date', 'HbA1c (%)'], ['W1', new Date('2024-03-01T00:00:00Z'), 6.1], ['W1', 'not a date', 6.2]];
    const read = readCheckupTable(table, { today: TODAY });
    if (isRefusal(read)) throw new Error(read.message);
    expect(read.step.rows).toEqual([{ line: 3, worker: 'W1', date: '2024-03-01', hba1c: { value: 6.1, unit: '%' }, strata: {} }]);
    expect(read.step.problems).toEqual([expect.objectContaining({ line: 4, column: 'Date', code: 'invalid-date' })]);
  });

  it('reads a value a formula wrote with binary noise as the spreadsheet shows it (15 significant digits, lib/text/significant.ts)', () => {
    // 0.7 + 0.1 is 0.7999999999999999 and 5.6999999999999993 is the double a formula can give for 5.7 (ECMA-262 Number::toString).
    const table = [['Worker', 'Date', 'HbA1c (%)', 'Fasting glucose (mmol/L)'], ['W1', new Date('2024-03-01T00:00:00Z'), 5.6999999999999993, 5 + (0.7 + 0.1)]];
    const read = readCheckupTable(table, { today: TODAY });
    if (isRefusal(read)) throw new Error(read.message);
    expect(read.step.rows.map((r) => [r.hba1c?.value, r.fpg?.value])).toEqual([[5.7, 5.8]]);
  });
});

describe('numbers written with binary noise in a text file', () => {
  it('are read at 15 significant digits, so 5.6999999999999993% is the 5.7% the file meant', () => {
    const { rows, problems } = readAll([`${HEADER}\nW1,2024-03-01,5.6999999999999993,6.1000000000000005,50,female,North\nW2,2024-03-01,6.25,5.55,50,male,North\n`]);
    expect(problems).toEqual([]);
    expect(rows.map((r) => [r.worker, r.hba1c?.value, r.fpg?.value])).toEqual([
      ['W1', 5.7, 6.1],
      ['W2', 6.25, 5.55], // 15 digits or fewer: exactly as written
    ]);
  });
});
