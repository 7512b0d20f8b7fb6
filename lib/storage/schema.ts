/**
 * The browser library's storage layout, as data: database name and version, object stores,
 * and the steps that upgrade an older database. The IndexedDB code (app/storage/) applies
 * these; keeping them here keeps them pure and tested.
 *
 * Never edit a released step: add a new one with the next version. A step only adds or
 * removes stores and indexes; record contents are migrated by ./records.ts when read.
 */

export const DB_NAME = 'hundredfold-library';

/** Object store names. */
export const STORES = {
  /** Full population tables ({@link StoredTable}), by table id. */
  tables: 'tables',
  /** One small summary per table ({@link TableSummary}), so the list never loads every stratum. */
  tableSummaries: 'table-summaries',
  /** Evidence entries ({@link StoredEvidence}), by entry id. */
  evidence: 'evidence',
  /** What is left of deleted records ({@link StoredTombstone}), by `<store>/<id>`, so a stale save cannot bring one back. */
  tombstones: 'tombstones',
  /** Handout templates ({@link StoredTemplate}), by template id. */
  templates: 'templates',
  /** Saved checkups sessions without their rows (lib/checkups/session.ts), by session id: what the list shows. */
  checkupSessions: 'checkup-sessions',
  /** Each saved session's checkup rows and row problems, by session id, written and deleted with its session. */
  checkupSessionRows: 'checkup-session-rows',
} as const;
export type StoreName = (typeof STORES)[keyof typeof STORES];

export interface StoreSpec {
  readonly name: StoreName;
  readonly keyPath: string;
}

export interface UpgradeStep {
  /** The database version this step brings the database to. */
  readonly version: number;
  readonly createStores: readonly StoreSpec[];
  readonly deleteStores: readonly StoreName[];
}

/** Every upgrade step, oldest first. */
export const UPGRADE_STEPS: readonly UpgradeStep[] = [
  {
    version: 1,
    createStores: [
      { name: STORES.tables, keyPath: 'table.id' },
      { name: STORES.tableSummaries, keyPath: 'id' },
      { name: STORES.evidence, keyPath: 'entry.id' },
    ],
    deleteStores: [],
  },
  {
    // Revisions and tombstones (./policy.ts); records are brought to format 2 when read.
    version: 2,
    createStores: [{ name: STORES.tombstones, keyPath: 'key' }],
    deleteStores: [],
  },
  {
    // Handout templates join the library (they were kept in localStorage before).
    version: 3,
    createStores: [{ name: STORES.templates, keyPath: 'id' }],
    deleteStores: [],
  },
  {
    // Saved checkups sessions (issue "Workforce checkups, part 2"): two new stores; every
    // existing store and record is left as it is.
    version: 4,
    createStores: [
      { name: STORES.checkupSessions, keyPath: 'session.id' },
      { name: STORES.checkupSessionRows, keyPath: 'id' },
    ],
    deleteStores: [],
  },
];

/** The current database version: the last step's. */
export const DB_VERSION = UPGRADE_STEPS[UPGRADE_STEPS.length - 1]?.version ?? 1;

/**
 * The steps that take a database from `oldVersion` (0 for a new one) to `newVersion`, in order.
 *
 * @example
 * upgradeStepsBetween(0, 1).map((s) => s.version) //=> [1]
 * upgradeStepsBetween(1, 1) //=> []
 */
export function upgradeStepsBetween(oldVersion: number, newVersion: number, steps: readonly UpgradeStep[] = UPGRADE_STEPS): UpgradeStep[] {
  return steps.filter((s) => s.version > oldVersion && s.version <= newVersion).sort((a, b) => a.version - b.version);
}
