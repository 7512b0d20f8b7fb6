import { describe, expect, it } from 'vitest';
import { parseTable } from '@/lib/tables/parse';
import type { PopulationTable } from '@/lib/tables/schema';

/** A small valid risk table; values invented for the test (illustrative). */
function table(overrides: Partial<PopulationTable> = {}): PopulationTable {
  return {
    id: 'test-table',
    title: 'Test table',
    outcome: 'an outcome',
    horizonYears: 10,
    population: 'test population',
    source: 'test source',
    year: 2024,
    illustrative: true,
    strata: [
      { sex: 'female', ageFrom: 30, ageTo: 39, risk: 0.01 },
      { sex: 'female', ageFrom: 40, ageTo: 49, risk: 0.02 },
      { sex: 'male', ageFrom: 30, ageTo: 39, risk: 0.015 },
      { sex: 'male', ageFrom: 40, ageTo: 49, risk: 0.03 },
    ],
    ...overrides,
  };
}

function codes(input: unknown): string[] {
  const r = parseTable(input);
  return r.ok ? [] : r.issues.map((i) => i.code);
}

function issuesOf(input: unknown) {
  const r = parseTable(input);
  if (r.ok) throw new Error('expected issues');
  return r.issues;
}

describe('parseTable: valid tables', () => {
  it('accepts a risk table and returns it unchanged', () => {
    const r = parseTable(table());
    expect(r).toEqual({ ok: true, value: table() });
  });

  it('accepts a rate table without a horizon', () => {
    const { horizonYears: _h, ...rest } = table();
    const r = parseTable({ ...rest, strata: [{ sex: 'any', ageFrom: 0, ageTo: 120, rate: 2.5, perPersonYears: 1000 }] });
    expect(r.ok).toBe(true);
  });

  it('accepts extra strata carried by every stratum, each group tiling on its own', () => {
    const r = parseTable(
      table({
        strata: [
          { sex: 'any', ageFrom: 30, ageTo: 49, extra: { region: 'north' }, risk: 0.01 },
          { sex: 'any', ageFrom: 30, ageTo: 49, extra: { region: 'south' }, risk: 0.02 },
        ],
      }),
    );
    expect(r.ok).toBe(true);
  });

  it('accepts bands given in any order', () => {
    const t = table();
    expect(parseTable({ ...t, strata: [...t.strata].reverse() }).ok).toBe(true);
  });

  it('accepts a one-year band (ageFrom = ageTo; both ends included)', () => {
    expect(parseTable(table({ strata: [{ sex: 'any', ageFrom: 50, ageTo: 50, risk: 0.1 }] })).ok).toBe(true);
  });
});

describe('parseTable: stratum values', () => {
  it.each([
    [0, 'out-of-range'],
    [1, 'out-of-range'],
    [-0.1, 'out-of-range'],
    [8, 'out-of-range'],
    [Number.NaN, 'not-a-number'],
    // zod 4's z.number() refuses ±Infinity as not a finite number (zod 4 changelog, from memory).
    [Number.POSITIVE_INFINITY, 'not-a-number'],
    [Number.NEGATIVE_INFINITY, 'not-a-number'],
    ['0.08', 'not-a-number'],
  ])('refuses a risk of %s (risks lie strictly between 0 and 1)', (risk, code) => {
    const issues = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: risk as number }] }));
    expect(issues[0]).toMatchObject({ code, path: ['strata', 0, 'risk'] });
  });

  it('refuses a negative rate and a zero rate, naming the field', () => {
    for (const rate of [-1, 0]) {
      const issues = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, rate, perPersonYears: 1000 }] }));
      expect(issues[0]).toMatchObject({ code: 'out-of-range', path: ['strata', 0, 'rate'] });
      expect(issues[0]?.message).toMatch(/rate must be greater than 0/);
    }
  });

  it('needs person-years with a rate and a rate with person-years', () => {
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, rate: 2 }] }))[0]).toMatchObject({ code: 'required', path: ['strata', 0, 'perPersonYears'] });
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, perPersonYears: 1000 }] }))[0]).toMatchObject({ code: 'required', path: ['strata', 0, 'rate'] });
  });

  it('refuses a stratum with both a risk and a rate, or neither', () => {
    expect(codes(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: 0.1, rate: 2, perPersonYears: 1000 }] }))).toEqual(['stratum-form']);
    expect(codes(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39 }] }))).toEqual(['stratum-form']);
  });

  it('refuses ages that are not whole years in 0–120, and a band that ends before it starts', () => {
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30.5, ageTo: 39, risk: 0.1 }] }))[0]).toMatchObject({ path: ['strata', 0, 'ageFrom'] });
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: -1, ageTo: 39, risk: 0.1 }] }))[0]).toMatchObject({ code: 'out-of-range' });
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 121, risk: 0.1 }] }))[0]).toMatchObject({ code: 'out-of-range', path: ['strata', 0, 'ageTo'] });
    expect(issuesOf(table({ strata: [{ sex: 'any', ageFrom: 40, ageTo: 39, risk: 0.1 }] }))[0]).toMatchObject({ code: 'age-band-order', path: ['strata', 0, 'ageTo'] });
  });

  it('refuses an unknown sex and unknown stratum fields', () => {
    expect(issuesOf(table({ strata: [{ sex: 'other' as 'any', ageFrom: 30, ageTo: 39, risk: 0.1 }] }))[0]).toMatchObject({ code: 'invalid-choice', path: ['strata', 0, 'sex'] });
    const issues = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: 0.1, rsik: 0.1 } as never] }));
    expect(issues[0]).toMatchObject({ code: 'unknown-field', path: ['strata', 0, 'rsik'] });
  });
});

