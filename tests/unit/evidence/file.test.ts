import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  EVIDENCE_FILE_FORMAT,
  evidenceFileSchema,
  exportEvidenceJson,
  MAX_EVIDENCE_FILE_CHARS,
  parseEvidenceFile,
  parseEvidenceJson,
} from '@/lib/evidence/file';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { EFFECT_MEASURES, STUDY_DESIGNS } from '@/lib/scenario/schema';
import { CRITERIA_SETS, GLYCAEMIC_CATEGORIES } from '@/lib/glycaemia/exposure';

function issues(text: string) {
  const r = parseEvidenceJson(text);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.issues;
}

describe('evidence file: export then import', () => {
  it('gives the demo entries back identically', () => {
    expect(parseEvidenceJson(exportEvidenceJson(DEMO_EVIDENCE))).toEqual({ ok: true, value: DEMO_EVIDENCE });
  });

  it('writes the versioned format', () => {
    const file = JSON.parse(exportEvidenceJson([])) as unknown;
    expect(file).toEqual({ format: EVIDENCE_FILE_FORMAT, version: 1, entries: [] });
    expect(evidenceFileSchema.safeParse(file).success).toBe(true);
  });

  const text = (max: number) => fc.string({ maxLength: max });
  const entryArb: fc.Arbitrary<EvidenceEntry> = fc
    .record({
      id: fc.stringMatching(/^[a-z0-9][a-z0-9._-]{0,30}$/),
      title: fc.string({ minLength: 1, maxLength: 80 }).map((s) => s.trim()).filter((s) => s.length > 0),
      measure: fc.constantFrom(...EFFECT_MEASURES),
      // Limits L < U, estimate between them (hand-built so the effect schema's order rules hold).
      limits: fc.tuple(fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })),
      design: fc.option(fc.constantFrom(...STUDY_DESIGNS), { nil: undefined }),
      followUpYears: fc.option(fc.double({ min: 0.1, max: 100, noNaN: true }), { nil: undefined }),
      adjusted: fc.option(fc.boolean(), { nil: undefined }),
      outcome: fc.option(text(100), { nil: undefined }),
      citation: fc.option(text(100), { nil: undefined }),
      exposure: fc.option(fc.record({ category: fc.constantFrom(...GLYCAEMIC_CATEGORIES), criteria: fc.constantFrom(...CRITERIA_SETS), minYears: fc.integer({ min: 1, max: 50 }) }), { nil: undefined }),
      illustrative: fc.boolean(),
      notes: fc.option(text(200), { nil: undefined }),
    })
    .filter(({ limits: [a, b] }) => a !== b)
    .map(({ id, title, measure, limits: [a, b, t], design, followUpYears, adjusted, outcome, citation, exposure, illustrative, notes }) => {
      const lower = Math.min(a, b);
      const upper = Math.max(a, b);
      const estimate = Math.min(upper, Math.max(lower, lower + t * (upper - lower)));
      return {
        id,
        title,
        effect: {
          measure,
          estimate,
          lower,
          upper,
          ...(design === undefined ? {} : { design }),
          ...(followUpYears === undefined ? {} : { followUpYears }),
          ...(adjusted === undefined ? {} : { adjusted }),
        },
        wording: { ...(outcome === undefined ? {} : { outcome }), ...(citation === undefined ? {} : { citation }) },
        ...(exposure === undefined ? {} : { exposureDefinition: exposure }),
        illustrative,
        ...(notes === undefined ? {} : { notes }),
      };
    });

  it('property: any valid list of entries with distinct ids survives export then import identically', () => {
    fc.assert(
      fc.property(fc.uniqueArray(entryArb, { selector: (e) => e.id, maxLength: 8 }), (entries) => {
        expect(parseEvidenceJson(exportEvidenceJson(entries))).toEqual({ ok: true, value: entries });
      }),
      { numRuns: 1000 },
    );
  });
});

