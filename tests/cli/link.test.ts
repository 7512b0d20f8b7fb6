import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeScenarioQuery } from '@/lib/link';
import { ensureBuilt, runCli } from './runCli';

// The expected link is written out by hand from the parameter table in lib/link/scenarioLink.ts.
// Scenarios are illustrative numbers, not from a real population or study.

const scenario = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };

let dir = '';
beforeAll(async () => {
  await ensureBuilt();
  dir = await mkdtemp(join(tmpdir(), 'hundredfold-link-'));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('hundredfold link (spawned)', () => {
  it('prints the path and fragment that open the scenario, one line', async () => {
    const r = await runCli(['link'], JSON.stringify(scenario));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toBe('/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9\n');
  });

  it('reads --input FILE; the link, and the same fragment on /handout, decode to the scenario', async () => {
    const full = {
      baseline: { populationRisk: 0.1, exposurePrevalence: 0.3, years: 10 },
      effect: { measure: 'OR', estimate: 2, lower: 1.5, upper: 2.7, level: 0.9, design: 'risk-set-case-control', adjusted: false },
      horizonYears: 5,
      wording: { outcome: 'heart attack & stroke', population: 'adults 40–70 # "illustrative"', citation: 'a=b?c' },
      person: { age: 55, sex: 'male' },
    };
    const file = join(dir, 'full.json');
    await writeFile(file, JSON.stringify(full));
    const r = await runCli(['link', '--input', file]);
    expect(r.code).toBe(0);
    const link = r.stdout.trimEnd();
    expect(link.startsWith('/#')).toBe(true);
    expect(link).not.toContain('\n');
    expect(decodeScenarioQuery(link)).toEqual({ ok: true, value: full });
    expect(decodeScenarioQuery(`/handout${link.slice(1)}`)).toEqual({ ok: true, value: full });
  });

  it('refuses an invalid scenario like compute does: exit 2, one stderr line, no stdout', async () => {
    const r = await runCli(['link'], JSON.stringify({ ...scenario, effect: { ...scenario.effect, upper: 1.1 } }));
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^hundredfold: effect\.lower: The lower limit \(1\.2\) must be less than the upper limit \(1\.1\)[^\n]*\n$/);
  });
});
