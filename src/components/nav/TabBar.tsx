/** The phone's bottom tabs: four places and "More", each an icon with its name. */
import { StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { Role } from '@/shared/api';
import { colors } from '@/src/theme';
import { isCurrent, MORE_HREF, moreIsCurrent, phoneLayout } from './destinations';
import { NavLink } from './NavLink';

export function TabBar({ pathname, role }: { pathname: string; role: Role | null }) {
  const insets = useSafeAreaInsets();
  const { tabs } = phoneLayout(role);
  return (
    <View style={[styles.bar, { paddingBottom: insets.bottom }]} role="navigation" aria-label="Main" testID="tab-bar">
      {tabs.map((d) => (
        <NavLink key={d.id} href={d.href} label={d.label} icon={d.icon} current={isCurrent(d, pathname)} layout="tab" testID={`nav-${d.id}`} />
      ))}
      <NavLink href={MORE_HREF} label="More" icon="more" current={moreIsCurrent(pathname, role)} layout="tab" testID="nav-more" />
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.lineStrong,
  },
});
