import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  blocksOf,
  exportTableCsv,
  idFromTitle,
  MAX_REPORTED_PROBLEMS,
  MAX_TABLE_FILE_BYTES,
  MAX_TABLE_ROWS,
  parseTableCsv,
  parseTableCsvInChunks,
  utf8Length,
  type TableCsvResult,
} from '@/lib/tables/csv';
import { DEMO_TABLES } from '@/lib/tables/demo';
import { parseTable } from '@/lib/tables/parse';
import type { PopulationTable, Stratum } from '@/lib/tables/schema';

// All figures in these files are invented for the tests (illustrative numbers).
const DETAILS = `# title: Test table
# outcome: an outcome
# horizon_years: 10
# population: test population
# source: test source
# year: 2024
`;

const GOOD = `${DETAILS}sex,age_from,age_to,risk
female,30,39,0.01
female,40,49,0.02
male,30,39,0.015
male,40,49,0.03
`;

function problems(result: TableCsvResult) {
  expect(result.ok).toBe(false);
  if (result.ok) return [];
  expect('value' in result).toBe(false);
  return result.issues;
}

function only(text: string) {
  const issues = problems(parseTableCsv(text));
  expect(issues).toHaveLength(1);
  return issues[0]!;
}

describe('parseTableCsv: good files', () => {
  it('reads a risk table with its details', () => {
    const r = parseTableCsv(GOOD);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toEqual({
      id: 'test-table',
      title: 'Test table',
      outcome: 'an outcome',
      horizonYears: 10,
      population: 'test population',
      source: 'test source',
      year: 2024,
      illustrative: false,
      strata: [
        { sex: 'female', ageFrom: 30, ageTo: 39, risk: 0.01 },
        { sex: 'female', ageFrom: 40, ageTo: 49, risk: 0.02 },
        { sex: 'male', ageFrom: 30, ageTo: 39, risk: 0.015 },
        { sex: 'male', ageFrom: 40, ageTo: 49, risk: 0.03 },
      ],
    });
    expect(r.preview).toMatchObject({ delimiter: ',', columns: ['sex', 'age_from', 'age_to', 'risk'], rowCount: 4 });
    expect(r.preview.rows[0]).toEqual({ line: 8, cells: ['female', '30', '39', '0.01'] });
  });

  it('reads a rate table with an extra stratum, and no horizon', () => {
    const text = `# id: regional-rates
# title: Rates
# outcome: o
# population: p
# source: s
# year: 2020
# illustrative: yes
sex,age_from,age_to,stratum_region,rate,person_years
any,0,120,north,2.5,1000
any,0,120,south,3,1000
`;
    const r = parseTableCsv(text);
    expect(r.ok && r.value).toMatchObject({
      id: 'regional-rates',
      illustrative: true,
      strata: [
        { sex: 'any', ageFrom: 0, ageTo: 120, extra: { region: 'north' }, rate: 2.5, perPersonYears: 1000 },
        { sex: 'any', ageFrom: 0, ageTo: 120, extra: { region: 'south' }, rate: 3, perPersonYears: 1000 },
      ],
    });
    expect(r.ok && r.value.horizonYears).toBeUndefined();
  });

  it('reads what spreadsheets write: BOM, CRLF, semicolons, trailing empty cells, quoted details, blank lines, capitals', () => {
    const text = `\uFEFF"# title: Test table, by sex";;;\r\n# outcome: an outcome;;;\r\n# horizon_years: 10;;;\r\n# population: p;;;\r\n# source: Report 3; table 2;;\r\n# year: 2024;;;\r\n;;;\r\nSex;Age From;Age_To;RISK\r\nFemale;30;39;0.01\r\n;;;\r\nMALE;30;39;0.02\r\n`;
    const r = parseTableCsv(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.title).toBe('Test table, by sex');
    expect(r.value.source).toBe('Report 3; table 2');
    expect(r.value.strata).toEqual([
      { sex: 'female', ageFrom: 30, ageTo: 39, risk: 0.01 },
      { sex: 'male', ageFrom: 30, ageTo: 39, risk: 0.02 },
    ]);
    expect(r.preview.delimiter).toBe(';');
  });

  it('reads tab-separated files', () => {
    const r = parseTableCsv(GOOD.replace(/,/g, '\t'));
    expect(r.ok).toBe(true);
  });

  it('makes an id from the title when none is given', () => {
    expect(idFromTitle('Heart failure (10 y), Région Nord')).toBe('heart-failure-10-y-region-nord');
    expect(idFromTitle('!!!')).toBe('table');
  });
});

