/**
 * Engine throughput on one core (issue 2 §5: at least 500,000 evaluations per second for a
 * mixed set of scenarios). Node runs this on one thread, so a rate here is a one-core rate.
 *
 * - computeScenario alone, on scenarios validated beforehand: the engine's own cost.
 * - parseScenario then computeScenario, on the same plain objects: what the app pays per
 *   keystroke and the command line per line (without JSON text).
 * - computeScenario by baseline form, to show where the time goes.
 *
 * Each figure is the median of several timed rounds after a warm-up, each timed by this
 * process's CPU time, so one slow round or a busy machine does not decide it.
 *
 * The engine is timed as it ships: bundled by esbuild, as the command (scripts/build-cli.mjs)
 * and the app's production build bundle it. Under tsx, the development loader that runs this
 * file, esbuild's keepNames wraps every closure in a call that renames it each time it is made,
 * a cost no shipped build pays; one figure shows the engine under tsx too, for comparison.
 */
import { computeScenario as computeUnderTsx } from '@/lib/engine/compute';
import type { computeScenario } from '@/lib/engine/compute';
import type { parseScenario } from '@/lib/scenario/parse';
import type { Scenario } from '@/lib/scenario/schema';
import { importBundled } from './bundle';
import { median, type Figure } from './figure';
import { BASELINE_FORMS, mixedScenarios } from './scenarios';


interface Engine {
  readonly computeScenario: typeof computeScenario;
  readonly parseScenario: typeof parseScenario;
}

/** The engine and the scenario parser, bundled as a production build would bundle them. */
function bundledEngine(): Promise<Engine> {
  return importBundled<Engine>(
    "export { computeScenario } from './lib/engine/compute'; export { parseScenario } from './lib/scenario/parse';",
    'engine',
  );
}

const SET_SIZE = 3000;
const ROUNDS = 7;
const ROUND_MS = 300;

/** CPU time this process has used, in milliseconds (user + system). */
function cpuMs(): number {
  const { user, system } = process.cpuUsage();
  return (user + system) / 1000;
}

/**
 * Calls `work(i)` over and over for about `ms` milliseconds of this process's CPU time; returns
 * calls per CPU-second. CPU time, not wall time, so other programs sharing the machine's cores
 * do not count against the engine: the figure is a one-core rate.
 */
function ratePerSecond(work: (i: number) => number, size: number, ms: number): { rate: number; checksum: number } {
  let calls = 0;
  let checksum = 0;
  const start = cpuMs();
  let elapsed = 0;
  while (elapsed < ms) {
    for (let i = 0; i < size; i += 1) checksum += work(i);
    calls += size;
    elapsed = cpuMs() - start;
  }
  return { rate: (calls / elapsed) * 1000, checksum };
}

function measure(work: (i: number) => number, size: number): number {
  ratePerSecond(work, size, ROUND_MS); // warm-up: let the JIT settle
  const rates: number[] = [];
  let checksum = 0;
  for (let r = 0; r < ROUNDS; r += 1) {
    const round = ratePerSecond(work, size, ROUND_MS);
    rates.push(round.rate);
    checksum += round.checksum;
  }
  // Using the checksum keeps the work from being optimised away.
  if (Number.isNaN(checksum)) throw new Error('the engine returned NaN');
  return median(rates);
}

function computeOnly(compute: Engine['computeScenario'], scenarios: readonly Scenario[]) {
  return (i: number): number => {
    const result = compute(scenarios[i] as Scenario);
    return result.ok ? result.value.referenceRisk : 0;
  };
}

export async function run(): Promise<Figure[]> {
  const { computeScenario, parseScenario } = await bundledEngine();
  const mixed = mixedScenarios(SET_SIZE);
  // The same scenarios as plain objects, as JSON.parse would hand them over.
  const plain: unknown[] = mixed.map((s) => JSON.parse(JSON.stringify(s)) as unknown);

  const figures: Figure[] = [
    {
      name: 'computeScenario, mixed scenarios (pre-validated)',
      value: measure(computeOnly(computeScenario, mixed), mixed.length),
      unit: 'evaluations/s',
      target: 500_000,
    },
    {
      name: 'parseScenario + computeScenario, mixed scenarios',
      value: measure((i) => {
        const parsed = parseScenario(plain[i]);
        if (!parsed.ok) return 0;
        const result = computeScenario(parsed.value);
        return result.ok ? result.value.referenceRisk : 0;
      }, plain.length),
      unit: 'evaluations/s',
    },
    {
      name: 'parseScenario alone, mixed scenarios',
      value: measure((i) => (parseScenario(plain[i]).ok ? 1 : 0), plain.length),
      unit: 'validations/s',
    },
  ];
  for (const form of BASELINE_FORMS) {
    const set = mixedScenarios(SET_SIZE / 3, [form]);
    figures.push({ name: `computeScenario, ${form} baselines only`, value: measure(computeOnly(computeScenario, set), set.length), unit: 'evaluations/s' });
  }
  figures.push({
    name: 'computeScenario under tsx (development loader), mixed',
    value: measure(computeOnly(computeUnderTsx, mixed), mixed.length),
    unit: 'evaluations/s',
  });
  return figures;
}