describe('parseTable: whole-table rules', () => {
  it('needs a horizon for a risk table', () => {
    const { horizonYears: _h, ...rest } = table();
    expect(issuesOf(rest)[0]).toMatchObject({ code: 'horizon-required', path: ['horizonYears'] });
  });

  it('refuses mixing risks and rates', () => {
    const issues = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: 0.1 }, { sex: 'any', ageFrom: 40, ageTo: 49, rate: 2, perPersonYears: 1000 }] }));
    expect(issues).toEqual([expect.objectContaining({ code: 'mixed-baseline-forms', path: ['strata', 1, 'rate'] })]);
  });

  it('refuses mixing sex "any" with female/male', () => {
    const issues = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: 0.1 }, { sex: 'female', ageFrom: 30, ageTo: 39, risk: 0.1 }] }));
    expect(issues).toEqual([expect.objectContaining({ code: 'mixed-sex-strata', path: ['strata', 1, 'sex'] })]);
  });

  it('refuses strata with different extra keys', () => {
    const issues = issuesOf(
      table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, extra: { region: 'north' }, risk: 0.1 }, { sex: 'any', ageFrom: 40, ageTo: 49, risk: 0.1 }] }),
    );
    expect(issues[0]).toMatchObject({ code: 'extra-strata-keys', path: ['strata', 1, 'extra'] });
  });

  it('finds a duplicated stratum', () => {
    const t = table();
    const issues = issuesOf({ ...t, strata: [...t.strata, { sex: 'male', ageFrom: 40, ageTo: 49, risk: 0.04 }] });
    expect(issues).toEqual([expect.objectContaining({ code: 'duplicate-stratum' })]);
    expect(issues[0]?.message).toMatch(/Stratum 5 repeats stratum 4 \(male, ages 40 to 49\)/);
  });

  it('finds overlapping bands, including one hidden inside a wider band', () => {
    const overlap = issuesOf(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 40, risk: 0.1 }, { sex: 'any', ageFrom: 40, ageTo: 49, risk: 0.1 }] }));
    expect(overlap).toEqual([expect.objectContaining({ code: 'overlapping-age-bands', path: ['strata', 1, 'ageFrom'] })]);
    // 30–59 then 40–49 then 50–59: the third band overlaps the first although not the second.
    const hidden = issuesOf(
      table({
        strata: [
          { sex: 'any', ageFrom: 30, ageTo: 59, risk: 0.1 },
          { sex: 'any', ageFrom: 40, ageTo: 49, risk: 0.1 },
          { sex: 'any', ageFrom: 50, ageTo: 59, risk: 0.1 },
        ],
      }),
    );
    expect(hidden.map((i) => [i.code, i.path])).toEqual([
      ['overlapping-age-bands', ['strata', 1, 'ageFrom']],
      ['overlapping-age-bands', ['strata', 2, 'ageFrom']],
    ]);
  });

  it('finds a gap between bands and names the missing ages', () => {
    const issues = issuesOf(table({ strata: [{ sex: 'female', ageFrom: 30, ageTo: 39, risk: 0.1 }, { sex: 'female', ageFrom: 45, ageTo: 49, risk: 0.1 }] }));
    expect(issues).toEqual([expect.objectContaining({ code: 'age-band-gap', path: ['strata', 1, 'ageFrom'] })]);
    expect(issues[0]?.message).toMatch(/Ages 40 to 44 are missing for female/);
  });

  it('refuses missing details, an empty table and a bad id', () => {
    expect(codes({})).toContain('required');
    expect(issuesOf(table({ strata: [] }))[0]).toMatchObject({ code: 'out-of-range', path: ['strata'] });
    expect(issuesOf(table({ title: '   ' }))[0]).toMatchObject({ path: ['title'] });
    expect(issuesOf(table({ id: 'Has Spaces' }))[0]).toMatchObject({ path: ['id'] });
    expect(issuesOf(table({ year: 1850 }))[0]).toMatchObject({ code: 'out-of-range', path: ['year'] });
    expect(codes(null)).toEqual(['wrong-type']);
    expect(codes('a table')).toEqual(['wrong-type']);
  });
});

describe('parseTable: messages', () => {
  it('names a one-year gap as one age, and "both sexes" for sex "any"', () => {
    const r = parseTable(table({ strata: [{ sex: 'any', ageFrom: 30, ageTo: 39, risk: 0.1 }, { sex: 'any', ageFrom: 41, ageTo: 49, risk: 0.1 }] }));
    expect(!r.ok && r.issues[0]?.message).toBe('Age 40 is missing for both sexes: stratum 1 ends at 39 and stratum 2 starts at 41');
  });
});
