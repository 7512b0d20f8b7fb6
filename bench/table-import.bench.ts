/**
 * Importing a large population-table CSV (issue 6: "a 5 MB CSV imports without freezing the
 * page; measure it in the benchmark").
 *
 * Builds a valid ~5 MB table file (833 districts × 2 sexes × 60 single years of age = 99,960
 * strata, invented numbers) and times:
 * - parseTableCsv: reading and checking the whole file in one go (the command line's path);
 * - parseTableCsvInChunks with the block size the library screen uses: the total time, and
 *   the longest stretch between two pauses, which is how long the page cannot respond. The
 *   target is 50 ms, the W3C Long Tasks threshold for a task that delays input (from memory).
 *
 * Timed as shipped: lib/tables/csv.ts bundled by esbuild (tsx's keepNames wrapper would add a
 * cost no build pays). Each figure is the median of several rounds after a warm-up.
 *
 * Run alone: `npx tsx bench/table-import.bench.ts`.
 */
import { pathToFileURL } from 'node:url';
import type * as Csv from '@/lib/tables/csv';
import type { PopulationTable, Stratum } from '@/lib/tables/schema';
import { LIBRARY_IMPORT_CHUNK_CHARS } from '@/lib/tables/chunking';
import { importBundled } from './bundle';
import { median, type Figure } from './figure';

const ROUNDS = 5;

function bundledCsv(): Promise<typeof Csv> {
  return importBundled<typeof Csv>("export * from './lib/tables/csv';", 'csv');
}

/** A valid table of invented numbers (illustrative, not from a real population). */
export function largeTable(districts = 833): PopulationTable {
  const strata: Stratum[] = [];
  for (let d = 0; d < districts; d++) {
    const district = `district-${String(d).padStart(4, '0')}-north-coast-area`;
    for (const sex of ['female', 'male'] as const) {
      for (let age = 30; age < 90; age++) {
        strata.push({ sex, ageFrom: age, ageTo: age === 89 ? 120 : age, extra: { district }, risk: Number((0.0005 + (age - 30) * 0.0011 + d * 1e-7).toFixed(7)) });
      }
    }
  }
  return {
    id: 'bench-large',
    title: 'Large benchmark table',
    outcome: 'an invented outcome',
    horizonYears: 10,
    population: 'invented districts (illustrative)',
    source: 'Illustrative numbers, not from a real population',
    year: 2024,
    illustrative: true,
    strata,
  };
}

export async function run(): Promise<Figure[]> {
  const csv = await bundledCsv();
  const table = largeTable();
  const text = csv.exportTableCsv(table);
  const megabytes = csv.utf8Length(text) / 1024 / 1024;

  // Warm-up, and a check that the file is valid (a benchmark of a refusal would mislead).
  const check = csv.parseTableCsv(text);
  if (!check.ok) throw new Error(`the benchmark file is not valid: ${check.issues[0]?.message}`);

  const whole: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    const t0 = performance.now();
    csv.parseTableCsv(text);
    whole.push(performance.now() - t0);
  }

  const totals: number[] = [];
  const longest: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    let last = performance.now();
    let worst = 0;
    const t0 = last;
    const result = await csv.parseTableCsvInChunks(text, {
      chunkChars: LIBRARY_IMPORT_CHUNK_CHARS,
      pause: async () => {
        const now = performance.now();
        worst = Math.max(worst, now - last);
        await new Promise<void>((resolve) => setImmediate(resolve));
        last = performance.now();
      },
    });
    const end = performance.now();
    worst = Math.max(worst, end - last);
    if (!result.ok) throw new Error('the chunked read refused the benchmark file');
    totals.push(end - t0);
    longest.push(worst);
  }

  return [
    { name: 'table CSV size', value: megabytes, unit: 'MB' },
    { name: 'table CSV strata', value: table.strata.length, unit: 'rows' },
    { name: 'parseTableCsv, whole file at once (parse + validate)', value: median(whole), unit: 'ms', better: 'lower' },
    { name: 'parseTableCsv throughput', value: (table.strata.length / median(whole)) * 1000, unit: 'rows/s' },
    { name: `parseTableCsvInChunks, ${LIBRARY_IMPORT_CHUNK_CHARS / 1024} kB blocks, total`, value: median(totals), unit: 'ms', better: 'lower' },
    { name: 'parseTableCsvInChunks, longest stretch without a pause', value: median(longest), unit: 'ms', target: 50, better: 'lower' },
  ];
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  run().then(
    (figures) => {
      for (const f of figures) process.stdout.write(`${f.name}: ${f.value.toFixed(f.unit === 'rows' ? 0 : 2)} ${f.unit}${f.target === undefined ? '' : ` (target ${f.better === 'lower' ? '≤' : '≥'} ${f.target})`}\n`);
    },
    (error: unknown) => {
      process.stderr.write(`table-import bench failed: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
