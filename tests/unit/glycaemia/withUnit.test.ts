import { describe, expect, it } from 'vitest';
import { withUnit } from '@/lib/glycaemia/format';

describe('withUnit writes entered values as labs print them', () => {
  it.each([
    [6, '%', '6.0%'],
    [6.25, '%', '6.25%'],
    [48, 'mmol/mol', '48 mmol/mol'],
    [7, 'mmol/L', '7.0 mmol/L'],
    [5.55, 'mmol/L', '5.55 mmol/L'],
    [101, 'mg/dL', '101 mg/dL'],
  ] as const)('%s %s → %s', (value, unit, text) => {
    // Common practice: labs report HbA1c % and glucose mmol/L to one decimal, mmol/mol and mg/dL
    // whole; an entered value keeps any further decimals it was typed with.
    expect(withUnit(value, unit)).toBe(text);
  });
});
