'use client';
/**
 * The clinic's library on one panel: population tables (import, list, view, rename, export,
 * delete) and evidence entries (find, use, edit, delete, export, import). Wraps itself in a
 * {@link LibraryProvider} unless `withProvider` is false (when the page already has one).
 *
 * Props:
 * - onUseTable(id), onUseEvidence(entry): picking from the library;
 * - selectedTableId, selectedEvidenceId: marked "in use";
 * - withProvider: default true;
 * - headingLevel: 2 (default) or 3, for where it is embedded.
 */
import type { EvidenceEntry } from '@/lib/evidence/schema';
import { LibraryProvider, LibraryStatus } from './LibraryContext';
import { TableImport } from './TableImport';
import { TableList } from './TableList';
import { EvidenceLibrary } from './EvidenceLibrary';
import './library.css';

export interface LibraryScreenProps {
  readonly onUseTable?: ((id: string) => void) | undefined;
  readonly onUseEvidence?: ((entry: EvidenceEntry) => void) | undefined;
  readonly selectedTableId?: string | undefined;
  readonly selectedEvidenceId?: string | undefined;
  readonly withProvider?: boolean;
  readonly headingLevel?: 2 | 3;
}

export function LibraryScreen({ withProvider = true, ...props }: LibraryScreenProps) {
  const body = <LibraryPanels {...props} />;
  return withProvider ? <LibraryProvider>{body}</LibraryProvider> : body;
}

function LibraryPanels({ onUseTable, onUseEvidence, selectedTableId, selectedEvidenceId, headingLevel = 2 }: Omit<LibraryScreenProps, 'withProvider'>) {
  const H = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <div className="library">
      <p className="library__note">
        Kept in this browser only: nothing is sent anywhere. Export a copy to move it to another computer or keep it safe.
      </p>
      <LibraryStatus />
      <section aria-labelledby="library-tables">
        <H id="library-tables">Population tables</H>
        {/* Saving a table never switches the consultation to it; the clinician asks for that. */}
        <TableImport onUse={onUseTable ? (t) => onUseTable(t.table.id) : undefined} headingLevel={headingLevel === 2 ? 3 : 4} />
        <TableList onUse={onUseTable} selectedId={selectedTableId} />
      </section>
      <section aria-labelledby="library-evidence">
        <H id="library-evidence">Evidence entries</H>
        <EvidenceLibrary onUse={onUseEvidence} selectedId={selectedEvidenceId} />
      </section>
    </div>
  );
}
