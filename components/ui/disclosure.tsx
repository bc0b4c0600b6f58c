import { useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, fonts, fontSizes, space, touchTarget } from './theme';

export type DisclosureProps = {
  /** What opening it shows, e.g. "Note"; written after the arrow. */
  label: string;
  /** Shown above the label inside the pressable area, which then also names the control. */
  summary?: ReactNode;
  children: ReactNode;
  testID?: string;
};

/** A pressable summary that opens to show more detail below it; closed at first. */
export function Disclosure({ label, summary, children, testID }: DisclosureProps) {
  const [open, setOpen] = useState(false);
  return (
    <View>
      <Pressable
        role="button"
        aria-expanded={open}
        aria-label={summary === undefined ? label : undefined}
        onPress={() => setOpen(!open)}
        style={({ pressed }) => [styles.trigger, pressed && styles.pressed]}
        testID={testID}
      >
        {summary}
        <AppText style={styles.label}>
          {open ? '▾' : '▸'} {label}
        </AppText>
      </Pressable>
      {open ? <View style={styles.body}>{children}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  trigger: { minHeight: touchTarget, justifyContent: 'center', paddingRight: space.md, gap: 2 },
  pressed: { opacity: 0.7 },
  label: { color: colors.film, fontFamily: fonts.medium, fontSize: fontSizes.small, lineHeight: 18 },
  body: { gap: space.xs, paddingTop: space.xs },
});
