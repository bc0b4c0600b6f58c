import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, fontSizes, radii, space } from '@/components/ui/theme';
import { SizingCaution } from '../sizing-caution';

export type AnalysisCardProps = {
  title: string;
  /** One line on what the analysis answers. */
  summary: string;
  /** The caveat of this analysis, shown beside its result; without one, the general sizing caution. */
  caveat?: string;
  testID: string;
  children: ReactNode;
};

/** One analysis in its own card: title, what it answers, the result and its caveat. */
export function AnalysisCard({ title, summary, caveat, testID, children }: AnalysisCardProps) {
  return (
    <Card testID={testID}>
      <AppText variant="heading">{title}</AppText>
      <AppText variant="muted">{summary}</AppText>
      {children}
      {caveat !== undefined ? (
        <View style={styles.caveat} role="note" testID={`${testID}-caveat`}>
          <AppText variant="label">Caveat</AppText>
          <AppText style={styles.caveatText}>{caveat}</AppText>
        </View>
      ) : (
        <SizingCaution testID={`${testID}-caveat`} />
      )}
    </Card>
  );
}

/** Why an analysis cannot run: each problem names its row or input. */
export function AnalysisProblems({ problems, testID }: { problems: readonly string[]; testID?: string }) {
  return (
    <View role="alert" testID={testID} style={styles.problems}>
      {problems.map((problem) => (
        <AppText key={problem} variant="error">
          {problem}
        </AppText>
      ))}
    </View>
  );
}

/** A labelled result in Roboto Mono, e.g. "Closest safe distance 0.27 AU". */
export function ResultFigure({ label, value, testID }: { label: string; value: string; testID: string }) {
  return (
    <View style={styles.figure}>
      <AppText variant="label">{label}</AppText>
      <AppText variant="mono" style={styles.value} testID={testID}>
        {value}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  // A result's own caveat reads as part of the result: sunken like a footnote, not the accent of the general caution.
  caveat: { backgroundColor: colors.recess, borderRadius: radii.md, padding: space.md, gap: 2 },
  caveatText: { color: colors.ink, fontSize: fontSizes.small, lineHeight: 18 },
  problems: { gap: space.xs },
  figure: { gap: 2 },
  value: { fontSize: 18, lineHeight: 24, color: colors.ink },
});
