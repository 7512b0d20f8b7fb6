'use client';
/**
 * The two charts for the clinician, drawn with recharts from data made only in lib/chart:
 * absolute risk in both groups with the exposed group's interval as whiskers, and risk by
 * horizon from year 1 to the chosen horizon for both groups. Each chart's text alternative is
 * its visible sentence, and its data table sits beside it (WCAG 2.2 SC 1.1.1). Loaded on demand,
 * so the chart library is not part of the page's first load.
 */
import { memo } from 'react';
import { Area, Bar, CartesianGrid, Cell, ComposedChart, ErrorBar, Line, ResponsiveContainer, Text, XAxis, YAxis } from 'recharts';
import type { ChartsView } from '@/lib/consultation';
import { ICON_COLOURS } from '@/app/components/iconStyle';

/** The pictures' colours (iconStyle.ts): reference group teal, exposed group ochre. */
const BLUE = ICON_COLOURS.event;
const ORANGE = ICON_COLOURS.added;
const INK = '#1b1f24';
const GRID = '#d5d9df';

export interface ChartsProps {
  /** Data and words from lib/consultation (consultationDetails). */
  readonly view: ChartsView;
}

/** A group name under its bar, wrapped onto several lines instead of running into the next. */
function GroupTick({ x, y, payload }: { x?: number | string; y?: number | string; payload?: { value?: unknown } }) {
  return (
    <Text x={Number(x)} y={Number(y) + 4} width={150} textAnchor="middle" verticalAnchor="start" fill={INK} fontSize={12}>
      {String(payload?.value ?? '')}
    </Text>
  );
}

function ChartsInner({ view }: ChartsProps) {
  const { bars, points, names, intervalLabel: ci } = view;
  const tickStyle = { fill: INK, fontSize: 12 };
  return (
    <section className="charts" aria-labelledby="charts-heading">
      <h3 id="charts-heading">Charts</h3>
      <div className="charts__grid">
        <figure className="chart" data-testid="chart-absolute">
          <figcaption id="chart-absolute-caption">{view.absoluteSentence}</figcaption>
          <div className="chart__frame" role="img" aria-labelledby="chart-absolute-caption">
            <ResponsiveContainer width="100%" height={280}>
              <ComposedChart data={[...bars]} margin={{ top: 12, right: 12, bottom: 4, left: 0 }} accessibilityLayer={false}>
                <CartesianGrid stroke={GRID} vertical={false} />
                <XAxis dataKey="name" tick={<GroupTick />} interval={0} stroke={INK} height={64} />
                <YAxis unit="%" tick={tickStyle} stroke={INK} width={48} domain={[0, 'auto']} />
                <Bar dataKey="riskPercent" isAnimationActive={false} maxBarSize={72}>
                  {bars.map((bar) => (
                    <Cell key={bar.group} fill={bar.group === 'exposed' ? ORANGE : BLUE} />
                  ))}
                  <ErrorBar dataKey="whisker" width={10} strokeWidth={2} stroke={INK} direction="y" />
                </Bar>
              </ComposedChart>
            </ResponsiveContainer>
          </div>
          <table className="data-table data-table--compact">
            <caption>{view.absoluteTableCaption}</caption>
            <thead>
              <tr>
                <th scope="col">Group</th>
                <th scope="col">Risk</th>
                <th scope="col">{ci}</th>
              </tr>
            </thead>
            <tbody>
              {bars.map((bar) => (
                <tr key={bar.group}>
                  <th scope="row">{bar.name}</th>
                  <td>{bar.riskText}</td>
                  <td>{bar.intervalText}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </figure>

        <figure className="chart" data-testid="chart-horizon">
          <figcaption id="chart-horizon-caption">{view.horizonSentence}</figcaption>
          <div className="chart__frame" role="img" aria-labelledby="chart-horizon-caption">
            <ResponsiveContainer width="100%" height={240}>
              <ComposedChart data={[...points]} margin={{ top: 12, right: 16, bottom: 4, left: 0 }} accessibilityLayer={false}>
                <CartesianGrid stroke={GRID} vertical={false} />
                <XAxis dataKey="horizonYears" type="number" domain={['dataMin', 'dataMax']} tick={tickStyle} stroke={INK} unit=" y" allowDecimals={false} />
                <YAxis unit="%" tick={tickStyle} stroke={INK} width={48} domain={[0, 'auto']} />
                <Area dataKey="exposedBandPercent" stroke="none" fill={ORANGE} fillOpacity={0.18} isAnimationActive={false} />
                <Line dataKey="referencePercent" stroke={BLUE} strokeWidth={2.5} dot={{ r: 3, fill: BLUE }} isAnimationActive={false} />
                <Line dataKey="exposedPercent" stroke={ORANGE} strokeWidth={2.5} strokeDasharray="6 3" dot={{ r: 3, fill: '#ffffff', stroke: ORANGE, strokeWidth: 2 }} isAnimationActive={false} />
              </ComposedChart>
            </ResponsiveContainer>
          </div>
          <p className="chart__key">
            <span className="chart__key-item chart__key-item--reference">{view.keyReference}</span>
            <span className="chart__key-item chart__key-item--exposed">{view.keyExposed}</span>
          </p>
          <details className="chart__data">
            <summary>Chart data by year</summary>
            <table className="data-table data-table--compact">
              <caption>Risk by year</caption>
              <thead>
                <tr>
                  <th scope="col">Years</th>
                  <th scope="col">{names.comparison}</th>
                  <th scope="col">{names.exposed}</th>
                  <th scope="col">{ci}</th>
                </tr>
              </thead>
              <tbody>
                {view.horizonRows.map((row) => (
                  <tr key={row.years}>
                    <th scope="row">{row.years}</th>
                    <td>{row.reference}</td>
                    <td>{row.exposed}</td>
                    <td>{row.interval}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        </figure>
      </div>
    </section>
  );
}

export const Charts = memo(ChartsInner);
export default Charts;
