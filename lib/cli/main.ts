/**
 * `hundredfold`: the command-line face of the engine. Each subcommand lives in ./commands/.
 * Usage errors exit 2 with one line on stderr and nothing on stdout; no stack trace ever
 * reaches the user.
 */
import { complain, EXIT_OK, type Command, type CommandIo } from './io';
import { compute } from './commands/compute';
import { link } from './commands/link';
import { glycaemia } from './commands/glycaemia';
import { table } from './commands/table';
import { checkups } from './commands/checkups';

export const USAGE = `Usage: hundredfold <command> [options]

Commands:
  compute [--input FILE] [--ndjson]   one scenario as JSON (stdin or FILE) -> one result as JSON
  link [--input FILE]                 print the path and fragment (/#…) that open the scenario in the app
  glycaemia [--input FILE] [--fhir] [--criteria ADA|WHO|NICE]
                                      classify serial HbA1c / fasting glucose results
  table check FILE                    validate a population-table CSV file
  checkups FILE --criteria ADA|WHO|NICE (--table FILE | --table-id ID) (--evidence FILE | --evidence-id ID)
                                      each worker's status and risks, then the workforce summary

Exit codes: 0 done, 1 some --ndjson lines (or checkup rows) failed, 2 bad input or usage.`;

/** A Map, not an object: "__proto__", "constructor" or "toString" must be unknown commands, not inherited members. */
const COMMANDS: ReadonlyMap<string, Command> = new Map<string, Command>([
  ['compute', compute],
  ['link', link],
  ['glycaemia', glycaemia],
  ['table', table],
  ['checkups', checkups],
]);

export async function main(io: CommandIo): Promise<number> {
  const [name, ...rest] = io.args;
  if (name === '--help' || name === '-h' || name === 'help') {
    io.stdout.write(`${USAGE}\n`);
    return EXIT_OK;
  }
  if (name === undefined) return complain(io, 'no command given; run "hundredfold --help" for the commands');
  const command = COMMANDS.get(name);
  if (!command) return complain(io, `unknown command ${JSON.stringify(name)}; commands are: ${[...COMMANDS.keys()].join(', ')}`);
  try {
    return await command({ ...io, args: rest });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    // Input that io.ts refused (streamTextChunks: not UTF-8): bad input, said as such.
    if (typeof error === 'object' && error !== null && (error as { code?: unknown }).code === 'HUNDREDFOLD_INPUT') return complain(io, `input: ${message}`);
    // A bug, not bad input: still one line, never a stack trace.
    return complain(io, `internal error: ${message}`);
  }
}
