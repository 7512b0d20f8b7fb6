import { describe, expect, it } from 'vitest';
import { parseGlucoseHistory, parseGlucoseHistoryJson } from '@/lib/glycaemia/parse';
import type { Issue } from '@/lib/result';

const TODAY = { today: '2024-06-30' };

function issues(input: unknown): Issue[] {
  const r = parseGlucoseHistory(input, TODAY);
  if (r.ok) throw new Error('expected issues');
  return [...r.issues];
}

function oneCheckup(checkup: unknown) {
  return { criteria: 'ADA', checkups: [checkup] };
}

describe('parseGlucoseHistory: valid input', () => {
  it('accepts either test or both, and sorts by date', () => {
    const r = parseGlucoseHistory(
      {
        criteria: 'NICE',
        checkups: [
          { date: '2023-03-01', hba1c: { value: 44, unit: 'mmol/mol' } },
          { date: '2021-03-01', fpg: { value: 5.9, unit: 'mmol/L' } },
          { date: '2022-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 104, unit: 'mg/dL' } },
        ],
      },
      TODAY,
    );
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.value.criteria).toBe('NICE');
      expect(r.value.checkups.map((c) => c.date)).toEqual(['2021-03-01', '2022-03-01', '2023-03-01']);
      expect(r.value.notes).toEqual([]);
    }
  });

  it('accepts today and the plausible bounds themselves (schema bounds: common practice)', () => {
    for (const checkup of [
      { date: '2024-06-30', hba1c: { value: 3, unit: '%' } },
      { date: '2024-06-30', hba1c: { value: 20, unit: '%' } },
      { date: '2024-06-30', hba1c: { value: 9, unit: 'mmol/mol' } },
      { date: '2024-06-30', hba1c: { value: 195, unit: 'mmol/mol' } },
      { date: '2024-06-30', fpg: { value: 1, unit: 'mmol/L' } },
      { date: '2024-06-30', fpg: { value: 50, unit: 'mmol/L' } },
      { date: '2024-06-30', fpg: { value: 18, unit: 'mg/dL' } },
      { date: '2024-06-30', fpg: { value: 900, unit: 'mg/dL' } },
      { date: '2024-02-29', fpg: { value: 5, unit: 'mmol/L' } }, // 2024 is a leap year
      { date: '1900-01-01', fpg: { value: 5, unit: 'mmol/L' } },
    ]) {
      expect(parseGlucoseHistory(oneCheckup(checkup), TODAY).ok).toBe(true);
    }
  });

  it('merges same-day results for different tests, with a note', () => {
    const r = parseGlucoseHistory(
      {
        criteria: 'ADA',
        checkups: [
          { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } },
          { date: '2023-03-01', fpg: { value: 101, unit: 'mg/dL' } },
        ],
      },
      TODAY,
    );
    expect(r.ok && r.value.checkups).toEqual([{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' }, fpg: { value: 101, unit: 'mg/dL' } }]);
    expect(r.ok && r.value.notes.map((n) => n.code)).toEqual(['same-day-merged']);
  });

  it('keeps one of two same-day reports of one result in both units, agreeing within rounding', () => {
    // 6.4 % = 46.45 mmol/mol; a lab printing 47 is within 0.5 + 0.05 × 10.93 = 1.05 (hand-computed).
    const r = parseGlucoseHistory(
      {
        criteria: 'ADA',
        checkups: [
          { date: '2023-03-01', hba1c: { value: 6.4, unit: '%' } },
          { date: '2023-03-01', hba1c: { value: 47, unit: 'mmol/mol' } },
        ],
      },
      TODAY,
    );
    expect(r.ok && r.value.checkups).toEqual([{ date: '2023-03-01', hba1c: { value: 6.4, unit: '%' } }]);
    expect(r.ok && r.value.notes[0]?.message).toMatch(/same result in two units/);
  });

  it('keeps an exact repeat once, with a note', () => {
    const entry = { date: '2023-03-01', fpg: { value: 5.8, unit: 'mmol/L' } };
    const r = parseGlucoseHistory({ criteria: 'WHO', checkups: [entry, entry] }, TODAY);
    expect(r.ok && r.value.checkups).toEqual([entry]);
    expect(r.ok && r.value.notes[0]?.message).toMatch(/given twice/);
  });
});

describe('parseGlucoseHistory: bad input becomes issues naming the checkup and field', () => {
  it('refuses an unknown unit', () => {
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: 'percent' } }))).toEqual([
      { code: 'invalid-choice', path: ['checkups', 0, 'hba1c', 'unit'], message: 'The HbA1c unit must be "%" or "mmol/mol"' },
    ]);
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { value: 5.1, unit: 'mmol/kg' } }))[0]).toMatchObject({
      code: 'invalid-choice',
      path: ['checkups', 0, 'fpg', 'unit'],
    });
  });

  it('accepts the unit spellings the FHIR import accepts (issue 11 item 11): mg/dl, mmol/l, UCUM annotations', () => {
    // UCUM: "l" and "L" are both the litre; "{…}" is an annotation, not part of the unit (from memory).
    for (const [unit, canonical, value] of [['mmol/l', 'mmol/L', 5.1], ['mg/dl', 'mg/dL', 92], ['MG/DL', 'mg/dL', 92]] as const) {
      const r = parseGlucoseHistory({ criteria: 'ADA', checkups: [{ date: '2023-03-01', fpg: { value, unit } }] }, { today: '2024-06-30' });
      expect(r.ok && r.value.checkups[0]?.fpg?.unit).toBe(canonical);
    }
    const annotated = parseGlucoseHistory({ criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%{HbA1c}' } }] }, { today: '2024-06-30' });
    expect(annotated.ok && annotated.value.checkups[0]?.hba1c?.unit).toBe('%');
  });

  it('refuses a missing unit or value', () => {
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: { value: 6.1 } }))[0]).toMatchObject({ code: 'required', path: ['checkups', 0, 'hba1c', 'unit'] });
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { unit: 'mmol/L' } }))[0]).toMatchObject({ code: 'required', path: ['checkups', 0, 'fpg', 'value'] });
  });

  it.each([
    [0, '%'],
    [-1, '%'],
    [2.9, '%'],
    [20.1, '%'],
    [8, 'mmol/mol'],
    [196, 'mmol/mol'],
  ] as const)('refuses an implausible HbA1c %d %s', (value, unit) => {
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: { value, unit } }))).toEqual([
      expect.objectContaining({ code: 'out-of-range', path: ['checkups', 0, 'hba1c', 'value'] }),
    ]);
  });

  it.each([
    [0, 'mmol/L'],
    [-5, 'mmol/L'],
    [0.9, 'mmol/L'],
    [50.1, 'mmol/L'],
    [17, 'mg/dL'],
    [901, 'mg/dL'],
  ] as const)('refuses an implausible fasting glucose %d %s', (value, unit) => {
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { value, unit } }))).toEqual([
      expect.objectContaining({ code: 'out-of-range', path: ['checkups', 0, 'fpg', 'value'] }),
    ]);
  });

  it('hints at the other unit when the value fits it', () => {
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: { value: 48, unit: '%' } }))[0]?.message).toBe(
      'The HbA1c value in % must be between 3 and 20 (got 48); 48 looks like a value in mmol/mol: check the unit',
    );
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { value: 5.6, unit: 'mg/dL' } }))[0]?.message).toMatch(/looks like a value in mmol\/L/);
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { value: 104, unit: 'mmol/L' } }))[0]?.message).toMatch(/looks like a value in mg\/dL/);
  });

  it.each([
    ['6.1', 'a string'],
    [null, 'null'],
    [true, 'a boolean'],
    [Number.NaN, 'NaN'],
    [Number.POSITIVE_INFINITY, '+Infinity'],
    [Number.NEGATIVE_INFINITY, '−Infinity'],
  ])('refuses a value that is not a number: %s (%s)', (value, _what) => {
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: { value, unit: '%' } }))).toEqual([
      expect.objectContaining({ code: 'not-a-number', path: ['checkups', 0, 'hba1c', 'value'] }),
    ]);
  });

  it.each([
    ['2023-02-29', 'invalid-date', '2023 is not a leap year'],
    ['2023-13-01', 'invalid-date', 'no month 13'],
    ['2023-04-31', 'invalid-date', 'April has 30 days'],
    ['2023-3-1', 'invalid-date', 'not zero-padded'],
    ['01.03.2023', 'invalid-date', 'not YYYY-MM-DD'],
    ['', 'invalid-date', 'empty'],
    ['1899-12-31', 'out-of-range', 'before 1900'],
    ['2024-07-01', 'future-date', 'the day after today'],
    ['2999-01-01', 'future-date', 'far future'],
  ])('refuses the date "%s" (%s: %s)', (date, code) => {
    expect(issues(oneCheckup({ date, fpg: { value: 5, unit: 'mmol/L' } }))).toEqual([
      expect.objectContaining({ code, path: ['checkups', 0, 'date'] }),
    ]);
  });

  it('refuses a missing date, a date that is not text, and a reading that is not an object', () => {
    expect(issues(oneCheckup({ fpg: { value: 5, unit: 'mmol/L' } }))).toEqual([
      expect.objectContaining({ code: 'required', path: ['checkups', 0, 'date'] }),
    ]);
    expect(issues(oneCheckup({ date: 20230301, fpg: { value: 5, unit: 'mmol/L' } }))).toEqual([
      expect.objectContaining({ code: 'wrong-type', path: ['checkups', 0, 'date'] }),
    ]);
    expect(issues(oneCheckup({ date: '2023-03-01', hba1c: 6.1 }))).toEqual([
      expect.objectContaining({ code: 'wrong-type', path: ['checkups', 0, 'hba1c'] }),
    ]);
    expect(issues(oneCheckup({ date: '2023-03-01', fpg: { value: Number.NaN, unit: 'mg/dL' } }))).toEqual([
      expect.objectContaining({ code: 'not-a-number', path: ['checkups', 0, 'fpg', 'value'] }),
    ]);
  });

  it('says which day "today" is in a future-date message', () => {
    expect(issues(oneCheckup({ date: '2024-07-01', fpg: { value: 5, unit: 'mmol/L' } }))[0]?.message).toBe(
      'The date 2024-07-01 is after today (2024-06-30): a checkup cannot be in the future',
    );
  });

  it('refuses a checkup with neither test', () => {
    expect(issues({ criteria: 'ADA', checkups: [{ date: '2022-01-01', fpg: { value: 5, unit: 'mmol/L' } }, { date: '2023-03-01' }] })).toEqual([
      { code: 'required', path: ['checkups', 1], message: 'The checkup has neither an HbA1c nor a fasting glucose: give at least one' },
    ]);
  });

  it('refuses the same date twice with different results, naming both checkups', () => {
    expect(
      issues({
        criteria: 'ADA',
        checkups: [
          { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } },
          { date: '2022-03-01', hba1c: { value: 5.9, unit: '%' } },
          { date: '2023-03-01', hba1c: { value: 6.4, unit: '%' } },
        ],
      }),
    ).toEqual([
      {
        code: 'duplicate-date',
        path: ['checkups', 2, 'hba1c', 'value'],
        message: 'Checkup [2] (2023-03-01) has a different HbA1c (6.4%) from checkup [0] on the same date (6.1%): keep one result per test and date',
      },
    ]);
  });

  it('refuses two units that do not agree for the same day (6.1 % = 43.2 mmol/mol, not 47; hand-computed)', () => {
    expect(
      issues({
        criteria: 'ADA',
        checkups: [
          { date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } },
          { date: '2023-03-01', hba1c: { value: 47, unit: 'mmol/mol' } },
        ],
      })[0],
    ).toMatchObject({ code: 'duplicate-date', path: ['checkups', 1, 'hba1c', 'value'] });
  });

  it('refuses a missing or unknown criteria set, a missing or empty checkup list, and unknown fields', () => {
    expect(issues({ checkups: [{ date: '2023-03-01', fpg: { value: 5, unit: 'mmol/L' } }] })[0]).toMatchObject({ code: 'required', path: ['criteria'] });
    expect(issues({ criteria: 'IDF', checkups: [{ date: '2023-03-01', fpg: { value: 5, unit: 'mmol/L' } }] })[0]).toMatchObject({ code: 'invalid-choice', path: ['criteria'] });
    expect(issues({ criteria: 'ADA' })[0]).toMatchObject({ code: 'required', path: ['checkups'] });
    expect(issues({ criteria: 'ADA', checkups: [] })[0]).toMatchObject({ code: 'out-of-range', path: ['checkups'] });
    expect(issues({ criteria: 'ADA', checkups: {} })[0]).toMatchObject({ code: 'wrong-type', path: ['checkups'] });
    expect(issues(oneCheckup({ date: '2023-03-01', hbA1c: { value: 6, unit: '%' }, fpg: { value: 5, unit: 'mmol/L' } }))[0]).toEqual({
      code: 'unknown-field',
      path: ['checkups', 0, 'hbA1c'],
      message: '"hbA1c" is not a field here; check its spelling',
    });
  });

  it('reports every problem at once, each with its own path', () => {
    const found = issues({
      criteria: 'ADA',
      checkups: [
        { date: '2023-02-30', hba1c: { value: 6.1, unit: '%' } },
        { date: '2023-03-01', fpg: { value: 'high', unit: 'mmol/L' } },
      ],
    });
    expect(found.map((i) => i.path)).toEqual([
      ['checkups', 0, 'date'],
      ['checkups', 1, 'fpg', 'value'],
    ]);
  });

  it('refuses input that is not an object', () => {
    for (const input of [null, undefined, 42, 'ADA', []]) {
      expect(parseGlucoseHistory(input, TODAY).ok).toBe(false);
    }
  });

  it('turns malformed JSON into an issue, never a throw', () => {
    const r = parseGlucoseHistoryJson('{"criteria": "ADA", ', TODAY);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.issues[0]?.code).toBe('invalid-json');
  });
});
