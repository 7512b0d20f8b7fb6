'use client';
/**
 * The /handout screen: the editor (paper size, editable blocks with live reading grade,
 * clinic details, templates, print) beside the printable sheet. The scenario arrives in the
 * URL query through the link codec (lib/link), so any `hundredfold link` query works here.
 * Nothing is sent anywhere: templates stay in this browser's storage.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import Link from 'next/link';
import { loadHistoryForHandout } from '@/app/handout/historyHandOver';
import { useTemplates } from '@/app/handout/useTemplates';
import { downloadText } from '@/app/components/library/download';
import {
  DEFAULT_BLOCKS,
  HANDOUT_AUDIENCE_KEYS,
  HANDOUT_AUDIENCES,
  HANDOUT_BLOCK_KEYS,
  HANDOUT_LAYOUT_KEYS,
  HANDOUT_LAYOUTS,
  handoutPageView,
  PAPER_SIZE_KEYS,
  PAPER_SIZES,
  requestedTableId,
  type Clinic,
  type HandoutAudience,
  type HandoutBlocks,
  type HandoutLayout,
  type PaperSize,
} from '@/lib/handout';
import { findDemoTable } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';
import { BlockEditor } from './BlockEditor';
import { HandoutSheet } from './HandoutSheet';
import { TemplatePanel } from './TemplatePanel';

export interface HandoutScreenProps {
  /** The scenario link's fragment, "#br=0.08&…" (or empty); an old query "?br=…" is read too. */
  readonly query: string;
}

/**
 * A population table the clinic saved in this browser, looked up by id when the scenario names
 * one that is not a demo table, so the handout can say where the baseline came from. Undefined
 * while it loads or when there is none; the handout's numbers never depend on it.
 */
function useLibraryTable(tableId: string | undefined): PopulationTable | undefined {
  const [found, setFound] = useState<{ id: string; table: PopulationTable } | undefined>(undefined);
  useEffect(() => {
    if (tableId === undefined || findDemoTable(tableId) !== undefined) return;
    let live = true;
    void import('@/app/storage/library').then(async ({ openLibrary }) => {
      const opened = await openLibrary();
      if (!opened.ok || !live) return;
      const got = await opened.value.getTable(tableId);
      if (got.ok && live) setFound({ id: tableId, table: got.value.table });
    });
    return () => {
      live = false;
    };
  }, [tableId]);
  return found !== undefined && found.id === tableId ? found.table : undefined;
}

/** Millimetres to CSS pixels (CSS Values 4: 1in = 96px = 25.4mm). */
const PX_PER_MM = 96 / 25.4;

