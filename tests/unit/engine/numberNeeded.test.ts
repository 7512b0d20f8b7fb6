import { describe, expect, it } from 'vitest';
import { numberNeeded, roundUpPeople } from '@/lib/engine/numberNeeded';

describe('numberNeeded = 1/|RD|, rounded up (Cochrane Handbook §12.5.4.1; Cook & Sackett 1995, BMJ 310:452)', () => {
  it('gives NNTH 25 for RD = 0.12 − 0.08, despite floating-point noise', () => {
    // Hand-computed: 1/0.04 = 25. In binary 0.12 − 0.08 = 0.039999999999999994, so 1/RD computes as
    // 25.000000000000004; rounding up must still give 25 people, not 26.
    const rd = 0.12 - 0.08;
    const nn = numberNeeded({ estimate: rd, lower: 0.016, upper: 0.072 }, 0.95);
    expect(nn.direction).toBe('harm');
    expect(nn.estimate).toBeCloseTo(25, 12);
    expect(nn.display).toBe(25);
    expect(nn.crossesNull).toBe(false);
    // Hand-computed limits: 1/0.016 = 62.5 → 63; 1/0.072 = 13.89 → 14.
    expect(nn.interval.from).toEqual({ direction: 'harm', value: 62.5, display: 63 });
    expect(nn.interval.to.display).toBe(14);
    expect(nn.text).toBe('NNTH 25 (95% CI: NNTH 14 to 63)');
  });

  it('gives NNTB for a risk reduction', () => {
    // Hand-computed: RD = −0.05 → NNTB 20; limits −0.1 → 10 and −0.02 → 50.
    const nn = numberNeeded({ estimate: -0.05, lower: -0.1, upper: -0.02 }, 0.9);
    expect(nn.direction).toBe('benefit');
    expect(nn.display).toBe(20);
    expect(nn.text).toBe('NNTB 20 (90% CI: NNTB 10 to 50)');
  });

  it('runs from NNTB through infinity to NNTH when the RD interval includes 0', () => {
    // Altman 1998, BMJ 317:1309: the interval is written NNTB a to ∞ to NNTH b.
    // Hand-computed: 1/0.005 = 200 (benefit side), 1/0.08 = 12.5 → 13 (harm side).
    const nn = numberNeeded({ estimate: 0.04, lower: -0.005, upper: 0.08 }, 0.95);
    expect(nn.crossesNull).toBe(true);
    expect(nn.interval.from).toEqual({ direction: 'benefit', value: 200, display: 200 });
    expect(nn.interval.to).toEqual({ direction: 'harm', value: 12.5, display: 13 });
    expect(nn.text).toBe('NNTH 25 (95% CI: NNTB 200 to ∞ to NNTH 13)');
  });

  it('says "no difference" and gives no finite number when RD = 0', () => {
    // Definition: 1/0 is infinite; JSON has no infinity, so null.
    const nn = numberNeeded({ estimate: 0, lower: -0.01, upper: 0.02 }, 0.99);
    expect(nn.direction).toBe('none');
    expect(nn.estimate).toBeNull();
    expect(nn.display).toBeNull();
    expect(nn.text).toBe('No difference (99% CI: NNTB 100 to ∞ to NNTH 50)');
  });

  it('writes a limit exactly at 0 as infinity', () => {
    // Altman 1998: a limit of RD = 0 is an infinite NNT.
    const nn = numberNeeded({ estimate: 0.02, lower: 0, upper: 0.05 }, 0.95);
    expect(nn.crossesNull).toBe(true);
    expect(nn.interval.from).toEqual({ direction: 'none', value: null, display: null });
    // Issue 11 item 12: the interval is written from its finite end (was "∞ to NNTH 20").
    expect(nn.text).toBe('NNTH 50 (95% CI: NNTH 20 to ∞)');
  });

  it('writes an upper limit exactly at 0 from the finite benefit end', () => {
    // Altman 1998: RD upper limit 0 is an infinite NNT; hand-computed 1/0.04 = 25, 1/0.02 = 50.
    const nn = numberNeeded({ estimate: -0.02, lower: -0.04, upper: 0 }, 0.95);
    expect(nn.text).toBe('NNTB 50 (95% CI: NNTB 25 to ∞)');
  });

  it('says "more than a million" for an astronomically large number needed (issue 11 item 13)', () => {
    // Hand-computed: 1/1e-17 = 1e17 people, far beyond a million; 1/5e-324 overflows to Infinity.
    expect(numberNeeded({ estimate: 1e-17, lower: 5e-18, upper: 2e-17 }, 0.95).text).toBe(
      'NNTH more than a million (95% CI: NNTH more than a million to more than a million)',
    );
    expect(numberNeeded({ estimate: 5e-324, lower: 5e-324, upper: 5e-324 }, 0.95).text).not.toMatch(/Infinity|e\+/);
    // 1/0.000001 = 1,000,000 exactly is still written as a number.
    expect(numberNeeded({ estimate: 0.000001, lower: 0.000001, upper: 0.000002 }, 0.95).text).toBe('NNTH 1000000 (95% CI: NNTH 500000 to 1000000)');
  });

  it('writes any interval level with its decimal (issue 11 item 10)', () => {
    expect(numberNeeded({ estimate: 0.04, lower: 0.02, upper: 0.08 }, 0.975).text).toBe('NNTH 25 (97.5% CI: NNTH 13 to 50)');
  });
});

describe('roundUpPeople', () => {
  it.each([
    [25.000000000000004, 25],
    [12.5, 13],
    [1, 1],
    [1.0000001, 2],
    [53921118117.029, 53921118118],
  ])('rounds %s up to %s', (value, expected) => {
    // Common practice: a number needed is rounded up to a whole person; 1e-9 people of slack only
    // forgives floating-point noise.
    expect(roundUpPeople(value)).toBe(expected);
  });
});
