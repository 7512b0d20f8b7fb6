/**
 * The checkups screen's set-up, as data: which evidence entries and population tables can be
 * chosen (the bundled demo ones, marked illustrative, and those saved in this browser's clinic
 * library), which entries can be used to match workers and, when one cannot, why — in one
 * sentence, with where to add what is missing.
 *
 * A workforce run needs the study's exposure definition (lib/glycaemia `exposureDefinitionSchema`:
 * the test, range, criteria set and run length the study used) to tell which workers fit the
 * exposure; lib/workforce `prepareCheckups` refuses an entry without one. This module says so
 * before the file is opened, so the physician is not sent through the columns first.
 */
import type { EvidenceEntry } from '../evidence/schema';

/** Where a choice comes from. */
export type SetupSource = 'demo' | 'library';

export interface SetupOption {
  readonly id: string;
  /** The text of the option: the title, with "(illustrative)" or "(no exposure definition)" when that applies. */
  readonly label: string;
  readonly source: SetupSource;
  readonly illustrative: boolean;
}

export interface EvidenceOption extends SetupOption {
  /** True when the entry carries an exposure definition (workers can be matched to the study). */
  readonly usable: boolean;
}

export interface SetupGroup<T extends SetupOption> {
  /** The option group's label. */
  readonly label: string;
  readonly options: readonly T[];
}

/** What the set-up needs to know about a table: the library lists tables by summary. */
export interface TableChoice {
  readonly id: string;
  readonly title: string;
  readonly illustrative: boolean;
}

export interface SetupView {
  readonly evidenceGroups: readonly SetupGroup<EvidenceOption>[];
  readonly tableGroups: readonly SetupGroup<SetupOption>[];
  /** The chosen entry's problem in one sentence, or null when it can be used. */
  readonly evidenceProblem: string | null;
  /** True when the chosen entry and table exist and the entry can be used. */
  readonly ready: boolean;
  /**
   * The chosen entry's and table's whole option text, shown under each list on a narrow screen:
   * a closed choice list cuts a long title at its edge (null when nothing known is chosen).
   */
  readonly chosen: { readonly evidence: string | null; readonly table: string | null };
}

export interface SetupInput {
  readonly demoEvidence: readonly EvidenceEntry[];
  readonly libraryEvidence: readonly EvidenceEntry[];
  readonly demoTables: readonly TableChoice[];
  readonly libraryTables: readonly TableChoice[];
  readonly evidenceId: string;
  readonly tableId: string;
}

/** The sentence shown when the chosen entry has no exposure definition. */
export const NO_EXPOSURE_DEFINITION =
  'This evidence entry has no exposure definition (the test, range, criteria set and number of yearly results the study used), so no worker can be matched to the study: add one to the entry in the clinic library, or choose another entry.';

function label(title: string, illustrative: boolean, usable = true): string {
  const notes = [illustrative && !/\b(demo|illustrative)\b/i.test(title) ? 'illustrative' : null, usable ? null : 'no exposure definition'].filter((n) => n !== null);
  return notes.length === 0 ? title : `${title} (${notes.join('; ')})`;
}

function evidenceOption(entry: EvidenceEntry, source: SetupSource): EvidenceOption {
  const usable = entry.exposureDefinition !== undefined;
  return { id: entry.id, label: label(entry.title, entry.illustrative, usable), source, illustrative: entry.illustrative, usable };
}

function tableOption(table: TableChoice, source: SetupSource): SetupOption {
  return { id: table.id, label: label(table.title, table.illustrative), source, illustrative: table.illustrative };
}

/** Library records whose id a demo record already has are left out (the library refuses such ids anyway). */
function own<T extends { readonly id: string }>(saved: readonly T[], demo: readonly { readonly id: string }[]): T[] {
  const demoIds = new Set(demo.map((d) => d.id));
  return saved.filter((s) => !demoIds.has(s.id));
}

function groups<T extends SetupOption>(demo: readonly T[], saved: readonly T[], demoLabel: string, savedLabel: string): SetupGroup<T>[] {
  return [
    { label: demoLabel, options: demo },
    ...(saved.length > 0 ? [{ label: savedLabel, options: saved }] : []),
  ];
}

/**
 * The set-up's choices and the chosen entry's problem.
 *
 * @example
 * setupView({ demoEvidence: DEMO_EVIDENCE, libraryEvidence: [], demoTables: DEMO_TABLES, libraryTables: [],
 *   evidenceId: 'demo-workforce-hba1c-heart-failure', tableId: 'demo-heart-failure-10y' }).ready //=> true
 */
export function setupView(input: SetupInput): SetupView {
  const demoEvidence = input.demoEvidence.map((e) => evidenceOption(e, 'demo'));
  const savedEvidence = own(input.libraryEvidence, input.demoEvidence).map((e) => evidenceOption(e, 'library'));
  const demoTables = input.demoTables.map((t) => tableOption(t, 'demo'));
  const savedTables = own(input.libraryTables, input.demoTables).map((t) => tableOption(t, 'library'));
  const chosen = [...demoEvidence, ...savedEvidence].find((e) => e.id === input.evidenceId);
  const table = [...demoTables, ...savedTables].find((t) => t.id === input.tableId);
  const evidenceProblem = chosen && !chosen.usable ? NO_EXPOSURE_DEFINITION : null;
  return {
    evidenceGroups: groups(demoEvidence, savedEvidence, 'Demo entries (illustrative)', 'Saved in this browser'),
    tableGroups: groups(demoTables, savedTables, 'Demo tables (illustrative)', 'Saved in this browser'),
    evidenceProblem,
    ready: chosen !== undefined && table !== undefined && evidenceProblem === null,
    chosen: { evidence: chosen?.label ?? null, table: table?.label ?? null },
  };
}
