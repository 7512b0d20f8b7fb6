import { describe, expect, it } from 'vitest';
import { evidenceToFormValues } from '@/lib/consultation/fromScenario';
import { checkEntry, effectMatches, leftoverIssues } from '@/lib/consultation';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';

const ENTRY = DEMO_WORKFORCE_HBA1C_HEART_FAILURE;

describe('checkEntry: leftovers from a saved entry (issue 12 item 1)', () => {
  it('the entry applies while the figures are its own', () => {
    const form = evidenceToFormValues(ENTRY);
    expect(effectMatches(ENTRY, form.effect)).toBe(true);
    const check = checkEntry(ENTRY, form);
    expect(check.applying).toBe(ENTRY);
    expect(check.noLongerApplies).toBe(false);
    expect(check.illustrative).toBe(true);
  });

  it('typing other figures: no longer applies, every wording it filled in is flagged', () => {
    const form = evidenceToFormValues(ENTRY);
    const typed = { ...form, effect: { ...form.effect, estimate: '2.1', lower: '1.5', upper: '2.9' } };
    const check = checkEntry(ENTRY, typed);
    expect(check.noLongerApplies).toBe(true);
    expect(check.applying).toBeUndefined();
    expect(check.staleId).toBe(ENTRY.id);
    const filled = (['outcome', 'exposure', 'comparison', 'population', 'citation'] as const).filter((f) => (ENTRY.wording?.[f] ?? '') !== '');
    expect(check.leftoverFields).toEqual(filled);
    expect(leftoverIssues(check).map((i) => i.path)).toEqual(filled.map((f) => ['wording', f]));
    expect(check.illustrative).toBe(true);
  });

  it('a wording kept or changed by the clinician is no longer flagged', () => {
    const form = evidenceToFormValues(ENTRY);
    const typed = { effect: { ...form.effect, estimate: '2.1', lower: '1.5', upper: '2.9' }, wording: { ...form.wording, citation: 'My own source' } };
    const kept = checkEntry(ENTRY, typed, { outcome: form.wording.outcome });
    expect(kept.leftoverFields).not.toContain('citation');
    expect(kept.leftoverFields).not.toContain('outcome');
  });

  it('a decimal comma or a trailing zero is still the entry’s figure', () => {
    const form = evidenceToFormValues(ENTRY);
    const same = { ...form, effect: { ...form.effect, estimate: `${form.effect.estimate}0`.replace('.', ',') } };
    expect(effectMatches(ENTRY, same.effect)).toBe(true);
  });

  it('no entry: nothing to say', () => {
    expect(checkEntry(undefined, evidenceToFormValues(ENTRY))).toEqual({ noLongerApplies: false, leftoverFields: [], illustrative: false });
  });
});
