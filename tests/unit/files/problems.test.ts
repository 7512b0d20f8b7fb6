import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { capProblems, cutText, MAX_LISTED_PROBLEMS, MAX_PROBLEM_CHARS } from '@/lib/files/problems';

describe('cutText', () => {
  it('cuts with an ellipsis (hand-computed: 4 characters = 3 kept + "…")', () => {
    expect(cutText('abcdef', 4)).toBe('abc…');
    expect(cutText('abc', 4)).toBe('abc');
  });

  it('never splits a surrogate pair', () => {
    expect(cutText('ab😀cd', 4)).toBe('ab…');
  });

  it('property: the result is at most the limit and starts with the text kept', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 500 }), fc.integer({ min: 2, max: 400 }), (s, max) => {
        const cut = cutText(s, max);
        expect(cut.length).toBeLessThanOrEqual(Math.max(max, s.length <= max ? s.length : 0));
        expect(s.startsWith(cut.endsWith('…') && cut.length < s.length + 1 && cut !== s ? cut.slice(0, -1) : cut)).toBe(true);
      }),
    );
  });
});

describe('capProblems', () => {
  it('lists at most the cap, then one line counting the rest', () => {
    const issues = Array.from({ length: MAX_LISTED_PROBLEMS + 7 }, (_, i) => ({ code: 'x', path: [i], message: `problem ${i}` }));
    const capped = capProblems(issues);
    expect(capped).toHaveLength(MAX_LISTED_PROBLEMS + 1);
    expect(capped.at(-1)).toEqual({ code: 'too-many-problems', path: [], message: '… and 7 more problems not listed; fix the ones above and check again' });
  });

  it('leaves a short list alone and cuts long messages', () => {
    expect(capProblems([{ code: 'x', path: [], message: 'short' }])).toEqual([{ code: 'x', path: [], message: 'short' }]);
    const [long] = capProblems([{ code: 'x', path: [], message: 'y'.repeat(10_000) }]);
    expect(long?.message.length).toBe(MAX_PROBLEM_CHARS);
  });
});
