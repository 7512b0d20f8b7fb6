import { describe, expect, it } from 'vitest';
import { DEMO_EVIDENCE } from '../../../lib/evidence/demo';
import { DEMO_TABLES } from '../../../lib/tables/demo';
import type { EvidenceEntry } from '../../../lib/evidence/schema';
import { NO_EXPOSURE_DEFINITION, setupView, type SetupInput } from '../../../lib/checkups/setup';

const demoEntry = DEMO_EVIDENCE[0]!;
/** A clinic's own entry: the first demo entry's numbers under another id and title (illustrative test data). */
const saved: EvidenceEntry = { ...demoEntry, id: 'clinic-hba1c-hf', title: 'Our HbA1c and heart failure entry', illustrative: false };
const { exposureDefinition: _dropped, ...withoutDefinition } = { ...saved, id: 'clinic-no-definition', title: 'Entry without a definition' };
const noDefinition: EvidenceEntry = withoutDefinition;
const demoTables = DEMO_TABLES.map((t) => ({ id: t.id, title: t.title, illustrative: t.illustrative }));

function input(over: Partial<SetupInput> = {}): SetupInput {
  return { demoEvidence: DEMO_EVIDENCE, libraryEvidence: [], demoTables, libraryTables: [], evidenceId: demoEntry.id, tableId: 'demo-heart-failure-10y', ...over };
}

describe('checkups set-up view', () => {
  it('lists the demo entries and tables as illustrative, and nothing else when the library is empty', () => {
    const view = setupView(input());
    expect(view.evidenceGroups.map((g) => g.label)).toEqual(['Demo entries (illustrative)']);
    expect(view.evidenceGroups[0]!.options.map((o) => o.id)).toEqual(DEMO_EVIDENCE.map((e) => e.id));
    expect(view.tableGroups.map((g) => g.label)).toEqual(['Demo tables (illustrative)']);
    expect(view.ready).toBe(true);
    expect(view.evidenceProblem).toBeNull();
  });

  it('lists the library’s entries and tables beside the demo ones', () => {
    const view = setupView(input({ libraryEvidence: [saved, noDefinition], libraryTables: [{ id: 'clinic-table', title: 'Our table', illustrative: false }] }));
    expect(view.evidenceGroups[1]).toEqual({
      label: 'Saved in this browser',
      options: [
        { id: 'clinic-hba1c-hf', label: 'Our HbA1c and heart failure entry', source: 'library', illustrative: false, usable: true },
        { id: 'clinic-no-definition', label: 'Entry without a definition (no exposure definition)', source: 'library', illustrative: false, usable: false },
      ],
    });
    expect(view.tableGroups[1]!.options).toEqual([{ id: 'clinic-table', label: 'Our table', source: 'library', illustrative: false }]);
  });

  it('marks a saved illustrative record whose title does not say so', () => {
    const view = setupView(input({ libraryTables: [{ id: 'practice', title: 'Practice table', illustrative: true }] }));
    expect(view.tableGroups[1]!.options[0]!.label).toBe('Practice table (illustrative)');
  });

  it('says in one sentence that an entry without an exposure definition cannot be used, and is not ready', () => {
    const view = setupView(input({ libraryEvidence: [noDefinition], evidenceId: 'clinic-no-definition' }));
    expect(view.evidenceProblem).toBe(NO_EXPOSURE_DEFINITION);
    expect(NO_EXPOSURE_DEFINITION.match(/\.\s/g)).toBeNull(); // one sentence
    expect(view.ready).toBe(false);
  });

  it('is not ready when the chosen entry or table is not in the lists (deleted in another tab)', () => {
    expect(setupView(input({ evidenceId: 'clinic-gone' })).ready).toBe(false);
    expect(setupView(input({ tableId: 'clinic-gone' })).ready).toBe(false);
    expect(setupView(input({ evidenceId: 'clinic-gone' })).evidenceProblem).toBeNull();
  });

  it('leaves out a saved record that has a demo record’s id', () => {
    const view = setupView(input({ libraryEvidence: [{ ...saved, id: demoEntry.id }] }));
    expect(view.evidenceGroups).toHaveLength(1);
  });

  it('gives the chosen entry’s and table’s whole option text (shown under the lists on a narrow screen), null when not listed', () => {
    const view = setupView(input({ libraryEvidence: [noDefinition], evidenceId: 'clinic-no-definition', libraryTables: [{ id: 'practice', title: 'Practice table', illustrative: true }], tableId: 'practice' }));
    expect(view.chosen).toEqual({ evidence: 'Entry without a definition (no exposure definition)', table: 'Practice table (illustrative)' });
    expect(setupView(input({ evidenceId: 'clinic-gone', tableId: 'clinic-gone' })).chosen).toEqual({ evidence: null, table: null });
  });
});
