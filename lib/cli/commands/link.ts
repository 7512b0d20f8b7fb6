/**
 * `hundredfold link [--input FILE]`: one scenario as JSON in (stdin or FILE), the path and
 * query that open it in the app out, e.g. `/?br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9`.
 * The same query after `/handout` opens its handout. The codec is lib/link/scenarioLink.ts.
 */
import { encodeScenarioLink } from '../../link/scenarioLink';
import { parseScenarioJson } from '../../scenario/parse';
import { complain, EXIT_OK, type CommandIo } from '../io';
import { issueLine, parseOptions, readInputText, writeText, type OptionSpec } from './scenarioInput';

export const LINK_USAGE = `Usage: hundredfold link [--input FILE]

Reads one scenario as JSON from stdin (or FILE) and prints the path and query that open it
in the app (/?…); put /handout before the same query to open its handout.
  --input FILE   read FILE instead of stdin ("-" means stdin)
Exit codes: 0 done, 2 bad input or usage.`;

const OPTIONS: OptionSpec = { input: { kind: 'value', placeholder: 'FILE' } };

export async function link(io: CommandIo): Promise<number> {
  const options = parseOptions('link', io.args, OPTIONS);
  if (!options.ok) return complain(io, options.problem);
  if (options.help) {
    await writeText(io.stdout, `${LINK_USAGE}\n`);
    return EXIT_OK;
  }
  const file = options.values.input === true ? undefined : options.values.input;
  const input = await readInputText(io, file);
  if (!input.ok) return complain(io, input.problem);
  const scenario = parseScenarioJson(input.text);
  if (!scenario.ok) return complain(io, issueLine(scenario.issues));
  await writeText(io.stdout, `${encodeScenarioLink(scenario.value)}\n`);
  return EXIT_OK;
}
