import { describe, expect, it } from 'vitest';
import { describePeople } from '@/lib/wording';

describe('describePeople', () => {
  it('prefers the table band to the exact age', () => {
    expect(describePeople({ person: { age: 53, sex: 'female' }, ageBand: { fromYears: 50, toYears: 59 } })).toEqual({ ok: true, value: 'women aged 50 to 59' });
  });
  it('uses the exact age without a band, and "people" without a sex', () => {
    expect(describePeople({ person: { age: 47 } })).toEqual({ ok: true, value: 'people aged 47' });
    expect(describePeople({ person: { sex: 'male' } })).toEqual({ ok: true, value: 'men' });
  });
  it('writes an open top band as "and over"', () => {
    expect(describePeople({ ageBand: { fromYears: 80, toYears: 120 } })).toEqual({ ok: true, value: 'people aged 80 and over' });
  });
  it('uses girls/boys under 18', () => {
    expect(describePeople({ person: { age: 15, sex: 'female' } })).toEqual({ ok: true, value: 'girls aged 15' });
  });
  it('falls back to a short population text, trimmed', () => {
    expect(describePeople({ population: ' adults at a workplace health check. ' })).toEqual({ ok: true, value: 'adults at a workplace health check' });
  });
  it('refuses when nothing says who the people are', () => {
    for (const input of [{}, { person: {} }, { population: '  ' }]) {
      const r = describePeople(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.issues[0]).toMatchObject({ code: 'population-required', path: ['people'] });
    }
  });
  it('refuses a population text too long to sit inside a sentence', () => {
    const r = describePeople({ population: 'x'.repeat(81) });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('too-long');
  });
});
