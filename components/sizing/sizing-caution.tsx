import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, fontSizes, radii, space } from '@/components/ui/theme';

/** What every sizing result carries: these are estimates, not design authority. */
export const SIZING_CAUTION =
  "Preliminary sizing estimates. Use your project's own margin policy, higher-fidelity analysis and licensed engineering practice for design decisions.";

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
    borderLeftColor: colors.accent,
    backgroundColor: colors.accentSoft,
    borderRadius: radii.sm,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
  },
  text: { color: colors.accentPressed, fontSize: fontSizes.small, lineHeight: 18 },
});
