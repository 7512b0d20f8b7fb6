/** Messages between the checkups screen and its Web Worker (plain data only). */
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { Checkup } from '@/lib/glycaemia/schema';
import type { PopulationTable } from '@/lib/tables/schema';
import type { CriteriaSet } from '@/lib/glycaemia/exposure';
import type { SessionSetup } from '@/lib/checkups/session';
import type { WorklistColumn } from '@/lib/checkups/worklist';
import type { ExportContext } from '@/lib/checkups/exportCsv';
import type { PackedChunk } from '@/lib/checkups/packedResults';
import type { WorklistColumns } from '@/lib/checkups/worklistColumns';
import type { WorklistOrders } from '@/lib/checkups/worklistOrder';
import type { CheckupsOutcome, CheckupsProgress, ColumnMapping, HeaderInfo, ReadRefusal, RowProblem } from '@/lib/workforce';

export type FileKindName = 'delimited' | 'xlsx' | 'fhir-ndjson';

export type ToWorker =
  | { readonly type: 'preview'; readonly file: File; readonly kind: FileKindName; readonly today: string }
  | {
      readonly type: 'run';
      readonly files: readonly File[];
      readonly kind: FileKindName;
      readonly today: string;
      /** The mapping to read with: null lets the reader take its own proposal. */
      readonly mapping: ColumnMapping | null;
      /** The mapping as the physician confirmed it (kept with a saved session); null for FHIR. */
      readonly confirmedMapping: ColumnMapping | null;
      readonly evidence: EvidenceEntry;
      readonly table: PopulationTable;
      readonly criteria: CriteriaSet;
      readonly horizon: number | null;
    }
  | { readonly type: 'cancel' }
  /** Save the last finished run as a session: its rows are read again here, so they never cross to the page. */
  | { readonly type: 'save-session'; readonly id: string; readonly name: string }
  /** Open a saved session: its rows are read from storage and processed here, as a run is. */
  | { readonly type: 'open-session'; readonly id: string }
  /** The per-worker CSV of the last finished run (lib/checkups/exportCsv workersCsv), made in the worker. */
  | { readonly type: 'export-workers'; readonly context: ExportContext }
  /** One worker's rows read again from the same files ("open one worker", lib/checkups/workerHistory.ts). */
  | {
      readonly type: 'history';
      readonly files: readonly File[];
      readonly kind: FileKindName;
      readonly today: string;
      readonly mapping: ColumnMapping | null;
      readonly worker: string;
    }
  /**
   * Several workers' rows read again from the same files in one pass (batch handouts' own results,
   * lib/checkups/workerHistory.ts `collectWorkersRows`). `id` names the pass in its answers; a new
   * pass, or 'histories-cancel' with its id, stops one still reading.
   */
  | {
      readonly type: 'histories';
      readonly id: number;
      readonly files: readonly File[];
      readonly kind: FileKindName;
      readonly today: string;
      readonly mapping: ColumnMapping | null;
      readonly workers: readonly string[];
    }
  | { readonly type: 'histories-cancel'; readonly id: number };

/** One worker's checkups, as read again from the file (answer to 'histories'). */
export interface WorkerHistoryData {
  readonly worker: string;
  readonly checkups: readonly Checkup[];
}

/** The worklist's filter choices, from the rows (lib/checkups/worklist `worklistFilterChoices`). */
export interface FilterChoices {
  readonly categories: readonly string[];
  readonly strata: readonly { readonly name: string; readonly value: string }[];
}

export type FromWorker =
  | { readonly type: 'header'; readonly header: HeaderInfo | null; readonly refusal: ReadRefusal | null }
  | { readonly type: 'refused'; readonly messages: readonly string[] }
  | { readonly type: 'progress'; readonly progress: CheckupsProgress }
  /** The next results, packed (lib/checkups/packedResults.ts; buffers transferred), as the run goes. */
  | { readonly type: 'results'; readonly chunk: PackedChunk }
  /** Sent once a run is done, just before `choices`: the worklist's filter columns (buffers transferred). */
  | { readonly type: 'columns'; readonly columns: WorklistColumns }
  | { readonly type: 'problems'; readonly problems: readonly RowProblem[] }
  /** Sent just before `done`: the filters' choices, worked out here rather than on the page. */
  | { readonly type: 'choices'; readonly choices: FilterChoices }
  | { readonly type: 'done'; readonly outcome: CheckupsOutcome }
  /** Just before `done`: each column's sort ranks and its rows in order both ways (lib/checkups/worklistOrder.ts), so a sort on the page computes nothing. */
  | { readonly type: 'ranks'; readonly ranks: Readonly<Partial<Record<WorklistColumn, Int32Array>>>; readonly orders: WorklistOrders }
  | { readonly type: 'session-saved'; readonly id: string; readonly messages: readonly string[] }
  | { readonly type: 'session-opened'; readonly setup: SessionSetup; readonly kind: FileKindName; readonly mapping: ColumnMapping | null }
  | { readonly type: 'session-refused'; readonly messages: readonly string[] }
  /** The answer to 'export-workers': the CSV text, or null when there is no finished run. */
  | { readonly type: 'export-workers'; readonly text: string | null }
  /** The answer to 'history': the worker's checkups, or why the file could not be read again. */
  | { readonly type: 'history'; readonly worker: string; readonly checkups: readonly Checkup[] | null; readonly message: string | null }
  /**
   * Answers to 'histories' `id`: progress through the file (bytes), then the workers' checkups in
   * batches (a worker with no row is absent), the last one `done`; or `message`, why the file
   * could not be read again (then `done`, and no checkups).
   */
  | {
      readonly type: 'histories';
      readonly id: number;
      readonly bytesRead: number;
      readonly bytesTotal: number;
      readonly histories: readonly WorkerHistoryData[];
      readonly done: boolean;
      readonly message: string | null;
    };
