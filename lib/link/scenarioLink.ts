/**
 * The scenario link: a {@link Scenario} written into the URL fragment, so that an address such
 * as `/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9` opens the scenario in the app, and the same
 * fragment after `/handout` opens its handout. The fragment (everything after "#") never leaves
 * the browser: it is not part of the request a browser sends, so no server, proxy or cache ever
 * sees the scenario, however long its wording. The link carries no patient identifier: only what
 * the scenario schema holds (lib/scenario/schema.ts).
 *
 * Older links carried the same parameters in the query (`/?br=…`); they are still read, and the
 * app moves them into the fragment on arrival (app/link/useScenarioLink.ts).
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
 * | x     | exposureDefinition            | JSON object (lib/glycaemia/exposure.ts), e.g.      |
 * |       |                               | {"category":"prediabetes","criteria":"ADA",        |
 * |       |                               | "minYears":3}                                      |
 * | t     | tableId                       | text                                               |
 * | w, p  | wording, person present but   | empty value; written only when the object is there |
 * |       | empty (`{}`)                  | with no field, so `{}` and absent stay distinct    |
 *
 * Writing, so that `decode(encode(s))` is deep-equal to `s` for every valid scenario whose text
 * is well-formed Unicode:
 * - A field that is absent (or `undefined`) writes no parameter; a parameter that is absent
 *   decodes to an absent field. Parameters are written in the table's order.
 * - Numbers are written with `String(n)`, which gives the shortest decimal that reads back as
 *   the same double (ECMAScript Number::toString), and read with `Number(s)`; −0 is written
 *   "-0". A number parameter must be a plain decimal, `-?digits[.digits][e±digits]`: empty
 *   values, "1.5abc", "0x10", " 1", "Infinity" and "NaN" are refused, never guessed at.
 * - Text is form-encoded (UTF-8, space as "+", so &, =, #, + and any Unicode survive).
 * - Text holding a lone UTF-16 surrogate (half of a pair: a broken character that UTF-8 cannot
 *   carry and a printer cannot show) is not written; {@link scenarioLinkIssues} names the field so
 *   the screen can ask for it to be retyped. Older links wrote such text under `<key>.json` as a
 *   JSON string literal; that form is still read, and a lone surrogate in it is refused.
 * - No link is longer than {@link MAX_LINK_CHARS}; every valid scenario fits well within it
 *   (five wording fields of 500 three-byte characters make about 23,000).
 *
 * Reading ({@link readScenarioLink}) is forgiving about what mail programs and chat tools do to
 * a link, and strict about its values:
 * - `&amp;` (a link escaped as HTML) is read as `&`; a whole address, a path with a fragment or a
 *   query, or the bare parameters are all accepted.
 * - A parameter that is unknown, repeated (every copy), unreadable (a number that is not a plain
 *   decimal, a broken `%` escape — never turned into "�"), or that the scenario schema refuses
 *   is dropped; the rest are kept and each dropped one is named. When what is left is not a
 *   whole scenario, the issues say so; a link that stops short of the fields it lacks is named
 *   as cut short.
 * - {@link decodeScenarioQuery} is the strict form: any dropped parameter refuses the link.
 *
 * The decoded object then goes through {@link parseScenario}, so a link can never carry what
 * the form, the command line or an import would refuse; those issues keep their field paths.
 */
import { fail, type Issue, type Result } from '../result';
import { parseScenario } from '../scenario/parse';
import type { Scenario } from '../scenario/schema';

type ParamKind = 'number' | 'text' | 'choice' | 'flag' | 'json';

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
  { key: 'x', path: ['exposureDefinition'], kind: 'json', label: 'the exposure definition' },
  { key: 't', path: ['tableId'], kind: 'text', label: 'the table id' },
];

/**
 * The longest link the codec writes or reads, in characters. Every valid scenario fits: its five
 * wording fields of at most 500 characters each, written as three-byte UTF-8 (9 characters per
 * character once percent-encoded), make about 22,500; the rest adds under 2,500 (hand-computed:
 * 5 × 500 × 9 = 22,500; table id 100 × 9 = 900; 16 numbers of at most 24 characters = 384; the
 * longest exposure definition, about 170 characters of JSON, at most 3 characters each once
 * percent-encoded = 510).
 * Anything longer was not made by this codec.
 */
export const MAX_LINK_CHARS = 32_768;

