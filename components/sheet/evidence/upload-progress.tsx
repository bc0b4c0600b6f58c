import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, radii, space } from '@/components/ui/theme';

/** How much of a file has gone up, as a bar and in words. */
export function UploadProgress({ name, fraction }: { name: string; fraction: number }) {
  const percent = Math.round(Math.min(Math.max(fraction, 0), 1) * 100);
  return (
    <View style={styles.field} testID="row-evidence-progress">
      <AppText variant="label">{percent < 100 ? `Uploading ${name}: ${percent} %` : `Checking ${name}…`}</AppText>
      <View
        role="progressbar"
        aria-label={`Upload of ${name}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        style={styles.track}
      >
        <View style={[styles.bar, { width: `${percent}%` }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  track: { height: 8, borderRadius: radii.pill, backgroundColor: colors.recess, overflow: 'hidden' },
  bar: { height: '100%', backgroundColor: colors.film },
});
