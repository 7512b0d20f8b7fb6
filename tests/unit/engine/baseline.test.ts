import { describe, expect, it } from 'vitest';
import { populationRisk, referenceRiskFromPopulation, rescaleRisk, riskFromRate } from '@/lib/engine/baseline';

describe('riskFromRate: p = 1 − exp(−λt) (Miller & Homan 1994, Med Decis Making 14:52)', () => {
  it('turns 12 events per 1000 person-years into a 10-year risk of 0.11308', () => {
    // Hand-computed: 1 − e^−0.12 = 0.1130795633.
    expect(riskFromRate(12 / 1000, 10)).toBeCloseTo(0.11307956328284252, 14);
  });

  it('is close to λt for a small rate (the usual shortcut)', () => {
    // Gidwani & Russell 2020, PharmacoEconomics 38:1153: p ≈ λt when λt is small. Hand-computed:
    // λt = 0.001 → p = 1 − e^−0.001 = 0.001 − 0.001²/2 + 0.001³/6 − … = 0.00099950017, within 5e-10 of 0.0009995.
    expect(riskFromRate(0.0001, 10)).toBeCloseTo(0.001 - 0.0000005, 9);
  });
});

describe('rescaleRisk: p2 = 1 − (1 − p1)^(t2/t1) (Miller & Homan 1994)', () => {
  it('turns a 10-year risk of 0.2 into a 5-year risk of 0.10557', () => {
    // Hand-computed: 1 − 0.8^0.5 = 1 − 0.894427191 = 0.105572809.
    expect(rescaleRisk(0.2, 10, 5)).toBeCloseTo(0.10557280900008414, 14);
  });

  it('turns a 1-year risk of 0.1 into a 2-year risk of 0.19', () => {
    // Hand-computed: 1 − 0.9² = 0.19.
    expect(rescaleRisk(0.1, 1, 2)).toBeCloseTo(0.19, 15);
  });

  it('returns the same risk for the same horizon', () => {
    // Definition: (t2/t1) = 1 leaves the risk unchanged.
    expect(rescaleRisk(0.123, 7, 7)).toBe(0.123);
  });
});

describe('referenceRiskFromPopulation: Ppop = (1 − pe)·P0 + pe·P1(P0)', () => {
  it('has the closed form P0 = Ppop / (1 − pe + pe·RR) for a risk ratio', () => {
    // Hand-computed: 0.12 / (0.8 + 0.2·2) = 0.1.
    expect(referenceRiskFromPopulation('risk-ratio', 0.12, 2, 0.2)).toBeCloseTo(0.1, 15);
  });

  it('solves the odds-ratio case', () => {
    // Hand-computed forwards: P0 = 0.1, OR = 3 → P1 = 0.3/1.2 = 0.25; pe = 0.25 →
    // Ppop = 0.75·0.1 + 0.25·0.25 = 0.1375. The solver must return 0.1 (to 1e-13).
    expect(referenceRiskFromPopulation('risk-odds-ratio', 0.1375, 3, 0.25)).toBeCloseTo(0.1, 13);
  });

  it('solves the rate-ratio case', () => {
    // Hand-computed forwards: P0 = 0.1, HR = 2 → P1 = 0.19; pe = 0.5 → Ppop = 0.145.
    expect(referenceRiskFromPopulation('rate-ratio', 0.145, 2, 0.5)).toBeCloseTo(0.1, 13);
  });

  it('solves a protective ratio (P0 above the population risk)', () => {
    // Hand-computed forwards: P0 = 0.2, HR = 0.5 → P1 = 1 − 0.8^0.5 = 0.105572809; pe = 0.4 →
    // Ppop = 0.6·0.2 + 0.4·0.105572809 = 0.1622291236.
    const ppop = 0.6 * 0.2 + 0.4 * (1 - Math.sqrt(0.8));
    expect(referenceRiskFromPopulation('rate-ratio', ppop, 0.5, 0.4)).toBeCloseTo(0.2, 13);
  });

  it('returns the population risk when nobody is exposed or the ratio is 1', () => {
    // Algebra: with pe = 0, or P1 = P0, Ppop = P0.
    expect(referenceRiskFromPopulation('risk-odds-ratio', 0.3, 4, 0)).toBe(0.3);
    expect(referenceRiskFromPopulation('rate-ratio', 0.3, 1, 0.5)).toBe(0.3);
  });

  it('handles a risk ratio whose exposed risk would pass certainty (capped at 1)', () => {
    // Hand-computed: RR = 3, pe = 0.5, Ppop = 0.8. Closed form gives 0.4, but 3·0.4 > 1; with P1
    // capped at 1, 0.5·P0 + 0.5·1 = 0.8 gives P0 = 0.6.
    const p0 = referenceRiskFromPopulation('risk-ratio', 0.8, 3, 0.5);
    expect(p0).toBeCloseTo(0.6, 12);
    expect(populationRisk('risk-ratio', p0, 3, 0.5)).toBeCloseTo(0.8, 12);
  });
});

describe('referenceRiskFromPopulation: no solution', () => {
  it('returns 1 when no reference risk below certainty fits (the engine then refuses)', () => {
    // Hand-computed: RR 0.05, pe 0.95 → even P0 = 1 gives Ppop = 0.05 + 0.95·0.05 = 0.0975;
    // a population risk of 0.2 cannot be reached.
    expect(referenceRiskFromPopulation('risk-ratio', 0.2, 0.05, 0.95)).toBe(1);
  });
});