/** Optional groups whose presence, when empty, is written as a bare marker parameter. */
const GROUP_MARKERS: ReadonlyMap<string, string> = new Map([
  ['w', 'wording'],
  ['p', 'person'],
]);
const MARKER_FOR_GROUP: ReadonlyMap<string, string> = new Map([
  ['wording', 'w'],
  ['person', 'p'],
]);

/** Suffix of a text parameter written, by older links, as a JSON string literal. */
const JSON_SUFFIX = '.json';

const PARAM_BY_KEY: ReadonlyMap<string, Param> = new Map(LINK_PARAMS.map((p) => [p.key, p]));
const PARAM_INDEX: ReadonlyMap<string, number> = new Map(LINK_PARAMS.map((p, i) => [p.key, i]));

/** A plain decimal as String(n) writes it (plus harmless variants such as 0.10). */
const DECIMAL = /^-?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?$/;

/** A lone UTF-16 surrogate: a high one not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True when the text holds a lone surrogate (a broken character). */
export function hasLoneSurrogate(text: string): boolean {
  return LONE_SURROGATE.test(text);
}

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

/** The parameters, form-encoded, without a leading "#" or "?". */
function scenarioParams(scenario: Scenario): string {
  const params = new URLSearchParams();
  const written = new Set<string>();
  for (const param of LINK_PARAMS) {
    const value = valueAt(scenario, param.path);
    if (value === undefined) continue;
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
      case 'json':
        params.append(param.key, JSON.stringify(value));
        break;
      case 'text':
        // Broken text is not written (scenarioLinkIssues names it); everything else is.
        if (hasLoneSurrogate(value as string)) continue;
        params.append(param.key, value as string);
        break;
    }
    written.add(param.path[0]);
  }
  const root = scenario as unknown as Record<string, unknown>;
  for (const [group, marker] of MARKER_FOR_GROUP) {
    if (root[group] !== undefined && !written.has(group)) params.append(marker, '');
  }
  return params.toString();
}

/**
 * The fragment that opens a scenario, with its leading "#": append it to any of the app's paths
 * ("/", "/handout"). The fragment never reaches a server.
 *
 * @example
 * scenarioFragment({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } })
 * //=> "#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9"
 */
export function scenarioFragment(scenario: Scenario): string {
  const params = scenarioParams(scenario);
  return params === '' ? '' : `#${params}`;
}

/**
 * The same parameters as an old-style query ("?…"). Only for reading and testing links made
 * before the scenario moved to the fragment: a query is sent to the server, so the app never
 * writes one.
 *
 * @deprecated write {@link scenarioFragment} or {@link encodeScenarioLink}
 */
export function scenarioQuery(scenario: Scenario): string {
  const params = scenarioParams(scenario);
  return params === '' ? '' : `?${params}`;
}

/**
 * The path and fragment that open a scenario: on the main screen by default, or on another of
 * the app's paths ("/handout").
 *
 * @example
 * encodeScenarioLink({ baseline: { rate: 12, perPersonYears: 1000 }, horizonYears: 5, effect: { measure: 'HR', estimate: 0.8, lower: 0.7, upper: 0.92, design: 'trial' } })
 * //=> "/#bn=12&bt=1000&em=HR&ee=0.8&el=0.7&eu=0.92&ed=trial&h=5"
 */
export function encodeScenarioLink(scenario: Scenario, path = '/'): string {
  return `${path}${scenarioFragment(scenario)}`;
}

function linkIssue(path: readonly (string | number)[], message: string): Issue {
  return { code: 'invalid-link', path, message };
}

/**
 * What a link to this scenario would leave out or could not hold: text with a broken character
 * (a lone surrogate, which is not written), and a link longer than {@link MAX_LINK_CHARS}.
 * Empty for every valid scenario with well-formed text.
 *
 * @example
 * scenarioLinkIssues({ ...scenario, wording: { outcome: 'a\ud800' } })
 * //=> [{ code: 'invalid-link', path: ['wording', 'outcome'], message: 'The outcome holds a broken character …' }]
 */
export function scenarioLinkIssues(scenario: Scenario): Issue[] {
  const issues: Issue[] = [];
  for (const param of LINK_PARAMS) {
    const value = valueAt(scenario, param.path);
    if (param.kind === 'text' && typeof value === 'string' && hasLoneSurrogate(value)) {
      const label = param.label.charAt(0).toUpperCase() + param.label.slice(1);
      issues.push(
        linkIssue(
          param.path,
          `${label} holds a broken character (half of a two-part Unicode character, often from a damaged copy and paste), so the link leaves it out; retype that text`,
        ),
      );
    }
  }
  const length = encodeScenarioLink(scenario, '/handout').length;
  if (length > MAX_LINK_CHARS) {
    issues.push(linkIssue([], `The link would be ${length.toLocaleString('en-GB')} characters long; the longest allowed is ${MAX_LINK_CHARS.toLocaleString('en-GB')}. Shorten the wording`));
  }
  return issues;
}

