'use client';
/**
 * The /handout screen: the editor (paper size, editable blocks with live reading grade,
 * clinic details, templates, print) beside the printable sheet. The scenario arrives in the
 * URL query through the link codec (lib/link), so any `hundredfold link` query works here.
 * Nothing is sent anywhere: templates stay in this browser's storage.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import Link from 'next/link';
import { createTemplateStore, type TemplateStore } from '@/app/handout/templateStore';
import {
  blockReadability,
  buildHandout,
  DEFAULT_BLOCKS,
  HANDOUT_BLOCK_KEYS,
  PAGE_MARGIN_MM,
  pageRule,
  PAPER_SIZE_KEYS,
  PAPER_SIZES,
  type Clinic,
  type HandoutBlocks,
  type HandoutTemplate,
  type PaperSize,
} from '@/lib/handout';
import { decodeScenarioQuery } from '@/lib/link';
import { MAX_GRADE, readability } from '@/lib/readability';
import type { Issue } from '@/lib/result';
import { formatPath } from '@/lib/result';
import { findDemoTable } from '@/lib/tables/demo';
import type { PopulationTable } from '@/lib/tables/schema';
import { patientProse } from '@/lib/wording';
import { BlockEditor } from './BlockEditor';
import { HandoutSheet } from './HandoutSheet';
import { TemplatePanel } from './TemplatePanel';

export interface HandoutScreenProps {
  /** The scenario link's fragment, "#br=0.08&…" (or empty); an old query "?br=…" is read too. */
  readonly query: string;
}

function browserStore(): TemplateStore | undefined {
  try {
    return typeof window === 'undefined' ? undefined : createTemplateStore(window.localStorage);
  } catch {
    return undefined;
  }
}

function download(fileName: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  URL.revokeObjectURL(url);
}

