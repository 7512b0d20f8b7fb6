import { describe, expect, it } from 'vitest';
import { jStat } from 'jstat';
import { probit } from 'simple-statistics';
import { zForLevel } from '@/lib/stats/normalQuantile';
import { INTERVAL_LEVELS } from '@/lib/scenario/schema';

describe('zForLevel', () => {
  it('gives z(0.975) = 1.959963984540054 for a 95% interval', () => {
    // Cochrane Handbook §7.7.7.3 (value quoted in shared/guides/methods.md).
    expect(zForLevel(0.95)).toBe(1.959963984540054);
  });

  it.each(INTERVAL_LEVELS)('agrees with jstat.normal.inv for level %s', (level) => {
    // jstat 1.9.6 normal.inv is an independent implementation of Φ⁻¹; it agrees to ~1e-9 or better,
    // so a tolerance of 1e-8 is honest.
    expect(Math.abs(zForLevel(level) - jStat.normal.inv((1 + level) / 2, 0, 1))).toBeLessThan(1e-8);
  });

  it.each(INTERVAL_LEVELS)('agrees with simple-statistics probit for level %s', (level) => {
    // simple-statistics 7.12 probit goes through a coarse inverse-error-function approximation:
    // measured here it is off by 1.4e-3 (0.90), 2.8e-3 (0.95) and 6.7e-3 (0.99). A tolerance of
    // 1e-2 is therefore honest; this check only guards against a gross slip such as a one-sided z.
    expect(Math.abs(zForLevel(level) - probit((1 + level) / 2))).toBeLessThan(1e-2);
  });
});

describe('zForLevel at any level from 80% to 99.9% (issue 11 item 10)', () => {
  const levels = [0.8, 0.85, 0.9, 0.925, 0.95, 0.96, 0.975, 0.98, 0.99, 0.995, 0.999];
  it.each(levels)('agrees with jstat.normal.inv at level %s to 1e-8', (level) => {
    // jstat 1.9.6 normal.inv: an independent implementation of Φ⁻¹ (test oracle, not the code under test).
    expect(Math.abs(zForLevel(level) - jStat.normal.inv((1 + level) / 2, 0, 1))).toBeLessThan(1e-8);
  });

  it('gives the tabulated z for 97.5% and 99.9% (standard normal tables, from memory)', () => {
    // z(0.9875) = 2.2414 and z(0.9995) = 3.2905 in printed tables of the standard normal (from memory).
    expect(zForLevel(0.975)).toBeCloseTo(2.2414, 4);
    expect(zForLevel(0.999)).toBeCloseTo(3.2905, 4);
    expect(zForLevel(0.8)).toBeCloseTo(1.2816, 4);
  });
});
