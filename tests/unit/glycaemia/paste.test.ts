import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parsePastedRows, pasteSummary } from '@/lib/glycaemia/paste';
import { draftsToCheckups, readDecimal } from '@/lib/glycaemia/draft';

// Pasted text invented for the tests (illustrative values).

describe('parsePastedRows', () => {
  it('reads tab-separated rows with a header, decimal commas and lower-case units', () => {
    const r = parsePastedRows('Date\tHbA1c\tUnit\tFPG\tUnit\n2021-03-01\t5,9\t%\t5,6\tmmol/l\n2022-03-01\t42\tmmol/mol\t\t\n', 'ADA');
    expect(r.headerSkipped).toBe(true);
    expect(r.issues).toEqual([]);
    expect(r.rows).toEqual([
      { date: '2021-03-01', hba1cValue: '5.9', hba1cUnit: '%', fpgValue: '5.6', fpgUnit: 'mmol/L' },
      { date: '2022-03-01', hba1cValue: '42', hba1cUnit: 'mmol/mol', fpgValue: '', fpgUnit: 'mg/dL' },
    ]);
  });

  it('reads comma-separated rows, with quoted cells', () => {
    const r = parsePastedRows('2021-03-01,6.0,%,101,mg/dL\n2022-03-01,"6,2",%,,\r\n', 'ADA');
    expect(r.headerSkipped).toBe(false);
    expect(r.rows).toEqual([
      { date: '2021-03-01', hba1cValue: '6.0', hba1cUnit: '%', fpgValue: '101', fpgUnit: 'mg/dL' },
      { date: '2022-03-01', hba1cValue: '6.2', hba1cUnit: '%', fpgValue: '', fpgUnit: 'mg/dL' },
    ]);
  });

  it('reads semicolon-separated rows and day-first dotted dates', () => {
    const r = parsePastedRows('01.03.2021;;;5,8;mmol/L\n1.3.2022;6,1;%;;', 'NICE');
    expect(r.rows.map((row) => row.date)).toEqual(['2021-03-01', '2022-03-01']);
    expect(r.rows[0]).toMatchObject({ hba1cValue: '', fpgValue: '5.8', fpgUnit: 'mmol/L', hba1cUnit: 'mmol/mol' });
  });

  it('skips blank lines and trailing empty cells', () => {
    const r = parsePastedRows('\n\n2021-03-01\t6.0\t%\t\t\t\t\n\n', 'ADA');
    expect(r.rows).toHaveLength(1);
    expect(r.issues).toEqual([]);
  });

  it('keeps bad values and dates in the row, for the row to show the error', () => {
    const r = parsePastedRows('2021-02-30\thigh\t%\t\t', 'ADA');
    expect(r.rows).toEqual([{ date: '2021-02-30', hba1cValue: 'high', hba1cUnit: '%', fpgValue: '', fpgUnit: 'mg/dL' }]);
  });

  it('reports lines it cannot turn into rows, by line number, and adds the others', () => {
    const r = parsePastedRows(['2021-03-01\t6.0\tmg%\t\t', '2022-03-01\t6.1\t\t\t', '2023-03-01\t\t\t5.9\tmmol', '2023-06-01\t1\t%\t2\tmg/dL\textra', '2024-03-01\t6.2\t%\t\t'].join('\n'), 'ADA');
    expect(r.rows.map((row) => row.date)).toEqual(['2024-03-01']);
    expect(r.issues).toEqual([
      { code: 'paste-line', path: ['lines', 0], message: 'Line 1: "mg%" is not an HbA1c unit (% or mmol/mol); the line was not added' },
      { code: 'paste-line', path: ['lines', 1], message: 'Line 2: the HbA1c has no unit (% or mmol/mol); the line was not added' },
      { code: 'paste-line', path: ['lines', 2], message: 'Line 3: "mmol" is not a glucose unit (mg/dL or mmol/L); the line was not added' },
      {
        code: 'paste-line',
        path: ['lines', 3],
        message: 'Line 4: 6 cells, but at most 5 are read (date, HbA1c, HbA1c unit, fasting glucose, glucose unit); the line was not added',
      },
    ]);
  });

  it('gives nothing for empty text', () => {
    expect(parsePastedRows('', 'WHO')).toEqual({ rows: [], issues: [], headerSkipped: false });
    expect(parsePastedRows('  \n \n', 'WHO')).toEqual({ rows: [], issues: [], headerSkipped: false });
  });

  it('never throws, and every non-blank line becomes a row, an issue or the header (property, 1000 runs)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), (text) => {
        const r = parsePastedRows(text, 'ADA');
        const nonBlank = text.split(/\r\n|\n|\r/).filter((l) => l.trim() !== '').length;
        expect(r.rows.length + r.issues.length + (r.headerSkipped ? 1 : 0)).toBe(nonBlank);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('drafts → history input', () => {
  it('reads decimals with a point or a comma, and passes anything else on for the schema to refuse', () => {
    expect(readDecimal(' 6,1 ')).toBe(6.1);
    expect(readDecimal('48')).toBe(48);
    expect(readDecimal('-2')).toBe(-2);
    expect(readDecimal('')).toBeUndefined();
    expect(readDecimal('6.1.2')).toBe('6.1.2');
    expect(readDecimal('1e3')).toBe('1e3');
    expect(readDecimal('NaN')).toBe('NaN');
  });

  it('leaves blank rows out and remembers which row each checkup came from', () => {
    const blank = { date: '', hba1cValue: '', hba1cUnit: '%' as const, fpgValue: '', fpgUnit: 'mg/dL' as const };
    const { checkups, rowOf } = draftsToCheckups([blank, { ...blank, date: '2023-03-01', fpgValue: '101' }, blank]);
    expect(checkups).toEqual([{ date: '2023-03-01', fpg: { value: 101, unit: 'mg/dL' } }]);
    expect(rowOf).toEqual([1]);
  });
});

describe('pasteSummary', () => {
  it('says how many rows were added and how many lines were not', () => {
    expect(pasteSummary(parsePastedRows('date\tHbA1c\n2021-03-01\t6\t%\t\t\n2022-03-01\t6\tx\t\t', 'ADA'))).toBe('Added 1 row (header line skipped). 1 line was not added:');
    expect(pasteSummary(parsePastedRows('2021-03-01\t6\t%\n2022-03-01\t6\t%', 'ADA'))).toBe('Added 2 rows.');
  });
});
