/**
 * The scenario link: a {@link Scenario} written as a URL query, so that a path such as
 * `/?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9` opens the scenario in the app, and the same
 * query after `/handout` opens its handout. The query carries no patient identifier: only
 * what the scenario schema holds (lib/scenario/schema.ts).
 *
 * Parameters, one per scenario field (b = baseline, e = effect, w = wording, p = person):
 *
 * | key   | field                         | written as                                         |
 * |-------|-------------------------------|----------------------------------------------------|
 * | br    | baseline.risk                 | number                                             |
 * | bn    | baseline.rate                 | number (events per `bt` person-years)              |
 * | bt    | baseline.perPersonYears       | number                                             |
 * | bp    | baseline.populationRisk       | number                                             |
 * | bx    | baseline.exposurePrevalence   | number                                             |
 * | by    | baseline.years                | number (risk and population forms)                 |
 * | em    | effect.measure                | OR, RR or HR                                       |
 * | ee    | effect.estimate               | number                                             |
 * | el    | effect.lower                  | number                                             |
 * | eu    | effect.upper                  | number                                             |
 * | ec    | effect.level                  | 0.9, 0.95 or 0.99                                  |
 * | ed    | effect.design                 | cohort, trial, cross-sectional, case-control,      |
 * |       |                               | risk-set-case-control or case-cohort               |
 * | ef    | effect.followUpYears          | number                                             |
 * | ea    | effect.adjusted               | 1 (true) or 0 (false)                              |
 * | h     | horizonYears                  | number                                             |
 * | n     | denominator                   | 100 or 1000                                        |
 * | wo    | wording.outcome               | text                                               |
 * | wx    | wording.exposure              | text                                               |
 * | wc    | wording.comparison            | text                                               |
 * | wp    | wording.population            | text                                               |
 * | wr    | wording.citation (reference)  | text                                               |
 * | pa    | person.age                    | number                                             |
 * | ps    | person.sex                    | female or male                                     |
 * | t     | tableId                       | text                                               |
 * | w, p  | wording, person present but   | empty value; written only when the object is there |
 * |       | empty (`{}`)                  | with no field, so `{}` and absent stay distinct    |
 *
 * Rules that make the round trip exact, `decode(encode(s))` deep-equal to `s` for every valid
 * scenario:
 * - A field that is absent (or `undefined`) writes no parameter; a parameter that is absent
 *   decodes to an absent field. Parameters are written in the table's order.
 * - Numbers are written with `String(n)`, which gives the shortest decimal that reads back as
 *   the same double (ECMAScript Number::toString), and read with `Number(s)`; −0 is written
 *   "-0". A number parameter must be a plain decimal, `-?digits[.digits][e±digits]`: empty
 *   values, "1.5abc", "0x10", " 1", "Infinity" and "NaN" are refused, never guessed at.
 * - Text is form-encoded by URLSearchParams (UTF-8, space as "+", so &, =, #, + and any
 *   Unicode survive). Text holding a lone UTF-16 surrogate, which UTF-8 cannot carry, is written
 *   under `<key>.json` as a JSON string literal instead (e.g. `wo.json="\ud800"`).
 * - Repeated parameters and unknown parameters are refused with an `invalid-link` issue that
 *   names the parameter; nothing in a link is silently dropped.
 *
 * The decoded object then goes through {@link parseScenario}, so a link can never carry what
 * the form, the command line or an import would refuse; those issues keep their field paths.
 */
import { fail, type Issue, type Result } from '../result';
import { parseScenario } from '../scenario/parse';
import type { Scenario } from '../scenario/schema';

type ParamKind = 'number' | 'text' | 'choice' | 'flag';

interface Param {
  readonly key: string;
  /** [field] at the root, or [group, field] inside baseline, effect, wording or person. */
  readonly path: readonly [string] | readonly [string, string];
  readonly kind: ParamKind;
  /** How the field is named in messages. */
  readonly label: string;
}