export function HandoutScreen({ query }: HandoutScreenProps) {
  const [blocks, setBlocks] = useState<HandoutBlocks>(DEFAULT_BLOCKS);
  const [clinic, setClinic] = useState<Clinic>({});
  const [paper, setPaper] = useState<PaperSize>('a4');
  const [layout, setLayout] = useState<HandoutLayout>('standard');
  const [audience, setAudience] = useState<HandoutAudience>('person');
  const [includeHistory, setIncludeHistory] = useState(true);
  const [storedHistory, setStoredHistory] = useState<string | null>(null);
  const templates = useTemplates();
  const [today] = useState(() => new Date());

  const libraryTable = useLibraryTable(useMemo(() => requestedTableId(query), [query]));
  const view = useMemo(
    () =>
      handoutPageView(
        query,
        { blocks, clinic },
        { date: today, paper, layout, audience, tableFor: (id) => findDemoTable(id) ?? (libraryTable?.id === id ? libraryTable : undefined), storedHistory, includeHistory },
      ),
    [query, blocks, clinic, today, paper, layout, audience, libraryTable, storedHistory, includeHistory],
  );
  const sheet = view.kind === 'sheet' ? view.sheet : undefined;

  // Does the sheet fit one page? The preview is laid out at the paper's printable width, so its
  // height (less the data table, which print hides) against the printable height says so.
  const frameRef = useRef<HTMLDivElement>(null);
  const [overflows, setOverflows] = useState(false);
  const printableHeightMm = sheet?.paper.printableHeightMm;
  useEffect(() => {
    const frame = frameRef.current;
    const element = frame?.querySelector<HTMLElement>('.sheet');
    if (!frame || !element || printableHeightMm === undefined || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      const table = element.querySelector<HTMLElement>('.sheet__table');
      const printed = element.getBoundingClientRect().height - (table ? table.getBoundingClientRect().height : 0);
      setOverflows(printed > printableHeightMm * PX_PER_MM);
    };
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, [printableHeightMm, view]);

  useEffect(() => {
    // Browser storage is only there after the first render (not on the server).
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setStoredHistory(loadHistoryForHandout());
  }, []);

  if (view.kind === 'problem') {
    const { problem } = view;
    return (
      <main className="handout-page">
        <div className="controls" data-testid="handout-problem" data-problem={problem.kind}>
          <h1>Handout</h1>
          <div role="alert" className="controls__issues">
            <p>{problem.heading}</p>
            <ul>
              {problem.details.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </div>
          <p>{problem.whatToDo}</p>
          <p>
            <Link href={view.backHref}>Back to the consultation screen</Link>
          </p>
        </div>
      </main>
    );
  }

  const { sheet: s, history } = view;
  const setBlock = (key: keyof HandoutBlocks) => (value: string) => setBlocks((b) => ({ ...b, [key]: value }));

  return (
    <main className="handout-page">
      <style>{s.paper.pageRule}</style>
      <div className="controls" data-testid="handout-controls">
        <h1>Prepare the handout</h1>
        <p className="controls__hint">
          Edit the title, opening words and next steps. The numbers and the caution come from the result and cannot be edited. Do not type
          the patient&rsquo;s name or any detail that identifies them.
        </p>
        <p>
          <Link href={view.backHref}>Back to the consultation screen</Link>
        </p>

        <fieldset className="controls__paper">
          <legend>Paper size</legend>
          {PAPER_SIZE_KEYS.map((key) => (
            <label key={key} className="controls__radio">
              <input type="radio" name="paper" value={key} checked={paper === key} onChange={() => setPaper(key)} />
              {PAPER_SIZES[key].label}
            </label>
          ))}
        </fieldset>
        <fieldset>
          <legend>Who it is for</legend>
          {HANDOUT_AUDIENCE_KEYS.map((key) => (
            <label key={key} className="controls__radio controls__radio--block">
              <input type="radio" name="audience" value={key} checked={audience === key} onChange={() => setAudience(key)} />
              {HANDOUT_AUDIENCES[key].label}
            </label>
          ))}
        </fieldset>
        <fieldset>
          <legend>Pictures</legend>
          {HANDOUT_LAYOUT_KEYS.map((key) => (
            <label key={key} className="controls__radio controls__radio--block">
              <input type="radio" name="layout" value={key} checked={layout === key} onChange={() => setLayout(key)} />
              {HANDOUT_LAYOUTS[key].label}
            </label>
          ))}
        </fieldset>
        {history.state !== 'none' ? (
          <fieldset>
            <legend>The person&rsquo;s own results</legend>
            <p className="controls__hint" role="status">
              {history.message}
            </p>
            {history.state === 'available' ? (
              <label className="controls__radio controls__radio--block">
                <input type="checkbox" checked={includeHistory} disabled={audience === 'group'} onChange={(e) => setIncludeHistory(e.target.checked)} />
                Print them on the handout{audience === 'group' ? ' (not on a group session\u2019s sheet)' : ''}
              </label>
            ) : null}
          </fieldset>
        ) : null}
        <p>
          <button type="button" className="controls__print" onClick={() => window.print()}>
            Print or save as PDF
          </button>
        </p>
        <p className="block-editor__warn" aria-live="polite">
          {s.paper.fitWarning ?? (overflows ? s.paper.overflowWarning : '')}
        </p>

        <fieldset>
          <legend>Text you can edit</legend>
          {HANDOUT_BLOCK_KEYS.map((key) => (
            <BlockEditor key={key} blockKey={key} value={blocks[key]} grade={s.readability.blocks.find((g) => g.key === key)} onChange={setBlock(key)} />
          ))}
          {s.titleWarning ? (
            <p className="block-editor__warn" role="status">
              {s.titleWarning}
            </p>
          ) : null}
          <p className="controls__status" aria-live="polite">
            {s.readability.whole}
          </p>
        </fieldset>
        <fieldset>
          <legend>Clinic details (optional)</legend>
          <div className="block-editor">
            <label htmlFor="clinic-name" className="block-editor__label">
              Clinic name
            </label>
            <input id="clinic-name" type="text" maxLength={120} value={clinic.name ?? ''} onChange={(e) => setClinic((c) => ({ ...c, name: e.target.value }))} />
          </div>
          <div className="block-editor">
            <label htmlFor="clinic-contact" className="block-editor__label">
              Clinic contact
            </label>
            <input
              id="clinic-contact"
              type="text"
              maxLength={200}
              value={clinic.contact ?? ''}
              onChange={(e) => setClinic((c) => ({ ...c, contact: e.target.value }))}
            />
          </div>
        </fieldset>

        <TemplatePanel
          templates={templates.templates}
          loadIssues={templates.loadIssues}
          ready={templates.ready}
          onUse={(record) => {
            setBlocks(record.template.blocks);
            setClinic(record.template.clinic);
            return templates.use(record);
          }}
          onSave={(name) => templates.save(name, blocks, clinic)}
          onRename={(id, to) => templates.rename(id, to)}
          onDelete={(record) => templates.remove(record)}
          onExport={async () => {
            const { text, ...outcome } = await templates.exportFile();
            if (text !== undefined) downloadText('hundredfold-handout-templates.json', text, 'application/json');
            return outcome;
          }}
          onImport={(text) => templates.importFile(text)}
        />

        {s.clinicianNotes.items.length > 0 ? (
          <section className="controls__warnings" aria-labelledby="clinician-notes">
            <h2 id="clinician-notes">{s.clinicianNotes.heading}</h2>
            <ul>
              {s.clinicianNotes.items.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </section>
        ) : null}
      </div>

      <div ref={frameRef} className={`sheet-frame sheet-frame--${paper}`} data-paper={paper}>
        <HandoutSheet sheet={s} />
      </div>
    </main>
  );
}
