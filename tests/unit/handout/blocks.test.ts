import { describe, expect, it } from 'vitest';
import { blockReadability, DEFAULT_BLOCKS, handoutBlocksSchema, isPaperSize, pageRule, PAPER_SIZES } from '@/lib/handout';
import { MAX_GRADE, readability } from '@/lib/readability';

describe('default blocks', () => {
  it('are valid and each scores at or below grade 8 (risk-communication guide)', () => {
    expect(handoutBlocksSchema.safeParse(DEFAULT_BLOCKS).success).toBe(true);
    for (const b of blockReadability(DEFAULT_BLOCKS)) {
      expect(b.score.ok).toBe(true);
      if (b.score.ok) expect(b.score.value.grade).toBeLessThanOrEqual(MAX_GRADE);
      expect(b.aboveTarget).toBe(false);
    }
  });

  it('flags a block above grade 8 and reports an empty one as unscored', () => {
    const hard = 'Comprehensive cardiometabolic characterisation necessitates individualised interpretation of epidemiological associations.';
    const r = readability(hard);
    expect(r.ok && r.value.grade).toBeGreaterThan(MAX_GRADE);
    const scores = blockReadability({ ...DEFAULT_BLOCKS, opening: hard, nextSteps: '' });
    expect(scores.find((b) => b.key === 'opening')?.aboveTarget).toBe(true);
    const empty = scores.find((b) => b.key === 'nextSteps');
    expect(empty?.score.ok).toBe(false);
    expect(empty?.aboveTarget).toBe(false);
  });
});

describe('paper sizes (ISO 216 A4 210 × 297 mm; ANSI US Letter 8.5 × 11 in)', () => {
  it('writes the page rule', () => {
    expect(pageRule('a4')).toBe('@page { size: A4 portrait; margin: 10mm; }');
    expect(pageRule('letter')).toBe('@page { size: letter portrait; margin: 10mm; }');
    expect(PAPER_SIZES.letter.widthMm).toBeCloseTo(8.5 * 25.4, 9);
    expect(PAPER_SIZES.letter.heightMm).toBeCloseTo(11 * 25.4, 9);
  });
  it('recognises only the two sizes', () => {
    expect(isPaperSize('a4')).toBe(true);
    expect(isPaperSize('letter')).toBe(true);
    expect(isPaperSize('A4')).toBe(false);
    expect(isPaperSize(undefined)).toBe(false);
  });
});