describe('parseTableCsv: every bad-input case names its row and column and yields no table', () => {
  it('an empty file', () => {
    for (const text of ['', '   \n\n', '\uFEFF']) expect(only(text)).toMatchObject({ code: 'empty-file' });
  });

  it('a huge file (more than 10 MB)', () => {
    const issue = only(GOOD + '#'.repeat(MAX_TABLE_FILE_BYTES));
    expect(issue.code).toBe('file-too-large');
    expect(issue.message).toMatch(/largest accepted is 10 MB/);
  });

  it('too many rows (more than 100,000)', () => {
    const rows = Array.from({ length: MAX_TABLE_ROWS + 1 }, (_, i) => `any,${i % 121},${i % 121},0.1`).join('\n');
    const issues = problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\n${rows}\n`));
    expect(issues.some((i) => i.code === 'too-many-rows' && i.line === 8 + MAX_TABLE_ROWS)).toBe(true);
  });

  it('details but no header, and a header but no rows', () => {
    expect(only(DETAILS)).toMatchObject({ code: 'no-header' });
    expect(only(`${DETAILS}sex,age_from,age_to,risk\n`)).toMatchObject({ code: 'no-rows' });
  });

  it('a missing column', () => {
    expect(only(`${DETAILS}sex,age_from,risk\nfemale,30,0.1\n`)).toMatchObject({ code: 'missing-column', line: 7, column: 'age_to' });
    expect(only(`${DETAILS}sex,age_from,age_to\nfemale,30,39\n`)).toMatchObject({ code: 'missing-column', column: 'risk' });
    expect(only(`${DETAILS}sex,age_from,age_to,rate\nfemale,30,39,2\n`)).toMatchObject({ code: 'missing-column', column: 'person_years' });
  });

  it('an unknown or repeated column', () => {
    const issue = only(`${DETAILS}sex,age_from,age_to,risk,colour\nfemale,30,39,0.1,red\n`);
    expect(issue).toMatchObject({ code: 'unknown-column', line: 7, column: 'colour' });
    expect(issue.message).toMatch(/^Row 7, column colour: "colour" is not a known column/);
    expect(only(`${DETAILS}sex,age_from,age_to,risk,risk\nfemale,30,39,0.1,0.1\n`)).toMatchObject({ code: 'duplicate-column', column: 'risk' });
  });

  it('both risk and rate columns', () => {
    expect(only(`${DETAILS}sex,age_from,age_to,risk,rate,person_years\nfemale,30,39,0.1,2,1000\n`)).toMatchObject({ code: 'mixed-baseline-forms' });
  });

  it.each([
    ['0', 'out-of-range'],
    ['1', 'out-of-range'],
    ['1.2', 'out-of-range'],
    ['-0.1', 'out-of-range'],
    ['8%', 'percent'],
    ['abc', 'not-a-number'],
    ['', 'required'],
    ['NaN', 'not-a-number'],
    ['Infinity', 'not-a-number'],
  ])('a risk of "%s" (risks lie strictly between 0 and 1)', (risk, code) => {
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nfemale,30,39,${risk}\n`)).toMatchObject({ code, line: 8, column: 'risk' });
  });

  it('a negative rate, and negative person-years', () => {
    const head = DETAILS.replace('# horizon_years: 10\n', '');
    const rate = only(`${head}sex,age_from,age_to,rate,person_years\nfemale,30,39,-2,1000\n`);
    expect(rate).toMatchObject({ code: 'out-of-range', line: 7, column: 'rate' });
    expect(rate.message).toMatch(/rate must be greater than 0/);
    expect(only(`${head}sex,age_from,age_to,rate,person_years\nfemale,30,39,2,-1000\n`)).toMatchObject({ code: 'out-of-range', column: 'person_years' });
  });

  it('overlapping age bands', () => {
    const issue = only(`${DETAILS}sex,age_from,age_to,risk\nfemale,30,40,0.1\nfemale,40,49,0.2\n`);
    expect(issue).toMatchObject({ code: 'overlapping-age-bands', line: 9, column: 'age_from' });
    expect(issue.message).toBe('Row 9, column age_from: This row (female, ages 40 to 49) overlaps row 8 (ages 30 to 40); both ends of a band are included, so the next band starts at 41');
  });

  it('missing age bands (a gap)', () => {
    const issue = only(`${DETAILS}sex,age_from,age_to,risk\nmale,30,39,0.1\nmale,50,59,0.2\n`);
    expect(issue).toMatchObject({ code: 'age-band-gap', line: 9, column: 'age_from' });
    expect(issue.message).toMatch(/Ages 40 to 49 are missing for male/);
  });

  it('a duplicated stratum', () => {
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nmale,30,39,0.1\nmale,30,39,0.1\n`)).toMatchObject({ code: 'duplicate-stratum', line: 9 });
  });

  it('does not report a band gap for a row whose only problem is its risk', () => {
    // The middle row's risk is bad, but its band is read, so no spurious gap between rows 8 and 10.
    const issues = problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\nmale,30,39,0.1\nmale,40,49,2\nmale,50,59,0.2\n`));
    expect(issues.map((i) => i.code)).toEqual(['out-of-range']);
  });

  it('a decimal comma in a semicolon file', () => {
    const issue = only(`${DETAILS}sex;age_from;age_to;risk\nfemale;30;39;0,08\n`);
    expect(issue).toMatchObject({ code: 'decimal-comma', line: 8, column: 'risk' });
    expect(issue.message).toMatch(/"0,08" has a comma inside a number; write numbers with a decimal point/);
  });

  it('a decimal comma in a comma file, quoted or not', () => {
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nfemale,30,39,"0,08"\n`)).toMatchObject({ code: 'decimal-comma', column: 'risk' });
    const split = only(`${DETAILS}sex,age_from,age_to,risk\nfemale,30,39,0,08\n`);
    expect(split).toMatchObject({ code: 'cell-count', line: 8 });
    expect(split.message).toMatch(/decimal comma \(e\.g\. 0,08\) splits into two cells/);
    expect(only(`${DETAILS.replace('# year: 2024', '# year: 2024')}`.replace('# horizon_years: 10', '# horizon_years: 7,5') + 'sex,age_from,age_to,risk\nany,0,120,0.1\n')).toMatchObject({
      code: 'decimal-comma',
      line: 3,
      column: 'horizon_years',
    });
  });

  it('bad sex and ages', () => {
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nwoman,30,39,0.1\n`)).toMatchObject({ code: 'invalid-choice', column: 'sex' });
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nany,30.5,39,0.1\n`)).toMatchObject({ column: 'age_from' });
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nany,40,39,0.1\n`)).toMatchObject({ code: 'age-band-order', column: 'age_to' });
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nany,80,80+,0.1\n`).message).toMatch(/open top band .* as 120/);
    expect(only(`${DETAILS}sex,age_from,age_to,risk\nany,30,39,0.1\nfemale,40,49,0.1\n`)).toMatchObject({ code: 'mixed-sex-strata', line: 9 });
  });

  it('missing, unknown, repeated and bad details', () => {
    const missing = only(GOOD.replace('# source: test source\n', ''));
    expect(missing).toMatchObject({ code: 'required', column: 'source' });
    expect(missing.message).toMatch(/add a line "# source: …"/);
    expect(only(GOOD.replace('# horizon_years: 10\n', ''))).toMatchObject({ code: 'horizon-required', column: 'horizon_years' });
    expect(only(`# colour: red\n${GOOD}`)).toMatchObject({ code: 'unknown-detail', line: 1, column: 'colour' });
    expect(only(`# title: again\n${GOOD}`)).toMatchObject({ code: 'duplicate-detail' });
    expect(only(GOOD.replace('# year: 2024', '# year: 1066'))).toMatchObject({ code: 'out-of-range', line: 6, column: 'year' });
    // A malformed line cannot be read as the year, so the year is also missing: two problems.
    expect(problems(parseTableCsv(GOOD.replace('# year: 2024', '# year 2024'))).map((i) => [i.code, i.line])).toEqual([
      ['required', undefined],
      ['detail-format', 6],
    ]);
    expect(only(`# illustrative: maybe\n${GOOD}`)).toMatchObject({ code: 'invalid-choice', column: 'illustrative' });
    expect(only(`# id: Not An Id\n${GOOD}`)).toMatchObject({ column: 'id' });
  });

  it('a header that is really a data row', () => {
    const issues = problems(parseTableCsv(`${DETAILS}female,30,39,0.1\n`));
    expect(issues.some((i) => i.code === 'no-header')).toBe(true);
  });

  it('a broken quotation mark', () => {
    expect(problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\nfemale,30,39,"0.1\n`)).some((i) => i.code === 'csv-syntax')).toBe(true);
  });

  it('lists every problem in row order, up to the cap, then says how many more', () => {
    const rows = Array.from({ length: MAX_REPORTED_PROBLEMS + 5 }, (_, i) => `any,${i},${i},2`).join('\n');
    const issues = problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\n${rows.split('\n').slice(0, 121).join('\n')}\n`));
    expect(issues).toHaveLength(121);
    expect(issues.map((i) => i.line)).toEqual([...issues.map((i) => i.line)].sort((a, b) => (a ?? 0) - (b ?? 0)));
    const many = Array.from({ length: MAX_REPORTED_PROBLEMS + 5 }, () => 'any,x,y,z').join('\n');
    const capped = problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\n${many}\n`));
    expect(capped).toHaveLength(MAX_REPORTED_PROBLEMS + 1);
    expect(capped.at(-1)?.code).toBe('too-many-problems');
  });
});

