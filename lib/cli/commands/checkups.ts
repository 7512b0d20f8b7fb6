/**
 * `hundredfold checkups FILE… --criteria ADA|WHO|NICE (--table FILE.csv | --table-id ID)
 *  (--evidence FILE.json | --evidence-id ID) [--horizon YEARS] [--map COLUMN=FIELD]…
 *  [--format ndjson|csv] [--summary FILE] [--sheet NAME] [--today YYYY-MM-DD]`
 *
 * A workforce's checkup file (CSV/TSV, XLSX, or FHIR R4 bulk NDJSON — Patient and Observation
 * files, given together) → one line per worker, in the order of first appearance, then the
 * summary (the last NDJSON line `{"summary": …}`, or in --summary FILE). Everything is computed
 * by lib/workforce; this file only reads files, writes lines and sets the exit code.
 *
 * Row problems go to stderr, one line each — `row N, column NAME: message`, control characters
 * escaped — at most {@link MAX_PROBLEM_LINES}, then a count. Exit 0 when no row was skipped, 1
 * when some were, 2 when the file or the usage cannot be used (one line, never a stack trace).
 *
 * Memory: a CSV/TSV file already grouped by worker (each worker's rows together) is streamed —
 * a first pass checks the grouping, the second evaluates each worker as soon as their rows are
 * read — so memory stays flat with the number of workers. Any other file (ungrouped CSV, XLSX,
 * FHIR NDJSON, standard input) is read whole.
 */
import { createReadStream } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import { parseEvidenceJson } from '../../evidence/file';
import { findDemoEvidence } from '../../evidence/demo';
import type { EvidenceEntry } from '../../evidence/schema';
import { localIsoDate, parseIsoDate } from '../../glycaemia/dates';
import { findDemoTable } from '../../tables/demo';
import { parseTableCsv } from '../../tables/csv';
import type { PopulationTable } from '../../tables/schema';
import {
  createCheckupTextReader,
  ColumnScanner,
  GroupingCheck,
  RunCounter,
  type Delimiter,
  evaluateWorker,
  isRefusal,
  noUsableRows,
  prepareCheckups,
  readXlsxSheet,
  runCheckups,
  runCheckupTable,
  StreamingGrouper,
  SummaryAccumulator,
  type CheckupsContext,
  type CheckupsOutcome,
  type HeaderInfo,
  type MappingOverrides,
  type RowProblem,
  type WorkerResult,
  type WorkerRows,
  type WorkforceSummary,
} from '../../workforce';
import { complain, EXIT_OK, EXIT_SOME_FAILED, streamTextChunks, type CommandIo } from '../io';
import { writeText } from './scenarioInput';
// One cell writer (with the spreadsheet-formula guard of lib/export) for the command and the screen.
import { csvCell } from '../../checkups/exportCsv';

export const CHECKUPS_USAGE = `Usage: hundredfold checkups FILE... --criteria ADA|WHO|NICE
         (--table FILE.csv | --table-id ID) (--evidence FILE.json | --evidence-id ID)
         [--horizon YEARS] [--map COLUMN=FIELD]... [--format ndjson|csv] [--summary FILE]
         [--sheet NAME] [--today YYYY-MM-DD]

Reads a workforce's checkups (CSV/TSV, .xlsx, or FHIR R4 bulk NDJSON: the Patient and
Observation files together; "-" reads CSV from stdin) and prints one line per worker, then the
workforce summary.
  --criteria     the criteria set for each worker's latest category
  --table        a population-table CSV file; --table-id a demo table's id
  --evidence     an evidence file (.json); --evidence-id an entry's id (in that file, or a demo entry)
  --horizon      years (default: the table's own period)
  --map          settle a column: --map "A1C=hba1c:%"; fields: worker, date, hba1c:%, hba1c:mmol/mol,
                 hba1c-unit, fpg:mmol/L, fpg:mg/dL, fpg-unit, age, birth-year, birth-date, sex,
                 stratum, ignore
  --format       ndjson (default: the summary is the last line, {"summary": ...}) or csv
  --summary      write the summary as JSON to FILE instead
  --sheet        the workbook sheet to read (default: the first)
  --today        the date future checkups are checked against (default: today)
Exit codes: 0 done, 1 some rows were skipped (listed on stderr), 2 the file or usage cannot be used.`;

