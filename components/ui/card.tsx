import { StyleSheet, View, type ViewProps } from 'react-native';
import { colors, radii, space } from './theme';

/** A raised panel on the sailcloth background. */
export function Card({ style, ...props }: ViewProps) {
  return <View style={[styles.card, style]} {...props} />;
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.panel,
    borderColor: colors.rule,
    borderWidth: 1,
    borderRadius: radii.lg,
    padding: space.lg,
    gap: space.sm,
  },
});