function quote(value: string): string {
  const shown = value.length > 40 ? `${value.slice(0, 40)}…` : value;
  return JSON.stringify(shown);
}

const HEX_PAIR = /^[0-9A-Fa-f]{2}$/;
const UTF8 = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
const ENCODER = new TextEncoder();

/**
 * Form-decodes one key or value ("+" is a space, "%XX" a UTF-8 byte), refusing what a lenient
 * decoder would patch over: a "%" not followed by two hex digits, bytes that are not UTF-8, and
 * a lone surrogate. Undefined when broken — never a "�" in place of what was sent.
 */
function decodeComponent(raw: string): string | undefined {
  const text = raw.replace(/\+/g, ' ');
  if (hasLoneSurrogate(text)) return undefined;
  if (!text.includes('%')) return text;
  const bytes: number[] = [];
  let i = 0;
  while (i < text.length) {
    const code = text.charCodeAt(i);
    if (code === 0x25) {
      const hex = text.slice(i + 1, i + 3);
      if (!HEX_PAIR.test(hex)) return undefined;
      bytes.push(parseInt(hex, 16));
      i += 3;
    } else if (code < 0x80) {
      bytes.push(code);
      i += 1;
    } else {
      const char = String.fromCodePoint(text.codePointAt(i) ?? code);
      for (const byte of ENCODER.encode(char)) bytes.push(byte);
      i += char.length;
    }
  }
  try {
    return UTF8.decode(new Uint8Array(bytes));
  } catch {
    return undefined;
  }
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
    case 'json': {
      let value: unknown;
      try {
        value = JSON.parse(raw);
      } catch {
        value = undefined;
      }
      if (typeof value !== 'object' || value === null || Array.isArray(value)) return { problem: `${named} must be a JSON object, not ${quote(raw)}` };
      return { value };
    }
    case 'text': {
      if (!asJson) return { value: raw };
      let value: unknown;
      try {
        value = JSON.parse(raw);
      } catch {
        value = undefined;
      }
      if (typeof value !== 'string') return { problem: `${named} must be a JSON string literal, not ${quote(raw)}` };
      if (hasLoneSurrogate(value)) {
        return { problem: `${named} holds a broken character (half of a two-part Unicode character), so it was left out; retype that text` };
      }
      return { value };
    }
  }
}

/** What a link holds: the part after "#", else after "?", else the bare parameters. */
function paramsPart(link: string): string {
  const text = link.trim();
  const hash = text.indexOf('#');
  if (hash >= 0 && hash < text.length - 1) return text.slice(hash + 1);
  const before = hash >= 0 ? text.slice(0, hash) : text;
  const mark = before.indexOf('?');
  if (mark >= 0) return before.slice(mark + 1);
  if (before.startsWith('/') || /^[a-z][a-z0-9+.-]*:/i.test(before) || hash >= 0) return '';
  return before;
}

