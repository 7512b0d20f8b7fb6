/**
 * `hundredfold glycaemia [--input FILE] [--fhir] [--criteria ADA|WHO|NICE]`
 *
 * Reads a glucose history as JSON — `{"criteria", "checkups": [...]}` (lib/glycaemia/schema.ts) —
 * on stdin or from FILE, and prints its report (lib/glycaemia/report.ts): each checkup's
 * category under the named body, the deciding test, discordance, both units of each test, and
 * the run ending at the latest checkup.
 *
 * With --fhir the input is a FHIR R4 Bundle (or one Observation); --criteria is then required,
 * with no default, because the criteria set changes the category and a record export does not
 * say which one the clinician uses. Without --fhir, --criteria may stand in for a missing
 * "criteria" field; if both are given they must agree.
 *
 * Bad input or usage: exit 2, one line on stderr naming each checkup and field, nothing on stdout.
 */
import { importFhirGlucoseJson, type CheckupSource } from '../../fhir/importGlucose';
import { localIsoDate } from '../../glycaemia/dates';
import { CRITERIA_SETS, type CriteriaSet } from '../../glycaemia/exposure';
import { parseGlucoseHistory } from '../../glycaemia/parse';
import { glycaemiaReport } from '../../glycaemia/report';
import type { Issue } from '../../result';
import { complain, EXIT_OK, readStreamText, type CommandIo } from '../io';
import { parseJsonStrict } from '../json';
import { withoutBom } from './scenarioInput';

export const GLYCAEMIA_USAGE = `Usage: hundredfold glycaemia [--input FILE] [--fhir] [--criteria ADA|WHO|NICE]

Reads {"criteria": "ADA"|"WHO"|"NICE", "checkups": [{"date": "YYYY-MM-DD",
"hba1c"?: {"value", "unit": "%"|"mmol/mol"}, "fpg"?: {"value", "unit": "mg/dL"|"mmol/L"}}]}
on stdin (or FILE) and prints each checkup's category and the run ending at the latest one.
  --input FILE read FILE instead of stdin ("-" means stdin); --input=FILE works too
  --fhir       the input is a FHIR R4 Bundle or Observation; needs --criteria
  --criteria   the criteria set (required with --fhir; otherwise fills a missing "criteria")
Exit codes: 0 done, 2 bad input or usage.`;

export interface GlycaemiaOptions {
  /** Today as YYYY-MM-DD, for the future-date check; default: the local date. */
  readonly today?: string;
}

interface Args {
  readonly input: string | null;
  readonly fhir: boolean;
  readonly criteria: CriteriaSet | null;
  readonly help: boolean;
}

function parseArgs(args: readonly string[]): Args | string {
  let input: string | null = null;
  let fhir = false;
  let criteria: CriteriaSet | null = null;
  let help = false;
  for (let i = 0; i < args.length; i += 1) {
    const given = args[i] ?? '';
    // "--input=FILE" and "--criteria=ADA" as well as "--input FILE".
    const eq = given.startsWith('--') ? given.indexOf('=') : -1;
    const arg = eq < 0 ? given : given.slice(0, eq);
    if (arg === '--help' || arg === '-h') help = true;
    else if (arg === '--fhir' && eq < 0) fhir = true;
    else if (arg === '--input' || arg === '--criteria') {
      const value = eq < 0 ? args[i + 1] : given.slice(eq + 1);
      if (value === undefined || value === '' || (eq < 0 && value.startsWith('--'))) return `${arg} needs a value`;
      if (eq < 0) i += 1;
      if (arg === '--input') {
        if (input !== null) return '--input given twice';
        input = value;
      } else {
        const upper = value.toUpperCase();
        const found = CRITERIA_SETS.find((c) => c === upper);
        if (!found) return `--criteria must be ADA, WHO or NICE (got "${value}")`;
        if (criteria !== null) return '--criteria given twice';
        criteria = found;
      }
    } else return `unknown option "${given}"; options are --input FILE, --fhir, --criteria ADA|WHO|NICE`;
  }
  return { input, fhir, criteria, help };
}

type Namer = (index: number, path: readonly (string | number)[]) => string;

/** "checkups[2] (2021-03-04) hba1c.value: message" — the checkup, its date, the field. */
function issueLine(issue: Issue, name: Namer): string {
  const [head, index, ...rest] = issue.path;
  if (head === 'checkups' && typeof index === 'number') {
    return `${name(index, rest)}${rest.length > 0 ? ` ${rest.join('.')}` : ''}: ${issue.message}`;
  }
  const where = issue.path.length === 0 ? 'input' : issue.path.join('.');
  return `${where}: ${issue.message}`;
}

function issuesLine(issues: readonly Issue[], name: Namer): string {
  return issues.map((issue) => issueLine(issue, name)).join('; ');
}