function IssueList({ issues }: { issues: readonly Issue[] }) {
  return (
    <ul>
      {issues.map((issue, i) => (
        <li key={`${issue.code}-${i}`}>
          {issue.message}
          {issue.path.length > 0 ? ` (${formatPath(issue.path)})` : ''}
        </li>
      ))}
    </ul>
  );
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

export function HandoutScreen({ query }: HandoutScreenProps) {
  const [blocks, setBlocks] = useState<HandoutBlocks>(DEFAULT_BLOCKS);
  const [clinic, setClinic] = useState<Clinic>({});
  const [paper, setPaper] = useState<PaperSize>('a4');
  const [templates, setTemplates] = useState<readonly HandoutTemplate[]>([]);
  const [loadIssues, setLoadIssues] = useState<readonly Issue[]>([]);
  const [today] = useState(() => new Date());

  const decoded = useMemo(() => decodeScenarioQuery(query), [query]);
  const tableId = decoded.ok ? decoded.value.tableId : undefined;
  const libraryTable = useLibraryTable(tableId);
  const content = useMemo(() => {
    if (!decoded.ok) return decoded;
    const table = decoded.value.tableId ? (findDemoTable(decoded.value.tableId) ?? libraryTable) : undefined;
    return buildHandout(decoded.value, { table, date: today });
  }, [decoded, today, libraryTable]);
  const scores = useMemo(() => blockReadability(blocks), [blocks]);
  const wholeGrade = useMemo(() => {
    if (!content.ok) return undefined;
    const r = readability([blocks.title, blocks.opening, patientProse(content.value.text), blocks.nextSteps].join('\n'));
    return r.ok ? r.value.grade : undefined;
  }, [content, blocks]);

  // Does the sheet fit one page? The preview is laid out at the paper's printable width, so its
  // height (less the data table, which print hides) against the printable height says so.
  const frameRef = useRef<HTMLDivElement>(null);
  const [overflows, setOverflows] = useState(false);
  useEffect(() => {
    const frame = frameRef.current;
    const sheet = frame?.querySelector<HTMLElement>('.sheet');
    if (!frame || !sheet || typeof ResizeObserver === 'undefined') return;
    const pxPerMm = 96 / 25.4;
    const measure = () => {
      const table = sheet.querySelector<HTMLElement>('.sheet__table');
      const printed = sheet.getBoundingClientRect().height - (table ? table.getBoundingClientRect().height : 0);
      const available = (PAPER_SIZES[paper].heightMm - 2 * PAGE_MARGIN_MM) * pxPerMm;
      setOverflows(printed > available);
    };
    const observer = new ResizeObserver(measure);
    observer.observe(sheet);
    return () => observer.disconnect();
  }, [paper, content]);

  useEffect(() => {
    const store = browserStore();
    if (!store) return;
    const loaded = store.load();
    // Reading browser storage can only happen after the first render (it is not there on the server).
    // eslint-disable-next-line react-hooks/set-state-in-effect
    if (loaded.ok) setTemplates(loaded.value);
    else setLoadIssues(loaded.issues);
  }, []);

  function withStore<T>(run: (store: TemplateStore) => { message?: string; issues?: readonly Issue[]; list?: readonly HandoutTemplate[] } & T) {
    const store = browserStore();
    if (!store) return { issues: [{ code: 'storage-unavailable', path: [], message: 'This browser does not allow saved templates here' }] };
    const outcome = run(store);
    if (outcome.list) setTemplates(outcome.list);
    return outcome;
  }

  const backHref = `/${query.startsWith('#') ? query : query ? `#${query.replace(/^\?/, '')}` : ''}`;

  if (!content.ok) {
    return (
      <main className="handout-page">
        <div className="controls">
          <h1>Handout</h1>
          <div role="alert" className="controls__issues">
            <p>The handout cannot be made from this link:</p>
            <IssueList issues={content.issues} />
          </div>
          <p>
            <Link href={backHref}>Back to the consultation screen</Link> to fill in what is missing.
          </p>
        </div>
      </main>
    );
  }

  const setBlock = (key: keyof HandoutBlocks) => (value: string) => setBlocks((b) => ({ ...b, [key]: value }));
  const titleEmpty = blocks.title.trim().length === 0;

  return (
    <main className="handout-page">
      <style>{`${pageRule(paper)}`}</style>
      <div className="controls" data-testid="handout-controls">
        <h1>Prepare the handout</h1>
        <p className="controls__hint">
          Edit the title, opening words and next steps. The numbers and the caution come from the result and cannot be edited. Do not type
          the patient&rsquo;s name or any detail that identifies them.
        </p>
        <p>
          <Link href={backHref}>Back to the consultation screen</Link>
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
        <p>
          <button type="button" className="controls__print" onClick={() => window.print()}>
            Print or save as PDF
          </button>
        </p>
        <p className="block-editor__warn" aria-live="polite">
          {overflows ? `The handout may run onto a second ${PAPER_SIZES[paper].label} page: shorten the opening words or the next steps.` : ''}
        </p>

        <fieldset>
          <legend>Text you can edit</legend>
          {HANDOUT_BLOCK_KEYS.map((key) => (
            <BlockEditor key={key} blockKey={key} value={blocks[key]} score={scores.find((s) => s.key === key)} onChange={setBlock(key)} />
          ))}
          {titleEmpty ? (
            <p className="block-editor__warn" role="status">
              The title is empty: the page prints without one.
            </p>
          ) : null}
          <p className="controls__status" aria-live="polite">
            {wholeGrade === undefined
              ? ''
              : `Whole handout: reading grade ${wholeGrade.toFixed(1)}${wholeGrade > MAX_GRADE ? `, above ${MAX_GRADE}` : ''}.`}
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
          templates={templates}
          loadIssues={loadIssues}
          onUse={(t) => {
            setBlocks(t.blocks);
            setClinic(t.clinic);
            return `Using the template "${t.name}".`;
          }}
          onSave={(name) =>
            withStore((store) => {
              const r = store.save({ name, blocks, clinic });
              return r.ok ? { list: r.value, message: `Saved the template "${name.trim()}".` } : { issues: r.issues };
            })
          }
          onRename={(from, to) =>
            withStore((store) => {
              const r = store.rename(from, to);
              return r.ok ? { list: r.value, message: `Renamed "${from}" to "${to.trim()}".` } : { issues: r.issues };
            })
          }
          onDelete={(name) =>
            withStore((store) => {
              const r = store.remove(name);
              return r.ok ? { list: r.value, message: `Deleted the template "${name}".` } : { issues: r.issues };
            })
          }
          onExport={() =>
            withStore((store) => {
              const r = store.exportFile();
              if (!r.ok) return { issues: r.issues };
              download('hundredfold-handout-templates.json', r.value);
              return { message: 'Exported the saved templates as a JSON file.' };
            })
          }
          onImport={(text) =>
            withStore((store) => {
              const r = store.importFile(text);
              if (!r.ok) return { issues: r.issues, message: 'The file was not imported; nothing saved was changed.' };
              const renamed = r.value.renamed.map((n) => ` "${n.from}" was saved as "${n.to}" because the name was taken.`).join('');
              return { list: r.value.templates, message: `Imported ${r.value.added.length} template${r.value.added.length === 1 ? '' : 's'}.${renamed}` };
            })
          }
        />

        {content.value.clinicianWarnings.length > 0 ? (
          <section className="controls__warnings" aria-labelledby="clinician-notes">
            <h2 id="clinician-notes">Notes for the clinician (not printed)</h2>
            <ul>
              {content.value.clinicianWarnings.map((w) => (
                <li key={w.code}>{w.message}</li>
              ))}
            </ul>
          </section>
        ) : null}
      </div>

      <div ref={frameRef} className={`sheet-frame sheet-frame--${paper}`} data-paper={paper}>
        <HandoutSheet content={content.value} blocks={blocks} clinic={clinic} />
      </div>
    </main>
  );
}
