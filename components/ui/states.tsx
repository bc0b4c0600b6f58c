import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from './button';
import { AppText } from './text';
import { colors, space } from './theme';

/** Shown while data is on its way. */
export function LoadingState({ label }: { label: string }) {
  return (
    <View style={styles.box} role="status" aria-live="polite">
      <ActivityIndicator color={colors.film} />
      <AppText variant="muted">{label}</AppText>
    </View>
  );
}

export type ErrorStateProps = {
  /** What could not be done, e.g. "Could not load the crafts". */
  title: string;
  /** The server's or the network's own words. */
  message: string;
  onRetry?: () => void;
};

/** Shown when a request failed: what failed, why, and a way to try again. */
export function ErrorState({ title, message, onRetry }: ErrorStateProps) {
  return (
    <View style={[styles.box, styles.error]} role="alert">
      <AppText variant="heading">{title}</AppText>
      <AppText variant="muted">{message}</AppText>
      {onRetry ? <Button label="Try again" tone="secondary" onPress={onRetry} /> : null}
    </View>
  );
}

/** Shown when a list has nothing in it yet. */
export function EmptyState({ title, message }: { title: string; message: string }) {
  return (
    <View style={styles.box}>
      <AppText variant="heading">{title}</AppText>
      <AppText variant="muted" style={styles.centred}>
        {message}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.md,
    paddingVertical: space.xxl,
    paddingHorizontal: space.lg,
  },
  error: { backgroundColor: colors.faultWash, borderRadius: 16 },
  centred: { textAlign: 'center' },
});
