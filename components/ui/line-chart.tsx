import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { G, Line, Path, Text as SvgText } from 'react-native-svg';
import { ChartFrame, plotArea, tickText, type LegendEntry } from './chart-frame';
import { colors } from './theme';

/** One line of a chart; NaN values leave a gap. */
export interface ChartSeries {
  readonly label: string;
  readonly color: string;
  readonly values: readonly number[];
  /** Drawn dashed, e.g. a reference or an idealised model. */
  readonly dashed?: boolean;
}

export type LineChartProps = {
  /** Names the chart for screen readers; a summary of the data's ranges is added to it. */
  title: string;
  x: readonly number[];
  series: readonly ChartSeries[];
  /** Axis titles with their units, e.g. "Cone angle (°)". */
  xLabel: string;
  yLabel: string;
  /** A vertical marker at an x value, e.g. the best cone angle. */
  marker?: { readonly x: number; readonly label: string };
  /** A horizontal reference at a y value, e.g. a temperature limit. */
  reference?: { readonly y: number; readonly label: string };
  /** Keeps zero on the y axis (default), so heights compare honestly. */
  includeZero?: boolean;
  /** How tick and summary numbers read; by default the scale's own tick format. */
  formatValue?: (value: number) => string;
  testID?: string;
};

const finite = (values: readonly number[]) => values.filter(Number.isFinite);

/** The smallest and largest finite value, or undefined when there is none. */
function extent(values: readonly number[]): [number, number] | undefined {
  const numbers = finite(values);
  return numbers.length === 0 ? undefined : [Math.min(...numbers), Math.max(...numbers)];
}

/**
 * A domain that is never empty (a single value is widened by one either side) and where rounding noise
 * around zero (a force of −1e−18 N edge-on) does not add a whole tick step past it.
 */
function domainOf(values: readonly number[]): [number, number] {
  const [low, high] = extent(values) ?? [0, 1];
  if (low === high) return [low - 1, high + 1];
  const noise = 1e-9 * (high - low);
  return [Math.abs(low) < noise ? 0 : low, Math.abs(high) < noise ? 0 : high];
}

/** One sentence on what the chart shows: the x range, then each series' range. */
function summarise(props: LineChartProps, format: (value: number) => string): string {
  const xRange = extent(props.x);
  const parts = [xRange === undefined ? 'No data.' : `${props.xLabel} from ${format(xRange[0])} to ${format(xRange[1])}.`];
  for (const series of props.series) {
    const range = extent(series.values);
    parts.push(range === undefined ? `${series.label}: no values.` : `${series.label}: ${format(range[0])} to ${format(range[1])}.`);
  }
  if (props.marker !== undefined) parts.push(`${props.marker.label} at ${format(props.marker.x)}.`);
  if (props.reference !== undefined) parts.push(`${props.reference.label} at ${format(props.reference.y)}.`);
  return parts.join(' ');
}

/** A line chart drawn with d3 scales and line paths: axes with titles and units, ticks, a legend, an optional marker and reference. */
export function LineChart(props: LineChartProps) {
  const { title, x, series, xLabel, yLabel, marker, reference, includeZero = true, formatValue, testID } = props;
  const xScale = scaleLinear().domain(domainOf(x)).range([plotArea.left, plotArea.right]);
  const yValues = [...series.flatMap((entry) => entry.values), ...(reference ? [reference.y] : []), ...(includeZero ? [0] : [])];
  const yScale = scaleLinear().domain(domainOf(yValues)).range([plotArea.bottom, plotArea.top]).nice(4);
  const yTicks = yScale.ticks(4);
  const xTicks = xScale.ticks(5);
  const yFormat = formatValue ?? yScale.tickFormat(4);
  const xFormat = formatValue ?? xScale.tickFormat(5);
  const path = line<number>()
    .defined((value, i) => Number.isFinite(value) && Number.isFinite(x[i] ?? Number.NaN))
    .x((_, i) => xScale(x[i] ?? Number.NaN))
    .y((value) => yScale(value));

  const legend: LegendEntry[] = [
    ...series.map((entry): LegendEntry => ({ label: entry.label, color: entry.color, kind: entry.dashed === true ? 'dashed' : 'line' })),
    ...(marker !== undefined ? [{ label: marker.label, color: colors.film, kind: 'rule' as const }] : []),
    ...(reference !== undefined ? [{ label: reference.label, color: colors.fault, kind: 'rule' as const }] : []),
  ];

  return (
    <ChartFrame
      title={title}
      summary={summarise(props, formatValue ?? ((value) => String(Number(value.toPrecision(4)))))}
      xLabel={xLabel}
      yLabel={yLabel}
      legend={legend}
      testID={testID}
    >
      {yTicks.map((tick) => (
        <G key={`y${tick}`}>
          <Line x1={plotArea.left} x2={plotArea.right} y1={yScale(tick)} y2={yScale(tick)} stroke={colors.recess} strokeWidth={1} />
          <SvgText x={plotArea.left - 4} y={yScale(tick) + 4} textAnchor="end" {...tickText}>
            {yFormat(tick)}
          </SvgText>
        </G>
      ))}
      {xTicks.map((tick) => (
        <SvgText key={`x${tick}`} x={xScale(tick)} y={plotArea.bottom + 15} textAnchor="middle" {...tickText}>
          {xFormat(tick)}
        </SvgText>
      ))}
      <Line x1={plotArea.left} x2={plotArea.left} y1={plotArea.top} y2={plotArea.bottom} stroke={colors.inkMuted} strokeWidth={1} />
      <Line x1={plotArea.left} x2={plotArea.right} y1={plotArea.bottom} y2={plotArea.bottom} stroke={colors.inkMuted} strokeWidth={1} />
      {reference !== undefined ? (
        <Line
          x1={plotArea.left}
          x2={plotArea.right}
          y1={yScale(reference.y)}
          y2={yScale(reference.y)}
          stroke={colors.fault}
          strokeWidth={1.5}
          strokeDasharray="2 3"
        />
      ) : null}
      {marker !== undefined ? (
        <Line
          x1={xScale(marker.x)}
          x2={xScale(marker.x)}
          y1={plotArea.top}
          y2={plotArea.bottom}
          stroke={colors.film}
          strokeWidth={1.5}
          strokeDasharray="2 3"
        />
      ) : null}
      {series.map((entry) => (
        <Path
          key={entry.label}
          d={path([...entry.values]) ?? ''}
          fill="none"
          stroke={entry.color}
          strokeWidth={2}
          strokeLinejoin="round"
          strokeDasharray={entry.dashed === true ? '6 4' : undefined}
        />
      ))}
    </ChartFrame>
  );
}
