'use client';
/**
 * The clinic library on the consultation screen (app/components/library): pick a saved table or
 * evidence entry for this consultation, or save the evidence now on screen. Loaded only when
 * the clinician opens it, so the library code (IndexedDB, CSV import) is not part of the
 * page's first load.
 */
import { LibraryProvider, LibraryScreen, SaveEvidence, useLibrary } from '@/app/components/library';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { ExposureDefinition } from '@/lib/glycaemia/exposure';
import type { Effect, Wording } from '@/lib/scenario/schema';
import type { PopulationTable } from '@/lib/tables/schema';

export interface CurrentEvidence {
  readonly effect: Effect;
  readonly wording?: Wording | undefined;
  readonly exposureDefinition?: ExposureDefinition | undefined;
  readonly illustrative: boolean;
}

export interface LibraryPanelProps {
  readonly onUseTable: (table: PopulationTable) => void;
  readonly onUseEvidence: (entry: EvidenceEntry) => void;
  readonly selectedTableId?: string | undefined;
  readonly selectedEvidenceId?: string | undefined;
  /** The evidence now on screen, when it is valid: offered for saving. */
  readonly current?: CurrentEvidence | undefined;
}

function Panels({ onUseTable, onUseEvidence, selectedTableId, selectedEvidenceId, current }: LibraryPanelProps) {
  const { library } = useLibrary();
  async function takeTable(id: string) {
    if (!library) return;
    const got = await library.getTable(id);
    if (got.ok) onUseTable(got.value.table);
  }
  return (
    <>
      {current ? (
        <div className="library-save">
          <h3>Save the evidence on screen</h3>
          <SaveEvidence
            effect={current.effect}
            wording={current.wording}
            exposureDefinition={current.exposureDefinition}
            illustrative={current.illustrative}
          />
        </div>
      ) : null}
      <LibraryScreen
        withProvider={false}
        headingLevel={3}
        onUseTable={(id) => void takeTable(id)}
        onUseEvidence={onUseEvidence}
        selectedTableId={selectedTableId}
        selectedEvidenceId={selectedEvidenceId}
      />
    </>
  );
}

export function LibraryPanel(props: LibraryPanelProps) {
  return (
    <LibraryProvider>
      <Panels {...props} />
    </LibraryProvider>
  );
}

export default LibraryPanel;
