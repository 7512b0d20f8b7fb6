/**
 * `hundredfold link [--input FILE]`: one scenario as JSON in (stdin or FILE), the path and
 * fragment that open it in the app out, e.g. `/#br=0.08&by=10&em=RR&ee=1.5&el=1.2&eu=1.9`.
 * The same fragment after `/handout` opens its handout. The scenario is in the fragment, which
 * a browser never sends to the server. The codec is lib/link/scenarioLink.ts.
 */
import { encodeScenarioLink, scenarioLinkIssues } from '../../link/scenarioLink';
import { complain, EXIT_OK, type CommandIo } from '../io';
import { issueLine, parseOptions, parseScenarioText, readInputText, writeText, type OptionSpec } from './scenarioInput';

export const LINK_USAGE = `Usage: hundredfold link [--input FILE]

Reads one scenario as JSON from stdin (or FILE) and prints the path and fragment that open
it in the app (/#…); put /handout before the same fragment to open its handout. The scenario
is in the fragment, which the browser never sends to the server.
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
  const scenario = parseScenarioText(input.text);
  if (!scenario.ok) return complain(io, issueLine(scenario.issues));
  // A link that would leave text out (a broken character) or be too long is refused, not cut.
  const problems = scenarioLinkIssues(scenario.value);
  if (problems.length > 0) return complain(io, issueLine(problems));
  await writeText(io.stdout, `${encodeScenarioLink(scenario.value)}\n`);
  return EXIT_OK;
}
