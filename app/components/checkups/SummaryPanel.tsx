'use client';
/**
 * The workforce summary: counts, the expected-events chart (fed only by lib/checkups' view of the
 * lib summary), the caution, the employer paragraph.
 *
 * The chart is drawn once `chart` is true, in steps, each in its own task after the previous one
 * was painted (the bars; the axes; the grid) and shown when complete: a chart's first drawing runs
 * much of recharts for the first time (compiling it as it goes), which in one task held up the
 * page for over 100 ms (README, Performance). Until then its place is kept, with its text
 * alternative.
 */
import { useEffect, useMemo, useState } from 'react';
import { afterNextPaint } from './afterNextPaint';
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { checkupsSummaryView } from '@/lib/checkups/summaryView';
import type { WorkforceSummary } from '@/lib/workforce';

/** The chart's parts, drawn one step at a time: the chart, its bars, the category axis, the number axis, the grid. */
const CHART_STEPS = 5;

export function SummaryPanel({ summary, outcome, chart = true, onChartDrawn }: { summary: WorkforceSummary; outcome: string; chart?: boolean; onChartDrawn?: () => void }) {
  const view = useMemo(() => checkupsSummaryView(summary, outcome), [summary, outcome]);
  const [drawn, setDrawn] = useState(0);
  const complete = drawn >= CHART_STEPS;
  useEffect(() => {
    if (!chart) return;
    // Drawn: said once it is painted, so what comes next starts in a task of its own.
    if (complete) return onChartDrawn ? afterNextPaint(onChartDrawn) : undefined;
    return afterNextPaint(() => setDrawn((d) => d + 1));
  }, [chart, complete, drawn, onChartDrawn]);
  const data = useMemo(() => [...view.chart], [view]);
  return (
    <section aria-labelledby="summary-heading" className="checkups__section" data-testid="summary">
      <h2 id="summary-heading">{view.heading}</h2>
      <p className="checkups__caution" role="note" data-testid="summary-caution">
        <strong>Caution: </strong>
        {view.caution}
      </p>
      <table className="checkups__table" data-testid="status-counts">
        <caption>Workers by status</caption>
        <tbody>
          {view.statuses.map((s) => (
            <tr key={s.status} data-status={s.status}>
              <th scope="row">{s.label}</th>
              <td>{s.count}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <figure className="checkups__chart">
        <div role="img" aria-labelledby="checkups-chart-caption" style={{ width: '100%', height: 220, visibility: complete ? 'visible' : 'hidden' }} data-drawn={complete ? 'true' : 'false'}>
          {drawn > 0 ? (
            <ResponsiveContainer>
              <BarChart data={data} layout="vertical" margin={{ left: 20, right: 20 }} accessibilityLayer={false}>
                {drawn > 4 ? <CartesianGrid strokeDasharray="3 3" /> : null}
                {drawn > 3 ? <XAxis type="number" allowDecimals /> : null}
                {/* Both labels always shown (two bars in 220 px never crowd them): recharts need not measure them to choose. */}
                {drawn > 2 ? <YAxis type="category" dataKey="label" width={170} interval={0} /> : null}
                {drawn > 1 ? <Bar dataKey="events" fill="#1f5f8b" isAnimationActive={false} /> : null}
              </BarChart>
            </ResponsiveContainer>
          ) : null}
        </div>
        <figcaption id="checkups-chart-caption" data-testid="chart-text">{view.chartText}</figcaption>
      </figure>
      {view.strata.map((s) => (
        <div key={s.name} className="checkups__scroll" tabIndex={0} role="region" aria-label={`Workers by ${s.name}`}>
          <table className="checkups__table" data-testid={`stratum-${s.name}`}>
            <caption>By {s.name}</caption>
            <thead>
              <tr>
                {view.stratumColumns.map((c) => (
                  <th key={c} scope="col">
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {s.rows.map((r) => (
                <tr key={r.value}>
                  <th scope="row">{r.value}</th>
                  {r.counts.map((n, i) => (
                    <td key={i}>{n}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
      <h3>For a report to the employer</h3>
      <p data-testid="employer-paragraph">{view.employerParagraph}</p>
    </section>
  );
}
