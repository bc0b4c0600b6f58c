import { Pressable, StyleSheet, View } from 'react-native';
import { colors, radii, touchTarget } from './theme';

export type ToggleProps = {
  /** Names the switch for assistive technology, e.g. "Organisation admin: Ravi Menon". */
  label: string;
  value: boolean;
  onChange: (value: boolean) => void;
  disabled?: boolean;
  testID?: string;
};

/** An on/off switch in the theme's colours, with a full touch target. */
export function Toggle({ label, value, onChange, disabled = false, testID }: ToggleProps) {
  return (
    <Pressable
      role="switch"
      aria-checked={value}
      aria-label={label}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={() => onChange(!value)}
      style={[styles.target, disabled && styles.disabled]}
      testID={testID}
    >
      <View style={[styles.track, value && styles.trackOn]}>
        <View style={[styles.thumb, value && styles.thumbOn]} />
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  target: { minHeight: touchTarget, minWidth: touchTarget, justifyContent: 'center', alignItems: 'center' },
  disabled: { opacity: 0.55 },
  track: { width: 40, height: 24, borderRadius: radii.pill, backgroundColor: colors.rule, padding: 3 },
  trackOn: { backgroundColor: colors.film },
  thumb: { width: 18, height: 18, borderRadius: radii.pill, backgroundColor: colors.panel },
  thumbOn: { transform: [{ translateX: 16 }] },
});