/** Row problems printed on stderr before the rest are only counted. */
export const MAX_PROBLEM_LINES = 50;

interface Args {
  readonly files: string[];
  readonly criteria: string | null;
  readonly table: string | null;
  readonly tableId: string | null;
  readonly evidence: string | null;
  readonly evidenceId: string | null;
  readonly horizon: number | null;
  readonly map: Record<string, string>;
  readonly format: 'ndjson' | 'csv';
  readonly summary: string | null;
  readonly sheet: string | null;
  readonly today: string | null;
  readonly help: boolean;
}

const VALUE_OPTIONS = ['criteria', 'table', 'table-id', 'evidence', 'evidence-id', 'horizon', 'map', 'format', 'summary', 'sheet', 'today'] as const;
type ValueOption = (typeof VALUE_OPTIONS)[number];

function parseArgs(args: readonly string[]): Args | string {
  const values: Partial<Record<ValueOption, string>> = {};
  const map: Record<string, string> = {};
  const files: string[] = [];
  let help = false;
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i] ?? '';
    if (arg === '--help' || arg === '-h') {
      help = true;
      continue;
    }
    if (!arg.startsWith('--') || arg === '-') {
      files.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq < 0 ? undefined : eq);
    const option = VALUE_OPTIONS.find((o) => o === name);
    if (!option) return `unknown option "${arg.slice(0, eq < 0 ? undefined : eq)}"; the options are ${VALUE_OPTIONS.map((o) => `--${o}`).join(', ')}`;
    let value: string | undefined;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      value = args[i + 1];
      i += 1;
    }
    if (value === undefined || value === '') return `the option --${option} needs a value`;
    if (option === 'map') {
      const at = value.lastIndexOf('=');
      if (at <= 0 || at === value.length - 1) return `--map needs COLUMN=FIELD (got "${value}"), e.g. --map "A1C=hba1c:%"`;
      map[value.slice(0, at)] = value.slice(at + 1);
      continue;
    }
    if (values[option] !== undefined) return `the option --${option} is given more than once`;
    values[option] = value;
  }
  let horizon: number | null = null;
  if (values.horizon !== undefined) {
    horizon = Number(values.horizon);
    if (!/^\d+(\.\d+)?$/.test(values.horizon) || !Number.isFinite(horizon)) return `--horizon must be a number of years (got "${values.horizon}")`;
  }
  const format = values.format ?? 'ndjson';
  if (format !== 'ndjson' && format !== 'csv') return `--format must be ndjson or csv (got "${format}")`;
  if (values.today !== undefined && (!parseIsoDate(values.today) || !/^\d{4}-\d{2}-\d{2}$/.test(values.today))) return `--today must be a date YYYY-MM-DD (got "${values.today}")`;
  return {
    files,
    criteria: values.criteria ?? null,
    table: values.table ?? null,
    tableId: values['table-id'] ?? null,
    evidence: values.evidence ?? null,
    evidenceId: values['evidence-id'] ?? null,
    horizon,
    map,
    format,
    summary: values.summary ?? null,
    sheet: values.sheet ?? null,
    today: values.today ?? null,
    help,
  };
}

function readProblem(file: string, error: unknown): string {
  const code = typeof error === 'object' && error !== null ? (error as { code?: unknown }).code : undefined;
  const reason = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a directory' : code === 'EACCES' ? 'permission denied' : error instanceof Error ? error.message : String(error);
  return `cannot read ${JSON.stringify(file)}: ${reason}`;
}

async function loadTable(io: CommandIo, args: Args): Promise<PopulationTable | string> {
  if ((args.table === null) === (args.tableId === null)) return 'give the population table with --table FILE.csv or --table-id ID (one of them)';
  if (args.tableId !== null) {
    const demo = findDemoTable(args.tableId);
    return demo ?? `--table-id: no table "${args.tableId}"; the demo tables are demo-heart-failure-10y, demo-coronary-rate, demo-stroke-5y (or give --table FILE.csv)`;
  }
  let text: string;
  try {
    text = await io.readFile(args.table ?? '');
  } catch (error) {
    return `--table: ${readProblem(args.table ?? '', error)}`;
  }
  const parsed = parseTableCsv(text);
  if (!parsed.ok) return `--table ${args.table} is not a valid table: ${parsed.issues[0]?.message ?? 'refused'} (run "hundredfold table check ${args.table}" for every problem)`;
  return parsed.value;
}

