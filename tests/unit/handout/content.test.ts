import { describe, expect, it } from 'vitest';
import { buildHandout, DEFAULT_BLOCKS, handoutSheet, preparedOnLine } from '@/lib/handout';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables';
import type { Scenario } from '@/lib/scenario/schema';
import { CAUTION_TEXT } from '@/lib/wording';

const DATE = new Date('2025-05-12T12:00:00Z');

const DEMO: Scenario = {
  // Demo table, women 50–59: invented 10-year risk 1.5% (lib/tables/demo.ts).
  baseline: { risk: 0.015, years: 10 },
  effect: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.effect,
  horizonYears: 10,
  wording: DEMO_WORKFORCE_HBA1C_HEART_FAILURE.wording,
  person: { age: 53, sex: 'female' },
  tableId: DEMO_HEART_FAILURE_10Y.id,
};

describe('buildHandout', () => {
  it('describes the group from the table band and names both sources', () => {
    const r = buildHandout(DEMO, { table: DEMO_HEART_FAILURE_10Y });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.text.people).toBe('women aged 50 to 59');
    expect(r.value.text.caution).toBe(CAUTION_TEXT);
    expect(r.value.sources[0]).toBe(
      'Risk for people like you: Heart failure needing hospital care within 10 years (demo). Source: Illustrative numbers, not from a real population; invented for the Hundredfold demo (2024).',
    );
    expect(r.value.sources[1]).toBe('Study: Illustrative entry \u2014 not a real study; numbers invented for the Hundredfold demo.');
    // The date line moved to the sheet, which writes it as the paper's region does (US Letter: month first).
    const sheet = handoutSheet(DEMO, { blocks: DEFAULT_BLOCKS, clinic: {} }, { table: DEMO_HEART_FAILURE_10Y, date: DATE, paper: 'letter' });
    expect(sheet.ok && sheet.value.footer.preparedOn).toBe('Prepared on May 12, 2025.');
  });

  it('uses the exact age without a matching table', () => {
    const r = buildHandout(DEMO, {});
    expect(r.ok && r.value.text.people).toBe('women aged 53');
    expect(r.ok && r.value.sources[0]).toBe('Risk for people like you: entered by your clinician.');
  });

  it('refuses when nothing says who the people are', () => {
    const r = buildHandout({ ...DEMO, person: undefined, tableId: undefined } as Scenario, {});
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]?.code).toBe('too-long'); // the demo population wording is longer than 80 characters
    const none = buildHandout({ baseline: DEMO.baseline, effect: DEMO.effect, wording: { outcome: 'a stroke' } }, {});
    expect(none.ok).toBe(false);
    if (!none.ok) expect(none.issues[0]?.code).toBe('population-required');
  });

  it('passes the engine refusal through', () => {
    const r = buildHandout({ ...DEMO, baseline: { risk: 0.99, years: 1 }, horizonYears: 100 }, {});
    expect(r.ok).toBe(false);
  });

  it('writes a date line even for an invalid date', () => {
    expect(preparedOnLine(new Date(Number.NaN), 'a4')).toBe('Prepared today.');
  });
});
