'use client';
/**
 * Two optional parts of the consultation, each opened by a button and loaded only then:
 * the person's glucose history (app/components/glucose/GlucoseSection.tsx, re-exported here) and
 * the clinic library (app/components/library). Neither is needed for a result, so neither weighs
 * on the page's first load.
 */
import { lazy, Suspense, useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import type { EvidenceEntry } from '@/lib/evidence/schema';
import type { PopulationTable } from '@/lib/tables/schema';
import type { Result } from '@/lib/result';
import type { ConsultationFormValues, FormFigures } from '@/lib/consultation/formValues';

const LibraryPanel = lazy(() => import('./LibraryPanel'));

function Loading({ what }: { what: string }) {
  return <p className="charts__loading">Loading {what}…</p>;
}

export { GlucoseSection } from '@/app/components/glucose/GlucoseSection';

interface LibrarySectionProps {
  readonly tables: readonly PopulationTable[];
  readonly entries: readonly EvidenceEntry[];
  readonly onUseTable: (table: PopulationTable) => void;
  readonly onUseEvidence: (entry: EvidenceEntry) => void;
  /** The figures on screen (./pipeline.ts), computed once by the screen. */
  readonly figures: Result<FormFigures>;
}

function OpenLibrary({ entries, onUseTable, onUseEvidence, figures }: LibrarySectionProps) {
  const { control } = useFormContext<ConsultationFormValues>();
  const [tableId, evidenceId] = useWatch({ control, name: ['tableId', 'evidenceId'] });
  const entry = entries.find((e) => e.id === evidenceId);
  const current =
    figures.ok && figures.value.wordsNeeded.length === 0
    ? {
        effect: figures.value.scenario.effect,
        wording: figures.value.scenario.wording,
        exposureDefinition: figures.value.scenario.exposureDefinition,
        illustrative: entry?.illustrative === true,
      }
    : undefined;
  return (
    <Suspense fallback={<Loading what="the library" />}>
      <LibraryPanel
        onUseTable={onUseTable}
        onUseEvidence={onUseEvidence}
        selectedTableId={tableId}
        selectedEvidenceId={entry?.id}
        current={current}
      />
    </Suspense>
  );
}

export function LibrarySection(props: LibrarySectionProps) {
  const [open, setOpen] = useState(false);
  return (
    <section className="section optional" aria-labelledby="library-heading" data-testid="library-section">
      <h2 id="library-heading" className="section__title">
        Clinic library
      </h2>
      {/* Once open, the library says this itself, with more detail. */}
      {open ? null : <p className="field__hint">Population tables and evidence entries saved in this browser only; nothing is sent anywhere.</p>}
      <button type="button" className="button button--secondary" aria-expanded={open} onClick={() => setOpen(!open)}>
        {open ? 'Close the library' : 'Open the library'}
      </button>
      {open ? <OpenLibrary {...props} /> : null}
    </section>
  );
}