async function loadEvidence(io: CommandIo, args: Args): Promise<EvidenceEntry | string> {
  if (args.evidence === null) {
    if (args.evidenceId === null) return 'give the evidence with --evidence FILE.json or --evidence-id ID';
    return findDemoEvidence(args.evidenceId) ?? `--evidence-id: no demo entry "${args.evidenceId}"; give the evidence file with --evidence FILE.json`;
  }
  let text: string;
  try {
    text = await io.readFile(args.evidence);
  } catch (error) {
    return `--evidence: ${readProblem(args.evidence, error)}`;
  }
  const parsed = parseEvidenceJson(text);
  if (!parsed.ok) return `--evidence ${args.evidence}: ${parsed.issues[0]?.message ?? 'refused'}`;
  const entries = parsed.value;
  if (args.evidenceId !== null) {
    return entries.find((e) => e.id === args.evidenceId) ?? `--evidence-id: the file ${args.evidence} has no entry "${args.evidenceId}"; its entries are ${entries.map((e) => e.id).join(', ')}`;
  }
  if (entries.length === 1 && entries[0]) return entries[0];
  return `--evidence ${args.evidence} holds ${entries.length} entries; choose one with --evidence-id (${entries.map((e) => e.id).slice(0, 10).join(', ')})`;
}

/** Control characters (and line and bidirectional separators) written as \xNN / \uNNNN, so one problem stays one line. */
export function escapeControl(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g, (c) => {
    const code = c.charCodeAt(0);
    return code < 0x100 ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
  });
}

/** "row 12, column HbA1c (%): message" (with the file first when several are read). */
export function problemLine(problem: RowProblem): string {
  const file = problem.file !== undefined ? `${problem.file}: ` : '';
  const column = problem.column !== null ? `, column ${problem.column}` : '';
  return escapeControl(`${file}row ${problem.line}${column}: ${problem.message}`);
}

/** The line's first keys, up to the reasons (the figures, strata and warnings follow). */
function workerHead(result: WorkerResult): Record<string, unknown> {
  return {
    worker: result.worker,
    age: result.age,
    sex: result.sex,
    checkups: result.checkups,
    latest: result.latest,
    run: result.run,
    status: result.status,
    reasons: result.reasons,
  };
}

/** The worker's line as the contract names its keys (no row problems: those went to stderr). */
export function workerRecord(result: WorkerResult): Record<string, unknown> {
  return {
    ...workerHead(result),
    referenceRisk: result.referenceRisk,
    exposedRisk: result.exposedRisk,
    riskDifference: result.riskDifference,
    numberNeeded: result.numberNeeded,
    horizonYears: result.horizonYears,
    strata: result.strata,
    warnings: result.warnings,
  };
}

/** A piece of a line: text, or text already encoded as UTF-8 (remembered, shared). */
export type LinePiece = string | Uint8Array;

/** The figures of a worker without them (not exposed or comparison), as they appear in the line. */
const NO_FIGURES_JSON = Buffer.from('"referenceRisk":null,"exposedRisk":null,"riskDifference":null,"numberNeeded":null,"horizonYears":null');

/** The figures' JSON text (without braces, UTF-8), per shared, frozen `exposedRisk` object, with the figures it was written from. */
const FIGURES_JSON = new WeakMap<object, { readonly of: Pick<WorkerResult, 'referenceRisk' | 'riskDifference' | 'numberNeeded' | 'horizonYears'>; readonly bytes: Uint8Array }>();
/** The JSON text (UTF-8) of a shared, frozen warnings list. */
const WARNINGS_JSON = new WeakMap<readonly unknown[], Uint8Array>();

/**
 * The worker's NDJSON line in pieces, which joined are exactly `JSON.stringify(workerRecord(result))`,
 * byte for byte (see {@link workerJsonLine}). lib/workforce gives every worker of one scenario
 * (age, sex, table strata) the same frozen figures and warnings (`scenarioFiguresFor`), so their
 * JSON — most of a line, and most of the cost of writing it (thirty-odd doubles) — is written and
 * encoded once per figures object and copied into the output as bytes. Anything else (figures
 * not frozen, a key missing) is one piece written by `JSON.stringify` afresh.
 */
