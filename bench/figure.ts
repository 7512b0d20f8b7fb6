/**
 * What a benchmark reports. Every bench/*.bench.ts exports `run(): Promise<Figure[]>`;
 * bench/index.ts finds the files, runs each in its own process, prints a table and writes
 * bench-results/latest.json.
 */
import { pathToFileURL } from 'node:url';

export interface Figure {
  /** What was measured, e.g. "computeScenario, mixed scenarios". */
  readonly name: string;
  readonly value: number;
  /** e.g. "evaluations/s", "ms", "×". */
  readonly unit: string;
  /** The figure the issue asks for, when it asks for one. */
  readonly target?: number;
  /** Whether a larger value is better (throughput) or a smaller one (time, ratio). Default "higher". */
  readonly better?: 'higher' | 'lower';
}

export type Bench = () => Promise<Figure[]>;

/** True when the figure meets its target; undefined when it has none. */
export function meetsTarget(figure: Figure): boolean | undefined {
  if (figure.target === undefined) return undefined;
  return figure.better === 'lower' ? figure.value <= figure.target : figure.value >= figure.target;
}

/** The median of some timings or rates (the middle one, or the mean of the middle two). */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  if (sorted.length === 0) return Number.NaN;
  return sorted.length % 2 === 1 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

/**
 * When a bench file is run on its own (`npx tsx bench/x.bench.ts`) rather than by bench/index.ts:
 * runs it and prints each figure with its target, or the error (exit code 1).
 * @example
 * runWhenAlone(import.meta.url, run, 'batch handouts bench')
 */
export function runWhenAlone(moduleUrl: string, bench: Bench, label: string): void {
  if (!process.argv[1] || moduleUrl !== pathToFileURL(process.argv[1]).href) return;
  bench().then(
    (figures) => {
      for (const f of figures) process.stdout.write(`${f.name}: ${f.value} ${f.unit}${f.target === undefined ? '' : ` (target ≤ ${f.target})`}\n`);
    },
    (error: unknown) => {
      process.stderr.write(`${label} failed: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
