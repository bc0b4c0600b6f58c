import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, fontSizes, radii, space } from '@/components/ui/theme';
import { pollMilliseconds, type LiveStatus } from './queries';

const words: Record<LiveStatus, string> = {
  live: 'Live',
  connecting: 'Connecting…',
  polling: `Checking every ${pollMilliseconds / 1000} s`,
};

/** A small badge saying how others' edits reach the screen: live through the events stream, or by polling. */
export function LiveStatusBadge({ status }: { status: LiveStatus }) {
  return (
    <View style={styles.badge} role="status" aria-label={`Updates from others: ${words[status]}`} testID="sheet-live-status">
      <View style={[styles.dot, status === 'live' ? styles.live : styles.waiting]} />
      <AppText style={styles.text}>{words[status]}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    borderRadius: radii.pill,
    backgroundColor: colors.recess,
  },
  dot: { width: 8, height: 8, borderRadius: 4 },
  live: { backgroundColor: colors.nominal },
  waiting: { backgroundColor: colors.film },
  text: { fontSize: fontSizes.small, lineHeight: 18, color: colors.inkMuted },
});
