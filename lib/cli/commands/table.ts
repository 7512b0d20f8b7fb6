/**
 * `hundredfold table check FILE`: validates a population-table CSV file (docs/table-format.md)
 * and prints every problem with its row and column, exactly as the import screen lists them.
 *
 * Exit 0 and a one-line summary on stdout when the file is a valid table; exit 2 with one line
 * per problem on stderr when it is not (or on a usage error).
 */
import { complain, EXIT_BAD_INPUT, EXIT_OK, type CommandIo } from '../io';
import { escapeForTerminal } from '../terminal';
import { parseTableCsv } from '../../tables/csv';
import { tableForm, type PopulationTable } from '../../tables/schema';

export const TABLE_USAGE = `Usage: hundredfold table check FILE

  Checks a population-table CSV file (format: docs/table-format.md). Prints every problem,
  one per line with its row and column, and exits 2 when there is any; prints a short
  summary and exits 0 when the file is a valid table.`;

function plural(n: number, one: string, many: string): string {
  return `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;
}

/** One line describing a valid table: "OK: "Title" (id x): 10 strata, female and male, ages 30 to 79, risks over 10 years". */
export function summariseTable(table: PopulationTable): string {
  const sexes = [...new Set(table.strata.map((s) => s.sex))];
  const who = sexes.includes('any') ? 'both sexes together' : sexes.sort().join(' and ');
  // Loops, not Math.min(...list): a long list spread into one call can overflow the stack.
  let from = Infinity;
  let to = -Infinity;
  for (const s of table.strata) {
    from = Math.min(from, s.ageFrom);
    to = Math.max(to, s.ageTo);
  }
  const ages = to >= 120 ? `ages ${from} and over` : `ages ${from} to ${to}`;
  const values = tableForm(table) === 'risk' ? `risks over ${table.horizonYears} years` : 'rates per person-years';
  const extras = Object.keys(table.strata[0]?.extra ?? {});
  const by = extras.length > 0 ? `, by ${extras.join(', ')}` : '';
  const note = table.illustrative ? ' (illustrative numbers)' : '';
  return `OK: "${table.title}" (id ${table.id}): ${plural(table.strata.length, 'stratum', 'strata')}, ${who}, ${ages}${by}, ${values}${note}`;
}

export async function table(io: CommandIo): Promise<number> {
  const [sub, ...rest] = io.args;
  if (sub === undefined || sub === '--help' || sub === '-h' || sub === 'help') {
    if (sub === undefined) return complain(io, 'no table command given; run "hundredfold table check FILE"');
    io.stdout.write(`${TABLE_USAGE}\n`);
    return EXIT_OK;
  }
  if (sub !== 'check') return complain(io, `unknown table command ${JSON.stringify(sub)}; the table command is: check FILE`);
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout.write(`${TABLE_USAGE}\n`);
    return EXIT_OK;
  }
  if (rest.length === 0) return complain(io, 'no file given; run "hundredfold table check FILE"');
  if (rest.length > 1) return complain(io, `one file at a time; got ${rest.length}: ${rest.join(' ')}`);
  const file = rest[0]!;
  if (file.startsWith('-')) return complain(io, `unknown option "${file}"; run "hundredfold table check FILE"`);

  let text: string;
  try {
    text = await io.readFile(file);
  } catch (error) {
    // A system error by its code (ENOENT, EACCES…); a file that is too large or not UTF-8 by its sentence.
    const code = error instanceof Error && 'code' in error ? String((error as NodeJS.ErrnoException).code) : undefined;
    const reason = code !== undefined && code !== 'EILSEQ' && code !== 'EFBIG' ? code : error instanceof Error ? error.message : String(error);
    return complain(io, `cannot read ${JSON.stringify(file)} (${reason})`);
  }

  const result = parseTableCsv(text);
  if (!result.ok) {
    // Messages quote cells from the file: control characters in them are shown escaped.
    for (const issue of result.issues) io.stderr.write(`${escapeForTerminal(`${file}: ${issue.message.replace(/\s+/g, ' ').trim()}`)}\n`);
    const real = result.issues.filter((i) => i.code !== 'too-many-problems').length;
    io.stderr.write(`hundredfold: ${escapeForTerminal(file)} is not a valid table (${plural(real, 'problem', 'problems')} listed); nothing was read\n`);
    return EXIT_BAD_INPUT;
  }
  io.stdout.write(`${escapeForTerminal(summariseTable(result.value))}\n`);
  return EXIT_OK;
}
