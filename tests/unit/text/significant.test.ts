/**
 * Numbers read from files at 15 significant digits (lib/text/significant.ts).
 * Sources: IEEE 754-2008 binary64 round-trips every decimal of at most 15 significant digits
 * (the C standard's DBL_DIG = 15, ISO/IEC 9899 <float.h>); the noisy doubles below are what
 * ECMAScript itself writes for these sums and products (checked with Number.prototype.toString,
 * i.e. ECMA-262 Number::toString, not with the code under test).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atFileDigits, SIGNIFICANT_DIGITS } from '@/lib/text/significant';

describe('atFileDigits', () => {
  it('takes the binary noise off values a formula wrote', () => {
    expect(String(0.1 + 0.2)).toBe('0.30000000000000004'); // ECMA-262 Number::toString
    expect(atFileDigits(0.1 + 0.2)).toBe(0.3);
    expect(atFileDigits(6.1000000000000005)).toBe(6.1);
    expect(atFileDigits(5.6999999999999993)).toBe(5.7);
    expect(String(0.7 + 0.1)).toBe('0.7999999999999999'); // ECMA-262 Number::toString
    expect(atFileDigits(0.7 + 0.1)).toBe(0.8);
  });

  it('leaves a number of 15 significant digits or fewer exactly as written (DBL_DIG = 15)', () => {
    expect(SIGNIFICANT_DIGITS).toBe(15);
    for (const text of ['5.7', '6.25', '48', '0.000123', '123456789012345', '5.55555555555556', '1e-9', '-7.25']) {
      expect(atFileDigits(Number(text))).toBe(Number(text));
    }
    fc.assert(
      fc.property(fc.bigInt({ min: 0n, max: 10n ** 15n - 1n }), fc.integer({ min: -20, max: 20 }), fc.boolean(), (digits, exponent, negative) => {
        const value = Number(`${negative ? '-' : ''}${digits}e${exponent}`);
        expect(atFileDigits(value)).toBe(value);
      }),
    );
  });

  it('gives back zero (−0 too) and what is not finite as it was', () => {
    expect(Object.is(atFileDigits(-0), -0)).toBe(true);
    expect(atFileDigits(Number.POSITIVE_INFINITY)).toBe(Number.POSITIVE_INFINITY);
    expect(atFileDigits(Number.NaN)).toBeNaN();
  });
});
