import { describe, expect, it } from 'vitest';
import { chooseDenominator, exposedLayout, iconArrayCounts, referenceLayout, roundPeople } from '@/lib/engine/iconArray';

describe('iconArrayCounts (risk-communication guide: one denominator, counts = round(P·D))', () => {
  it('counts people out of 100 for everyday risks', () => {
    // Hand-computed: 0.08·100 = 8; 0.12·100 = 12; limits 0.096 → 10, 0.152 → 15.
    expect(iconArrayCounts(0.08, { estimate: 0.12, lower: 0.096, upper: 0.152 })).toEqual({
      denominator: 100,
      automatic: true,
      referenceEvents: 8,
      exposedEvents: 12,
      exposedLower: 10,
      exposedUpper: 15,
    });
  });

  it('switches to 1,000 when a risk would round to 0 people out of 100', () => {
    // Galesic et al. 2009, Health Psychol 28:210 (denominators); the rule is the guide's:
    // 0.004·100 = 0.4 → 0 people, so 1,000: 4 and 6 people.
    const counts = iconArrayCounts(0.004, { estimate: 0.006, lower: 0.005, upper: 0.008 });
    expect(counts.denominator).toBe(1000);
    expect(counts.referenceEvents).toBe(4);
    expect(counts.exposedEvents).toBe(6);
  });

  it('switches to 1,000 when a real difference would vanish at 100', () => {
    // Hand-computed: 0.081 and 0.083 both give 8 out of 100, hiding the difference; 81 and 83 out of 1,000 show it.
    expect(chooseDenominator(0.081, 0.083)).toBe(1000);
    expect(chooseDenominator(0.08, 0.08)).toBe(100);
  });

  it('switches to 1,000 when "will not" would round to 0 out of 100', () => {
    // Hand-computed: 1 − 0.997 = 0.003 → 0 people without the outcome at 100.
    expect(chooseDenominator(0.5, 0.997)).toBe(1000);
  });

  it('keeps a denominator the clinician chose', () => {
    // Hand-computed: 0.08·1000 = 80, 0.12·1000 = 120.
    const counts = iconArrayCounts(0.08, { estimate: 0.12, lower: 0.1, upper: 0.15 }, 1000);
    expect(counts).toMatchObject({ denominator: 1000, automatic: false, referenceEvents: 80, exposedEvents: 120 });
  });
});

describe('roundPeople', () => {
  it('rounds 14.5 people up although 0.145·100 computes as 14.4999…', () => {
    // Binary floating point: 0.145 * 100 = 14.499999999999998; read as "14.5%", it is 15 people (half up, common practice).
    expect(0.145 * 100).toBeLessThan(14.5);
    expect(roundPeople(0.145 * 100)).toBe(15);
    expect(roundPeople(7.49)).toBe(7);
  });
});

describe('layouts (Ancker et al. 2011; Zikmund-Fisher et al. 2008)', () => {
  const harm = iconArrayCounts(0.08, { estimate: 0.12, lower: 0.096, upper: 0.152 });

  it('draws every icon and fills the reference array from the first corner', () => {
    // Ancker et al. 2011 (grouped, from one corner); hand-computed: 8 events, 100 − 8 = 92 without.
    const layout = referenceLayout(harm);
    expect(layout.cells).toHaveLength(100);
    expect(layout.columns).toBe(10);
    expect(layout.tally).toEqual({ event: 8, added: 0, avoided: 0, none: 92, uncertain: 0 });
    expect(layout.cells.slice(0, 8).every((c) => c.kind === 'event')).toBe(true);
    expect(layout.cells[8]?.kind).toBe('none');
  });

  it('puts added events right after the baseline events and marks the interval as uncertain', () => {
    // Zikmund-Fisher et al. 2008 (added right after baseline); hand-computed: 12 − 8 = 4 added, 100 − 12 = 88 without.
    const layout = exposedLayout(harm);
    expect(layout.tally).toEqual({ event: 8, added: 4, avoided: 0, none: 88, uncertain: 5 });
    expect(layout.cells.map((c) => c.kind).slice(0, 13).join(',')).toBe(
      'event,event,event,event,event,event,event,event,added,added,added,added,none',
    );
    // Uncertain icons run from the lower count (10) to the upper count (15): 5 icons, as the sentence says.
    expect(layout.cells.map((c, i) => (c.uncertain ? i : -1)).filter((i) => i >= 0)).toEqual([10, 11, 12, 13, 14]);
  });

  it('shows avoided events after the exposed events when the effect is protective', () => {
    // Hand-computed: 0.12·100 = 12 reference, 0.08·100 = 8 exposed, so 12 − 8 = 4 avoided;
    // limits 0.06 → 6 and 0.11 → 11, so 11 − 6 = 5 uncertain icons.
    const counts = iconArrayCounts(0.12, { estimate: 0.08, lower: 0.06, upper: 0.11 });
    const layout = exposedLayout(counts);
    expect(layout.tally).toEqual({ event: 8, added: 0, avoided: 4, none: 88, uncertain: 5 });
    expect(layout.cells[7]?.kind).toBe('event');
    expect(layout.cells[8]?.kind).toBe('avoided');
    expect(layout.cells[12]?.kind).toBe('none');
  });

  it('uses 25 columns for 1,000 icons', () => {
    // Our layout convention (lib/engine/iconArray.ts): 40 rows of 25 for 1,000; 10 rows of 10 for 100.
    const counts = iconArrayCounts(0.004, { estimate: 0.006, lower: 0.005, upper: 0.008 });
    const layout = exposedLayout(counts);
    expect(layout.columns).toBe(25);
    expect(layout.cells).toHaveLength(1000);
    expect(layout.tally.event + layout.tally.added + layout.tally.avoided + layout.tally.none).toBe(1000);
  });
});