export function workerJsonPieces(result: WorkerResult): LinePiece[] {
  const { referenceRisk, exposedRisk, riskDifference, numberNeeded, horizonYears, strata, warnings } = result;
  if (strata === undefined || warnings === undefined || referenceRisk === undefined || riskDifference === undefined || numberNeeded === undefined || horizonYears === undefined) {
    return [JSON.stringify(workerRecord(result))];
  }
  let figures: Uint8Array;
  if (exposedRisk === null && referenceRisk === null && riskDifference === null && numberNeeded === null && horizonYears === null) figures = NO_FIGURES_JSON;
  else if (exposedRisk !== null && typeof exposedRisk === 'object' && Object.isFrozen(exposedRisk) && Object.isFrozen(riskDifference) && Object.isFrozen(numberNeeded)) {
    const known = FIGURES_JSON.get(exposedRisk);
    if (known && known.of.referenceRisk === referenceRisk && known.of.riskDifference === riskDifference && known.of.numberNeeded === numberNeeded && known.of.horizonYears === horizonYears) {
      figures = known.bytes;
    } else {
      figures = Buffer.from(JSON.stringify({ referenceRisk, exposedRisk, riskDifference, numberNeeded, horizonYears }).slice(1, -1));
      FIGURES_JSON.set(exposedRisk, { of: { referenceRisk, riskDifference, numberNeeded, horizonYears }, bytes: figures });
    }
  } else return [JSON.stringify(workerRecord(result))];
  let warningsJson: LinePiece;
  if (Object.isFrozen(warnings)) {
    let known = WARNINGS_JSON.get(warnings);
    if (known === undefined) {
      known = Buffer.from(JSON.stringify(warnings));
      WARNINGS_JSON.set(warnings, known);
    }
    warningsJson = known;
  } else warningsJson = JSON.stringify(warnings);
  const head = JSON.stringify(workerHead(result));
  if (head.length < 3) return [JSON.stringify(workerRecord(result))];
  return [head.slice(0, -1), ',', figures, ',"strata":', JSON.stringify(strata), ',"warnings":', warningsJson, '}'];
}

/** The worker's NDJSON line: {@link workerJsonPieces} joined; exactly `JSON.stringify(workerRecord(result))`. */
export function workerJsonLine(result: WorkerResult): string {
  return workerJsonPieces(result)
    .map((piece) => (typeof piece === 'string' ? piece : Buffer.from(piece.buffer, piece.byteOffset, piece.byteLength).toString('utf8')))
    .join('');
}

/**
 * The command's CSV columns (`--format csv`), documented in the README: one column per key of the
 * NDJSON line, snake_case, reasons and warnings apart, the number needed as a number and as text,
 * `stratum_<name>` last. The screen's export (lib/checkups/exportCsv.ts `workersCsv`) is a sheet
 * for people — headers in words, reasons and warnings in one "notes" column, no number-needed
 * display figure, a preamble naming the evidence — so the two keep their own lists: one
 * definition would change one of the two documented files. They share the cell writer (`csvCell`).
 */
const CSV_COLUMNS = [
  'worker',
  'age',
  'sex',
  'checkups',
  'latest_date',
  'latest_category',
  'run_category',
  'run_yearly_results',
  'status',
  'reference_risk',
  'exposed_risk',
  'exposed_risk_lower',
  'exposed_risk_upper',
  'risk_difference',
  'risk_difference_lower',
  'risk_difference_upper',
  'number_needed',
  'number_needed_text',
  'reasons',
  'warnings',
] as const;

function csvHeader(strata: readonly string[]): string {
  return [...CSV_COLUMNS, ...strata.map((s) => `stratum_${s}`)].join(',');
}

function csvLine(r: WorkerResult, strata: readonly string[]): string {
  const cells: (string | number | null)[] = [
    r.worker,
    r.age,
    r.sex,
    r.checkups,
    r.latest?.date ?? null,
    r.latest ? (r.latest.category ?? 'not-classified') : null,
    r.run.category,
    r.run.yearlyResults,
    r.status,
    r.referenceRisk,
    r.exposedRisk?.estimate ?? null,
    r.exposedRisk?.lower ?? null,
    r.exposedRisk?.upper ?? null,
    r.riskDifference?.estimate ?? null,
    r.riskDifference?.lower ?? null,
    r.riskDifference?.upper ?? null,
    r.numberNeeded?.display ?? null,
    r.numberNeeded?.text ?? null,
    r.reasons.join(' '),
    r.warnings.map((w) => w.message).join(' '),
    ...strata.map((s) => r.strata[s] ?? null),
  ];
  return cells.map(csvCell).join(',');
}

