import { describe, expect, it } from 'vitest';
import { parseEvidenceEntry } from '@/lib/evidence/parse';
import { DEMO_EVIDENCE, findDemoEvidence } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';

const entry: EvidenceEntry = {
  id: 'my-entry',
  title: 'My entry',
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 },
  wording: { outcome: 'an outcome' },
  illustrative: false,
};

describe('demo evidence entries', () => {
  it.each(DEMO_EVIDENCE.map((e) => [e.id, e] as const))('%s is valid, illustrative and says it is not a real study', (_id, e) => {
    expect(parseEvidenceEntry(e)).toEqual({ ok: true, value: e });
    expect(e.illustrative).toBe(true);
    expect(e.wording.citation).toMatch(/Illustrative entry — not a real study/);
  });

  it('has each estimate within 3% of the geometric mean of its limits (consistent with a log-symmetric interval; Cochrane Handbook §7.7.7.3, from memory)', () => {
    for (const e of DEMO_EVIDENCE) {
      const gm = Math.sqrt(e.effect.lower * e.effect.upper);
      expect(Math.abs(e.effect.estimate / gm - 1)).toBeLessThan(0.03);
    }
  });

  it('covers a cohort HR, a risk-set case-control OR and a cross-sectional OR', () => {
    expect(DEMO_EVIDENCE.map((e) => [e.effect.measure, e.effect.design])).toEqual([
      ['HR', 'cohort'],
      ['OR', 'risk-set-case-control'],
      ['OR', 'cross-sectional'],
    ]);
    expect(findDemoEvidence('demo-workforce-hba1c-heart-failure')?.wording.outcome).toBe('heart failure needing hospital care');
    expect(findDemoEvidence('nope')).toBeUndefined();
  });
});

describe('parseEvidenceEntry', () => {
  it('accepts a minimal entry', () => {
    expect(parseEvidenceEntry(entry)).toEqual({ ok: true, value: entry });
  });

  it('reuses the effect rules (interval order, estimate inside)', () => {
    const r = parseEvidenceEntry({ ...entry, effect: { ...entry.effect, lower: 2 } });
    expect(!r.ok && r.issues[0]).toMatchObject({ code: 'interval-order', path: ['effect', 'lower'] });
  });

  it('reuses the exposure-definition rules', () => {
    const r = parseEvidenceEntry({ ...entry, exposureDefinition: { category: 'prediabetes', criteria: 'XYZ', minYears: 0 } });
    expect(!r.ok && r.issues.map((i) => i.path)).toEqual([
      ['exposureDefinition', 'criteria'],
      ['exposureDefinition', 'minYears'],
    ]);
  });

  it.each([
    [{ ...entry, id: '' }, ['id']],
    [{ ...entry, title: '' }, ['title']],
    [{ ...entry, illustrative: 'yes' }, ['illustrative']],
    [{ ...entry, wording: { outcome: 5 } }, ['wording', 'outcome']],
    [{ ...entry, effect: { ...entry.effect, estimate: Number.NaN } }, ['effect', 'estimate']],
    [{ ...entry, extra: 1 }, ['extra']],
  ])('names the bad field (%#)', (input, path) => {
    const r = parseEvidenceEntry(input);
    expect(!r.ok && r.issues[0]?.path).toEqual(path);
  });

  it('refuses non-objects', () => {
    for (const bad of [null, undefined, 3, 'entry', []]) expect(parseEvidenceEntry(bad).ok).toBe(false);
  });
});
