import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BloomFilter, ColumnScanner, DelimitedSplitter, GroupingCheck, RunCounter, StreamingGrouper, WorkerGrouper, type CheckupRow } from '@/lib/workforce';

// Invented ids and rows (illustrative).
function rowsOf(ids: readonly string[]): CheckupRow[] {
  return ids.map((worker, i) => ({ line: i + 2, worker, date: '2024-01-01', strata: {} }));
}

/** The first pass as the command runs it: the filter, then an exact count of the suspects' runs. */
function firstPass(ids: readonly string[], bitsLog2: number): ReadonlySet<string> | null {
  const check = new GroupingCheck(bitsLog2);
  for (const id of ids) if (!check.add(id)) return null;
  const runs = new RunCounter(check.suspects);
  for (const id of ids) if (!runs.add(id)) return null;
  return check.suspects;
}

// Grouped id sequences: distinct ids, each repeated 1–3 times in a row.
const groupedIds = fc.uniqueArray(fc.string({ minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 300 }).chain((ids) =>
  fc.array(fc.integer({ min: 1, max: 3 }), { minLength: ids.length, maxLength: ids.length }).map((counts) => ids.flatMap((id, i) => Array<string>(counts[i] ?? 1).fill(id))),
);

describe('grouping check with a Bloom filter and an exact second count', () => {
  it('property: a grouped file is found grouped even with a tiny filter (many false "seen"), and the streaming grouper then hands over every worker in order', () => {
    fc.assert(
      fc.property(groupedIds, fc.integer({ min: 3, max: 10 }), (ids, bitsLog2) => {
        const confirmed = firstPass(ids, bitsLog2);
        expect(confirmed).not.toBeNull();
        const grouper = new StreamingGrouper(confirmed ?? new Set(), bitsLog2);
        const streamed = [...grouper.add(rowsOf(ids)), ...grouper.end()];
        expect(grouper.ungrouped).toBeNull();
        const whole = new WorkerGrouper();
        whole.add(rowsOf(ids));
        expect(streamed).toEqual([...whole.workers()]);
      }),
      { numRuns: 200 },
    );
  });

  it('property: a file where some worker comes back after another worker is never taken as grouped, whatever the filter size', () => {
    fc.assert(
      fc.property(groupedIds, fc.integer({ min: 3, max: 24 }), fc.nat(), (ids, bitsLog2, pick) => {
        const distinct = [...new Set(ids)];
        fc.pre(distinct.length >= 2);
        // The first worker's id once more at the end, after another worker's rows.
        const first = distinct[pick % (distinct.length - 1)] as string;
        const back = [...ids, first];
        fc.pre(back.at(-2) !== first);
        expect(firstPass(back, bitsLog2)).toBeNull();
      }),
      { numRuns: 200 },
    );
  });

  it('the full-size filter (2^24 bits) finds every one of 400 workers coming back (a filter position past its end once lost about a third)', () => {
    const ids = Array.from({ length: 400 }, (_, i) => `W${i}`);
    for (const id of ids.slice(0, -1)) expect(firstPass([...ids, id], 24)).toBeNull();
  });

  it('property: GroupingCheck and RunCounter give the same answers when an id repeating the one before is left out (the first pass skips such rows)', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom('W1', 'W2', 'W3', 'W4'), { maxLength: 40 }), fc.integer({ min: 3, max: 24 }), (ids, bitsLog2) => {
        const changes = ids.filter((id, i) => i === 0 || ids[i - 1] !== id);
        expect(firstPass(changes, bitsLog2)).toEqual(firstPass(ids, bitsLog2));
      }),
      { numRuns: 300 },
    );
  });

  it('W1 W2 W1 is not grouped; W1 W1 W2 is (hand-made)', () => {
    expect(firstPass(['W1', 'W2', 'W1'], 24)).toBeNull();
    expect(firstPass(['W1', 'W1', 'W2'], 24)).toEqual(new Set());
  });
});