type Kind = 'delimited' | 'xlsx' | 'fhir-ndjson';

async function sniffKind(file: string): Promise<Kind | string> {
  const lower = file.toLowerCase();
  if (lower.endsWith('.xlsx')) return 'xlsx';
  if (lower.endsWith('.ndjson') || lower.endsWith('.jsonl')) return 'fhir-ndjson';
  if (file === '-') return 'delimited';
  try {
    const handle = await import('node:fs/promises').then((fs) => fs.open(file, 'r'));
    try {
      const { buffer, bytesRead } = await handle.read(Buffer.alloc(8), 0, 8, 0);
      const head = buffer.subarray(0, bytesRead);
      if (head[0] === 0x50 && head[1] === 0x4b) return 'xlsx';
      if (head.subarray(0, 5).toString('latin1') === '%PDF-') return `${JSON.stringify(file)} is a PDF, not a checkup file (CSV, TSV, .xlsx or FHIR NDJSON)`;
      const text = head.toString('utf8').replace(/^\uFEFF/, '').trimStart();
      if (text.startsWith('{')) return 'fhir-ndjson';
      return 'delimited';
    } finally {
      await handle.close();
    }
  } catch (error) {
    return readProblem(file, error);
  }
}

/**
 * Chunk size for reading a file, every pass: small, so the rows and lines of one chunk die young
 * (they are collected cheaply instead of being promoted to the old generation), and each chunk's
 * text stays a regular heap string (V8 puts strings over 128 KiB in its large-object space, one
 * mapping each). Measured: 64 KiB used about 15% less CPU than 1 MiB on 100,000 workers for the
 * second pass; decoding the 19.5 MB file as UTF-8 took about 80 ms of CPU in 64 KiB chunks against
 * 160–330 ms in chunks of 16 KiB, 128 KiB, 256 KiB or 1 MiB.
 */
const STREAM_CHUNK_BYTES = 1 << 16;

async function* fileChunks(file: string, chunkBytes = STREAM_CHUNK_BYTES): AsyncGenerator<string> {
  const stream = createReadStream(file, { encoding: 'utf8', highWaterMark: chunkBytes });
  for await (const chunk of stream) yield chunk as string;
}

/** Bytes of output gathered before they are written (one write, not one per line). */
const OUTPUT_BLOCK_BYTES = 1 << 16;

/**
 * Writes lines with backpressure; stops quietly when the reader has gone. Each line is encoded
 * straight into a block of bytes (no joined string to copy again: the output is several times
 * the input's size, so every copy of it shows), a line given in pieces piece by piece, bytes
 * copied as they are; full blocks wait for {@link flush}.
 */
export class LineWriter {
  private blocks: Buffer[] = [];
  private block = Buffer.allocUnsafe(OUTPUT_BLOCK_BYTES);
  private used = 0;
  private size = 0;
  open = true;
  constructor(private readonly io: Pick<CommandIo, 'stdout'>) {}
  /** Makes room for a line of at most `most` bytes (its newline included) in the current block. */
  private room(most: number): void {
    if (this.used + most > this.block.length) {
      if (this.used > 0) this.blocks.push(this.block.subarray(0, this.used));
      this.block = Buffer.allocUnsafe(Math.max(OUTPUT_BLOCK_BYTES, most));
      this.used = 0;
    }
  }
  push(line: string): void {
    if (!this.open) return;
    this.room(line.length * 3 + 1); // UTF-8 takes at most 3 bytes per UTF-16 unit
    const written = this.block.write(line, this.used) + 1;
    this.block[this.used + written - 1] = 0x0a;
    this.used += written;
    this.size += written;
  }
  /** One line given in pieces (text, or UTF-8 bytes). */
  pushPieces(pieces: readonly LinePiece[]): void {
    if (!this.open) return;
    let most = 1;
    for (const piece of pieces) most += typeof piece === 'string' ? piece.length * 3 : piece.byteLength;
    this.room(most);
    const start = this.used;
    let at = start;
    for (const piece of pieces) {
      if (typeof piece === 'string') at += this.block.write(piece, at);
      else {
        this.block.set(piece, at);
        at += piece.byteLength;
      }
    }
    this.block[at] = 0x0a;
    this.used = at + 1;
    this.size += this.used - start;
  }
  /** Bytes waiting to be written. */
  get pending(): number {
    return this.size;
  }
  async flush(): Promise<void> {
    if (this.used > 0) {
      this.blocks.push(this.block.subarray(0, this.used));
      this.block = Buffer.allocUnsafe(OUTPUT_BLOCK_BYTES);
      this.used = 0;
    }
    const blocks = this.blocks;
    this.blocks = [];
    this.size = 0;
    for (const block of blocks) {
      if (!this.open) return;
      this.open = await writeText(this.io.stdout, block);
    }
  }
}

