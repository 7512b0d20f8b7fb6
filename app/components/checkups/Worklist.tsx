'use client';
/**
 * The worklist: one row per worker, virtualized (@tanstack/react-virtual), sortable and
 * filterable; rows from lib/checkups. Filtering and sorting read the worklist's columns
 * (lib/checkups/worklistColumns.ts: the worker's, or made here for a short list of plain rows)
 * and each column's order (the worker's, or made here from the ranks), and give the positions of
 * the rows shown; only the rows on screen are read (a long list's rows are made from the packed
 * results when first read). A sort asked for before the worker's ranks arrive is applied when
 * they do. Every row has the same height, so the virtualizer never measures one. When the screen
 * asks for them, each row also has a tick box (choose the worker for batch handouts; "Tick all
 * shown" and "Clear the ticks" above the table, the count announced) and an "Open" button (the
 * worker in the consultation screen).
 */
import { Fragment, useEffect, useMemo, useRef, useState } from 'react';
import { useVirtualizer } from '@tanstack/react-virtual';
import { STATUS_LABELS, WORKLIST_COLUMNS, type WorklistColumn, type WorklistRow, type WorklistSort } from '@/lib/checkups/worklist';
import { columnRanks, sortedOrder, worklistRanks, type WorklistRanks } from '@/lib/checkups/worklistOrder';
import { arrangeColumns, columnsFilterChoices, columnsOfRows, worklistColumnsOf } from '@/lib/checkups/worklistColumns';
import type { FilterChoices } from './protocol';
import { afterNextPaint } from './afterNextPaint';
import './worklist.css';
import { WORKER_STATUSES, type WorkerStatus } from '@/lib/workforce';

/**
 * Every row's height, px, at the browser's default text size (one line, with a 44 px tick box and
 * button); the first row shown is measured once and, if the text size makes it differ, this is
 * corrected for all rows at once. The virtualizer never measures rows one by one (each such
 * measurement made it go over every row again).
 */
const ROW_HEIGHT = 62.6;

export interface WorklistProps {
  readonly rows: readonly WorklistRow[];
  /** Ticked rows, by `row.index`; with {@link onSelect}, each row gets a tick box. */
  readonly selected?: ReadonlySet<number>;
  readonly onSelect?: (indices: readonly number[], ticked: boolean) => void;
  /** With {@link canOpen}, each row the worker can be opened for gets an "Open" button. */
  readonly onOpen?: (row: WorklistRow) => void;
  readonly canOpen?: (row: WorklistRow) => boolean;
  /** The filters' choices, from the checkups worker (worked out off the page); without them the list works them out itself. */
  readonly choices?: FilterChoices | null;
  /** Each column's sort ranks, from the checkups worker; without them a short list of plain rows ranks itself, and a packed list waits for them to sort. */
  readonly ranks?: WorklistRanks | null;
}

/**
 * The list goes on screen in three steps, each after the last was painted, so none holds up the
 * page for long: its heading (with whatever is shown beside it, e.g. batch handouts), then its
 * filters, count and table head (the rows' order worked out), then its rows.
 */
export function Worklist(props: WorklistProps) {
  const [ready, setReady] = useState(false);
  useEffect(() => (ready ? undefined : afterNextPaint(() => setReady(true))), [ready]);
  return (
    <section aria-labelledby="worklist-heading" className="checkups__section">
      <h2 id="worklist-heading">Worklist</h2>
      {ready ? <WorklistBody {...props} /> : null}
    </section>
  );
}

