'use client';
/** The worklist: one row per worker, virtualized (@tanstack/react-virtual), sortable and filterable; rows from lib/checkups. */
import { useMemo, useRef, useState } from 'react';
import { useVirtualizer } from '@tanstack/react-virtual';
import { STATUS_LABELS, WORKLIST_COLUMNS, worklistFilterChoices, type WorklistColumn, type WorklistRow, type WorklistSort } from '@/lib/checkups/worklist';
import { arrangeWithRanks, type WorklistRanks } from '@/lib/checkups/worklistOrder';
import type { FilterChoices } from './protocol';
import { WORKER_STATUSES, type WorkerStatus } from '@/lib/workforce';

const ROW_HEIGHT = 44;

/**
 * `choices` and `ranks` come from the checkups worker (worked out off the page); without them the
 * list works them out itself.
 */
export function Worklist({ rows, choices: given, ranks }: { rows: readonly WorklistRow[]; choices?: FilterChoices | null; ranks?: WorklistRanks | null }) {
  const [status, setStatus] = useState<WorkerStatus | ''>('');
  const [category, setCategory] = useState('');
  const [stratum, setStratum] = useState('');
  const [sort, setSort] = useState<WorklistSort | null>(null);
  const choices = useMemo(() => given ?? worklistFilterChoices(rows), [given, rows]);
  const shown = useMemo(() => {
    const [name, value] = stratum === '' ? [] : stratum.split('\u0000');
    return arrangeWithRanks(rows, { status: status || null, category: category || null, stratum: name !== undefined && value !== undefined ? { name, value } : null }, sort, ranks ?? null);
  }, [rows, status, category, stratum, sort, ranks]);
  const scrollRef = useRef<HTMLDivElement>(null);
  // eslint-disable-next-line react-hooks/incompatible-library -- the virtualizer is read fresh on every render; nothing memoizes it
  const virtualizer = useVirtualizer({ count: shown.length, getScrollElement: () => scrollRef.current, estimateSize: () => ROW_HEIGHT, overscan: 10 });

  const sortBy = (column: WorklistColumn) =>
    setSort((s) => (s && s.column === column ? { column, direction: s.direction === 'ascending' ? 'descending' : 'ascending' } : { column, direction: 'ascending' }));

  const items = virtualizer.getVirtualItems();
  const before = items[0]?.start ?? 0;
  const after = virtualizer.getTotalSize() - (items[items.length - 1]?.end ?? 0);

  return (
    <section aria-labelledby="worklist-heading" className="checkups__section">
      <h2 id="worklist-heading">Worklist</h2>
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
      <div ref={scrollRef} className="checkups__worklist" tabIndex={0} role="region" aria-labelledby="worklist-heading">
        <table className="checkups__table" aria-rowcount={shown.length + 1} data-testid="worklist" data-order={sort ? `${sort.column}-${sort.direction}` : 'file'} data-ranked={ranks ? 'true' : 'false'}>
          <thead>
            <tr aria-rowindex={1}>
              {WORKLIST_COLUMNS.map((c) => (
                <th key={c.key} scope="col" aria-sort={sort?.column === c.key ? sort.direction : 'none'}>
                  <button type="button" onClick={() => sortBy(c.key)}>
                    {c.label}
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {before > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={WORKLIST_COLUMNS.length} style={{ height: before, padding: 0 }} />
              </tr>
            ) : null}
            {items.map((item) => {
              const row = shown[item.index];
              if (!row) return null;
              return (
                <tr key={row.index} aria-rowindex={item.index + 2} data-status={row.status} style={{ height: ROW_HEIGHT }}>
                  {WORKLIST_COLUMNS.map((c) =>
                    c.key === 'worker' ? (
                      <th key={c.key} scope="row">
                        {row.cells.worker}
                      </th>
                    ) : (
                      <td key={c.key} className={c.key === 'notes' ? 'checkups__notes' : undefined}>
                        {row.cells[c.key]}
                      </td>
                    ),
                  )}
                </tr>
              );
            })}
            {after > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={WORKLIST_COLUMNS.length} style={{ height: after, padding: 0 }} />
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </section>
  );
}
