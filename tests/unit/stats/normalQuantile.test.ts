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
