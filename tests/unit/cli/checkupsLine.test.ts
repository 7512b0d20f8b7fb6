import { Writable } from 'node:stream';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LineWriter, workerJsonLine, type LinePiece } from '@/lib/cli/commands/checkups';
import { DEMO_WORKFORCE_HBA1C_HEART_FAILURE } from '@/lib/evidence/demo';
import { DEMO_HEART_FAILURE_10Y } from '@/lib/tables/demo';
import { evaluateWorker, prepareCheckups, type CheckupRow, type CheckupsContext, type WorkerResult } from '@/lib/workforce';

// `hundredfold checkups` writes each worker's line in pieces, remembering the JSON text of the
// figures that workers of one scenario share. The line must be the contract's object written by
// JSON.stringify, keys in the contract's order (README "Output"), byte for byte.
// Invented workers (illustrative).

/** The line as the contract lists its keys, written whole. */
function contractLine(r: WorkerResult): string {
  return JSON.stringify({
    worker: r.worker,
    age: r.age,
    sex: r.sex,
    checkups: r.checkups,
    latest: r.latest,
    run: r.run,
    status: r.status,
    reasons: r.reasons,
    referenceRisk: r.referenceRisk,
    exposedRisk: r.exposedRisk,
    riskDifference: r.riskDifference,
    numberNeeded: r.numberNeeded,
    horizonYears: r.horizonYears,
    strata: r.strata,
    warnings: r.warnings,
  });
}

function context(): CheckupsContext {
  const prepared = prepareCheckups({ evidence: DEMO_WORKFORCE_HBA1C_HEART_FAILURE, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA' });
  if (!prepared.ok) throw new Error(prepared.issues[0]?.message);
  return prepared.value;
}

const workerArb = fc
  .record({
    id: fc.oneof(fc.constantFrom('W1', 'W2'), fc.string({ maxLength: 8 })),
    values: fc.array(fc.integer({ min: 45, max: 75 }), { minLength: 1, maxLength: 5 }),
    age: fc.integer({ min: 25, max: 85 }),
    sex: fc.option(fc.constantFrom('female' as const, 'male' as const), { nil: undefined }),
    site: fc.option(fc.string({ maxLength: 6 }), { nil: undefined }),
  })
  .map(({ id, values, age, sex, site }) => ({
    worker: id,
    rows: values.map(
      (v, i): CheckupRow => ({
        line: i + 2,
        worker: id,
        date: `${2019 + i}-05-0${1 + (i % 3)}`,
        hba1c: { value: v / 10, unit: '%' },
        age,
        ...(sex !== undefined ? { sex } : {}),
        strata: site !== undefined ? { site } : {},
      }),
    ),
  }));

describe('workerJsonLine', () => {
  it('property: every worker of a run (figures shared between workers of one scenario) gets the contract line, byte for byte', () => {
    fc.assert(
      fc.property(fc.array(workerArb, { minLength: 1, maxLength: 40 }), (workers) => {
        const shared = context();
        for (const group of workers) {
          const result = evaluateWorker(group, shared);
          expect(workerJsonLine(result)).toBe(contractLine(result));
          // Twice: the second time from the remembered text.
          expect(workerJsonLine(result)).toBe(contractLine(result));
        }
      }),
      { numRuns: 100 },
    );
  });

  it('never reuses a remembered text for figures that differ, and writes figures that are not frozen afresh', () => {
    const shared = context();
    const rows = (worker: string, hba1c: number): CheckupRow[] =>
      [2021, 2022, 2023].map((year, i) => ({ line: i + 2, worker, date: `${year}-03-01`, hba1c: { value: hba1c, unit: '%' }, age: 52, sex: 'female', strata: {} }));
    // Hand-worked: 5.9% three years running is exposed (ADA 5.7–6.4%), 5.2% comparison; both women of 52.
    const exposed = evaluateWorker({ worker: 'W1', rows: rows('W1', 5.9) }, shared);
    expect(exposed.status).toBe('exposed');
    expect(workerJsonLine(exposed)).toBe(contractLine(exposed));
    // The same frozen exposedRisk with another reference risk, number needed and horizon: not the remembered text.
    const changed: WorkerResult = { ...exposed, referenceRisk: 0.5, numberNeeded: null, horizonYears: 5 };
    expect(workerJsonLine(changed)).toBe(contractLine(changed));
    // Figures that are plain objects (not from the shared, frozen answers).
    const plain: WorkerResult = JSON.parse(JSON.stringify(exposed)) as WorkerResult;
    expect(workerJsonLine(plain)).toBe(contractLine(plain));
    if (plain.exposedRisk) Object.assign(plain.exposedRisk, { estimate: 0.25 });
    expect(workerJsonLine(plain)).toContain('"estimate":0.25');
    expect(workerJsonLine(plain)).toBe(contractLine(plain));
    // A worker without figures, and one whose warnings list is frozen and shared.
    const insufficient = evaluateWorker({ worker: 'W3', rows: rows('W3', 5.9).slice(0, 1) }, shared);
    expect(insufficient.status).toBe('insufficient');
    expect(workerJsonLine(insufficient)).toBe(contractLine(insufficient));
    const warned: WorkerResult = { ...insufficient, warnings: Object.freeze([{ code: 'x', message: 'first "quoted" \u2028 text' }]) };
    expect(workerJsonLine(warned)).toBe(contractLine(warned));
    expect(workerJsonLine({ ...warned })).toBe(contractLine(warned));
  });
});

describe('LineWriter', () => {
  it('property: lines given whole or in pieces (text and UTF-8 bytes, any size) come out as the lines joined by newlines, byte for byte', async () => {
    const text = fc.string({ unit: fc.constantFrom('a', '"', 'é', '–', '中', '😀', ','), maxLength: 40 });
    const lineArb = fc.oneof(
      text.map((t) => ({ whole: t })),
      fc.array(fc.tuple(text, fc.boolean()), { maxLength: 6 }).map((parts) => ({ parts })),
      // Longer than a whole output block (64 KiB), as text and as bytes; ASCII bytes that fill a block.
      fc.constant({ whole: 'x'.repeat(70_000) }),
      fc.constant({ parts: [['y'.repeat(70_000), true] as [string, boolean]] }),
      fc.integer({ min: 1, max: 3000 }).map((n) => ({ parts: [['z'.repeat(n), true] as [string, boolean]] })),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(lineArb, { maxLength: 300 }), fc.array(fc.constantFrom('a'.repeat(5000), 'é'.repeat(3000)), { maxLength: 30 }), async (lines, filler) => {
        const chunks: Buffer[] = [];
        const stdout = new Writable({
          write(chunk: Buffer, _encoding, done) {
            chunks.push(Buffer.from(chunk));
            done();
          },
        });
        const out = new LineWriter({ stdout });
        const expected: string[] = [];
        for (const line of [...lines, ...filler.map((whole) => ({ whole }))]) {
          if ('whole' in line) {
            out.push(line.whole);
            expected.push(line.whole);
          } else {
            // Bytes given as a view into a larger buffer, as remembered pieces may be.
            const pieces: LinePiece[] = line.parts.map(([t, asBytes]) => (asBytes ? Buffer.concat([Buffer.from('#'), Buffer.from(t)]).subarray(1) : t));
            out.pushPieces(pieces);
            expected.push(line.parts.map(([t]) => t).join(''));
          }
          if (out.pending > 100_000) await out.flush();
        }
        await out.flush();
        expect(Buffer.concat(chunks).equals(Buffer.from(expected.map((l) => `${l}\n`).join('')))).toBe(true);
      }),
      { numRuns: 60 },
    );
  });
});