class ProblemPrinter {
  count = 0;
  constructor(private readonly io: CommandIo) {}
  add(problems: readonly RowProblem[]): void {
    for (const p of problems) {
      this.count++;
      if (this.count <= MAX_PROBLEM_LINES) this.io.stderr.write(`${problemLine(p)}\n`);
    }
  }
  finish(): void {
    if (this.count > MAX_PROBLEM_LINES) this.io.stderr.write(`… and ${this.count - MAX_PROBLEM_LINES} more row problems not listed\n`);
  }
}

function strataNames(header: HeaderInfo | null): string[] {
  return header ? header.proposal.mapping.columns.filter((c) => c.field === 'stratum' && c.stratum !== null).map((c) => c.stratum as string) : [];
}

/** Text the first pass's header probe reads at a time (about 400 rows of a usual file: enough to settle the header). */
const PROBE_SLICE_CHARS = 1 << 14;

/** The worker column of a CSV/TSV file and where its data rows start, found as the checkup reader finds them. */
interface WorkerColumn {
  readonly delimiter: Delimiter;
  readonly index: number;
  readonly headerLine: number;
}

/**
 * One quick pass over the worker column (./delimited.ts ColumnScanner: lines cut, no row
 * checked), feeding each data row's trimmed worker id to `add`; false when the header cannot be
 * read or `add` said stop.
 */
async function scanWorkerIds(file: string, options: { today: string; overrides: MappingOverrides }, add: (id: string) => boolean): Promise<boolean> {
  const probe = createCheckupTextReader(options);
  let column: WorkerColumn | null = null;
  let scanner: ColumnScanner | null = null;
  let buffered = '';
  for await (const chunk of fileChunks(file)) {
    if (scanner === null) {
      buffered += chunk;
      // The probe only needs the header and the rows that settle it: fed in slices until it has them,
      // it does not read the rest of a large first chunk.
      for (let at = 0; at < chunk.length && probe.header === null; at += PROBE_SLICE_CHARS) {
        const step = probe.push(chunk.slice(at, at + PROBE_SLICE_CHARS));
        if (isRefusal(step)) return false;
      }
      const header = probe.header;
      if (header === null) continue;
      const worker = header.proposal.mapping.columns.find((c) => c.field === 'worker');
      if (!worker) return false;
      column = { delimiter: header.delimiter, index: worker.index, headerLine: header.headerLine };
      const headerLine = column.headerLine;
      // Only where the worker id changes matters (GroupingCheck and RunCounter ignore a repeat), so
      // a row repeating the row before's cell is skipped without being cut out.
      const onCell = (cell: string, line: number) => {
        if (line <= headerLine) return true;
        const id = cell.trim();
        return id === '' || add(id);
      };
      scanner = new ColumnScanner(column.delimiter, column.index, onCell, 1, { repeatsSkippedAfter: headerLine });
      if (!scanner.push(buffered.charCodeAt(0) === 0xfeff ? buffered.slice(1) : buffered)) return false;
      buffered = '';
      continue;
    }
    if (!scanner.push(chunk)) return false;
  }
  return scanner !== null && scanner.end();
}

/**
 * Pass 1 for a CSV/TSV file: is it grouped by worker? Looks only at the worker column (about the
 * cost of reading the file). When the Bloom filter of finished workers answers "seen" for some
 * ids (./group.ts GroupingCheck: rare, and only in very large files), one more quick pass counts
 * those ids' runs exactly. Returns the ids so cleared (for the StreamingGrouper), or null when
 * the file is not grouped (then it is read whole).
 */
async function groupedIds(file: string, options: { today: string; overrides: MappingOverrides }): Promise<ReadonlySet<string> | null> {
  const check = new GroupingCheck();
  if (!(await scanWorkerIds(file, options, (id) => check.add(id)))) return null;
  if (check.suspects.size === 0) return check.suspects;
  const runs = new RunCounter(check.suspects);
  if (!(await scanWorkerIds(file, options, (id) => runs.add(id)))) return null;
  return check.suspects;
}

