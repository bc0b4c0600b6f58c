import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { SheetSnapshot } from '../use-sheet-session';
import { ConeSweepAnalysis } from './cone-sweep';
import { FilmThicknessAnalysis } from './film-thickness-trade';
import { TargetSolveAnalysis } from './size-to-target';
import { DragCrossoverAnalysis, SpiralAnalysis } from './mission-checks';
import { TemperatureAnalysis } from './temperature-analysis';

export type AnalysesSectionProps = {
  /** The sheet as edited, with its values: every analysis runs on it. */
  snapshot: SheetSnapshot;
  /** Sets an input on the live sheet from text, as an undoable edit. */
  onSetInput: (key: string, text: string) => void;
};

/** The analyses of the sheet being edited: sweep, solving for a target, temperature and first-order mission checks. */
export function AnalysesSection({ snapshot, onSetInput }: AnalysesSectionProps) {
  return (
    <View style={styles.section} testID="analyses">
      <AppText variant="title">Analyses</AppText>
      <AppText variant="muted">Run on the sheet as you have edited it; each result carries its caveat.</AppText>
      <ConeSweepAnalysis sheet={snapshot.sheet} />
      <FilmThicknessAnalysis sheet={snapshot.sheet} testID="analysis-film-thickness" />
      <TargetSolveAnalysis sheet={snapshot.sheet} onApply={onSetInput} />
      <TemperatureAnalysis sheet={snapshot.sheet} />
      <AppText variant="heading">Mission checks (first-order)</AppText>
      <DragCrossoverAnalysis snapshot={snapshot} />
      <SpiralAnalysis snapshot={snapshot} />
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md, marginTop: space.xl },
});
