/**
 * A fixed, mixed set of valid scenarios for the benchmarks: every baseline form (risk, rate,
 * population with prevalence), every measure (OR, RR, HR), every design and interval level,
 * with limits rounded to two decimals as papers print them. Made by a seeded generator, so
 * every run times the same work. Illustrative numbers, not from a real population or study.
 */
import { parseScenario } from '@/lib/scenario/parse';
import { EFFECT_MEASURES, INTERVAL_LEVELS, STUDY_DESIGNS, type Scenario } from '@/lib/scenario/schema';
import { computeScenario } from '@/lib/engine/compute';

/** mulberry32, a small seeded generator (Tommy Ettinger, public domain) (from memory). */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function round(value: number, places: number): number {
  const f = 10 ** places;
  return Math.round(value * f) / f;
}

export type BaselineForm = 'risk' | 'rate' | 'population';
export const BASELINE_FORMS: readonly BaselineForm[] = ['risk', 'rate', 'population'];

/** One valid scenario of the given form; index picks measure, design and level in turn. */
function scenarioAt(form: BaselineForm, index: number, random: () => number): Scenario {
  const measure = EFFECT_MEASURES[index % EFFECT_MEASURES.length] ?? 'RR';
  const design = STUDY_DESIGNS[Math.floor(index / 3) % STUDY_DESIGNS.length] ?? 'cohort';
  const level = INTERVAL_LEVELS[Math.floor(index / 18) % INTERVAL_LEVELS.length] ?? 0.95;
  const estimate = round(Math.exp(-0.7 + 1.8 * random()), 2);
  const halfWidth = 1.96 * (0.05 + 0.3 * random());
  const lower = Math.max(0.01, round(estimate * Math.exp(-halfWidth), 2));
  const upper = Math.max(lower + 0.01, round(estimate * Math.exp(halfWidth), 2));
  const effect = {
    measure,
    estimate: Math.min(Math.max(estimate, lower), upper),
    lower,
    upper,
    level,
    design,
    ...(index % 4 === 0 ? { followUpYears: round(2 + 10 * random(), 1) } : {}),
    ...(index % 5 === 0 ? { adjusted: index % 10 === 0 } : {}),
  };
  const years = 1 + Math.floor(random() * 20);
  const horizon = index % 3 === 0 ? { horizonYears: 1 + Math.floor(random() * 20) } : {};
  switch (form) {
    case 'risk':
      return { baseline: { risk: round(0.005 + 0.3 * random(), 3), years }, effect, ...horizon };
    case 'rate':
      return {
        baseline: { rate: round(1 + 40 * random(), 1), perPersonYears: 1000 },
        effect,
        horizonYears: 1 + Math.floor(random() * 20),
      };
    case 'population':
      return {
        baseline: { populationRisk: round(0.005 + 0.3 * random(), 3), exposurePrevalence: round(0.05 + 0.5 * random(), 2), years },
        effect,
        ...horizon,
      };
  }
}

/**
 * `count` scenarios that parse and compute, the forms in turn (or one form only).
 * Candidates the engine refuses (a baseline that reaches 100% over a long horizon) are skipped.
 */
export function mixedScenarios(count: number, forms: readonly BaselineForm[] = BASELINE_FORMS, seed = 20240601): Scenario[] {
  const random = seeded(seed);
  const out: Scenario[] = [];
  for (let i = 0; out.length < count; i += 1) {
    const candidate = scenarioAt(forms[i % forms.length] ?? 'risk', Math.floor(i / forms.length), random);
    const parsed = parseScenario(candidate);
    if (parsed.ok && computeScenario(parsed.value).ok) out.push(parsed.value);
  }
  return out;
}