export async function checkups(io: CommandIo): Promise<number> {
  const args = parseArgs(io.args);
  if (typeof args === 'string') return complain(io, `checkups: ${args}`);
  if (args.help) {
    io.stdout.write(`${CHECKUPS_USAGE}\n`);
    return EXIT_OK;
  }
  if (args.files.length === 0) return complain(io, 'checkups: no file given; run "hundredfold checkups --help"');
  if (args.criteria === null) return complain(io, 'checkups: --criteria ADA, WHO or NICE is required (there is no default: the criteria set changes the category)');
  const table = await loadTable(io, args);
  if (typeof table === 'string') return complain(io, `checkups: ${table}`);
  const evidence = await loadEvidence(io, args);
  if (typeof evidence === 'string') return complain(io, `checkups: ${evidence}`);

  const kinds: Kind[] = [];
  for (const file of args.files) {
    const kind = await sniffKind(file);
    if (kind !== 'delimited' && kind !== 'xlsx' && kind !== 'fhir-ndjson') return complain(io, `checkups: ${kind}`);
    kinds.push(kind);
  }
  const kind = kinds[0] ?? 'delimited';
  if (args.files.length > 1 && !kinds.every((k) => k === 'fhir-ndjson')) {
    return complain(io, 'checkups: several files are read together only for FHIR bulk NDJSON (Patient and Observation files); give one CSV, TSV or .xlsx file');
  }
  const today = args.today ?? localIsoDate();
  const reader = { today, overrides: args.map };

  const prepared = prepareCheckups({ evidence, table, criteria: args.criteria, ...(args.horizon !== null ? { horizonYears: args.horizon } : {}) });
  if (!prepared.ok) return complain(io, `checkups: ${prepared.issues.map((i) => i.message).join('; ')}`);
  const context: CheckupsContext = prepared.value;

  const out = new LineWriter(io);
  const problems = new ProblemPrinter(io);
  let strata: string[] = [];
  let headerWritten = false;
  const onWorker = (result: WorkerResult) => {
    if (args.format === 'csv') {
      if (!headerWritten) {
        out.push(csvHeader(strata));
        headerWritten = true;
      }
      out.push(csvLine(result, strata));
    } else out.pushPieces(workerJsonPieces(result));
  };
  const onHeader = (header: HeaderInfo | null) => {
    strata = strataNames(header);
  };
  const pause = async () => {
    if (out.pending > 1 << 16) await out.flush();
  };

  let outcome: CheckupsOutcome;
  const file = args.files[0] ?? '-';
  if (kind === 'xlsx') {
    let bytes: Buffer;
    try {
      bytes = await readFile(file);
    } catch (error) {
      return complain(io, `checkups: ${readProblem(file, error)}`);
    }
    const sheet = await readXlsxSheet(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer, args.sheet ?? undefined);
    if (isRefusal(sheet)) return complain(io, `checkups: ${file}: ${sheet.message}`);
    outcome = await runCheckupTable(sheet.rows, { context, reader, onHeader, onWorker, onProblems: (p) => problems.add(p), pause });
  } else if (kind === 'fhir-ndjson') {
    const files = args.files;
    async function* all(): AsyncGenerator<string | { file: string }> {
      for (const f of files) {
        yield { file: f.split(/[\\/]/).pop() ?? f };
        yield* fileChunks(f);
      }
    }
    try {
      outcome = await runCheckups(all(), { context, reader, format: 'fhir-ndjson', onHeader, onWorker, onProblems: (p) => problems.add(p), pause });
    } catch (error) {
      return complain(io, `checkups: ${readProblem(file, error)}`);
    }
  } else {
    let confirmed: ReadonlySet<string> | null = null;
    if (file !== '-') {
      try {
        confirmed = await groupedIds(file, reader);
      } catch (error) {
        return complain(io, `checkups: ${readProblem(file, error)}`);
      }
    }
    if (confirmed) outcome = await streamGrouped(file, context, reader, confirmed, { onWorker, onProblems: (p) => problems.add(p), pause, setHeader: onHeader });
    else {
      const source = file === '-' ? streamTextChunks(io.stdin, 'standard input') : fileChunks(file);
      try {
        outcome = await runCheckups(source, { context, reader, format: 'delimited', onHeader, onWorker, onProblems: (p) => problems.add(p), pause });
      } catch (error) {
        if (file === '-') return complain(io, `checkups: ${error instanceof Error ? error.message : String(error)}`);
        return complain(io, `checkups: ${readProblem(file, error)}`);
      }
    }
  }
  if (!outcome.ok) {
    if ('cancelled' in outcome) return complain(io, 'checkups: cancelled');
    return complain(io, `checkups: ${file === '-' ? 'standard input' : file}: ${outcome.refusal.message}`);
  }
  if (args.format === 'csv' && !headerWritten) out.push(csvHeader(strata));
  problems.finish();
  const summary = outcome.summary;
  if (args.summary !== null) {
    try {
      await writeFile(args.summary, `${JSON.stringify(summary, null, 2)}\n`);
    } catch (error) {
      await out.flush();
      return complain(io, `checkups: cannot write --summary ${args.summary}: ${error instanceof Error ? error.message : String(error)}`);
    }
  } else if (args.format === 'ndjson') out.push(JSON.stringify({ summary }));
  else {
    await out.flush();
    io.stderr.write('checkups: the CSV output has no summary line; give --summary FILE to keep it\n');
  }
  await out.flush();
  return summary.rows.skipped > 0 ? EXIT_SOME_FAILED : EXIT_OK;
}

