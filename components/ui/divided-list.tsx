import { Children, Fragment, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { colors, radii } from './theme';

/** A card-like list whose rows are separated by hairlines (none above the first or below the last). */
export function DividedList({ children, testID }: { children: ReactNode; testID?: string }) {
  const rows = Children.toArray(children);
  return (
    <View style={styles.list} testID={testID}>
      {rows.map((row, index) => (
        <Fragment key={index}>
          {index > 0 ? <View style={styles.divider} /> : null}
          {row}
        </Fragment>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { backgroundColor: colors.panel, borderColor: colors.rule, borderWidth: 1, borderRadius: radii.lg, overflow: 'hidden' },
  divider: { height: 1, backgroundColor: colors.rule },
});
