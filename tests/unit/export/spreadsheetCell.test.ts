import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { FORMULA_TRIGGERS, guardTextCell, startsLikeFormula, unguardTextCell } from '@/lib/export/spreadsheetCell';

// The triggers are those named in issue 14 item 2 (=, +, -, @, tab, carriage return); the
// quotation-mark guard is common practice (OWASP "CSV Injection", from memory).
const trickyText = fc.string({ unit: fc.constantFrom(...`=+-@\t\r'"a1 ,;#`.split('')), maxLength: 12 });

describe('guardTextCell', () => {
  it('puts a quotation mark in front of each formula trigger', () => {
    expect(guardTextCell('=HYPERLINK("http://example.invalid","x")')).toBe(`'=HYPERLINK("http://example.invalid","x")`);
    expect(guardTextCell('+cmd|x')).toBe("'+cmd|x");
    expect(guardTextCell('-1+2')).toBe("'-1+2");
    expect(guardTextCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(guardTextCell('\tx')).toBe("'\tx");
    expect(guardTextCell('\rx')).toBe("'\rx");
  });

  it('leaves ordinary text alone', () => {
    for (const text of ['north', '', 'a=b', ' =x', '#1', "it's"]) expect(guardTextCell(text)).toBe(text);
  });

  it('marks text that already starts with quotation marks before a trigger once more, so it reads back', () => {
    expect(guardTextCell("'=x")).toBe("''=x");
    expect(unguardTextCell("''=x")).toBe("'=x");
    expect(unguardTextCell("'north")).toBe("'north");
  });

  it('property: no guarded cell starts like a formula', () => {
    fc.assert(fc.property(trickyText, (s) => !startsLikeFormula(guardTextCell(s))), { numRuns: 2000 });
  });

  it('property: unguarding a guarded cell gives the original text', () => {
    fc.assert(fc.property(fc.oneof(trickyText, fc.string()), (s) => unguardTextCell(guardTextCell(s)) === s), { numRuns: 2000 });
  });

  it('property: text that does not start like a formula (after any quotation marks) is written unchanged', () => {
    fc.assert(
      fc.property(trickyText, (s) => {
        fc.pre(!startsLikeFormula(s.replace(/^'+/, '')));
        return guardTextCell(s) === s;
      }),
      { numRuns: 1000 },
    );
  });

  it('names exactly the six triggers', () => {
    expect([...FORMULA_TRIGGERS].sort()).toEqual(['\t', '\r', '+', '-', '=', '@'].sort());
  });
});
