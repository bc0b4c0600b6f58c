import { scaleLinear } from 'd3-scale';
import { G, Line, Rect, Text as SvgText } from 'react-native-svg';
import { ChartFrame, plotArea, tickText, type LegendEntry } from './chart-frame';
import { colors } from './theme';

export type HistogramChartProps = {
  /** Names the chart for screen readers; the range, the busiest bin and the markers are added to it. */
  title: string;
  /** counts[i] values fell in bin i of equal bins from `from` to `to`. */
  from: number;
  to: number;
  counts: readonly number[];
  /** Axis title with its unit, e.g. "Characteristic acceleration (mm/s²)". */
  xLabel: string;
  yLabel?: string;
  /** Vertical lines at values, e.g. percentiles (in the bars' colour) or a requirement (in the fault colour). */
  markers?: readonly { readonly x: number; readonly label: string; readonly kind: 'percentile' | 'limit' }[];
  formatValue: (value: number) => string;
  testID?: string;
};

/** A histogram: equal bins as bars over a linear axis, with optional vertical markers. */
export function HistogramChart({
  title,
  from,
  to,
  counts,
  xLabel,
  yLabel = 'Samples',
  markers = [],
  formatValue,
  testID,
}: HistogramChartProps) {
  const span = to > from ? to - from : Math.max(Math.abs(from), 1) * 1e-6;
  const low = to > from ? from : from - span / 2;
  const high = to > from ? to : from + span / 2;
  const inView = markers.filter((marker) => Number.isFinite(marker.x));
  const xScale = scaleLinear()
    .domain([Math.min(low, ...inView.map((marker) => marker.x)), Math.max(high, ...inView.map((marker) => marker.x))])
    .range([plotArea.left, plotArea.right])
    .nice(5);
  const largest = Math.max(1, ...counts);
  const yScale = scaleLinear().domain([0, largest]).range([plotArea.bottom, plotArea.top]).nice(4);
  const width = (high - low) / Math.max(counts.length, 1);
  const busiest = counts.indexOf(Math.max(...counts));
  const summary = [
    `${counts.reduce((sum, count) => sum + count, 0)} samples from ${formatValue(from)} to ${formatValue(to)}.`,
    busiest >= 0 ? `Most fall between ${formatValue(low + busiest * width)} and ${formatValue(low + (busiest + 1) * width)}.` : '',
    ...inView.map((marker) => `${marker.label} at ${formatValue(marker.x)}.`),
  ].join(' ');
  const legend: LegendEntry[] = [
    { label: 'Samples per bin', color: colors.film, kind: 'swatch' },
    ...inView.map((marker): LegendEntry => ({
      label: marker.label,
      color: marker.kind === 'limit' ? colors.fault : colors.ink,
      kind: 'rule',
    })),
  ];
  return (
    <ChartFrame title={title} summary={summary} xLabel={xLabel} yLabel={yLabel} legend={legend} testID={testID}>
      {yScale.ticks(4).map((tick) => (
        <G key={`y${tick}`}>
          <Line x1={plotArea.left} x2={plotArea.right} y1={yScale(tick)} y2={yScale(tick)} stroke={colors.recess} strokeWidth={1} />
          <SvgText x={plotArea.left - 4} y={yScale(tick) + 4} textAnchor="end" {...tickText}>
            {String(tick)}
          </SvgText>
        </G>
      ))}
      {xScale.ticks(4).map((tick) => (
        <SvgText key={`x${tick}`} x={xScale(tick)} y={plotArea.bottom + 15} textAnchor="middle" {...tickText}>
          {formatValue(tick)}
        </SvgText>
      ))}
      {counts.map((count, bin) => {
        const left = xScale(low + bin * width);
        const right = xScale(low + (bin + 1) * width);
        return (
          <Rect
            key={bin}
            x={left}
            y={yScale(count)}
            width={Math.max(right - left - 1, 1)}
            height={Math.max(plotArea.bottom - yScale(count), 0)}
            fill={colors.film}
          />
        );
      })}
      <Line x1={plotArea.left} x2={plotArea.left} y1={plotArea.top} y2={plotArea.bottom} stroke={colors.inkMuted} strokeWidth={1} />
      <Line x1={plotArea.left} x2={plotArea.right} y1={plotArea.bottom} y2={plotArea.bottom} stroke={colors.inkMuted} strokeWidth={1} />
      {inView.map((marker) => (
        <Line
          key={marker.label}
          x1={xScale(marker.x)}
          x2={xScale(marker.x)}
          y1={plotArea.top}
          y2={plotArea.bottom}
          stroke={marker.kind === 'limit' ? colors.fault : colors.ink}
          strokeWidth={1.5}
          strokeDasharray="2 3"
        />
      ))}
    </ChartFrame>
  );
}
