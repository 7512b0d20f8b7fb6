import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeScenario } from '@/lib/engine/compute';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { parseScenario } from '@/lib/scenario/parse';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { addMonths, compareWithMonthsLater, daysInMonth, dayNumber, formatIsoDate, inDateOrder, parseIsoDate, sortByDate } from '@/lib/glycaemia/dates';
import { THRESHOLD_DECIMALS, withUnit, type ValueUnit } from '@/lib/glycaemia/format';
import { ageBand, createRowReader, evaluateWorker, MAX_SCENARIOS, MEMO_LIMIT, prepareCheckups, proposeMapping, scenarioFiguresFor, scenarioFor, TextMemo, type CheckupRow, type CheckupsContext } from '@/lib/workforce';

// The fast paths (answers remembered per text, per age and sex, per pair of readings) against the
// plain ones (each check afresh; the scenario validated by parseScenario, then computeScenario).
// Invented rows (illustrative).
const TODAY = '2026-01-01';
const HEADERS = ['Worker', 'Date', 'HbA1c', 'Unit', 'FPG (mg/dL)', 'Age', 'Sex', 'Site'];
const mapping = proposeMapping(HEADERS).mapping;

const cellArb = fc.record({
  worker: fc.constantFrom('W1', 'W2', ' W3 ', '', 'Jo Bloggs', 'x'.repeat(70)),
  date: fc.constantFrom('2024-03-01', '2023-02-29', '2030-01-01', '01.02.2024', '02/03/2024', 'soon', '', ' 2022-06-30 ', '1899-12-31'),
  hba1c: fc.constantFrom('6.1', '6,1', '42', '5.7', '', 'abc', '<5', '6.1%', '13', '-0', '1e999'),
  unit: fc.constantFrom('%', 'mmol/mol', 'pct', '', 'mg', ' % '),
  fpg: fc.constantFrom('101', '99.5', '', '5.5', '2000', 'x'),
  age: fc.constantFrom('52', '52.5', '', '130', 'old'),
  sex: fc.constantFrom('F', 'male', 'Weiblich', 'X', '', ' m '),
  site: fc.constantFrom('North', '', 'South'),
});
const rowArb = cellArb.map((c) => [c.worker, c.date, c.hba1c, c.unit, c.fpg, c.age, c.sex, c.site]);

describe('the row reader remembers checks per text, with the same answers', () => {
  it('property: rows read through one reader equal each row read by a fresh reader (nothing remembered), decimal point or comma', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { maxLength: 40 }), fc.boolean(), (rows, decimalComma) => {
        const warm = createRowReader(mapping, { today: TODAY, decimalComma });
        rows.forEach((cells, i) => {
          const cold = createRowReader(mapping, { today: TODAY, decimalComma });
          expect(warm.read(cells, i + 2)).toEqual(cold.read(cells, i + 2));
        });
      }),
      { numRuns: 200 },
    );
  });

  it('TextMemo computes once per text and starts over past its limit', () => {
    let calls = 0;
    const memo = new TextMemo((t) => {
      calls += 1;
      return t.length;
    });
    expect([memo.get('ab'), memo.get('ab'), memo.get('abc')]).toEqual([2, 2, 3]);
    expect(calls).toBe(2);
    for (let i = 0; i < MEMO_LIMIT + 10; i += 1) memo.get(`k${i}`);
    expect(memo.get('k0')).toBe(2);
  });
});

function context(): CheckupsContext {
  const prepared = prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
  if (!prepared.ok) throw new Error(prepared.issues[0]?.message);
  return prepared.value;
}

const workerArb = fc
  .record({
    values: fc.array(fc.integer({ min: 45, max: 75 }), { minLength: 1, maxLength: 5 }),
    fpg: fc.option(fc.integer({ min: 80, max: 130 }), { nil: undefined }),
    age: fc.integer({ min: 25, max: 85 }),
    sex: fc.option(fc.constantFrom('female' as const, 'male' as const), { nil: undefined }),
  })
  .map(({ values, fpg, age, sex }) =>
    values.map((v, i): CheckupRow => ({
      line: i + 2,
      worker: 'WX',
      date: `${2019 + i}-05-0${1 + (i % 3)}`,
      hba1c: { value: v / 10, unit: '%' },
      ...(fpg !== undefined ? { fpg: { value: fpg, unit: 'mg/dL' as const } } : {}),
      age,
      ...(sex !== undefined ? { sex } : {}),
      strata: { site: 'North' },
    })),
  );

