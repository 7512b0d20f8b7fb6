import { describe, expect, it } from 'vitest';
import { checkupsFileNames, csvCell, summaryCsv, workersCsv } from '../../../lib/checkups/exportCsv';
import { summariseWorkforce } from '../../../lib/workforce/summary';
import { C003, W001, W002 } from './fixtures';

const ctx = { evidenceTitle: 'Demo entry', evidenceId: 'demo-x', tableTitle: 'Demo table', tableId: 'demo-t', criteria: 'ADA', date: '2025-01-02' };

describe('csvCell', () => {
  it('guards text that a spreadsheet would read as a formula, and leaves numbers alone', () => {
    // OWASP "CSV Injection" triggers = + - @ tab CR (from memory); RFC 4180 quoting
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvCell('-North')).toBe("'-North");
    expect(csvCell('@site')).toBe("'@site");
    expect(csvCell('\tx')).toBe("'\tx");
    expect(csvCell(-0.5)).toBe('-0.5');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell(null)).toBe('');
  });
});

describe('workersCsv / summaryCsv', () => {
  it('names the evidence, table, criteria and date, then one line per worker', () => {
    const lines = workersCsv([W001, W002, { ...C003, strata: { site: '=cmd' } }], ctx).split('\r\n');
    expect(lines.slice(0, 5)).toEqual(['Evidence,Demo entry (demo-x)', 'Population table,Demo table (demo-t)', 'Criteria set,ADA', 'Horizon (years),10', 'Date,2025-01-02']);
    expect(lines[7]).toBe('worker,age,sex,latest date,latest category,yearly results in run,status,risk without the exposure,risk with the exposure,lower,upper,difference,lower,upper,number needed,department,site,notes');
    expect(lines[8]?.startsWith('W001,53,female,2024-04-12,prediabetes,4,exposed,0.015,0.02389178285776514,')).toBe(true);
    expect(lines[10]).toContain(",'=cmd,");
  });

  it('writes the summary counts from the lib summary', () => {
    const csv = summaryCsv(summariseWorkforce([W001, W002, C003], { read: 10, used: 9, skipped: 1 }), ctx);
    expect(csv).toContain('\r\nWorkers,3\r\n');
    expect(csv).toContain('\r\nall,all,1,1,0,0,1\r\n');
    expect(csv).toContain('\r\nsite,North,1,1,0,0,0\r\n');
    expect(csv).toContain('\r\nExpected events at their own risk,0.02389178285776514\r\n');
  });

  it('names files by date only', () => {
    expect(checkupsFileNames('2025-01-02')).toEqual({ workers: 'checkups-workers-2025-01-02.csv', summary: 'checkups-summary-2025-01-02.csv' });
  });
});
