import { StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, fonts, radii, space } from './theme';

/** A small pill naming a status or role; `strong` uses the accent for the caller's own standing. */
export function Badge({ label, strong = false }: { label: string; strong?: boolean }) {
  return (
    <View style={[styles.badge, strong && styles.strong]}>
      <AppText style={[styles.text, strong && styles.strongText]}>{label}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    alignSelf: 'flex-start',
    borderRadius: radii.pill,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    backgroundColor: colors.recess,
  },
  strong: { backgroundColor: colors.filmWash },
  text: { fontFamily: fonts.medium, fontSize: 12, lineHeight: 18, color: colors.inkMuted },
  strongText: { color: colors.filmPressed },
});
