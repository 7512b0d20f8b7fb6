import { describe, expect, it } from 'vitest';
import { exportTableCsv, parseTableCsv } from '@/lib/tables/csv';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';

// Issue 11 item 3: a table's exposure prevalence in the CSV format, as a "# exposure_prevalence:"
// detail for the whole table and an "exposure_prevalence" column per stratum. Values illustrative.
const head = '# title: T\n# outcome: O\n# horizon_years: 10\n# population: P\n# source: S\n# year: 2024\n';

describe('the exposure prevalence in a table file', () => {
  it('reads the detail for the whole table', () => {
    const r = parseTableCsv(`${head}# exposure_prevalence: 0.25\nsex,age_from,age_to,risk\nany,30,79,0.05\n`);
    expect(r.ok && r.value.exposurePrevalence).toBe(0.25);
  });

  it('reads a column per stratum, an empty cell leaving the table’s', () => {
    const r = parseTableCsv(`${head}sex,age_from,age_to,risk,exposure_prevalence\nany,30,49,0.05,0.1\nany,50,79,0.08,\n`);
    expect(r.ok && r.value.strata).toEqual([
      { sex: 'any', ageFrom: 30, ageTo: 49, risk: 0.05, exposurePrevalence: 0.1 },
      { sex: 'any', ageFrom: 50, ageTo: 79, risk: 0.08 },
    ]);
  });

  it('refuses a prevalence of 1 or a percentage, naming the row and column', () => {
    const one = parseTableCsv(`${head}sex,age_from,age_to,risk,exposure_prevalence\nany,30,79,0.05,1\n`);
    expect(one.ok).toBe(false);
    if (!one.ok) expect(JSON.stringify(one.issues)).toContain('exposure_prevalence');
    const percent = parseTableCsv(`${head}# exposure_prevalence: 30%\nsex,age_from,age_to,risk\nany,30,79,0.05\n`);
    expect(percent.ok).toBe(false);
    if (!percent.ok) expect(JSON.stringify(percent.issues)).toContain('for 30% write 0.3');
  });

  it('writes both back so the table reads the same', () => {
    const table: PopulationTable = {
      ...DEMO_HEART_FAILURE_10Y,
      exposurePrevalence: 0.2,
      strata: DEMO_HEART_FAILURE_10Y.strata.map((s, i) => (i === 0 ? { ...s, exposurePrevalence: 0.15 } : s)),
    };
    const text = exportTableCsv(table);
    expect(text).toContain('# exposure_prevalence: 0.2\n');
    expect(text).toMatch(/,exposure_prevalence\n/);
    const back = parseTableCsv(text);
    expect(back.ok && back.value).toEqual(table);
  });
});
