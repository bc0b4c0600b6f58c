import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, fontSizes, radii, space } from '@/components/ui/theme';
import { SIZING_CAUTION } from '@/shared/analyses/caution';

/** The caution shown beside sizing results. */
export function SizingCaution({ testID }: { testID?: string }) {
  return (
    <View style={styles.box} role="note" testID={testID}>
      <AppText style={styles.text}>{SIZING_CAUTION}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    borderLeftWidth: 3,
    borderLeftColor: colors.film,
    backgroundColor: colors.filmWash,
    borderRadius: radii.sm,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
  },
  text: { color: colors.filmPressed, fontSize: fontSizes.small, lineHeight: 18 },
});