describe('evaluateWorker with remembered scenarios and categories gives the plain path\'s figures', () => {
  it('property: many workers through one context equal each worker through a fresh context, and the figures equal computeScenario on the parseScenario\'d scenario', () => {
    fc.assert(
      fc.property(fc.array(workerArb, { minLength: 1, maxLength: 30 }), (workers) => {
        const shared = context();
        for (const rows of workers) {
          const warm = evaluateWorker({ worker: 'WX', rows }, shared);
          const fresh = context();
          expect(warm).toEqual(evaluateWorker({ worker: 'WX', rows }, fresh));
          if (warm.status !== 'exposed' && warm.status !== 'comparison') continue;
          const built = scenarioFor(warm.age, warm.sex, warm.strata, fresh);
          if (!built.ok) throw new Error('a worker with figures has a scenario');
          const parsed = parseScenario(JSON.parse(JSON.stringify(built.value)));
          if (!parsed.ok) throw new Error(parsed.issues[0]?.message);
          const plain = computeScenario(parsed.value);
          if (!plain.ok) throw new Error('valid scenario');
          const { referenceRisk, exposedRisk, riskDifference, numberNeeded, warnings } = plain.value;
          expect(warm).toMatchObject({ referenceRisk, exposedRisk, riskDifference, numberNeeded, warnings });
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('scenarioFiguresFor: computeScenario remembered per age, sex and table strata', () => {
  const ageArb = fc.oneof(fc.integer({ min: 0, max: 120 }), fc.constantFrom(-1, 121, 200));
  const sexArb = fc.constantFrom('female' as const, 'male' as const, null);
  const isDeeplyFrozen = (value: unknown): boolean =>
    typeof value !== 'object' || value === null || (Object.isFrozen(value) && Object.values(value).every(isDeeplyFrozen));

  it('property: the remembered figures equal computeScenario on the scenario built afresh, are the same object on every call, and are frozen', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(ageArb, sexArb, fc.constantFrom('North', 'South')), { minLength: 1, maxLength: 20 }), (people) => {
        const shared = context();
        for (const [age, sex, site] of people) {
          const first = scenarioFiguresFor(age, sex, { site }, shared);
          // Another site: not a stratum of the table, so the same scenario (and the same object).
          expect(scenarioFiguresFor(age, sex, { site: site === 'North' ? 'South' : 'North' }, shared)).toBe(first);
          const built = scenarioFor(age, sex, { site }, context());
          expect(first.built).toEqual(built);
          if (!built.ok) {
            expect(first.computed).toEqual(built);
            continue;
          }
          expect(first.computed).toEqual(computeScenario(built.value));
          expect(isDeeplyFrozen(first.computed)).toBe(true);
        }
      }),
      { numRuns: 100 },
    );
  });

  it(`keeps at most ${MAX_SCENARIOS} scenarios per run, then starts over with the same answers`, () => {
    const shared = context();
    const first = scenarioFiguresFor(52, 'female', {}, shared);
    expect(first.computed.ok).toBe(true);
    // Ages past 120 are distinct keys that the table cannot place: MAX_SCENARIOS of them fill the memory.
    for (let i = 0; i < MAX_SCENARIOS; i += 1) scenarioFiguresFor(1000 + i, 'male', {}, shared);
    const again = scenarioFiguresFor(52, 'female', {}, shared);
    expect(again).not.toBe(first);
    expect(again).toEqual(first);
  });
});

describe('ageBand writes each decade\'s band once, with the same words', () => {
  it('property: equals the band written out for any age', () => {
    const written = (age: number | null) => {
      if (age === null) return 'unknown';
      if (age < 20) return 'under 20';
      if (age >= 70) return '70 and over';
      const from = Math.floor(age / 10) * 10;
      return `${from}–${from + 9}`;
    };
    fc.assert(fc.property(fc.oneof(fc.integer({ min: -5, max: 130 }), fc.double(), fc.constant(null)), (age) => {
        expect(ageBand(age)).toBe(written(age));
      }), { numRuns: 1000 });
  });
});

describe('lib/glycaemia dates and values read without patterns, with the same answers', () => {
  // The forms before they were rewritten for speed, as references.
  const isoByPattern = (text: string) => {
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
    if (!m) return null;
    const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
    return month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month) ? null : { year, month, day };
  };
  const withUnitBySplit = (value: number, unit: ValueUnit) => {
    const entered = (String(value).split('.')[1] ?? '').length;
    const text = /e/i.test(String(value)) ? String(value) : value.toFixed(Math.max(THRESHOLD_DECIMALS[unit], entered));
    return unit === '%' ? `${text}%` : `${text} ${unit}`;
  };
  const digit = fc.constantFrom(...'0123456789'.split(''));
  const dateLike = fc.oneof(
    fc.tuple(fc.array(digit, { minLength: 4, maxLength: 4 }), fc.array(digit, { minLength: 2, maxLength: 2 }), fc.array(digit, { minLength: 2, maxLength: 2 })).map(([y, m, d]) => `${y.join('')}-${m.join('')}-${d.join('')}`),
    fc.string({ maxLength: 12 }),
    fc.constantFrom('2024-02-29', '2023-02-29', '2024-13-01', '2024-1-01', '2024-01-01\n', ' 2024-01-01', '２０２４-01-01', '2024/01/01'),
  );

  it('property: parseIsoDate equals the pattern it replaced', () => {
    fc.assert(fc.property(dateLike, (text) => {
        expect(parseIsoDate(text)).toEqual(isoByPattern(text));
      }), { numRuns: 2000 });
  });

  it('property: formatIsoDate and daysInMonth equal the forms they replaced', () => {
    const padded = (year: number, month: number, day: number) => `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
    const daysByList = (year: number, month: number) => (month === 2 ? ((year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28) : [4, 6, 9, 11].includes(month) ? 30 : 31);
    const part = fc.oneof(fc.integer({ min: -20, max: 12_000 }), fc.constantFrom(0, -0, 9, 10, 99, 100, 999, 1000, 9999, 10_000, 1.5, Number.NaN, Infinity));
    fc.assert(fc.property(part, part, part, (year, month, day) => {
        expect(formatIsoDate({ year, month, day })).toBe(padded(year, month, day));
        expect(daysInMonth(year, month)).toBe(daysByList(year, month));
      }), { numRuns: 3000 });
  });

  it('property: addMonths, dayNumber and compareWithMonthsLater equal the forms they replaced (the later date written out and compared as text)', () => {
    const addByText = (iso: string, months: number) => {
      const date = isoByPattern(iso);
      if (!date) return iso;
      const index = date.year * 12 + (date.month - 1) + months;
      const year = Math.floor(index / 12);
      const month = (index % 12) + 1;
      const day = Math.min(date.day, daysInMonth(year, month));
      return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
    };
    const dayByDate = (iso: string) => {
      const date = isoByPattern(iso);
      return date ? Date.UTC(date.year, date.month - 1, date.day) / 86_400_000 : Number.NaN;
    };
    const year = fc.oneof(fc.integer({ min: 1990, max: 2030 }), fc.integer({ min: 0, max: 9999 }), fc.constantFrom(0, 999, 1000, 9998, 9999));
    const realDate = fc
      .tuple(year, fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 31 }))
      .map(([y, m, d]) => `${String(y).padStart(4, '0')}-${String(m).padStart(2, '0')}-${String(Math.min(d, daysInMonth(y, m))).padStart(2, '0')}`);
    const text = fc.oneof(realDate, realDate, dateLike);
    const months = fc.oneof(fc.constantFrom(6, 12, 18), fc.integer({ min: -40, max: 40 }), fc.integer({ min: -200_000, max: 200_000 }));
    fc.assert(fc.property(text, text, months, (from, to, m) => {
        const later = addByText(from, m);
        expect(addMonths(from, m)).toBe(later);
        expect(compareWithMonthsLater(to, from, m)).toBe(to < later ? -1 : to > later ? 1 : 0);
        expect(dayNumber(from)).toBe(dayByDate(from));
      }), { numRuns: 5000 });
  });

  it('property: inDateOrder and sortByDate equal a stable sort by date, and inDateOrder gives back a list already in order as it is', () => {
    const item = fc.record({ date: fc.constantFrom('2021-03-01', '2021-03-02', '2022-01-01', '2022-01-01', '2023-12-31'), id: fc.nat() });
    fc.assert(fc.property(fc.array(item, { maxLength: 8 }), (items) => {
        const sorted = [...items].sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));
        expect(inDateOrder(items)).toEqual(sorted);
        expect(inDateOrder(sorted)).toBe(sorted);
        expect(sortByDate([...items])).toEqual(sorted);
      }), { numRuns: 1000 });
  });

  it('property: withUnit equals the form it replaced', () => {
    const unit = fc.constantFrom<ValueUnit>('%', 'mmol/mol', 'mg/dL', 'mmol/L');
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), unit, (value, u) => {
        expect(withUnit(value, u)).toBe(withUnitBySplit(value, u));
      }), { numRuns: 2000 });
  });
});