/** The parameter table above, as data; its order is the order parameters are written in. */
export const LINK_PARAMS: readonly Param[] = [
  { key: 'br', path: ['baseline', 'risk'], kind: 'number', label: 'the baseline risk' },
  { key: 'bn', path: ['baseline', 'rate'], kind: 'number', label: 'the event rate' },
  { key: 'bt', path: ['baseline', 'perPersonYears'], kind: 'number', label: 'the person-years' },
  { key: 'bp', path: ['baseline', 'populationRisk'], kind: 'number', label: 'the population risk' },
  { key: 'bx', path: ['baseline', 'exposurePrevalence'], kind: 'number', label: 'the exposure prevalence' },
  { key: 'by', path: ['baseline', 'years'], kind: 'number', label: 'the baseline period' },
  { key: 'em', path: ['effect', 'measure'], kind: 'choice', label: 'the measure' },
  { key: 'ee', path: ['effect', 'estimate'], kind: 'number', label: 'the estimate' },
  { key: 'el', path: ['effect', 'lower'], kind: 'number', label: 'the lower limit' },
  { key: 'eu', path: ['effect', 'upper'], kind: 'number', label: 'the upper limit' },
  { key: 'ec', path: ['effect', 'level'], kind: 'number', label: 'the interval level' },
  { key: 'ed', path: ['effect', 'design'], kind: 'choice', label: 'the study design' },
  { key: 'ef', path: ['effect', 'followUpYears'], kind: 'number', label: 'the follow-up' },
  { key: 'ea', path: ['effect', 'adjusted'], kind: 'flag', label: 'adjusted' },
  { key: 'h', path: ['horizonYears'], kind: 'number', label: 'the horizon' },
  { key: 'n', path: ['denominator'], kind: 'number', label: 'the denominator' },
  { key: 'wo', path: ['wording', 'outcome'], kind: 'text', label: 'the outcome' },
  { key: 'wx', path: ['wording', 'exposure'], kind: 'text', label: 'the exposure' },
  { key: 'wc', path: ['wording', 'comparison'], kind: 'text', label: 'the comparison' },
  { key: 'wp', path: ['wording', 'population'], kind: 'text', label: 'the population' },
  { key: 'wr', path: ['wording', 'citation'], kind: 'text', label: 'the citation' },
  { key: 'pa', path: ['person', 'age'], kind: 'number', label: 'the age' },
  { key: 'ps', path: ['person', 'sex'], kind: 'choice', label: 'the sex' },
  { key: 't', path: ['tableId'], kind: 'text', label: 'the table id' },
];

/** Optional groups whose presence, when empty, is written as a bare marker parameter. */
const GROUP_MARKERS: Readonly<Record<string, string>> = { w: 'wording', p: 'person' };
const MARKER_FOR_GROUP: Readonly<Record<string, string>> = { wording: 'w', person: 'p' };

/** Suffix of a text parameter written as a JSON string literal (text with a lone surrogate). */
const JSON_SUFFIX = '.json';

const PARAM_BY_KEY: ReadonlyMap<string, Param> = new Map(LINK_PARAMS.map((p) => [p.key, p]));

/** A plain decimal as String(n) writes it (plus harmless variants such as 0.10). */
const DECIMAL = /^-?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?$/;

/** A lone UTF-16 surrogate: a high one not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function formatNumber(value: number): string {
  return Object.is(value, -0) ? '-0' : String(value);
}

function valueAt(scenario: Scenario, path: Param['path']): unknown {
  const root = scenario as unknown as Record<string, unknown>;
  const first = root[path[0]];
  if (path.length === 1) return first;
  if (typeof first !== 'object' || first === null) return undefined;
  return (first as Record<string, unknown>)[path[1]];
}

/**
 * The query that opens a scenario, with its leading "?": append it to any of the app's paths
 * ("/", "/handout").
 *
 * @example
 * scenarioQuery({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } })
 * //=> "?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9"
 */
export function scenarioQuery(scenario: Scenario): string {
  const params = new URLSearchParams();
  const written = new Set<string>();
  for (const param of LINK_PARAMS) {
    const value = valueAt(scenario, param.path);
    if (value === undefined) continue;
    written.add(param.path[0]);
    switch (param.kind) {
      case 'number':
        params.append(param.key, formatNumber(value as number));
        break;
      case 'flag':
        params.append(param.key, value === true ? '1' : '0');
        break;
      case 'choice':
        params.append(param.key, String(value));
        break;
      case 'text': {
        const text = value as string;
        if (!LONE_SURROGATE.test(text)) params.append(param.key, text);
        else params.append(`${param.key}${JSON_SUFFIX}`, JSON.stringify(text));
        break;
      }
    }
  }
  const root = scenario as unknown as Record<string, unknown>;
  for (const [group, marker] of Object.entries(MARKER_FOR_GROUP)) {
    if (root[group] !== undefined && !written.has(group)) params.append(marker, '');
  }
  const query = params.toString();
  return query === '' ? '' : `?${query}`;
}

/**
 * The path and query that open a scenario on the app's main screen.
 *
 * @example
 * encodeScenarioLink({ baseline: { rate: 12, perPersonYears: 1000 }, horizonYears: 5, effect: { measure: 'HR', estimate: 0.8, lower: 0.7, upper: 0.92, design: 'trial' } })
 * //=> "/?bn=12&bt=1000&em=HR&ee=0.8&el=0.7&eu=0.92&ed=trial&h=5"
 */
