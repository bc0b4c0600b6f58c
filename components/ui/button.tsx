import { ActivityIndicator, Pressable, StyleSheet, type PressableProps, type ViewStyle } from 'react-native';
import { AppText } from './text';
import { colors, fonts, radii, space, touchTarget } from './theme';

type Tone = 'primary' | 'secondary' | 'danger' | 'quiet';

export type ButtonProps = Omit<PressableProps, 'children' | 'style'> & {
  label: string;
  tone?: Tone;
  /** Shows a spinner and blocks presses while an action is under way. */
  busy?: boolean;
  style?: ViewStyle;
};

/** A labelled button with a full touch target; the label doubles as the accessible name. */
export function Button({ label, tone = 'primary', busy = false, disabled, style, ...props }: ButtonProps) {
  const inactive = Boolean(disabled) || busy;
  return (
    <Pressable
      role="button"
      aria-label={props['aria-label'] ?? label}
      aria-disabled={inactive}
      aria-busy={busy}
      disabled={inactive}
      style={({ pressed }) => [styles.base, styles[tone], pressed && pressedStyles[tone], inactive && styles.inactive, style]}
      {...props}
    >
      {busy ? <ActivityIndicator size="small" color={tone === 'primary' || tone === 'danger' ? colors.onFilm : colors.ink} /> : null}
      <AppText style={[styles.label, labelStyles[tone]]}>{label}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: touchTarget,
    paddingHorizontal: space.lg,
    borderRadius: radii.md,
    borderWidth: 1,
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.sm,
  },
  primary: { backgroundColor: colors.film, borderColor: colors.film },
  secondary: { backgroundColor: colors.panel, borderColor: colors.ink },
  danger: { backgroundColor: colors.fault, borderColor: colors.fault },
  quiet: { backgroundColor: 'transparent', borderColor: 'transparent', paddingHorizontal: space.sm },
  inactive: { opacity: 0.55 },
  label: { fontFamily: fonts.semibold },
});

const pressedStyles = StyleSheet.create({
  primary: { backgroundColor: colors.filmPressed },
  secondary: { backgroundColor: colors.recess },
  danger: { opacity: 0.85 },
  quiet: { backgroundColor: colors.recess },
});

const labelStyles = StyleSheet.create({
  primary: { color: colors.onFilm },
  secondary: { color: colors.ink },
  danger: { color: colors.onFilm },
  quiet: { color: colors.film },
});