describe('evidence file versions', () => {
  const oldEntry: EvidenceEntry = { ...DEMO_EVIDENCE[0]!, exposureDefinition: { category: 'prediabetes', criteria: 'ADA', minYears: 3 } };

  it('a version-1 file of the current shape still imports', () => {
    const text = JSON.stringify({ format: EVIDENCE_FILE_FORMAT, version: 1, entries: [oldEntry] });
    expect(parseEvidenceJson(text)).toEqual({ ok: true, value: [oldEntry] });
  });

  it('writes version 1 when no entry needs more, version 2 for a test, a gap or a comparison group', () => {
    expect(JSON.parse(exportEvidenceJson([oldEntry])).version).toBe(1);
    const withComparison: EvidenceEntry = { ...oldEntry, exposureDefinition: { ...oldEntry.exposureDefinition!, comparison: { category: 'normal' } } };
    const withGap: EvidenceEntry = { ...oldEntry, id: 'gap', exposureDefinition: { ...oldEntry.exposureDefinition!, maxGapMonths: 12 } };
    const text = exportEvidenceJson([oldEntry, withComparison, withGap].map((e, i) => ({ ...e, id: `e${i}` })));
    expect(JSON.parse(text).version).toBe(2);
    expect(parseEvidenceJson(text).ok).toBe(true);
    expect(evidenceFileSchema.safeParse(JSON.parse(text)).success).toBe(true);
  });
});

describe('evidence file: refusals name the entry and the field', () => {
  const good = DEMO_EVIDENCE[0]!;
  const file = (entries: unknown[], extra: Record<string, unknown> = {}) => JSON.stringify({ format: EVIDENCE_FILE_FORMAT, version: 1, entries, ...extra });

  it('refuses the whole file when one entry is bad', () => {
    const bad = { ...good, id: 'second', title: 'Second entry', effect: { ...good.effect, lower: 3 } };
    const found = issues(file([good, bad]));
    expect(found).toEqual([
      {
        code: 'interval-order',
        path: ['entries', 1, 'effect', 'lower'],
        message: 'Entry 2 ("Second entry"), effect.lower: The lower limit (3) must be less than the upper limit (2.1); check the order of the limits',
      },
    ]);
  });

  it('lists every problem of every entry', () => {
    const found = issues(file([{ ...good, title: '' }, { ...good, id: 'b', illustrative: 'no' }, 42]));
    expect(found.map((i) => i.path)).toEqual([
      ['entries', 0, 'title'],
      ['entries', 1, 'illustrative'],
      ['entries', 2],
    ]);
    expect(found[2]?.message).toMatch(/^Entry 3: /);
  });

  it('shortens a long title in the message', () => {
    const found = issues(file([{ ...good, effect: { ...good.effect, lower: 3 } }]));
    expect(found[0]?.message).toMatch(/^Entry 1 \("Prediabetes-range HbA1c and heart failure, workforce coho…"\), effect\.lower: /);
  });

  it('refuses duplicated ids', () => {
    expect(issues(file([good, good]))[0]).toMatchObject({ code: 'duplicate-id', path: ['entries', 1, 'id'] });
  });

  it('refuses unknown fields in an entry and in the file', () => {
    expect(issues(file([{ ...good, colour: 'red' }]))[0]).toMatchObject({ code: 'unknown-field', path: ['entries', 0, 'colour'] });
    expect(issues(file([good], { extra: 1 }))[0]).toMatchObject({ code: 'unknown-field', path: ['extra'] });
  });

  it.each([
    ['', 'empty-file'],
    ['{', 'invalid-json'],
    ['[]', 'wrong-type'],
    ['null', 'wrong-type'],
    ['{"format":"other","version":1,"entries":[]}', 'wrong-format'],
    // Version 2 is read now (exposure definitions with test, gap and comparison); 3 is newer.
    ['{"format":"hundredfold-evidence","version":3,"entries":[]}', 'newer-version'],
    ['{"format":"hundredfold-evidence","version":"1","entries":[]}', 'wrong-version'],
    ['{"format":"hundredfold-evidence","version":1}', 'required'],
    ['{"format":"hundredfold-evidence","version":1,"entries":{}}', 'wrong-type'],
  ])('refuses %j (%s)', (text, code) => {
    expect(issues(text)[0]?.code).toBe(code);
  });

  it('refuses a file over the size limit', () => {
    expect(issues(' '.repeat(MAX_EVIDENCE_FILE_CHARS + 1))[0]?.code).toBe('file-too-large');
  });

  it('accepts a byte-order mark', () => {
    expect(parseEvidenceJson(`\uFEFF${exportEvidenceJson(DEMO_EVIDENCE)}`).ok).toBe(true);
  });

  it('parseEvidenceFile refuses non-objects', () => {
    for (const bad of [undefined, 3, 'x']) expect(parseEvidenceFile(bad).ok).toBe(false);
  });
});