describe('BloomFilter positions by a mask', () => {
  /** The filter as first written: positions as a remainder (FNV-1a, double hashing), for reference. */
  function remainderFilter(bitsLog2: number, hashes = 7) {
    const size = 2 ** bitsLog2;
    const bits = new Set<number>();
    const positions = (text: string) => {
      let h1 = 0x811c9dc5;
      let h2 = 0x01000193;
      for (let i = 0; i < text.length; i++) {
        const c = text.charCodeAt(i);
        h1 = Math.imul(h1 ^ c, 0x01000193) >>> 0;
        h2 = Math.imul(h2 ^ c, 0x5bd1e995) >>> 0;
      }
      h2 = (h2 | 1) >>> 0;
      return Array.from({ length: hashes }, (_, k) => ((h1 + Math.imul(k, h2)) >>> 0) % size);
    };
    return { add: (t: string) => positions(t).forEach((p) => bits.add(p)), mightHave: (t: string) => positions(t).every((p) => bits.has(p)) };
  }

  it('property: answers "might have" exactly as the remainder form (sizes up to 2^24 bits, the command\'s; past 2^30 the remainder is kept)', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ maxLength: 6 }), { maxLength: 40 }), fc.array(fc.string({ maxLength: 6 }), { maxLength: 40 }), fc.constantFrom(0, 1, 3, 5, 8, 17, 24), (added, asked, bitsLog2) => {
        const filter = new BloomFilter(bitsLog2);
        const reference = remainderFilter(bitsLog2);
        for (const t of added) {
          filter.add(t);
          reference.add(t);
        }
        for (const t of [...asked, ...added]) expect(filter.mightHave(t)).toBe(reference.mightHave(t));
      }),
      { numRuns: 200 },
    );
  });
});

describe('ColumnScanner gives the cells DelimitedSplitter gives', () => {
  const cell = fc.constantFrom('W1', ' W2 ', '', 'x', 'a b', '"q,uo""te"', '"two\nlines"', 'é', '6.1');
  const text = fc
    .record({
      rows: fc.array(fc.array(cell, { minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 30 }),
      delimiter: fc.constantFrom(',' as const, ';' as const, '\t' as const),
      end: fc.constantFrom('\n', '\r\n', '\r'),
      last: fc.boolean(),
    })
    .map(({ rows, delimiter, end, last }) => ({ delimiter, text: rows.map((r) => r.join(delimiter)).join(end) + (last ? end : '') }));

  it('property: for any column and any cut into chunks, the same cells with the same line numbers', () => {
    fc.assert(
      fc.property(text, fc.integer({ min: 0, max: 4 }), fc.array(fc.nat(), { maxLength: 5 }), ({ delimiter, text: body }, column, cuts) => {
        const points = [...new Set(cuts.map((c) => c % (body.length + 1)))].sort((a, b) => a - b);
        const chunks: string[] = [];
        let from = 0;
        for (const p of points) {
          chunks.push(body.slice(from, p));
          from = p;
        }
        chunks.push(body.slice(from));
        const splitter = new DelimitedSplitter(delimiter);
        const expected = [...chunks.flatMap((c) => splitter.push(c)), ...splitter.end()].map((l) => [l.cells[column] ?? '', l.line]);
        const got: [string, number][] = [];
        const scanner = new ColumnScanner(delimiter, column, (c, line) => got.push([c, line]) > 0);
        for (const c of chunks) scanner.push(c);
        scanner.end();
        expect(got).toEqual(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('property: with repeats skipped past a line, the same cells less each one that repeats the row before\'s (both past that line)', () => {
    // Cells that repeat often, and cells that differ only by spaces or by a quote.
    const repeating = fc.constantFrom('W1', 'W1', 'W1', ' W1', 'W2', '', '"W1"', 'W1 ');
    const rowsText = fc
      .record({
        rows: fc.array(fc.array(repeating, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 40 }),
        delimiter: fc.constantFrom(',' as const, ';' as const),
        end: fc.constantFrom('\n', '\r\n', '\r'),
        last: fc.boolean(),
      })
      .map(({ rows, delimiter, end, last }) => ({ delimiter, text: rows.map((r) => r.join(delimiter)).join(end) + (last ? end : '') }));
    fc.assert(
      fc.property(fc.oneof(rowsText, text), fc.integer({ min: 0, max: 2 }), fc.integer({ min: 0, max: 5 }), fc.array(fc.nat(), { maxLength: 5 }), ({ delimiter, text: body }, column, after, cuts) => {
        const points = [...new Set(cuts.map((c) => c % (body.length + 1)))].sort((a, b) => a - b);
        const chunks: string[] = [];
        let from = 0;
        for (const p of points) {
          chunks.push(body.slice(from, p));
          from = p;
        }
        chunks.push(body.slice(from));
        const every: [string, number][] = [];
        const all = new ColumnScanner(delimiter, column, (c, line) => every.push([c, line]) > 0);
        for (const c of chunks) all.push(c);
        all.end();
        const expected = every.filter(([c, line], i) => !(line > after && i > 0 && (every[i - 1] as [string, number])[1] > after && (every[i - 1] as [string, number])[0] === c));
        const got: [string, number][] = [];
        const scanner = new ColumnScanner(delimiter, column, (c, line) => got.push([c, line]) > 0, 1, { repeatsSkippedAfter: after });
        for (const c of chunks) scanner.push(c);
        scanner.end();
        expect(got).toEqual(expected);
      }),
      { numRuns: 500 },
    );
  });
});
