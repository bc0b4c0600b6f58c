import { scaleLinear } from 'd3-scale';
import { G, Line, Rect, Text as SvgText } from 'react-native-svg';
import { ChartFrame, chartBox, tickText } from './chart-frame';
import { colors, fonts } from './theme';

/** One signed share: what it is, how much (either sign), and its colour. */
export interface Share {
  readonly label: string;
  readonly value: number;
  readonly color: string;
}

export type ShareBarsProps = {
  /** Names the chart for screen readers; each share's value is added to it. */
  title: string;
  /** In the order they are drawn, top to bottom. */
  shares: readonly Share[];
  /** Axis title of the value axis, with its unit. */
  valueLabel: string;
  categoryLabel: string;
  formatValue: (value: number) => string;
  testID?: string;
};

// Each share gets a band this tall: its name above, the bar under it. Values are written in a column on the right.
const band = 40;
const barHeight = 14;
const margin = { left: 8, right: 84, top: 4, bottom: 6 };

/**
 * Horizontal bars that grow either way from a zero line (d3 linear scale): a share that raised the total
 * to the right, one that lowered it to the left, each value written at the right-hand edge.
 */
export function ShareBars({ title, shares, valueLabel, categoryLabel, formatValue, testID }: ShareBarsProps) {
  const height = margin.top + band * Math.max(shares.length, 1) + margin.bottom;
  const values = shares.map((share) => share.value).filter(Number.isFinite);
  const low = Math.min(0, ...values);
  const high = Math.max(0, ...values);
  const x = scaleLinear()
    .domain(low === high ? [0, 1] : [low, high])
    .range([margin.left, chartBox.width - margin.right]);
  const zero = x(0);
  const summary = shares.map((share) => `${share.label}: ${formatValue(share.value)}.`).join(' ');
  return (
    <ChartFrame title={title} summary={summary} xLabel={valueLabel} yLabel={categoryLabel} legend={[]} height={height} testID={testID}>
      {/* The zero line first, so the names written across it stay readable. */}
      <Line x1={zero} x2={zero} y1={margin.top} y2={height - margin.bottom} stroke={colors.inkMuted} strokeWidth={1} />
      {shares.map((share, index) => {
        const top = margin.top + band * index;
        const end = Number.isFinite(share.value) ? x(share.value) : zero;
        return (
          <G key={`${index}-${share.label}`}>
            <SvgText x={margin.left} y={top + 12} fontFamily={fonts.medium} fontSize={12} fill={colors.ink}>
              {share.label}
            </SvgText>
            <Rect x={Math.min(zero, end)} y={top + 18} width={Math.abs(end - zero)} height={barHeight} rx={2} fill={share.color} />
            <SvgText x={chartBox.width - 2} y={top + 18 + barHeight - 3} textAnchor="end" {...tickText} fill={colors.ink}>
              {formatValue(share.value)}
            </SvgText>
          </G>
        );
      })}
    </ChartFrame>
  );
}
