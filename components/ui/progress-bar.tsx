import { StyleSheet, View } from 'react-native';
import { Button } from './button';
import { AppText } from './text';
import { colors, radii, space } from './theme';

export type ProgressBarProps = {
  /** What is progressing, for screen readers: "Sweep progress". */
  label: string;
  done: number;
  total: number;
  /** What is counted, plural: "points", "samples". */
  counting: string;
  onCancel: () => void;
  /** The row's testID; the Cancel button's is `${testID}-cancel` unless `cancelTestID` says otherwise. */
  testID: string;
  cancelTestID?: string;
};

/** A long computation's progress: a bar, "n of N things" and a Cancel button. */
export function ProgressBar({ label, done, total, counting, onCancel, testID, cancelTestID }: ProgressBarProps) {
  const percent = total > 0 ? Math.round((done / total) * 100) : 0;
  return (
    <View style={styles.progress} testID={testID}>
      <View role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} style={styles.track}>
        <View style={[styles.fill, { width: `${percent}%` }]} />
      </View>
      <AppText variant="mono">
        {done.toLocaleString('en')} of {total.toLocaleString('en')} {counting}
      </AppText>
      <Button label="Cancel" tone="quiet" onPress={onCancel} testID={cancelTestID ?? `${testID}-cancel`} />
    </View>
  );
}

const styles = StyleSheet.create({
  progress: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  track: { flexGrow: 1, minWidth: 160, height: 8, borderRadius: radii.pill, backgroundColor: colors.recess, overflow: 'hidden' },
  fill: { height: 8, backgroundColor: colors.film },
});
