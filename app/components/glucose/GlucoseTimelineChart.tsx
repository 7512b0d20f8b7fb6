'use client';
/**
 * One small timeline per test: the values over dates in the criteria body's unit, with the body's
 * thresholds as reference lines. It draws only what lib/glycaemia/timeline.ts computed. Each chart
 * is labelled by its visible sentence (role="img"), and its data sit in a table beside it
 * (WCAG 2.2 SC 1.1.1). The figure is named by its short title, and the visible sentence is
 * hidden from assistive technology because the chart's name already is that sentence: a screen
 * reader hears it once, not three times (figure name, caption, picture). Threshold lines differ
 * by dash pattern and label as well as colour (SC 1.4.1). The charts sit one above the other, the
 * full width of the section, so the dates on the axis have room.
 */
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import type { Timeline, TimelineSeries } from '@/lib/glycaemia/timeline';

const INK = '#1b1f24';
const GRID = '#d5d9df';
/** Prediabetes line: dark amber, long dashes; diabetes-range line: dark red, short dashes (both ≥ 3:1 on white). */
const LINE_STYLES = [
  { stroke: '#8a5a00', dash: '8 4' },
  { stroke: '#a4262c', dash: '3 3' },
] as const;

function SeriesChart({ series, timeline, idBase }: { series: TimelineSeries; timeline: Timeline; idBase: string }) {
  const captionId = `${idBase}-${series.test}-caption`;
  const titleId = `${idBase}-${series.test}-title`;
  const tickStyle = { fill: INK, fontSize: 11 };
  const styleFor = (index: number) => LINE_STYLES[series.thresholds.length === 1 ? 1 : index] ?? LINE_STYLES[1];
  return (
    <figure className="chart glucose-chart" aria-labelledby={titleId} data-testid={`glucose-chart-${series.test}`}>
      <figcaption id={titleId} className="glucose-chart__title">
        {series.title} over time
      </figcaption>
      <p id={captionId} className="glucose-chart__summary" aria-hidden="true">
        {series.summary}
      </p>
      <div className="chart__frame glucose-chart__frame" role="img" aria-labelledby={captionId}>
        <ResponsiveContainer width="100%" height={200} initialDimension={{ width: 320, height: 200 }}>
          <LineChart data={[...series.points]} margin={{ top: 10, right: 16, bottom: 4, left: 0 }} accessibilityLayer={false}>
            <CartesianGrid stroke={GRID} vertical={false} />
            <XAxis
              dataKey="day"
              type="number"
              domain={[...timeline.xDomain]}
              ticks={[...timeline.ticks]}
              tickFormatter={(day: number) => timeline.tickLabels[day] ?? ''}
              tick={tickStyle}
              stroke={INK}
              interval="preserveStartEnd"
            />
            <YAxis domain={[...series.yDomain]} tick={tickStyle} stroke={INK} width={44} />
            {series.thresholds.map((line, index) => (
              <ReferenceLine
                key={line.label}
                y={line.value}
                stroke={styleFor(index).stroke}
                strokeDasharray={styleFor(index).dash}
                strokeWidth={2}
                ifOverflow="extendDomain"
              />
            ))}
            <Line dataKey="value" stroke={INK} strokeWidth={2} dot={{ r: 4, fill: INK }} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <ul className="chart__key glucose-chart__key">
        {series.thresholds.map((line, index) => (
          <li key={line.label}>
            <svg width="28" height="8" aria-hidden="true" focusable="false">
              <line x1="0" y1="4" x2="28" y2="4" stroke={styleFor(index).stroke} strokeWidth="2" strokeDasharray={styleFor(index).dash} />
            </svg>{' '}
            {line.label}
          </li>
        ))}
      </ul>
      <table className="data-table data-table--compact">
        <caption>Chart data: {series.title}</caption>
        <thead>
          <tr>
            <th scope="col">Date</th>
            <th scope="col">Value</th>
            <th scope="col">Range</th>
          </tr>
        </thead>
        <tbody>
          {series.points.map((point) => (
            <tr key={point.date}>
              <th scope="row">{point.date}</th>
              <td>{point.text}</td>
              <td>{point.label}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}

export function GlucoseTimelineChart({ timeline, idBase }: { timeline: Timeline; idBase: string }) {
  return (
    <div className="glucose-charts">
      {timeline.series.map((series) => (
        <SeriesChart key={series.test} series={series} timeline={timeline} idBase={idBase} />
      ))}
    </div>
  );
}

export default GlucoseTimelineChart;