// --- Round trip -------------------------------------------------------------------------------

/** At most 2 sexes × 2 × 2 extra values = 8 groups, each with at most 6 bands. */
const MAX_GROUPS = 8;
const MAX_BANDS = 6;

/** One-line text the schema keeps as is: no line breaks, no surrounding spaces, not empty. */
const textArb = (max: number) =>
  fc
    .string({ unit: fc.constantFrom(...'abcXYZ019 ,;:"\'#éü%-_()'.split('')), minLength: 1, maxLength: max })
    .map((s) => s.trim())
    .filter((s) => s.length > 0);

/** Age bands tiling a stretch of 0–120: cut points p0 < p1 < … give bands [p_i, p_{i+1} − 1]. */
const bandsArb = fc
  .uniqueArray(fc.integer({ min: 0, max: 121 }), { minLength: 2, maxLength: MAX_BANDS + 1 })
  .map((points) => {
    const sorted = [...points].sort((a, b) => a - b);
    return sorted.slice(1).map((next, i) => [sorted[i]!, next - 1] as const);
  });

const riskArb = fc.double({ min: Number.MIN_VALUE, max: 1, noNaN: true, maxExcluded: true }).map((risk) => ({ risk }));
const rateArb = fc
  .tuple(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e9, noNaN: true }))
  .map(([rate, perPersonYears]) => ({ rate, perPersonYears }));
