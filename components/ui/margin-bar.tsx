import { scaleLinear } from 'd3-scale';
import { Line, Rect, Text as SvgText } from 'react-native-svg';
import { ChartFrame, chartBox, tickText, type LegendEntry } from './chart-frame';
import { colors } from './theme';

export type MarginBarProps = {
  /** Names the chart for screen readers; the figures are added to it. */
  title: string;
  /** The allocation, the predicted mass and the margin required below the allocation, all in `unit`. */
  allocation: number;
  predicted: number;
  requiredMargin: number;
  /** Whether the margin is below the required one, as the budget roll-up says. */
  belowRequired: boolean;
  /** Axis title of the mass axis, with its unit, e.g. "Mass (kg)". */
  valueLabel: string;
  formatValue: (value: number) => string;
  testID?: string;
};

const height = 84;
const margin = { left: 8, right: 16, barTop: 18, barHeight: 26 };

/**
 * One bar against the allocation: the predicted mass, then the margin up to the allocation (in the
 * warning colour when below the required margin, or the overrun past it), with the required margin marked.
 */
export function MarginBar({
  title,
  allocation,
  predicted,
  requiredMargin,
  belowRequired,
  valueLabel,
  formatValue,
  testID,
}: MarginBarProps) {
  const scale = scaleLinear()
    .domain([0, Math.max(allocation, predicted, Number.MIN_VALUE)])
    .range([margin.left, chartBox.width - margin.right]);
  const requiredAt = allocation - requiredMargin;
  const marginColor = belowRequired ? colors.fault : colors.nominal;
  const barBottom = margin.barTop + margin.barHeight;
  const [marginFrom, marginTo] = predicted <= allocation ? [predicted, allocation] : [allocation, predicted];
  const legend: LegendEntry[] = [
    { label: 'Predicted mass', color: colors.ink, kind: 'swatch' },
    {
      label: predicted > allocation ? 'Over the allocation' : belowRequired ? 'Margin, below the required one' : 'Margin',
      color: marginColor,
      kind: 'swatch',
    },
    { label: 'Required margin starts', color: colors.film, kind: 'rule' },
  ];
  const summary =
    `Predicted ${formatValue(predicted)} of an allocation of ${formatValue(allocation)}; ` +
    `margin ${formatValue(allocation - predicted)}, required ${formatValue(requiredMargin)}` +
    (belowRequired ? ', below the required margin.' : '.');
  return (
    <ChartFrame
      title={title}
      summary={summary}
      xLabel={valueLabel}
      yLabel="Predicted mass against the allocation"
      legend={legend}
      height={height}
      testID={testID}
    >
      <Rect
        x={margin.left}
        y={margin.barTop}
        width={scale(Math.min(predicted, allocation)) - margin.left}
        height={margin.barHeight}
        fill={colors.ink}
      />
      <Rect
        x={scale(marginFrom)}
        y={margin.barTop}
        width={scale(marginTo) - scale(marginFrom)}
        height={margin.barHeight}
        fill={marginColor}
        opacity={0.8}
      />
      <Line x1={scale(allocation)} x2={scale(allocation)} y1={margin.barTop - 6} y2={barBottom + 6} stroke={colors.ink} strokeWidth={2} />
      <SvgText x={scale(allocation)} y={margin.barTop - 8} textAnchor="end" {...tickText} fill={colors.ink}>
        {`allocation ${formatValue(allocation)}`}
      </SvgText>
      <Line
        x1={scale(requiredAt)}
        x2={scale(requiredAt)}
        y1={margin.barTop - 4}
        y2={barBottom + 4}
        stroke={colors.film}
        strokeWidth={2}
        strokeDasharray="2 2"
      />
      <SvgText x={margin.left} y={barBottom + 18} {...tickText}>
        0
      </SvgText>
      <SvgText x={scale(predicted)} y={barBottom + 18} textAnchor="middle" {...tickText} fill={colors.ink}>
        {formatValue(predicted)}
      </SvgText>
    </ChartFrame>
  );
}