/** `&amp;` and `&#38;`: a link that went through HTML (a mail program) on its way here. */
const HTML_AMPERSAND = /&(?:amp|#0*38|#x0*26);/gi;

/** What {@link readScenarioLink} makes of a link. */
export interface LinkReading {
  /** The scenario from every parameter that could be kept, or why there is none. */
  readonly result: Result<Scenario>;
  /**
   * The parameters left out, one issue each, naming the parameter and why. When `result` is a
   * scenario, these are what it is without; say so beside it.
   */
  readonly dropped: readonly Issue[];
  /** True when the link holds no parameter at all (a plain visit): nothing to report. */
  readonly empty: boolean;
  /**
   * When the link looks cut short (it ends inside a "%" escape, or lacks required fields that
   * would come after its last parameter): the real cause, to show before the other issues.
   */
  readonly cutShort?: Issue;
}

interface Piece {
  readonly key: string;
  readonly value: string | undefined;
  /** The raw text, for messages. */
  readonly raw: string;
}

function splitPieces(part: string): { pieces: Piece[]; broken: Issue[] } {
  const pieces: Piece[] = [];
  const broken: Issue[] = [];
  for (const raw of part.replace(HTML_AMPERSAND, '&').split('&')) {
    if (raw === '') continue;
    const eq = raw.indexOf('=');
    const rawKey = eq < 0 ? raw : raw.slice(0, eq);
    const key = decodeComponent(rawKey);
    if (key === undefined) {
      broken.push(linkIssue([], `The link has a parameter with a broken % escape, ${quote(raw)}, so it was left out; a "%" must be followed by two hex digits that spell UTF-8 text. Check that the whole link was copied`));
      continue;
    }
    pieces.push({ key, value: eq < 0 ? '' : decodeComponent(raw.slice(eq + 1)), raw });
  }
  return { pieces, broken };
}

/** The link's parameter that sets this field, if any. */
function paramForPath(path: readonly (string | number)[]): Param | undefined {
  return LINK_PARAMS.find((p) => p.path.length <= path.length && p.path.every((part, i) => path[i] === part));
}

function baseKey(key: string): string {
  return key.endsWith(JSON_SUFFIX) ? key.slice(0, -JSON_SUFFIX.length) : key;
}

function withoutFields(root: Record<string, unknown>, params: readonly Param[]): Record<string, unknown> {
  const copy: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(root)) {
    copy[key] = typeof value === 'object' && value !== null ? { ...(value as Record<string, unknown>) } : value;
  }
  for (const param of params) {
    if (param.path.length === 1) delete copy[param.path[0]];
    else delete (copy[param.path[0]] as Record<string, unknown> | undefined)?.[param.path[1]];
  }
  return copy;
}

/**
 * Names a link that stopped short: it ends inside a "%" escape, or it lacks a required field
 * whose parameter would come after the last one it has (parameters are written in table order).
 */
function cutShort(part: string, pieces: readonly Piece[], issues: readonly Issue[]): Issue | undefined {
  const known = pieces.map((p) => PARAM_INDEX.get(baseKey(p.key))).filter((i): i is number => i !== undefined);
  const last = known[known.length - 1];
  const lastPiece = pieces[pieces.length - 1];
  const inOrder = known.every((index, i) => i === 0 || index >= (known[i - 1] ?? 0));
  const missing = issues
    .filter((i) => i.code === 'required' || i.code === 'horizon-required')
    .map((i) => paramForPath(i.path))
    .filter((p): p is Param => p !== undefined && last !== undefined && (PARAM_INDEX.get(p.key) ?? 0) > last);
  const endsInEscape = /%[0-9A-Fa-f]?$/.test(part);
  if (!endsInEscape && !(inOrder && missing.length > 0)) return undefined;
  const after = lastPiece === undefined ? '' : ` after ${quote(lastPiece.raw)}`;
  const lacks = missing.length > 0 ? ` and lacks ${missing.map((p) => `"${p.key}" (${p.label})`).join(', ')}` : '';
  return linkIssue(
    [],
    `This link looks cut short: it stops${after} (${part.length.toLocaleString('en-GB')} characters arrived)${lacks}. Mail programs and chat tools sometimes break long links; copy the whole link again`,
  );
}

/**
 * Reads a scenario from a link, keeping every parameter it can and naming those it cannot.
 *
 * @param link - a whole address, a path with its fragment ("/handout#br=…") or old query
 *   ("/?br=…"), "#br=…", "?br=…" or the bare parameters
 * @example
 * readScenarioLink('/#br=0.08&amp;by=10&amp;em=RR&amp;ee=1.5&amp;el=1.2&amp;eu=1.9&amp;ed=survey')
 * //=> { result: { ok: true, value: { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } } },
 * //     dropped: [{ code: 'invalid-choice', path: ['effect', 'design'], message: 'The link\'s "ed" (the study design) was left out: …' }], empty: false }
 */