const horizonArb = fc.double({ min: 1e-3, max: 100, noNaN: true });

// Drawn flat and assembled in one map (nested chains made generation ~100 times slower).
const tableArb: fc.Arbitrary<PopulationTable> = fc
  .record({
    form: fc.constantFrom('risk' as const, 'rate' as const),
    sexes: fc.constantFrom(['any'] as const, ['female', 'male'] as const),
    extras: fc.uniqueArray(fc.stringMatching(/^[a-z][a-z0-9_]{0,8}$/), { maxLength: 2 }),
    extraValues: fc.uniqueArray(textArb(12), { minLength: 1, maxLength: 2 }),
    bandSets: fc.array(bandsArb, { minLength: MAX_GROUPS, maxLength: MAX_GROUPS }),
    risks: fc.array(riskArb, { minLength: MAX_GROUPS * MAX_BANDS, maxLength: MAX_GROUPS * MAX_BANDS }),
    rates: fc.array(rateArb, { minLength: MAX_GROUPS * MAX_BANDS, maxLength: MAX_GROUPS * MAX_BANDS }),
    id: fc.stringMatching(/^[a-z0-9][a-z0-9._-]{0,20}$/),
    title: textArb(40),
    outcome: textArb(40),
    horizonYears: horizonArb,
    rateHorizon: fc.option(horizonArb, { nil: undefined }),
    population: textArb(40),
    source: textArb(40),
    year: fc.integer({ min: 1900, max: 2100 }),
    illustrative: fc.boolean(),
  })
  .map(({ form, sexes, extras, extraValues, bandSets, risks, rates, horizonYears, rateHorizon, ...details }): PopulationTable => {
    const combos = extras.reduce<Record<string, string>[]>((acc, key) => acc.flatMap((c) => extraValues.map((v) => ({ ...c, [key]: v }))), [{}]);
    const groups = sexes.flatMap((sex) => combos.map((extra) => ({ sex, extra })));
    const values = form === 'risk' ? risks : rates;
    let v = 0;
    const strata = groups.flatMap((g, gi) =>
      (bandSets[gi] ?? []).slice(0, MAX_BANDS).map(([ageFrom, ageTo]): Stratum => ({
        sex: g.sex,
        ageFrom,
        ageTo,
        ...(Object.keys(g.extra).length > 0 ? { extra: g.extra } : {}),
        ...values[v++]!,
      })),
    );
    const horizon = form === 'risk' ? horizonYears : rateHorizon;
    return { ...details, ...(horizon === undefined ? {} : { horizonYears: horizon }), strata };
  });

