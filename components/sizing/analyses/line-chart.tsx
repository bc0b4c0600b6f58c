import { StyleSheet, View } from 'react-native';
import Svg, { G, Line, Polyline, Text as SvgText } from 'react-native-svg';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { formatNumber } from '../format';

/** One line of a chart; NaN values leave a gap. */
export interface ChartSeries {
  readonly label: string;
  readonly color: string;
  readonly values: readonly number[];
  /** Drawn dashed, e.g. a reference or an idealised model. */
  readonly dashed?: boolean;
}

export type LineChartProps = {
  /** Names the chart for screen readers. */
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
  testID?: string;
};

// The drawing is laid out in this box and scaled to the width it gets, so it fits a phone.
const width = 360;
const height = 230;
const plot = { left: 60, right: 12, top: 12, bottom: 40 };
const ticks = 4;

function extent(values: readonly number[]): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, 1];
  const low = Math.min(...finite);
  const high = Math.max(...finite);
  return low === high ? [low - 1, high + 1] : [low, high];
}

/** The 1, 2 or 5 times a power of ten step nearest to `ticks` intervals over the span (common practice for axes). */
function niceStep(span: number): number {
  const raw = span / ticks;
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const scaled = raw / power;
  return (scaled < 1.5 ? 1 : scaled < 3 ? 2 : scaled < 7 ? 5 : 10) * power;
}

/** The range widened to whole steps, and the ticks in it (rounded, so no float noise such as 1e-19 shows). */
function niceAxis(values: readonly number[]): { low: number; high: number; ticks: number[] } {
  const [low, high] = extent(values);
  const step = niceStep(high - low);
  // Rounding noise (a force of −1e−18 N at 90°) must not add a whole step below zero.
  const first = Math.floor(low / step + 1e-9);
  const last = Math.ceil(high / step - 1e-9);
  const marks = Array.from({ length: last - first + 1 }, (_, i) => Number(((first + i) * step).toPrecision(12)));
  return { low: first * step, high: last * step, ticks: marks };
}

/** A small line chart in our colours: axes with titles and units, ticks, a legend, an optional marker. */
export function LineChart({ title, x, series, xLabel, yLabel, marker, reference, testID }: LineChartProps) {
  const [xLow, xHigh] = extent(x);
  const yAxis = niceAxis([...series.flatMap((line) => line.values), ...(reference ? [reference.y] : []), 0]);
  const [yLow, yHigh] = [yAxis.low, yAxis.high];
  const innerWidth = width - plot.left - plot.right;
  const innerHeight = height - plot.top - plot.bottom;
  const px = (value: number) => plot.left + ((value - xLow) / (xHigh - xLow)) * innerWidth;
  const py = (value: number) => plot.top + (1 - (value - yLow) / (yHigh - yLow)) * innerHeight;
  // The x axis keeps the data's own range: only the whole steps inside it are marked.
  const xTicks = niceAxis(x).ticks.filter((tick) => tick >= xLow - 1e-9 * (xHigh - xLow) && tick <= xHigh + 1e-9 * (xHigh - xLow));
  const segments = (values: readonly number[]) => {
    const runs: string[][] = [[]];
    values.forEach((value, i) => {
      const xValue = x[i];
      if (xValue === undefined || !Number.isFinite(value)) runs.push([]);
      else runs[runs.length - 1]?.push(`${px(xValue).toFixed(1)},${py(value).toFixed(1)}`);
    });
    return runs.filter((run) => run.length > 1).map((run) => run.join(' '));
  };
  const axisText = { fontFamily: fonts.mono, fontSize: 11, fill: colors.inkMuted };
  return (
    <View style={styles.root} testID={testID}>
      <View style={styles.frame}>
        <Svg width="100%" height="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label={title}>
          {yAxis.ticks.map((tick) => (
            <G key={`y${tick}`}>
              <Line x1={plot.left} x2={width - plot.right} y1={py(tick)} y2={py(tick)} stroke={colors.surfaceSunken} strokeWidth={1} />
              <SvgText x={plot.left - 4} y={py(tick) + 3} textAnchor="end" {...axisText}>
                {formatNumber(tick, 3)}
              </SvgText>
            </G>
          ))}
          {xTicks.map((tick) => (
            <SvgText key={`x${tick}`} x={px(tick)} y={height - plot.bottom + 14} textAnchor="middle" {...axisText}>
              {formatNumber(tick, 3)}
            </SvgText>
          ))}
          <Line x1={plot.left} x2={plot.left} y1={plot.top} y2={height - plot.bottom} stroke={colors.inkMuted} strokeWidth={1} />
          <Line
            x1={plot.left}
            x2={width - plot.right}
            y1={height - plot.bottom}
            y2={height - plot.bottom}
            stroke={colors.inkMuted}
            strokeWidth={1}
          />
          <SvgText x={plot.left + innerWidth / 2} y={height - 6} textAnchor="middle" {...axisText} fill={colors.ink}>
            {xLabel}
          </SvgText>
          <SvgText
            x={10}
            y={plot.top + innerHeight / 2}
            textAnchor="middle"
            transform={`rotate(-90 10 ${plot.top + innerHeight / 2})`}
            {...axisText}
            fill={colors.ink}
          >
            {yLabel}
          </SvgText>
          {reference !== undefined ? (
            <Line
              x1={plot.left}
              x2={width - plot.right}
              y1={py(reference.y)}
              y2={py(reference.y)}
              stroke={colors.danger}
              strokeWidth={1.5}
              strokeDasharray="4 3"
            />
          ) : null}
          {marker !== undefined ? (
            <Line
              x1={px(marker.x)}
              x2={px(marker.x)}
              y1={plot.top}
              y2={height - plot.bottom}
              stroke={colors.accent}
              strokeWidth={1.5}
              strokeDasharray="4 3"
            />
          ) : null}
          {series.flatMap((line) =>
            segments(line.values).map((points) => (
              <Polyline
                key={`${line.label}${points.slice(0, 12)}`}
                points={points}
                fill="none"
                stroke={line.color}
                strokeWidth={2}
                strokeDasharray={line.dashed === true ? '6 4' : undefined}
              />
            )),
          )}
        </Svg>
      </View>
      <View style={styles.legend}>
        {series.map((line) => (
          <View key={line.label} style={styles.legendItem}>
            <View style={[styles.swatch, { backgroundColor: line.color }, line.dashed === true && styles.dashed]} />
            <AppText variant="label">{line.label}</AppText>
          </View>
        ))}
        {marker !== undefined ? <LegendRule color={colors.accent} label={marker.label} /> : null}
        {reference !== undefined ? <LegendRule color={colors.danger} label={reference.label} /> : null}
      </View>
    </View>
  );
}

function LegendRule({ color, label }: { color: string; label: string }) {
  return (
    <View style={styles.legendItem}>
      <View style={[styles.swatch, styles.rule, { borderColor: color }]} />
      <AppText variant="label">{label}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.sm, width: '100%', maxWidth: 560 },
  frame: { width: '100%', aspectRatio: width / height },
  legend: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xs },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  swatch: { width: 16, height: 3, borderRadius: 2 },
  dashed: { opacity: 0.6 },
  rule: { height: 0, borderTopWidth: 2, borderStyle: 'dashed', backgroundColor: 'transparent' },
});