function WorklistBody({ rows, selected, onSelect, onOpen, canOpen, choices: given, ranks }: WorklistProps) {
  const [status, setStatus] = useState<WorkerStatus | ''>('');
  const [category, setCategory] = useState('');
  const [stratum, setStratum] = useState('');
  const [sort, setSort] = useState<WorklistSort | null>(null);
  // The worker's columns for its packed rows; plain rows (a short list) get theirs made here.
  const packed = columnsOfRows(rows);
  const columns = useMemo(() => packed ?? worklistColumnsOf(rows), [packed, rows]);
  const choices = useMemo(() => given ?? columnsFilterChoices(columns), [given, columns]);
  const knownRanks = useMemo(() => ranks ?? (packed ? null : worklistRanks(rows)), [ranks, packed, rows]);
  // The sort on screen: the one asked for once its column's ranks are known (file order until then).
  const sortRanks = sort ? columnRanks(knownRanks, sort.column, rows.length) : null;
  const applied = sort && sortRanks ? sort : null;
  const order = useMemo(() => (applied && sortRanks ? sortedOrder(sortRanks, applied.direction) : null), [applied, sortRanks]);
  const shown = useMemo(() => {
    const [name, value] = stratum === '' ? [] : stratum.split('\u0000');
    return arrangeColumns(columns, { status: status || null, category: category || null, stratum: name !== undefined && value !== undefined ? { name, value } : null }, order);
  }, [columns, status, category, stratum, order]);
  const scrollRef = useRef<HTMLDivElement>(null);
  // The rows go in a step after the rest of the list is on screen (the virtualizer's first pass reads every row's place).
  const [bodyReady, setBodyReady] = useState(false);
  useEffect(() => (bodyReady ? undefined : afterNextPaint(() => setBodyReady(true))), [bodyReady]);
  const [rowHeight, setRowHeight] = useState(ROW_HEIGHT);
  const rowMeasured = useRef(false);
  // eslint-disable-next-line react-hooks/incompatible-library -- the virtualizer is read fresh on every render; nothing memoizes it
  const virtualizer = useVirtualizer({ count: bodyReady ? shown.length : 0, getScrollElement: () => scrollRef.current, estimateSize: () => rowHeight, overscan: 10 });
  // Once: the first row shown gives every row's height (they are all one line high).
  const noRows = shown.length === 0;
  useEffect(() => {
    if (rowMeasured.current) return;
    const first = scrollRef.current?.querySelector('tbody tr[data-worker]');
    if (!first) return;
    rowMeasured.current = true;
    const height = first.getBoundingClientRect().height;
    if (height > 0 && Math.abs(height - rowHeight) >= 0.5) {
      setRowHeight(height);
      virtualizer.measure();
    }
  }, [bodyReady, noRows, rowHeight, virtualizer]);

  const sortBy = (column: WorklistColumn) =>
    setSort((s) => (s && s.column === column ? { column, direction: s.direction === 'ascending' ? 'descending' : 'ascending' } : { column, direction: 'ascending' }));

  const selecting = selected !== undefined && onSelect !== undefined;
  const opening = onOpen !== undefined;
  const columnCount = WORKLIST_COLUMNS.length + (selecting ? 1 : 0) + (opening ? 1 : 0);
  const tickedShown = useMemo(() => (selecting && selected.size > 0 ? shown.reduce((n, i) => n + (selected.has(i) ? 1 : 0), 0) : 0), [selecting, shown, selected]);

  const items = virtualizer.getVirtualItems();
  const before = items[0]?.start ?? 0;
  const after = virtualizer.getTotalSize() - (items[items.length - 1]?.end ?? 0);

  return (
    <>
      <div className="checkups__grid">
        <label>
          Status
          <select value={status} onChange={(e) => setStatus(e.target.value as WorkerStatus | '')}>
            <option value="">all</option>
            {WORKER_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <label>
          Latest category
          <select value={category} onChange={(e) => setCategory(e.target.value)}>
            <option value="">all</option>
            {choices.categories.map((c) => (
              <option key={c}>{c}</option>
            ))}
          </select>
        </label>
        <label>
          Group
          <select value={stratum} onChange={(e) => setStratum(e.target.value)}>
            <option value="">all</option>
            {choices.strata.map((s) => (
              <option key={`${s.name}\u0000${s.value}`} value={`${s.name}\u0000${s.value}`}>
                {s.name}: {s.value}
              </option>
            ))}
          </select>
        </label>
      </div>
      <p aria-live="polite" data-testid="worklist-count">
        {shown.length} of {rows.length} workers shown
      </p>
      {selecting ? (
        <div className="checkups__actions">
          <button type="button" onClick={() => onSelect(Array.from(shown), true)} disabled={shown.length === 0 || tickedShown === shown.length}>
            Tick all shown
          </button>
          <button type="button" onClick={() => onSelect([...selected], false)} disabled={selected.size === 0}>
            Clear the ticks
          </button>
          <p role="status" data-testid="worklist-ticked" className="checkups__inline-status">
            {selected.size === 1 ? '1 worker ticked' : `${selected.size} workers ticked`}
          </p>
        </div>
      ) : null}
      <div ref={scrollRef} className="checkups__worklist" tabIndex={0} role="region" aria-labelledby="worklist-heading">
        <table className="checkups__table" aria-rowcount={shown.length + 1} data-testid="worklist" data-order={applied ? `${applied.column}-${applied.direction}` : 'file'} data-ranked={ranks ? 'true' : 'false'}>
          <thead>
            <tr aria-rowindex={1}>
              {selecting ? <th scope="col">Tick</th> : null}
              {WORKLIST_COLUMNS.map((c) => (
                <Fragment key={c.key}>
                  <th scope="col" aria-sort={applied?.column === c.key ? applied.direction : 'none'}>
                    <button type="button" onClick={() => sortBy(c.key)}>
                      {c.label}
                    </button>
                  </th>
                  {c.key === 'worker' && opening ? <th scope="col">Consultation</th> : null}
                </Fragment>
              ))}
            </tr>
          </thead>
          <tbody>
            {before > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={columnCount} style={{ height: before, padding: 0 }} />
              </tr>
            ) : null}
            {items.map((item) => {
              const at = shown[item.index];
              const row = at === undefined ? undefined : rows[at];
              if (!row) return null;
              return (
                <tr key={row.index} aria-rowindex={item.index + 2} data-status={row.status} data-worker={row.worker} style={{ height: rowHeight }}>
                  {selecting ? (
                    <td>
                      <input
                        type="checkbox"
                        className="checkups__tick"
                        aria-label={`Tick ${row.worker}`}
                        checked={selected.has(row.index)}
                        onChange={(e) => onSelect([row.index], e.target.checked)}
                      />
                    </td>
                  ) : null}
                  {WORKLIST_COLUMNS.map((c) =>
                    c.key === 'worker' ? (
                      <Fragment key={c.key}>
                        <th scope="row">{row.cells.worker}</th>
                        {opening ? (
                          <td>
                            {canOpen === undefined || canOpen(row) ? (
                              <button type="button" aria-label={`Open ${row.worker} in the consultation screen (new tab)`} onClick={() => onOpen(row)}>
                                Open
                              </button>
                            ) : (
                              <span>no figures</span>
                            )}
                          </td>
                        ) : null}
                      </Fragment>
                    ) : (
                      <td key={c.key} className={c.key === 'notes' ? 'checkups__notes' : undefined} data-column={c.key}>
                        {row.cells[c.key]}
                      </td>
                    ),
                  )}
                </tr>
              );
            })}
            {after > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={columnCount} style={{ height: after, padding: 0 }} />
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </>
  );
}
