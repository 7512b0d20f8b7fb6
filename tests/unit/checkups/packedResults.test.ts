/**
 * Packed results (lib/checkups/packedResults.ts): what is packed reads back exactly — arbitrary
 * results (any text, finite numbers) and the engine's own results for the demo file — chunk by
 * chunk, and as the lazily read list the checkups screen holds.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { packedChunkBuffers, copyPackedChunk, packedResultList, ResultsPacker, unpackResult, type PackedChunk } from '@/lib/checkups/packedResults';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { GLYCAEMIC_CATEGORIES } from '@/lib/glycaemia/exposure';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { prepareCheckups, runCheckups, WORKER_STATUSES, type WorkerResult } from '@/lib/workforce';
import { C003, W001, W002 } from './fixtures';

/** Plain objects, as JSON gives back (fast-check otherwise sometimes makes them without a prototype). */
const record = <T,>(model: { [K in keyof T]: fc.Arbitrary<T[K]> }): fc.Arbitrary<T> => fc.record(model, { noNullPrototype: true });

/** Any text: whole Unicode, lone surrogates included (JSON writes those as escapes). */
const text = fc.string({ unit: 'binary', maxLength: 30 });
/** Finite numbers (the engine gives no NaN, no ±Infinity and no −0 in a result: see the module's note). */
const finite = fc.double({ noNaN: true, noDefaultInfinity: true }).filter((x) => !Object.is(x, -0));
const estimate = record({ estimate: finite, lower: finite, upper: finite });
const direction = fc.constantFrom('harm' as const, 'benefit' as const, 'none' as const);
const limit = record({ direction, value: fc.option(finite, { nil: null }), display: fc.option(fc.nat(), { nil: null }) });
const category = fc.option(fc.constantFrom(...GLYCAEMIC_CATEGORIES), { nil: null });

const resultArb: fc.Arbitrary<WorkerResult> = record({
  worker: text,
  age: fc.option(fc.integer({ min: 0, max: 120 }), { nil: null }),
  sex: fc.constantFrom('female' as const, 'male' as const, null),
  checkups: fc.nat(),
  latest: fc.option(record({ date: text, category }), { nil: null }),
  run: record({ category, yearlyResults: fc.nat(), from: fc.option(text, { nil: null }), to: fc.option(text, { nil: null }) }),
  status: fc.constantFrom(...WORKER_STATUSES),
  reasons: fc.array(text, { maxLength: 3 }),
  referenceRisk: fc.option(finite, { nil: null }),
  exposedRisk: fc.option(estimate, { nil: null }),
  riskDifference: fc.option(estimate, { nil: null }),
  numberNeeded: fc.option(
    record({ direction, estimate: fc.option(finite, { nil: null }), display: fc.option(fc.nat(), { nil: null }), crossesNull: fc.boolean(), interval: record({ from: limit, to: limit }), text }),
    { nil: null },
  ),
  horizonYears: fc.option(finite, { nil: null }),
  warnings: fc.array(record({ code: text, message: text }), { maxLength: 2 }),
  strata: fc.dictionary(text, text, { maxKeys: 3, noNullPrototype: true }),
  problems: fc.array(fc.record({ line: fc.nat(), file: text, column: fc.option(text, { nil: null }), code: text, message: text }, { requiredKeys: ['line', 'column', 'code', 'message'], noNullPrototype: true }), { maxLength: 2 }),
  skippedRows: fc.nat(),
});

function pack(results: readonly WorkerResult[], chunkSize?: number): { packed: ReturnType<ResultsPacker['finish']>; chunks: PackedChunk[] } {
  const chunks: PackedChunk[] = [];
  const packer = new ResultsPacker((c) => chunks.push(c), chunkSize);
  for (const r of results) packer.add(r);
  return { packed: packer.finish(), chunks };
}

describe('ResultsPacker and unpackResult', () => {
  it('reads back every result exactly, whatever its text and numbers, in chunks of any size', () => {
    fc.assert(
      fc.property(fc.array(resultArb, { maxLength: 12 }), fc.integer({ min: 1, max: 5 }), (results, chunkSize) => {
        const { packed, chunks } = pack(results, chunkSize);
        expect(packed.count).toBe(results.length);
        expect(chunks).toEqual(packed.chunks);
        expect(chunks.map((c) => c.first)).toEqual(chunks.map((_, k) => k * chunkSize));
        results.forEach((r, i) => expect(unpackResult(packed, i)).toStrictEqual(r));
      }),
      { numRuns: 300 },
    );
  });

  it('reads back the engine’s own results for the demo file exactly (all 40 workers)', async () => {
    const context = prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
    if (!context.ok) throw new Error('the demo settings are refused');
    const results: WorkerResult[] = [];
    const outcome = await runCheckups([readFileSync('demo/checkups/checkups.csv', 'utf8')], { context: context.value, reader: { today: '2026-01-01' }, format: 'delimited', onWorker: (w) => results.push(w) });
    expect(outcome.ok).toBe(true);
    expect(results).toHaveLength(40); // demo/checkups/checkups.csv has W001–W040
    const { packed } = pack(results, 16);
    expect(packed.chunks.map((c) => c.ends.length)).toEqual([16, 16, 8]);
    results.forEach((r, i) => expect(unpackResult(packed, i)).toStrictEqual(r));
  });

  it('refuses a position with no result, and a chunk size that is not a whole number ≥ 1', () => {
    const { packed } = pack([W001, W002]);
    expect(() => unpackResult(packed, 2)).toThrow(RangeError);
    expect(() => unpackResult(packed, -1)).toThrow(RangeError);
    expect(() => unpackResult(packed, 0.5)).toThrow(RangeError);
    expect(() => new ResultsPacker(() => {}, 0)).toThrow(RangeError);
  });

  it('copies a chunk into buffers of its own, to transfer one and keep the other', () => {
    const { chunks } = pack([W001, W002, C003], 2);
    const first = chunks[0]!;
    const copy = copyPackedChunk(first);
    expect(copy).toEqual(first);
    expect(packedChunkBuffers(copy).some((b) => packedChunkBuffers(first).includes(b))).toBe(false);
  });
});

describe('packedResultList', () => {
  it('gives each result, read when first asked for, the same object every time', () => {
    fc.assert(
      fc.property(fc.array(resultArb, { maxLength: 10 }), fc.integer({ min: 1, max: 4 }), (results, chunkSize) => {
        const list = packedResultList(pack(results, chunkSize).packed);
        expect(list).toHaveLength(results.length);
        results.forEach((r, i) => {
          const read = list[i]!;
          expect(read.status).toBe(r.status);
          expect(read.worker).toBe(r.worker);
          expect(read.exposedRisk).toStrictEqual(r.exposedRisk);
          expect(read.strata).toStrictEqual(r.strata);
          expect(JSON.parse(JSON.stringify(read))).toStrictEqual(JSON.parse(JSON.stringify(r)));
          expect(list[i]).toBe(read);
        });
      }),
      { numRuns: 200 },
    );
  });

  it('reads every field of W001 (demo file) as the engine gave it', () => {
    const read = packedResultList(pack([W002, W001]).packed)[1]!;
    for (const key of Object.keys(W001) as (keyof WorkerResult)[]) expect(read[key]).toStrictEqual(W001[key]);
  });
});
