import { useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, fonts, fontSizes, space, touchTarget } from './theme';

export type DisclosureProps = {
  /** What opening it shows, e.g. "Note and source". */
  label: string;
  children: ReactNode;
  testID?: string;
};

/** A line that opens to show more detail below it; closed at first. */
export function Disclosure({ label, children, testID }: DisclosureProps) {
  const [open, setOpen] = useState(false);
  return (
    <View>
      <Pressable
        role="button"
        aria-expanded={open}
        aria-label={label}
        onPress={() => setOpen(!open)}
        style={({ pressed }) => [styles.trigger, pressed && styles.pressed]}
        testID={testID}
      >
        <AppText style={styles.label}>
          {open ? '▾' : '▸'} {label}
        </AppText>
      </Pressable>
      {open ? <View style={styles.body}>{children}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  trigger: { minHeight: touchTarget, justifyContent: 'center', alignSelf: 'flex-start', paddingRight: space.md },
  pressed: { opacity: 0.7 },
  label: { color: colors.accent, fontFamily: fonts.medium, fontSize: fontSizes.small, lineHeight: 18 },
  body: { gap: space.xs, paddingBottom: space.sm },
});
