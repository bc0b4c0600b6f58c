import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { AppText } from './text';
import { colors, contentMaxWidth, space } from './theme';

export type ScreenProps = {
  /** The screen's heading, read first by screen readers. */
  title: string;
  /** A short line under the heading. */
  subtitle?: string;
  /** Controls placed beside the heading, e.g. a back link. */
  aside?: ReactNode;
  children: ReactNode;
};

/** A scrolling page with a heading and a centred column that stops growing on wide screens. */
export function Screen({ title, subtitle, aside, children }: ScreenProps) {
  const insets = useSafeAreaInsets();
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={[styles.content, { paddingTop: insets.top + space.xl }]}>
      <View style={styles.column}>
        <View style={styles.header}>
          <View style={styles.headings}>
            <AppText variant="display">{title}</AppText>
            {subtitle ? <AppText variant="muted">{subtitle}</AppText> : null}
          </View>
          {aside}
        </View>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.ground },
  content: { paddingHorizontal: space.lg, paddingBottom: space.xxl },
  column: { width: '100%', maxWidth: contentMaxWidth, alignSelf: 'center', gap: space.xl },
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', gap: space.md },
  headings: { flexShrink: 1, gap: space.xs },
});
