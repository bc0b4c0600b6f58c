import { scaleBand, scaleLinear } from 'd3-scale';
import { G, Line, Rect, Text as SvgText } from 'react-native-svg';
import { ChartFrame, chartBox, tickText } from './chart-frame';
import { colors, fonts } from './theme';

/** One bar: its category, its value and its colour. */
export interface Bar {
  readonly label: string;
  readonly value: number;
  readonly color: string;
}

export type BarChartProps = {
  /** Names the chart for screen readers; each bar's value is added to it. */
  title: string;
  bars: readonly Bar[];
  /** Axis titles with units: the value axis (along the bars) and the category axis. */
  valueLabel: string;
  categoryLabel: string;
  /** How values read at the end of each bar and in the summary. */
  formatValue: (value: number) => string;
  testID?: string;
};

// Each bar gets a band this tall: the category name above, the bar under it.
const band = 40;
const margin = { left: 8, right: 64, top: 4, bottom: 6 };

/** Horizontal bars, one per category, drawn with d3 band and linear scales; the value is written at each bar's end. */
export function BarChart({ title, bars, valueLabel, categoryLabel, formatValue, testID }: BarChartProps) {
  const height = margin.top + band * Math.max(bars.length, 1) + margin.bottom;
  const largest = Math.max(0, ...bars.map((bar) => bar.value).filter(Number.isFinite));
  const xScale = scaleLinear()
    .domain([0, largest > 0 ? largest : 1])
    .range([margin.left, chartBox.width - margin.right]);
  const yScale = scaleBand<string>()
    .domain(bars.map((bar) => bar.label))
    .range([margin.top, height - margin.bottom])
    .paddingInner(0.15);
  const summary = bars.map((bar) => `${bar.label}: ${formatValue(bar.value)}.`).join(' ');
  return (
    <ChartFrame title={title} summary={summary} xLabel={valueLabel} yLabel={categoryLabel} legend={[]} height={height} testID={testID}>
      {bars.map((bar) => {
        const top = yScale(bar.label) ?? 0;
        const barHeight = yScale.bandwidth() / 2;
        const end = Number.isFinite(bar.value) ? xScale(Math.max(bar.value, 0)) : margin.left;
        return (
          <G key={bar.label}>
            <SvgText x={margin.left} y={top + 12} fontFamily={fonts.medium} fontSize={12} fill={colors.ink}>
              {bar.label}
            </SvgText>
            <Rect x={margin.left} y={top + 16} width={Math.max(end - margin.left, 0)} height={barHeight} rx={3} fill={bar.color} />
            <SvgText x={end + 4} y={top + 16 + barHeight - 2} {...tickText} fill={colors.ink}>
              {formatValue(bar.value)}
            </SvgText>
          </G>
        );
      })}
      <Line x1={margin.left} x2={margin.left} y1={margin.top} y2={height - margin.bottom} stroke={colors.inkMuted} strokeWidth={1} />
    </ChartFrame>
  );
}
