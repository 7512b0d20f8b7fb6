import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseScenario } from '@/lib/scenario/parse';
import { scenarioSchema } from '@/lib/scenario/schema';
import { scenarioArb } from '../support/arbitraries';

describe('parseScenario picks the baseline form by its key', () => {
  it('gives the same verdict and value as the union schema for valid scenarios (1000 runs)', () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        const union = scenarioSchema.safeParse(s);
        const parsed = parseScenario(s);
        expect(parsed.ok).toBe(union.success);
        if (parsed.ok && union.success) expect(parsed.value).toEqual(union.data);
      }),
      { numRuns: 1000 },
    );
  });

  it('reports the chosen form’s own problems, and a second form key as an unknown field', () => {
    const result = parseScenario({
      baseline: { risk: 0.1, years: 10, rate: 5 },
      effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toEqual([expect.objectContaining({ code: 'unknown-field', path: ['baseline', 'rate'] })]);
  });

  it.each([null, [], 'text', 3, true])('refuses a root that is not an object (%j) with one plain issue', (input) => {
    const result = parseScenario(input);
    expect(result).toEqual({
      ok: false,
      issues: [{ code: 'wrong-type', path: [], message: 'The scenario must be a JSON object with "baseline" and "effect" fields' }],
    });
  });
});

describe('whole-number fields', () => {
  it('calls a fractional age "not-a-whole-number"', () => {
    const result = parseScenario({
      baseline: { risk: 0.1, years: 10 },
      effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
      person: { age: 45.5 },
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues[0]).toMatchObject({ code: 'not-a-whole-number', path: ['person', 'age'], message: 'The age must be a whole number of years' });
  });
});
