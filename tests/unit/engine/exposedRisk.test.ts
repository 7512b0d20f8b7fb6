import { describe, expect, it } from 'vitest';
import { exposedRisk, exposedRiskCapped, exposedRiskSlope, ratioFromRisks } from '@/lib/engine/exposedRisk';
import { conversionFor } from '@/lib/engine/conversion';
import { riskFromRate } from '@/lib/engine/baseline';
import { STUDY_DESIGNS } from '@/lib/scenario/schema';

describe('conversionFor', () => {
  it('treats an odds ratio by what its design estimates', () => {
    // Zhang & Yu 1998, JAMA 280:1690 (risk odds ratio); Rodrigues & Kirkwood 1990, Int J Epidemiol
    // 19:205 (risk-set sampling estimates the rate ratio; case-cohort sampling the risk ratio).
    expect(conversionFor('OR', 'cohort')).toBe('risk-odds-ratio');
    expect(conversionFor('OR', 'trial')).toBe('risk-odds-ratio');
    expect(conversionFor('OR', 'cross-sectional')).toBe('risk-odds-ratio');
    expect(conversionFor('OR', 'case-control')).toBe('risk-odds-ratio');
    expect(conversionFor('OR', 'risk-set-case-control')).toBe('rate-ratio');
    expect(conversionFor('OR', 'case-cohort')).toBe('risk-ratio');
  });

  it.each(STUDY_DESIGNS)('uses the measure itself for RR and HR whatever the design (%s)', (design) => {
    // Definition (RR); Altman & Andersen 1999, BMJ 319:1492 (HR under proportional hazards).
    expect(conversionFor('RR', design)).toBe('risk-ratio');
    expect(conversionFor('HR', design)).toBe('rate-ratio');
  });
});

describe('exposedRisk: risk odds ratio (Zhang & Yu 1998)', () => {
  it('gives RR = OR / (1 − P0 + P0·OR) at P0 = 0.1, OR = 2', () => {
    // Hand-computed from Zhang & Yu's formula: RR = 2 / (0.9 + 0.2) = 1.8181…, P1 = 0.1818…
    expect(exposedRisk('risk-odds-ratio', 0.1, 2)).toBeCloseTo(0.2 / 1.1, 15);
  });

  it('recovers the exposed risk of a crude cohort 2×2 table exactly', () => {
    // Hand-computed from the definitions: 60 events among 200 exposed (P1 = 0.3), 30 among 300
    // unexposed (P0 = 0.1); OR = (60/140)/(30/270) = 3.857142857. For a crude table the
    // Zhang–Yu formula is an identity, so it must give back 0.3 (to rounding, 1e-15).
    const or = (60 / 140) / (30 / 270);
    expect(or).toBeCloseTo(3.857142857142857, 12);
    expect(exposedRisk('risk-odds-ratio', 0.1, or)).toBeCloseTo(0.3, 15);
  });

  it('is the risk ratio itself for a rare outcome', () => {
    // Zhang & Yu 1998: the OR approximates the RR when the outcome is rare (< 10%).
    // Hand-computed: P0 = 0.001, OR = 2 → P1 = 0.002 / 1.001 = 0.001998…, within 0.1% of RR·P0.
    expect(exposedRisk('risk-odds-ratio', 0.001, 2) / 0.002).toBeCloseTo(1 / 1.001, 12);
  });
});

describe('exposedRisk: rate ratio (proportional hazards)', () => {
  it('matches exponential survival: 1 − (1 − P0)^HR = 1 − exp(−HR·λ·t)', () => {
    // Altman & Andersen 1999, BMJ 319:1492 (S1 = S0^HR, from memory for the formula). Hand-computed
    // with λ = 0.02/yr, t = 5: P0 = 1 − e^−0.1 = 0.0951625820, P1 = 1 − e^−0.15 = 0.1392920236.
    const p0 = riskFromRate(0.02, 5);
    expect(p0).toBeCloseTo(0.09516258196404048, 14);
    expect(exposedRisk('rate-ratio', p0, 1.5)).toBeCloseTo(0.1392920235749422, 14);
  });

  it('gives 1 − 0.9² = 0.19 at P0 = 0.1, HR = 2', () => {
    // Hand-computed: 1 − (1 − 0.1)^2 = 1 − 0.81.
    expect(exposedRisk('rate-ratio', 0.1, 2)).toBeCloseTo(0.19, 15);
  });

  it('keeps precision for very small risks', () => {
    // Hand-computed: for P0 = 1e-12, 1 − (1 − P0)^2 = 2e-12 − 1e-24; naive pow would lose it.
    expect(exposedRisk('rate-ratio', 1e-12, 2)).toBeCloseTo(2e-12, 22);
  });
});

describe('exposedRisk: risk ratio', () => {
  it('multiplies the baseline (definition)', () => {
    // Hand-computed: 1.5·0.08 = 0.12.
    expect(exposedRisk('risk-ratio', 0.08, 1.5)).toBeCloseTo(0.12, 15);
  });

  it('is capped at certainty when RR·P0 ≥ 1', () => {
    // Definition: a risk cannot exceed 1. Hand-computed: 2·0.6 = 1.2, capped at 1.
    expect(exposedRisk('risk-ratio', 0.6, 2)).toBeCloseTo(1.2, 15);
    expect(exposedRiskCapped('risk-ratio', 0.6, 2)).toBe(1);
  });
});

describe('exposedRisk: a ratio of 1 (no effect)', () => {
  it.each(['risk-ratio', 'risk-odds-ratio', 'rate-ratio'] as const)('gives back P0 exactly for %s', (conversion) => {
    // Definition: RR·P0, P0/(1 − P0 + P0) and 1 − (1 − P0)^1 are all P0. Computed through
    // expm1/log1p, 1 − (1 − 0.061)^1 is 0.06099999999999999 (measured), so exactness is tested.
    for (const p0 of [0.061, 0.116, 0.118, 0.123, 1e-7, 0.5, 0.999]) {
      expect(exposedRisk(conversion, p0, 1)).toBe(p0);
    }
  });
});

describe('ratioFromRisks inverts exposedRisk', () => {
  it.each([
    ['risk-ratio', 0.1, 1.7],
    ['risk-odds-ratio', 0.25, 3.2],
    ['rate-ratio', 0.3, 0.6],
  ] as const)('%s at P0 = %s, ratio %s', (conversion, p0, ratio) => {
    // Algebraic inverse (hand-derived); round trip to 1e-12.
    expect(ratioFromRisks(conversion, p0, exposedRisk(conversion, p0, ratio))).toBeCloseTo(ratio, 12);
  });
});

describe('exposedRiskSlope', () => {
  it.each([
    ['risk-ratio', 0.1, 1.7],
    ['risk-odds-ratio', 0.25, 3.2],
    ['rate-ratio', 0.3, 0.6],
  ] as const)('agrees with a central difference for %s', (conversion, p0, ratio) => {
    // Numerical derivative with h = 1e-6: truncation error O(h²) ≈ 1e-12, rounding ≈ 1e-10, so 1e-7 is safe.
    const h = 1e-6;
    const numeric = (exposedRisk(conversion, p0 + h, ratio) - exposedRisk(conversion, p0 - h, ratio)) / (2 * h);
    expect(Math.abs(exposedRiskSlope(conversion, p0, ratio) - numeric)).toBeLessThan(1e-7);
  });
});
