import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findPasteColumns, foldHeader, parsePastedRows, pasteSummary, quoteCell } from '@/lib/glycaemia/paste';
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
    // The one decimal reader (lib/text/decimal.ts) reads an exponent, as the form and the CSV
    // reader do (issue 13 item 4); the schema's range then judges the value.
    expect(readDecimal('1e3')).toBe(1000);
    expect(readDecimal('NaN')).toBe('NaN');
    expect(readDecimal('6%')).toBe('6%');
    // A comma before exactly three digits could be a thousands separator: not guessed at.
    expect(readDecimal('1,000')).toBe('1,000');
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

describe('parsePastedRows with a header that names the columns', () => {
  // Headers and values invented for the tests (illustrative).
  it('finds columns by name in any order, with units in the header, ignoring case and accents', () => {
    const r = parsePastedRows('FPG mmol/L;Datum;HBA1C (%);Note\n5,9;01.03.2023;6,1;fasting\n;2024-03-04;6.3;', 'ADA');
    expect(r.issues).toEqual([]);
    expect(r.headerSkipped).toBe(true);
    expect(r.ignoredColumns).toEqual(['Note']);
    expect(r.rows).toEqual([
      { date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '5.9', fpgUnit: 'mmol/L' },
      // The empty glucose keeps the header's unit.
      { date: '2024-03-04', hba1cValue: '6.3', hba1cUnit: '%', fpgValue: '', fpgUnit: 'mmol/L' },
    ]);
    expect(pasteSummary(r)).toBe('Added 2 rows (header line skipped; column "Note" not used).');
  });

  it('reads accented names and a unit column that belongs to the value column before it', () => {
    const r = parsePastedRows('Glycémie à jeun\tUnité\tDate\tHbA1c\tUNITÉ\n101\tmg/dl\t2023-03-01\t44\tmmol/mol', 'ADA');
    expect(r.issues).toEqual([]);
    expect(r.rows).toEqual([{ date: '2023-03-01', hba1cValue: '44', hba1cUnit: 'mmol/mol', fpgValue: '101', fpgUnit: 'mg/dL' }]);
  });

  it('reads a unit written in the cell, and leaves a two-hour glucose column out', () => {
    const r = parsePastedRows('date,HbA1c,2h glucose,fasting glucose\n2023-03-01,6.1%,9.2,104 mg/dL', 'ADA');
    expect(r.issues).toEqual([]);
    expect(r.ignoredColumns).toEqual(['2h glucose']);
    expect(r.rows).toEqual([{ date: '2023-03-01', hba1cValue: '6.1', hba1cUnit: '%', fpgValue: '104', fpgUnit: 'mg/dL' }]);
  });

  it('says what is wrong with a header it cannot use, and adds nothing', () => {
    const r = parsePastedRows('HbA1c (%)\tA1c\tNote\n6.1\t6.0\tx', 'ADA');
    expect(r.rows).toEqual([]);
    expect(r.issues).toEqual([
      { code: 'paste-header', path: ['lines', 0], message: 'Line 1 (the header): columns 1 and 2 are both read as the HbA1c ("HbA1c (%)" and "A1c"): keep one' },
      { code: 'paste-header', path: ['lines', 0], message: 'Line 1 (the header): no column is named as the date (for example "Date")' },
    ]);
    expect(pasteSummary(r)).toBe('Nothing was added: the header line cannot be read:');
  });

  it('names the real cause when a number sits where a unit is expected, never "is not an HbA1c unit"', () => {
    const r = parsePastedRows('2023-03-01\t5.7\t5.6', 'ADA');
    expect(r.rows).toEqual([]);
    expect(r.issues.map((i) => i.message)).toEqual([
      'Line 1: the HbA1c unit cell holds the number "5.6", not a unit (% or mmol/mol): without a header line the columns are read in the order date, HbA1c, HbA1c unit, fasting glucose, glucose unit, so the cell after the HbA1c must be its unit. Add a header line naming the columns (for example Date, HbA1c (%), Fasting glucose (mmol/L)) or write the unit after each value; the line was not added',
    ]);
    expect(r.issues[0]?.message).not.toMatch(/is not an HbA1c unit/);
  });

  it('refuses a unit in the cell that disagrees with the header', () => {
    const r = parsePastedRows('Date\tHbA1c (%)\n2023-03-01\t44 mmol/mol', 'ADA');
    expect(r.issues.map((i) => i.message)).toEqual(['Line 2: the HbA1c is given in mmol/mol here but in % by the header: use one; the line was not added']);
  });

  it('cuts quoted cells to a readable length', () => {
    const long = 'x'.repeat(500);
    const r = parsePastedRows(`2023-03-01\t6.1\t${long}`, 'ADA');
    const message = r.issues[0]?.message ?? '';
    expect(message).toBe(`Line 1: "${'x'.repeat(23)}…" is not an HbA1c unit (% or mmol/mol); the line was not added`);
  });

  it('lists at most 20 problem lines and counts the rest', () => {
    const text = Array.from({ length: 25 }, (_, i) => `2023-01-${String(i + 1).padStart(2, '0')}\t6.1\tbad`).join('\n');
    const r = parsePastedRows(text, 'ADA');
    expect(r.issues).toHaveLength(21);
    expect(r.issues[20]).toEqual({ code: 'too-many-problems', path: ['lines'], message: '… and 5 more lines not added, not listed here' });
    expect(r.moreProblems).toBe(5);
    expect(pasteSummary(r)).toBe('Added 0 rows. 25 lines were not added:');
  });

  it('refuses a paste of more than 500 lines of checkups before reading any (500: MAX_CHECKUPS in lib/glycaemia/schema.ts)', () => {
    const line = '2023-03-01\t6.1\t%';
    const r = parsePastedRows(['Date\tHbA1c\tUnit', ...Array.from({ length: 501 }, () => line)].join('\n'), 'ADA');
    expect(r.rows).toEqual([]);
    expect(r.issues).toEqual([
      { code: 'too-many', path: ['lines'], message: 'The paste has 501 lines of checkups; a history holds at most 500. Nothing was added: paste the most recent 500 or fewer' },
    ]);
    expect(pasteSummary(r)).toBe('The paste has 501 lines of checkups; a history holds at most 500. Nothing was added: paste the most recent 500 or fewer');
    // 500 lines are read.
    expect(parsePastedRows(Array.from({ length: 500 }, () => line).join('\n'), 'ADA').rows).toHaveLength(500);
  });

  it('finds columns from folded header text', () => {
    expect(foldHeader('  Glycémie   À JEUN ')).toBe('glycemie a jeun');
    expect(findPasteColumns(['Datum', 'FPG (mmol/L)', 'HbA1c (%)']).columns).toEqual({
      date: 0,
      hba1c: 2,
      hba1cUnit: null,
      fpg: 1,
      fpgUnit: null,
      hba1cHeaderUnit: '%',
      fpgHeaderUnit: 'mmol/L',
      inOrder: false,
      ignored: [],
    });
    expect(findPasteColumns(['Date', 'HbA1c', 'Unit', 'Fasting glucose', 'Unit']).columns.inOrder).toBe(true);
    expect(quoteCell('  a   b ')).toBe('"a b"');
  });
});
