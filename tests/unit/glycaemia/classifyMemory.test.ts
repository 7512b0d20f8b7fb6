import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { classifyCheckup, forgetRememberedReadings, MAX_REMEMBERED_READINGS } from '@/lib/glycaemia/classify';
import { CRITERIA_SETS } from '@/lib/glycaemia/exposure';
import type { Checkup } from '@/lib/glycaemia/schema';

// classifyCheckup remembers what a pair of readings decides (a workforce repeats the same readings
// on thousands of checkups). The remembered answer must be the one worked out afresh, whatever was
// classified before. Invented readings.

const hba1cArb = fc.oneof(
  fc.record({ value: fc.integer({ min: 30, max: 90 }).map((v) => v / 10), unit: fc.constant('%' as const) }),
  fc.record({ value: fc.integer({ min: 20, max: 80 }), unit: fc.constant('mmol/mol' as const) }),
  // Values either unit allows (a unit-slip note), 0 and −0, and any double.
  fc.record({ value: fc.oneof(fc.integer({ min: 9, max: 20 }), fc.constantFrom(0, -0, 6.45, 47.5), fc.double({ noNaN: true })), unit: fc.constantFrom('%' as const, 'mmol/mol' as const) }),
);
const fpgArb = fc.oneof(
  fc.record({ value: fc.integer({ min: 30, max: 90 }).map((v) => v / 10), unit: fc.constant('mmol/L' as const) }),
  fc.record({ value: fc.integer({ min: 70, max: 160 }), unit: fc.constant('mg/dL' as const) }),
  fc.record({ value: fc.oneof(fc.integer({ min: 18, max: 50 }), fc.constantFrom(0, -0, 6.99, 99, 126), fc.double({ noNaN: true })), unit: fc.constantFrom('mmol/L' as const, 'mg/dL' as const) }),
);
const checkupArb: fc.Arbitrary<Checkup> = fc
  .record({ date: fc.constantFrom('2021-03-01', '2022-03-01', '2023-03-01'), hba1c: fc.option(hba1cArb, { nil: undefined }), fpg: fc.option(fpgArb, { nil: undefined }) })
  .filter((c) => c.hba1c !== undefined || c.fpg !== undefined)
  .map((c) => ({ date: c.date, ...(c.hba1c ? { hba1c: c.hba1c } : {}), ...(c.fpg ? { fpg: c.fpg } : {}) }));

describe('classifyCheckup remembers each pair of readings, with the same answer', () => {
  it('property: a classification through the memory (filled by the checkups before it) equals the one worked out afresh', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(checkupArb, fc.constantFrom(...CRITERIA_SETS)), { minLength: 1, maxLength: 30 }), (checkups) => {
        const warm = checkups.map(([c, criteria]) => classifyCheckup(c, criteria));
        checkups.forEach(([c, criteria], i) => {
          forgetRememberedReadings();
          expect(warm[i]).toEqual(classifyCheckup(c, criteria));
          // The checkup's own date, never a remembered one.
          expect(warm[i]?.date).toBe(c.date);
        });
      }),
      { numRuns: 300 },
    );
  });

  it('shares one frozen answer between checkups with the same readings, and −0 is not taken for 0', () => {
    forgetRememberedReadings();
    const a = classifyCheckup({ date: '2022-03-01', hba1c: { value: 6.1, unit: '%' } }, 'ADA');
    const b = classifyCheckup({ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }, 'ADA');
    expect(b.hba1c).toBe(a.hba1c);
    expect(Object.isFrozen(a.hba1c)).toBe(true);
    expect(Object.isFrozen(a.notes)).toBe(true);
    expect(b.date).toBe('2023-03-01');
    const zero = classifyCheckup({ date: '2022-03-01', fpg: { value: 0, unit: 'mmol/L' } }, 'ADA');
    const minusZero = classifyCheckup({ date: '2022-03-01', fpg: { value: -0, unit: 'mmol/L' } }, 'ADA');
    expect(Object.is(zero.fpg?.entered.value, 0)).toBe(true);
    expect(Object.is(minusZero.fpg?.entered.value, -0)).toBe(true);
  });

  it(`keeps at most ${MAX_REMEMBERED_READINGS} pairs of readings per criteria set, then starts over`, () => {
    forgetRememberedReadings();
    const first = classifyCheckup({ date: '2022-03-01', hba1c: { value: 6.1, unit: '%' } }, 'WHO');
    expect(classifyCheckup({ date: '2022-03-01', hba1c: { value: 6.1, unit: '%' } }, 'WHO').hba1c).toBe(first.hba1c);
    for (let i = 1; i <= MAX_REMEMBERED_READINGS; i += 1) classifyCheckup({ date: '2022-03-01', fpg: { value: i / 100, unit: 'mmol/L' } }, 'WHO');
    const again = classifyCheckup({ date: '2022-03-01', hba1c: { value: 6.1, unit: '%' } }, 'WHO');
    expect(again.hba1c).not.toBe(first.hba1c);
    expect(again).toEqual(first);
  });
});