describe('export then import', () => {
  it('gives the demo tables back identically', () => {
    for (const t of DEMO_TABLES) expect(parseTableCsv(exportTableCsv(t))).toMatchObject({ ok: true, value: t });
  });

  it('property: the generator makes valid tables (so the round trip below tests valid tables)', () => {
    fc.assert(fc.property(tableArb, (t) => parseTable(t).ok), { numRuns: 300 });
  });

  it('property: any valid table survives export then import identically', () => {
    fc.assert(
      fc.property(tableArb, (t) => {
        const r = parseTableCsv(exportTableCsv(t));
        expect(r.ok ? r.value : r.issues).toEqual(t);
        // The reader assembles the table without a final schema pass: it must still pass one.
        expect(r.ok && parseTable(r.value).ok).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });

  it('property: CRLF line ends and a byte-order mark change nothing', () => {
    fc.assert(
      fc.property(tableArb, (t) => {
        const r = parseTableCsv(`\uFEFF${exportTableCsv(t).replace(/\n/g, '\r\n')}`);
        expect(r.ok ? r.value : r.issues).toEqual(t);
      }),
      { numRuns: 200 },
    );
  });
});

describe('files that are not a CSV table', () => {
  const utf16le = (text: string) => {
    const bytes = new Uint8Array(2 + text.length * 2);
    bytes.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i++) bytes[2 + i * 2] = text.charCodeAt(i);
    return bytes;
  };

  it('a UTF-16 file gets one sentence about the encoding', () => {
    // As a browser's File.text() or the command line's UTF-8 read decodes it.
    const text = new TextDecoder('utf-8').decode(utf16le(GOOD));
    const issues = problems(parseTableCsv(text));
    expect(issues).toHaveLength(1);
    expect(issues[0]?.code).toBe('wrong-encoding');
    expect(issues[0]?.message).toMatch(/UTF-16/);
    expect(issues[0]?.message).toMatch(/CSV UTF-8/);
  });

  it('a workbook, a PDF or a picture gets one sentence, never a list of garbled problems', () => {
    const workbook = 'PK\u0003\u0004\u0014\u0000\u0006\u0000[Content_Types].xml\u0000PK\u0003\u0004xl/workbook.xml\u0000\u0000garbage,\n,,more\n';
    const pdf = '%PDF-1.7\n1 0 obj\n<< /Type /Catalog >>\nendobj\n';
    const png = new TextDecoder('utf-8').decode(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]));
    for (const [text, pattern] of [
      [workbook, /spreadsheet workbook.*save it as CSV/],
      [pdf, /PDF document/],
      [png, /PNG picture/],
    ] as const) {
      const issues = problems(parseTableCsv(text));
      expect(issues).toHaveLength(1);
      expect(issues[0]?.code).toBe('not-a-text-file');
      expect(issues[0]?.message).toMatch(pattern);
    }
  });

  it('a detail line with a broken quotation mark is refused with its row, not silently altered', () => {
    for (const bad of ['"# title: unclosed', '"# title: a"b"', '# title: x,"y']) {
      const text = `${bad}\n${GOOD.split('\n').slice(1).join('\n')}`;
      const r = parseTableCsv(text);
      expect(r.ok).toBe(false);
      const quote = problems(r).find((i) => i.code === 'csv-syntax');
      expect(quote?.line).toBe(1);
      expect(quote?.message).toMatch(/^Row 1: The detail line has a quotation mark/);
    }
  });

  it('a well-quoted detail line with doubled quotation marks is read as written', () => {
    const r = parseTableCsv(`"# title: the ""north"" table"\n${GOOD.split('\n').slice(1).join('\n')}`);
    expect(r.ok && r.value.title).toBe('the "north" table');
  });

  it('cuts a problem about an enormous cell to a readable length', () => {
    const huge = 'x'.repeat(5000);
    const issues = problems(parseTableCsv(`${DETAILS}sex,age_from,age_to,risk\nany,0,120,${huge}\n`));
    expect(issues[0]?.code).toBe('not-a-number');
    expect(issues[0]?.message.length).toBeLessThanOrEqual(300);
    expect(issues[0]?.message.endsWith('…')).toBe(true);
  });
});