function jsonNamer(raw: unknown): Namer {
  return (index) => {
    const list = typeof raw === 'object' && raw !== null ? (raw as { checkups?: unknown }).checkups : undefined;
    const entry = Array.isArray(list) ? (list[index] as unknown) : undefined;
    const date = typeof entry === 'object' && entry !== null ? (entry as { date?: unknown }).date : undefined;
    return `checkups[${index}]${typeof date === 'string' && date !== '' ? ` (${date})` : ''}`;
  };
}

function fhirNamer(sources: readonly CheckupSource[]): Namer {
  return (index, rest) => {
    const source = sources[index];
    if (!source) return `checkups[${index}]`;
    const entry = rest[0] === 'hba1c' ? source.hba1c : rest[0] === 'fpg' ? source.fpg : null;
    return `checkups[${index}] (${source.date}${entry !== null ? `, Bundle entry ${entry}` : ''})`;
  };
}

async function readInput(io: CommandIo, file: string | null): Promise<{ text: string } | { error: string }> {
  if (file === null || file === '-') {
    const read = await readStreamText(io.stdin);
    return read.ok ? { text: read.text } : { error: read.problem };
  }
  try {
    // A byte-order mark, as some editors write, is dropped here as by the other commands.
    return { text: withoutBom(await io.readFile(file)) };
  } catch (error) {
    const detail = error instanceof Error ? error.message : String(error);
    return { error: `cannot read --input ${file}: ${detail}` };
  }
}

function print(io: CommandIo, value: unknown): number {
  io.stdout.write(`${JSON.stringify(value, null, 2)}\n`);
  return EXIT_OK;
}

export async function glycaemia(io: CommandIo, options: GlycaemiaOptions = {}): Promise<number> {
  const args = parseArgs(io.args);
  if (typeof args === 'string') return complain(io, `glycaemia: ${args}`);
  if (args.help) {
    io.stdout.write(`${GLYCAEMIA_USAGE}\n`);
    return EXIT_OK;
  }
  if (args.fhir && args.criteria === null) {
    return complain(io, 'glycaemia: --fhir needs --criteria ADA, WHO or NICE (there is no default: the criteria set changes the category)');
  }
  const read = await readInput(io, args.input);
  if ('error' in read) return complain(io, `glycaemia: ${read.error}`);
  const today = options.today ?? localIsoDate();

  // One strict reading for both forms: a repeated key or an oversized object is refused here.
  const json = parseJsonStrict(read.text);
  // Text that is not JSON at all is the FHIR importer's to describe, with --fhir.
  const notJson = !json.ok && (json.issues[0]?.message.startsWith('The input is not valid JSON') ?? false);
  if (!json.ok && !(args.fhir && notJson)) {
    const [issue] = json.issues;
    const where = issue !== undefined && issue.path.length > 0 ? `${issue.path.join('.')}: ` : '';
    return complain(io, `glycaemia: ${where}${issue?.message.replace(/^The input is not valid JSON/, 'the input is not valid JSON') ?? 'the input is not valid JSON'}`);
  }

  if (args.fhir && args.criteria !== null) {
    const imported = importFhirGlucoseJson(read.text, { today, criteria: args.criteria });
    if (!imported.ok) return complain(io, `glycaemia: ${issuesLine(imported.issues, (i) => `checkups[${i}]`)}`);
    const { checkups, sources, skipped, resources } = imported.value;
    if (checkups.length === 0) {
      const why = skipped.slice(0, 3).map((s) => `${s.entry === null ? 'the Observation' : `entry ${s.entry}`}: ${s.reason}`);
      const more = skipped.length > 3 ? `; and ${skipped.length - 3} more` : '';
      return complain(io, `glycaemia: no usable HbA1c or fasting glucose Observation in the FHIR input (${resources} resource${resources === 1 ? '' : 's'})${why.length > 0 ? `; ${why.join('; ')}${more}` : ''}`);
    }
    const history = parseGlucoseHistory({ criteria: args.criteria, checkups }, { today });
    if (!history.ok) return complain(io, `glycaemia: ${issuesLine(history.issues, fhirNamer(sources))}`);
    return print(io, { ...glycaemiaReport(history.value), skipped, resources });
  }

  if (!json.ok) return complain(io, 'glycaemia: the input is not valid JSON');
  let raw = json.value;
  if (args.criteria !== null && typeof raw === 'object' && raw !== null && !Array.isArray(raw)) {
    const given = (raw as { criteria?: unknown }).criteria;
    if (given === undefined) raw = { ...raw, criteria: args.criteria };
    else if (given !== args.criteria) {
      return complain(io, `glycaemia: the input says criteria ${JSON.stringify(given)} but --criteria says ${args.criteria}; give one`);
    }
  }
  const history = parseGlucoseHistory(raw, { today });
  if (!history.ok) return complain(io, `glycaemia: ${issuesLine(history.issues, jsonNamer(raw))}`);
  return print(io, glycaemiaReport(history.value));
}
