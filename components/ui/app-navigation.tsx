import { TabList, TabSlot, TabTrigger, Tabs, type TabTriggerSlotProps } from 'expo-router/ui';
import { Pressable, StyleSheet, useWindowDimensions, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { NavIcon, type NavIconName } from './nav-icons';
import { SailMark } from './sail-mark';
import { AppText } from './text';
import { colors, fonts, radii, sideNavBreakpoint, space, touchTarget } from './theme';

type Placement = 'bottom' | 'side';

type NavItemProps = TabTriggerSlotProps & { label: string; icon: NavIconName; placement: Placement };

function NavItem({ label, icon, placement, isFocused = false, ...props }: NavItemProps) {
  const side = placement === 'side';
  const color = side ? (isFocused ? colors.filmOnInk : colors.ground) : isFocused ? colors.film : colors.inkMuted;
  return (
    <Pressable
      {...props}
      role="tab"
      aria-selected={isFocused}
      aria-label={label}
      style={[side ? styles.sideItem : styles.bottomItem, isFocused && (side ? styles.sideItemFocused : styles.bottomItemFocused)]}
    >
      <NavIcon name={icon} color={color} />
      <AppText style={[side ? styles.sideLabel : styles.bottomLabel, { color }]}>{label}</AppText>
    </Pressable>
  );
}

export type AppNavigationProps = {
  /** The People tab is for organisation admins only. */
  showPeople: boolean;
};

/**
 * The signed-in shell: tabs along the bottom on phones, a side navigation from 900 px wide.
 * Headless expo-router tabs read their triggers from the direct children of TabList, so the
 * triggers are written out here rather than mapped from a list through another component.
 */
export function AppNavigation({ showPeople }: AppNavigationProps) {
  const { width } = useWindowDimensions();
  const insets = useSafeAreaInsets();
  const placement: Placement = width >= sideNavBreakpoint ? 'side' : 'bottom';
  const side = placement === 'side';

  return (
    <Tabs style={side ? styles.rootSide : styles.rootBottom}>
      <TabSlot style={styles.slot} />
      <TabList
        role="tablist"
        aria-label="Main"
        testID={side ? 'nav-side' : 'nav-bottom'}
        style={side ? [styles.side, { paddingTop: insets.top + space.xl }] : [styles.bottom, { paddingBottom: insets.bottom }]}
      >
        {side ? (
          <View style={styles.brand}>
            <SailMark size={32} backdrop="ink" />
            <AppText style={styles.brandText}>Trimsheet</AppText>
          </View>
        ) : null}
        <TabTrigger name="crafts" href="/crafts" asChild>
          <NavItem label="Crafts" icon="crafts" placement={placement} testID="nav-crafts" />
        </TabTrigger>
        <TabTrigger name="sandbox" href="/sandbox" asChild>
          <NavItem label="Sandbox" icon="sandbox" placement={placement} testID="nav-sandbox" />
        </TabTrigger>
        {showPeople ? (
          <TabTrigger name="people" href="/people" asChild>
            <NavItem label="People" icon="people" placement={placement} testID="nav-people" />
          </TabTrigger>
        ) : null}
        <TabTrigger name="account" href="/account" asChild>
          <NavItem label="Account" icon="account" placement={placement} testID="nav-account" />
        </TabTrigger>
      </TabList>
    </Tabs>
  );
}

const styles = StyleSheet.create({
  // The slot comes first in reading order; row-reverse then puts the side list on the left.
  rootSide: { flex: 1, flexDirection: 'row-reverse', backgroundColor: colors.ground },
  rootBottom: { flex: 1, flexDirection: 'column', backgroundColor: colors.ground },
  slot: { flex: 1 },
  side: {
    width: 232,
    flexDirection: 'column',
    alignItems: 'stretch',
    justifyContent: 'flex-start',
    gap: space.xs,
    paddingHorizontal: space.md,
    backgroundColor: colors.ink,
  },
  bottom: {
    flexDirection: 'row',
    justifyContent: 'space-around',
    backgroundColor: colors.panel,
    borderTopWidth: 1,
    borderTopColor: colors.rule,
  },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.sm, marginBottom: space.xl },
  brandText: { color: colors.ground, fontFamily: fonts.bold, fontSize: 20 },
  sideItem: {
    minHeight: touchTarget,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.md,
    borderRadius: radii.md,
  },
  sideItemFocused: { backgroundColor: 'rgba(242, 244, 248, 0.12)' },
  sideLabel: { fontFamily: fonts.medium },
  bottomItem: {
    flex: 1,
    minHeight: 56,
    borderTopWidth: 3,
    borderTopColor: 'transparent',
    alignItems: 'center',
    justifyContent: 'center',
    gap: 2,
    paddingVertical: space.xs,
  },
  bottomItemFocused: { borderTopColor: colors.film },
  bottomLabel: { fontFamily: fonts.medium, fontSize: 12, lineHeight: 16 },
});
