/**
 * Validates anything that claims to be a {@link Scenario}: a parsed JSON body from the command
 * line, a decoded link, an import, the form's values.
 */
import { fail, ok, type Issue, type Result } from '../result';
import { BASELINE_FORM_KEYS, scenarioSchema, scenarioSchemaByForm, type Scenario } from './schema';
import { pickUnionBranch, toIssues } from '../validation/issues';

const BASELINE_FORMS_MESSAGE =
  'The baseline must be one of: {"risk", "years"}, {"rate", "perPersonYears"} or {"populationRisk", "exposurePrevalence", "years"}';

/**
 * Validate a scenario.
 *
 * @example
 * parseScenario({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } })
 * //=> { ok: true, value: { baseline: …, effect: … } }
 * parseScenario({ baseline: { risk: 8, years: 10 }, effect: … })
 * //=> { ok: false, issues: [{ code: 'out-of-range', path: ['baseline', 'risk'], message: 'The baseline risk must be less than 1 …' }] }
 */
export function parseScenario(input: unknown): Result<Scenario> {
  if (typeof input !== 'object' || input === null || Array.isArray(input)) {
    return fail([{ code: 'wrong-type', path: [], message: ROOT_MESSAGE }]);
  }
  const baseline = (input as { baseline?: unknown }).baseline;
  const form = baselineForm(baseline);
  // A scenario whose baseline form is evident is checked against that form alone.
  const schema = form === undefined ? scenarioSchema : scenarioSchemaByForm[form];
  const quick = schema.safeParse(input);
  if (quick.success) return ok(quick.data);
  // Only a failure pays for reportInput, which the issue codes need.
  const parsed = schema.safeParse(input, { reportInput: true });
  if (parsed.success) return ok(parsed.data);
  const issues: Issue[] = [];
  for (const issue of parsed.error.issues) {
    if (issue.code === 'invalid_union' && issue.path.length === 1 && issue.path[0] === 'baseline') {
      const branch = pickUnionBranch(issue, BASELINE_FORM_KEYS, baseline);
      if (branch) {
        // One at a time: spreading a huge list into one call overflows the stack.
        for (const one of toIssues(branch)) issues.push(one);
      } else {
        issues.push({
          code: baseline === undefined ? 'required' : 'baseline-form',
          path: ['baseline'],
          message: baseline === undefined ? `The baseline is required. ${BASELINE_FORMS_MESSAGE}` : BASELINE_FORMS_MESSAGE,
        });
      }
      continue;
    }
    for (const one of toIssues([issue])) issues.push(one);
  }
  return fail(issues);
}

const ROOT_MESSAGE = 'The scenario must be a JSON object with "baseline" and "effect" fields';

/** Which baseline form the input evidently means, by the key that selects it. */
function baselineForm(baseline: unknown): (typeof BASELINE_FORM_KEYS)[number] | undefined {
  if (typeof baseline !== 'object' || baseline === null) return undefined;
  return BASELINE_FORM_KEYS.find((key) => key in baseline);
}

/** Parse JSON text, then validate it as a scenario. Malformed JSON is an issue, never a throw. */
export function parseScenarioJson(textInput: string): Result<Scenario> {
  let value: unknown;
  try {
    value = JSON.parse(textInput);
  } catch (error) {
    const detail = error instanceof SyntaxError ? error.message : 'unreadable';
    return fail([{ code: 'invalid-json', path: [], message: `The input is not valid JSON (${detail})` }]);
  }
  return parseScenario(value);
}

export type { Scenario };