export function readScenarioLink(link: string): LinkReading {
  if (link.length > MAX_LINK_CHARS) {
    const message = `This link is ${link.length.toLocaleString('en-GB')} characters long; a scenario link is at most ${MAX_LINK_CHARS.toLocaleString('en-GB')}, so it was not made by Hundredfold or was changed on the way`;
    return { result: fail([linkIssue([], message)]), dropped: [], empty: false };
  }
  const part = paramsPart(link);
  const { pieces, broken } = splitPieces(part);
  if (pieces.length === 0 && broken.length === 0) return { result: parseScenario({}), dropped: [], empty: true };

  const dropped: Issue[] = [...broken];
  const count = new Map<string, number>();
  for (const piece of pieces) count.set(baseKey(piece.key), (count.get(baseKey(piece.key)) ?? 0) + 1);
  const reported = new Set<string>();
  const root: Record<string, unknown> = {};
  const group = (name: string): Record<string, unknown> => {
    const existing = root[name];
    if (typeof existing === 'object' && existing !== null) return existing as Record<string, unknown>;
    const created: Record<string, unknown> = {};
    root[name] = created;
    return created;
  };

  for (const piece of pieces) {
    const asJson = piece.key.endsWith(JSON_SUFFIX);
    const key = baseKey(piece.key);
    const marked = asJson ? undefined : GROUP_MARKERS.get(key);
    const param = PARAM_BY_KEY.get(key);
    const repeated = (count.get(key) ?? 0) > 1;

    if (marked !== undefined) {
      if (repeated) {
        if (!reported.has(key)) dropped.push(linkIssue([marked], `The link gives "${key}" more than once; each parameter may appear once`));
        reported.add(key);
      } else if (piece.value !== '') {
        dropped.push(linkIssue([marked], `The link's "${key}" marks an empty ${marked} and takes no value, not ${quote(piece.value ?? piece.raw)}`));
      } else group(marked);
      continue;
    }
    if (param === undefined || (asJson && param.kind !== 'text')) {
      dropped.push(linkIssue([piece.key], `The link has an unknown parameter ${quote(piece.key)}, which was left out; check that the whole link was copied`));
      continue;
    }
    if (repeated) {
      if (!reported.has(key)) {
        dropped.push(linkIssue(param.path, `The link gives "${key}" (${param.label}) more than once, so neither copy was used; each parameter may appear once`));
      }
      reported.add(key);
      continue;
    }
    if (piece.value === undefined) {
      dropped.push(
        linkIssue(
          param.path,
          `The link's "${piece.key}" (${param.label}) has a broken % escape, ${quote(piece.raw)}, so it was left out; a "%" must be followed by two hex digits that spell UTF-8 text`,
        ),
      );
      continue;
    }
    const read = readValue(param, piece.value, asJson);
    if ('problem' in read) {
      dropped.push(linkIssue(param.path, read.problem));
      continue;
    }
    if (param.path.length === 1) root[param.path[0]] = read.value;
    else group(param.path[0])[param.path[1]] = read.value;
  }

  const parsed = parseScenario(root);
  if (parsed.ok) {
    const cut = cutShort(part, pieces, []);
    return { result: parsed, dropped, empty: false, ...(cut === undefined ? {} : { cutShort: cut }) };
  }

  // Leave out the parameters the schema refuses, and keep the rest if they still make a scenario.
  const refused = parsed.issues.map((issue) => ({ issue, param: paramForPath(issue.path) }));
  const present = refused.filter((r): r is { issue: Issue; param: Param } => r.param !== undefined && valueAt(root as unknown as Scenario, r.param.path) !== undefined);
  if (present.length === refused.length && present.length > 0) {
    const again = parseScenario(withoutFields(root, present.map((r) => r.param)));
    if (again.ok) {
      const left = present.map(({ issue, param }) => ({ ...issue, message: `The link's "${param.key}" (${param.label}) was left out: ${issue.message}` }));
      return { result: again, dropped: [...dropped, ...left], empty: false };
    }
  }
  const cut = cutShort(part, pieces, parsed.issues);
  return { result: parsed, dropped, empty: false, ...(cut === undefined ? {} : { cutShort: cut }) };
}

/**
 * Reads a scenario back from a link and validates it, strictly: any parameter that
 * {@link readScenarioLink} would leave out refuses the whole link.
 *
 * @param query - anything {@link readScenarioLink} takes, or URLSearchParams
 * @returns the scenario, or issues: `invalid-link` for a parameter the codec cannot read
 *   (unknown, repeated, not a number, a broken escape), else the scenario's own issues with their
 *   field paths
 * @example
 * decodeScenarioQuery('#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9')
 * //=> { ok: true, value: { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } } }
 * decodeScenarioQuery('#br=8%25&by=10')
 * //=> { ok: false, issues: [{ code: 'invalid-link', path: ['baseline', 'risk'], message: 'The link\'s "br" (the baseline risk) must be a plain decimal number such as 0.08, not "8%"' }] }
 */
export function decodeScenarioQuery(query: string | URLSearchParams): Result<Scenario> {
  const reading = readScenarioLink(typeof query === 'string' ? query : `?${query.toString()}`);
  if (reading.dropped.length > 0) return fail(reading.dropped);
  return reading.result;
}
