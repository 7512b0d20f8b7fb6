/** Messages between the checkups screen and its Web Worker (plain data only). */
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { Checkup } from '@/lib/glycaemia/schema';
import type { PopulationTable } from '@/lib/tables/schema';
import type { CheckupsOutcome, CheckupsProgress, ColumnMapping, HeaderInfo, ReadRefusal, RowProblem, WorkerResult } from '@/lib/workforce';

export type FileKindName = 'delimited' | 'xlsx' | 'fhir-ndjson';

export type ToWorker =
  | { readonly type: 'preview'; readonly file: File; readonly kind: FileKindName; readonly today: string }
  | {
      readonly type: 'run';
      readonly files: readonly File[];
      readonly kind: FileKindName;
      readonly today: string;
      readonly mapping: ColumnMapping | null;
      readonly evidence: EvidenceEntry;
      readonly table: PopulationTable;
      readonly criteria: string;
      readonly horizon: number | null;
    }
  | { readonly type: 'cancel' }
  /** One worker's rows read again from the same files ("open one worker", lib/checkups/workerHistory.ts). */
  | {
      readonly type: 'history';
      readonly files: readonly File[];
      readonly kind: FileKindName;
      readonly today: string;
      readonly mapping: ColumnMapping | null;
      readonly worker: string;
    };

export type FromWorker =
  | { readonly type: 'header'; readonly header: HeaderInfo | null; readonly refusal: ReadRefusal | null }
  | { readonly type: 'refused'; readonly messages: readonly string[] }
  | { readonly type: 'progress'; readonly progress: CheckupsProgress }
  | { readonly type: 'workers'; readonly workers: readonly WorkerResult[] }
  | { readonly type: 'problems'; readonly problems: readonly RowProblem[] }
  | { readonly type: 'done'; readonly outcome: CheckupsOutcome }
  /** The answer to 'history': the worker's checkups, or why the file could not be read again. */
  | { readonly type: 'history'; readonly worker: string; readonly checkups: readonly Checkup[] | null; readonly message: string | null };
