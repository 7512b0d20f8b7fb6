/**
 * The /handout view model: a sheet, or plain words saying why not and what to do (issue 12.4,
 * 12.10). No message may read like schema text.
 */
import { describe, expect, it } from 'vitest';
import { backHrefFor, contactSegments, DEFAULT_BLOCKS, handOverRecord, handoutPageView, plainIssue, requestedTableId, writtenDate } from '@/lib/handout';
import { scenarioFragment, scenarioQuery } from '@/lib/link';
import type { Scenario } from '@/lib/scenario/schema';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables';

const DATE = new Date(2025, 4, 12, 12);
const TEMPLATE = { blocks: DEFAULT_BLOCKS, clinic: {} };
const TYPED: Scenario = {
  baseline: { risk: 0.08, years: 10 },
  effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9, design: 'cohort' },
  wording: { outcome: 'a first stroke', exposure: 'raised blood pressure', comparison: 'normal blood pressure' },
  person: { age: 62, sex: 'female' },
};
const SCHEMA_TEXT = /[{}]|expected|Invalid input|received|undefined/;

function problemOf(query: string) {
  const view = handoutPageView(query, TEMPLATE, { date: DATE });
  if (view.kind !== 'problem') throw new Error('expected a problem');
  return view.problem;
}

describe('handoutPageView', () => {
  it('says what to do when the link holds no scenario', () => {
    for (const q of ['', '?', '/handout']) {
      const p = problemOf(q);
      expect(p.kind).toBe('empty');
      expect(p.heading).toBe('The handout cannot be made from this link: it holds no consultation yet.');
      expect(p.whatToDo).toContain('choose \u201CPrepare handout\u201D');
      expect([p.heading, ...p.details, p.whatToDo].join(' ')).not.toMatch(SCHEMA_TEXT);
    }
  });

  it('names what is missing in a cut-short link in the screen’s words, never schema text', () => {
    const p = problemOf('?br=0.08');
    expect(p.kind).toBe('broken');
    expect(p.details).toEqual(['The baseline period is missing.', 'The study\u2019s figures (the ratio and its interval) are missing.']);
    expect([p.heading, ...p.details, p.whatToDo].join(' ')).not.toMatch(SCHEMA_TEXT);
    expect(problemOf('?br=0.08&by=10&em=RR&ee=1.5&el=1.2').details).toEqual(['The upper limit is missing.']);
  });

  it('keeps a plain message from the link reader and replaces a technical one', () => {
    expect(plainIssue({ code: 'out-of-range', path: ['baseline', 'risk'], message: 'The baseline risk must be less than 1' })).toBe('The baseline risk must be less than 1.');
    expect(plainIssue({ code: 'wrong-type', path: ['effect'], message: 'Invalid input: expected object, received string' })).toBe(
      'The study\u2019s figures (the ratio and its interval) are not valid.',
    );
    expect(problemOf('?br=0.08&by=10&em=XX&ee=1.5&el=1.2&eu=1.9').details).toEqual(['The measure must be one of OR, RR or HR.']);
  });

  it('says a capped result makes no handout', () => {
    // Hand-computed: RR 2.5 × 0.4 = 1.0, certainty.
    const p = problemOf(scenarioQuery({ ...TYPED, baseline: { risk: 0.4, years: 10 }, effect: { measure: 'RR', estimate: 2.5, lower: 2, upper: 3.2 } }));
    expect(p.kind).toBe('capped');
    expect(p.heading).toBe('The handout cannot be made for these figures: they reach certainty.');
  });

  it('asks for the words when only the patient wording is missing', () => {
    const p = problemOf(scenarioQuery({ ...TYPED, wording: {} }));
    expect(p.kind).toBe('words');
    expect(p.details[0]).toContain('The outcome is required in plain words');
  });

  it('gives the sheet for a valid link, with the table found by id', () => {
    // The scenario travels in the fragment (lib/link); the back link opens the same fragment.
    const query = scenarioFragment({ ...TYPED, tableId: DEMO_HEART_FAILURE_10Y.id });
    expect(requestedTableId(query)).toBe(DEMO_HEART_FAILURE_10Y.id);
    const view = handoutPageView(query, TEMPLATE, { date: DATE, tableFor: (id) => (id === DEMO_HEART_FAILURE_10Y.id ? DEMO_HEART_FAILURE_10Y : undefined) });
    expect(view.kind).toBe('sheet');
    if (view.kind === 'sheet') {
      expect(view.sheet.footer.sources[0]).toContain(DEMO_HEART_FAILURE_10Y.title);
      expect(view.backHref).toBe(`/${query}`);
      expect(view.history.state).toBe('none');
    }
    expect(backHrefFor('br=1')).toBe('/#br=1');
    // An old query link's back link is written as a fragment too.
    expect(backHrefFor('?br=1')).toBe('/#br=1');
    expect(backHrefFor('')).toBe('/');
  });

  it('prints the person’s own results from the hand-over, unless left out or a group session', () => {
    const stored = handOverRecord(TYPED, { criteria: 'ADA', checkups: [{ date: '2023-03-01', hba1c: { value: 6.1, unit: '%' } }] });
    const query = scenarioQuery(TYPED);
    const on = handoutPageView(query, TEMPLATE, { date: DATE, storedHistory: stored });
    expect(on.kind === 'sheet' && on.history.state).toBe('available');
    expect(on.kind === 'sheet' && on.sheet.ownResults?.items[0]).toBe('Your HbA1c was 6.1% at one checkup, in 2023.');
    const off = handoutPageView(query, TEMPLATE, { date: DATE, storedHistory: stored, includeHistory: false });
    expect(off.kind === 'sheet' && off.sheet.ownResults).toBeUndefined();
    const group = handoutPageView(query, TEMPLATE, { date: DATE, storedHistory: stored, audience: 'group' });
    expect(group.kind === 'sheet' && group.sheet.ownResults).toBeUndefined();
    const damaged = handoutPageView(query, TEMPLATE, { date: DATE, storedHistory: '{' });
    expect(damaged.kind === 'sheet' && damaged.history.state).toBe('damaged');
  });
});

describe('small pieces', () => {
  it('writes dates by region (A4: day month year; US Letter: month day, year)', () => {
    expect(writtenDate(new Date(2025, 0, 3), 'day-month-year')).toBe('3 January 2025');
    expect(writtenDate(new Date(2025, 11, 31), 'month-day-year')).toBe('December 31, 2025');
    expect(writtenDate(new Date(Number.NaN), 'day-month-year')).toBeUndefined();
  });

  it('keeps telephone numbers together, and only them', () => {
    expect(contactSegments('Tel. (020) 7946-0000 or 0161 496 0999')).toEqual([
      { text: 'Tel. ', keepTogether: false },
      { text: '(020) 7946-0000', keepTogether: true },
      { text: ' or ', keepTogether: false },
      { text: '0161 496 0999', keepTogether: true },
    ]);
    expect(contactSegments('Room 12, open 9 to 5')).toEqual([{ text: 'Room 12, open 9 to 5', keepTogether: false }]);
    expect(contactSegments('')).toEqual([]);
  });
});
