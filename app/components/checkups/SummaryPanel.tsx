'use client';
/** The workforce summary: counts, the expected-events chart (fed only by lib/checkups' view of the lib summary), the caution, the employer paragraph. */
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { checkupsSummaryView } from '@/lib/checkups/summaryView';
import type { WorkforceSummary } from '@/lib/workforce';

export function SummaryPanel({ summary, outcome }: { summary: WorkforceSummary; outcome: string }) {
  const view = checkupsSummaryView(summary, outcome);
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
        <div role="img" aria-labelledby="checkups-chart-caption" style={{ width: '100%', height: 220 }}>
          <ResponsiveContainer>
            <BarChart data={[...view.chart]} layout="vertical" margin={{ left: 20, right: 20 }} accessibilityLayer={false}>
              <CartesianGrid strokeDasharray="3 3" />
              <XAxis type="number" allowDecimals />
              <YAxis type="category" dataKey="label" width={170} />
              <Bar dataKey="events" fill="#1f5f8b" isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
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