export function encodeScenarioLink(scenario: Scenario): string {
  return `/${scenarioQuery(scenario)}`;
}

/** Accepts "?a=1", "a=1", or a path with a query ("/handout?a=1"); a bare path has no query. */
function queryPart(query: string): string {
  if (query.startsWith('?')) return query.slice(1);
  if (query.startsWith('/')) {
    const mark = query.indexOf('?');
    return mark < 0 ? '' : query.slice(mark + 1);
  }
  return query;
}

function quote(value: string): string {
  const shown = value.length > 40 ? `${value.slice(0, 40)}…` : value;
  return JSON.stringify(shown);
}

function readValue(param: Param, raw: string, asJson: boolean): { value: unknown } | { problem: string } {
  const named = `The link's "${param.key}${asJson ? JSON_SUFFIX : ''}" (${param.label})`;
  switch (param.kind) {
    case 'number': {
      const value = Number(raw);
      if (!DECIMAL.test(raw) || !Number.isFinite(value)) {
        return { problem: `${named} must be a plain decimal number such as 0.08, not ${quote(raw)}` };
      }
      return { value };
    }
    case 'flag':
      if (raw === '1') return { value: true };
      if (raw === '0') return { value: false };
      return { problem: `${named} must be 1 (adjusted) or 0 (unadjusted), not ${quote(raw)}` };
    case 'choice':
      return { value: raw };
    case 'text': {
      if (!asJson) return { value: raw };
      let value: unknown;
      try {
        value = JSON.parse(raw);
      } catch {
        value = undefined;
      }
      if (typeof value !== 'string') return { problem: `${named} must be a JSON string literal, not ${quote(raw)}` };
      return { value };
    }
  }
}

function linkIssue(path: readonly (string | number)[], message: string): Issue {
  return { code: 'invalid-link', path, message };
}

/**
 * Reads a scenario back from a link's query and validates it.
 *
 * @param query - "?br=…", "br=…", a path with its query ("/handout?br=…"), or URLSearchParams
 * @returns the scenario, or issues: `invalid-link` for a parameter the codec cannot read
 *   (unknown, repeated, not a number), else the scenario's own issues with their field paths
 * @example
 * decodeScenarioQuery('?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9')
 * //=> { ok: true, value: { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } } }
 * decodeScenarioQuery('?br=8%25&by=10')
 * //=> { ok: false, issues: [{ code: 'invalid-link', path: ['baseline', 'risk'], message: 'The link\'s "br" (the baseline risk) must be a plain decimal number such as 0.08, not "8%"' }] }
 */
export function decodeScenarioQuery(query: string | URLSearchParams): Result<Scenario> {
  const params = typeof query === 'string' ? new URLSearchParams(queryPart(query)) : query;
  const issues: Issue[] = [];
  const root: Record<string, unknown> = {};
  const seen = new Set<string>();

  const group = (name: string): Record<string, unknown> => {
    const existing = root[name];
    if (typeof existing === 'object' && existing !== null) return existing as Record<string, unknown>;
    const created: Record<string, unknown> = {};
    root[name] = created;
    return created;
  };

  for (const [rawKey, raw] of params) {
    const asJson = rawKey.endsWith(JSON_SUFFIX);
    const key = asJson ? rawKey.slice(0, -JSON_SUFFIX.length) : rawKey;
    const marked = GROUP_MARKERS[key];
    const param = PARAM_BY_KEY.get(key);

    if (marked !== undefined && !asJson) {
      if (seen.has(key)) {
        issues.push(linkIssue([marked], `The link gives "${key}" more than once; each parameter may appear once`));
      } else if (raw !== '') {
        issues.push(linkIssue([marked], `The link's "${key}" marks an empty ${marked} and takes no value, not ${quote(raw)}`));
      }
      seen.add(key);
      group(marked);
      continue;
    }
    if (param === undefined || (asJson && param.kind !== 'text')) {
      issues.push(linkIssue([rawKey], `The link has an unknown parameter "${rawKey}"; check that the whole link was copied`));
      continue;
    }
    if (seen.has(key)) {
      issues.push(linkIssue(param.path, `The link gives "${key}" (${param.label}) more than once; each parameter may appear once`));
      continue;
    }
    seen.add(key);
    const read = readValue(param, raw, asJson);
    if ('problem' in read) {
      issues.push(linkIssue(param.path, read.problem));
      continue;
    }
    if (param.path.length === 1) root[param.path[0]] = read.value;
    else group(param.path[0])[param.path[1]] = read.value;
  }

  if (issues.length > 0) return fail(issues);
  return parseScenario(root);
}