/**
 * The first pass found the file grouped by worker, but a worker's rows came back after another
 * worker's in the second: the file changed between the passes. Lines already written stand; the
 * rest is refused.
 */
function changedWhileRead(line: number): CheckupsOutcome {
  return {
    ok: false,
    refusal: { refused: true, code: 'unreadable', message: `the file changed while it was read (row ${line} belongs to a worker whose rows ended earlier); run the command again`, problems: [] },
  };
}

interface StreamHooks {
  readonly onWorker: (result: WorkerResult) => void;
  readonly onProblems: (problems: readonly RowProblem[]) => void;
  readonly pause: () => Promise<void>;
  readonly setHeader: (header: HeaderInfo | null) => void;
}

/** Pass 2 for a grouped file: each worker evaluated as soon as the next worker's row arrives. */
async function streamGrouped(
  file: string,
  context: CheckupsContext,
  options: { today: string; overrides: MappingOverrides },
  confirmed: ReadonlySet<string>,
  hooks: StreamHooks,
): Promise<CheckupsOutcome> {
  const reader = createCheckupTextReader(options);
  const grouper = new StreamingGrouper(confirmed);
  const summary = new SummaryAccumulator();
  let extraSkipped = 0;
  let problemCount = 0;
  let headerSet = false;
  const evaluate = (groups: readonly WorkerRows[]) => {
    if (!headerSet && reader.header) {
      hooks.setHeader(reader.header);
      headerSet = true;
    }
    for (const group of groups) {
      const result = evaluateWorker(group, context);
      if (result.problems.length > 0) {
        problemCount += result.problems.length;
        extraSkipped += result.skippedRows;
        hooks.onProblems(result.problems);
      }
      summary.add(result);
      hooks.onWorker(result);
    }
  };
  for await (const chunk of fileChunks(file)) {
    const step = reader.push(chunk);
    if (isRefusal(step)) return { ok: false, refusal: step };
    if (step.problems.length > 0) {
      problemCount += step.problems.length;
      hooks.onProblems(step.problems);
    }
    evaluate(grouper.add(step.rows));
    if (grouper.ungrouped) return changedWhileRead(grouper.ungrouped.line);
    await hooks.pause();
  }
  const last = reader.end();
  if (isRefusal(last)) return { ok: false, refusal: last };
  if (last.problems.length > 0) {
    problemCount += last.problems.length;
    hooks.onProblems(last.problems);
  }
  evaluate(grouper.add(last.rows));
  if (grouper.ungrouped) return changedWhileRead(grouper.ungrouped.line);
  evaluate(grouper.end());
  const counts = reader.counts();
  const empty = noUsableRows(counts);
  if (empty) return { ok: false, refusal: empty };
  const finished: WorkforceSummary = summary.finish({ read: counts.read, used: counts.used - extraSkipped, skipped: counts.skipped + extraSkipped });
  return { ok: true, summary: finished, header: reader.header, problemCount };
}
