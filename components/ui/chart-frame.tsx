import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg from 'react-native-svg';
import { AppText } from './text';
import { colors, fonts, space } from './theme';

/**
 * The drawing box every chart is laid out in; it scales to the width it gets, so a chart fits a phone
 * and stops growing on a wide screen.
 */
export const chartBox = { width: 360, height: 220, left: 56, right: 14, top: 10, bottom: 24 } as const;

/** The inner plotting area of `chartBox`, in drawing units. */
export const plotArea = {
  left: chartBox.left,
  right: chartBox.width - chartBox.right,
  top: chartBox.top,
  bottom: chartBox.height - chartBox.bottom,
} as const;

/** Tick text in the charts: Roboto Mono, small, muted. */
export const tickText = { fontFamily: fonts.mono, fontSize: 11, fill: colors.inkMuted } as const;

/** One entry of a chart's legend: a line, a dashed line, a rule (marker) or a filled swatch. */
export interface LegendEntry {
  readonly label: string;
  readonly color: string;
  readonly kind: 'line' | 'dashed' | 'rule' | 'swatch';
}

export type ChartFrameProps = {
  /** What the chart shows, and a sentence summing it up; together they are the chart's accessible name. */
  title: string;
  summary: string;
  /** Axis titles with units, e.g. "Cone angle (°)": written as text beside the drawing. */
  xLabel: string;
  yLabel: string;
  legend: readonly LegendEntry[];
  /** Height of the drawing in `chartBox` units, when it is not the standard one (a bar per row). */
  height?: number;
  testID?: string;
  /** The drawing, in `chartBox` units. */
  children: ReactNode;
};

/** A chart's frame: the y-axis title above the drawing, the x-axis title below it, then the legend. */
export function ChartFrame({ title, summary, xLabel, yLabel, legend, height = chartBox.height, testID, children }: ChartFrameProps) {
  return (
    <View style={styles.root} testID={testID}>
      <AppText variant="label" style={styles.axisTitle} testID="chart-y-label">
        {yLabel}
      </AppText>
      <View style={[styles.drawing, { aspectRatio: chartBox.width / height }]}>
        <Svg width="100%" height="100%" viewBox={`0 0 ${chartBox.width} ${height}`} role="img" aria-label={`${title}. ${summary}`}>
          {children}
        </Svg>
      </View>
      <AppText variant="label" style={[styles.axisTitle, styles.xTitle]} testID="chart-x-label">
        {xLabel}
      </AppText>
      {legend.length > 0 ? (
        <View style={styles.legend} testID="chart-legend">
          {legend.map((entry) => (
            <View key={entry.label} style={styles.legendItem}>
              <View
                style={[
                  styles.key,
                  keyStyles[entry.kind],
                  entry.kind === 'swatch' ? { backgroundColor: entry.color } : { borderColor: entry.color },
                ]}
              />
              <AppText variant="label" style={styles.legendText}>
                {entry.label}
              </AppText>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.xs, width: '100%', maxWidth: 560 },
  drawing: { width: '100%' },
  axisTitle: { color: colors.ink },
  xTitle: { textAlign: 'center' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xs, paddingTop: space.xs },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  key: { width: 18 },
  legendText: { color: colors.ink },
});

const keyStyles = StyleSheet.create({
  line: { height: 0, borderTopWidth: 3 },
  dashed: { height: 0, borderTopWidth: 3, borderStyle: 'dashed' },
  rule: { height: 0, borderTopWidth: 2, borderStyle: 'dotted' },
  swatch: { height: 12, borderRadius: 3 },
});