describe('spreadsheet formulas in exported files', () => {
  // Stratum values chosen to look like formulas (issue 14 item 2); the numbers are illustrative.
  const formulaTable: PopulationTable = {
    id: 'formula-cells',
    title: '=HYPERLINK("http://example.invalid","click")',
    outcome: 'an outcome',
    horizonYears: 10,
    population: 'test population',
    source: 'test source',
    year: 2024,
    illustrative: true,
    strata: [
      { sex: 'any', ageFrom: 0, ageTo: 120, extra: { site: '=HYPERLINK("http://example.invalid","x")' }, risk: 0.1 },
      { sex: 'any', ageFrom: 0, ageTo: 120, extra: { site: '+cmd|calc' }, risk: 0.2 },
      { sex: 'any', ageFrom: 0, ageTo: 120, extra: { site: '@SUM(A1)' }, risk: 0.3 },
      { sex: 'any', ageFrom: 0, ageTo: 120, extra: { site: "'-north" }, risk: 0.4 },
    ],
  };

  it('writes no cell that a spreadsheet would read as a formula', () => {
    const text = exportTableCsv(formulaTable);
    const cells = text.split('\n').flatMap((line) => line.split(','));
    const bare = cells.map((c) => c.replace(/^"/, ''));
    expect(bare.filter((c) => /^[=+\-@\t\r]/.test(c))).toEqual([]);
    expect(text).toContain(`"'=HYPERLINK(""http://example.invalid"",""x"")"`);
    expect(text).toContain("''-north");
  });

  it('reads the guarded cells back to the original values', () => {
    const r = parseTableCsv(exportTableCsv(formulaTable));
    expect(r.ok ? r.value : r.issues).toEqual(formulaTable);
  });

  it('property: stratum values starting with =, +, -, @ or quotation marks survive export then import', () => {
    const formulaText = fc
      .tuple(fc.constantFrom('=', '+', '-', '@', "'", "''=", "'+", ''), textArb(10))
      .map(([lead, rest]) => `${lead}${rest}`.trim())
      .filter((s) => s.length > 0 && s.length <= 100);
    fc.assert(
      fc.property(fc.uniqueArray(formulaText, { minLength: 1, maxLength: 3 }), (values) => {
        const t: PopulationTable = { ...formulaTable, strata: values.map((site, i) => ({ sex: 'any', ageFrom: 0, ageTo: 120, extra: { site }, risk: (i + 1) / 10 })) };
        fc.pre(parseTable(t).ok);
        const r = parseTableCsv(exportTableCsv(t));
        expect(r.ok ? r.value : r.issues).toEqual(t);
      }),
      { numRuns: 500 },
    );
  });
});

describe('reading in blocks', () => {
  it('cuts only at line ends outside quotes', () => {
    const body = 'a,b\n"x\ny",1\nc,d\n';
    const blocks = [...blocksOf(body, 1)];
    expect(blocks.map((b) => b.text)).toEqual(['a,b\n', '"x\ny",1\n', 'c,d\n']);
    expect(blocks.map((b) => b.firstLine)).toEqual([0, 1, 3]);
    expect(blocks.map((b) => b.text).join('')).toBe(body);
  });

  it('property: reading in blocks of any size gives the same result as reading at once', async () => {
    await fc.assert(
      fc.asyncProperty(tableArb, fc.integer({ min: 1, max: 300 }), fc.boolean(), async (t, chunkChars, spoil) => {
        // Spoiling a risk or rate makes a bad file: the problems must match too.
        const text = spoil ? exportTableCsv(t).replace(/\n(any|female|male),/, '\n$1,-') : exportTableCsv(t);
        const progress: number[] = [];
        const chunked = await parseTableCsvInChunks(text, { chunkChars, onProgress: (p) => progress.push(p.charsDone), pause: async () => {} });
        expect(chunked).toEqual(parseTableCsv(text));
        expect(progress).toEqual([...progress].sort((a, b) => a - b));
      }),
      { numRuns: 300 },
    );
  });

  it('stops on cancel and gives no table', async () => {
    const controller = new AbortController();
    const r = await parseTableCsvInChunks(GOOD, { chunkChars: 10, signal: controller.signal, pause: async () => controller.abort() });
    expect(problems(r)[0]?.code).toBe('cancelled');
  });

  it('counts UTF-8 bytes (hand-computed: a=1, é=2, €=3, 😀=4 bytes)', () => {
    expect(utf8Length('aé€😀')).toBe(10);
  });
});

describe('docs/table-format.md', () => {
  it('its example file is a valid table', async () => {
    const { readFile } = await import('node:fs/promises');
    const doc = await readFile(new URL('../../../docs/table-format.md', import.meta.url), 'utf8');
    const example = /```csv\n([\s\S]*?)```/.exec(doc)?.[1] ?? '';
    const r = parseTableCsv(example);
    expect(r.ok ? r.value.strata.length : r.issues).toBe(10);
    expect(r.ok && r.value.id).toBe('north-heart-failure-10y');
  });
});
