import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, fontSizes, radii, space } from '@/components/ui/theme';
import type { CheckResult } from '@/shared/analyses';

const marks: Record<CheckResult['status'], string> = { holds: 'Holds', fails: 'Fails', unknown: 'Unknown' };

/** One check of the template, in words: a failing one in the fault style, so it cannot be missed. */
export function CheckLine({ check }: { check: CheckResult }) {
  const failing = check.status === 'fails';
  return (
    <View
      style={[styles.check, failing && styles.failing]}
      role={failing ? 'alert' : undefined}
      testID={`check-${check.role}`}
      accessibilityLabel={`${marks[check.status]}: ${check.message}`}
    >
      <AppText style={[styles.checkText, failing && styles.failingText]}>
        <AppText style={styles.mark}>{marks[check.status]}: </AppText>
        {check.message}
      </AppText>
    </View>
  );
}

/** The caveats the template shows with every result. */
export function TemplateCaveats({ caveats, testID }: { caveats: readonly string[]; testID: string }) {
  if (caveats.length === 0) return null;
  return (
    <View style={styles.caveats} role="note" testID={testID}>
      <AppText variant="label">Caveats</AppText>
      {caveats.map((caveat) => (
        <AppText key={caveat} style={styles.caveatText}>
          {caveat}
        </AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  check: { borderLeftWidth: 3, borderLeftColor: colors.nominal, paddingLeft: space.sm, paddingVertical: 2 },
  failing: { borderLeftColor: colors.fault, backgroundColor: colors.faultWash },
  checkText: { color: colors.ink, fontSize: fontSizes.small, lineHeight: 18 },
  failingText: { color: colors.fault },
  mark: { fontWeight: '600', fontSize: fontSizes.small, lineHeight: 18 },
  caveats: { backgroundColor: colors.recess, borderRadius: radii.md, padding: space.md, gap: space.xs },
  caveatText: { color: colors.ink, fontSize: fontSizes.small, lineHeight: 18 },
});
