/** The wide-window navigation: every place as a row, and the account at the foot. */
import { ScrollView, StyleSheet, View } from 'react-native';
import type { Role } from '@/shared/api';
import { colors, space } from '@/src/theme';
import { AccountPanel } from './AccountPanel';
import { BrandMark } from './BrandMark';
import { destinationsFor, isCurrent } from './destinations';
import { NavLink } from './NavLink';

export const SIDE_NAV_WIDTH = 248;

export function SideNav({ pathname, role }: { pathname: string; role: Role | null }) {
  return (
    <View style={styles.side} role="navigation" aria-label="Main" testID="side-nav">
      <ScrollView contentContainerStyle={styles.content}>
        <View style={styles.brand}>
          <BrandMark />
        </View>
        <View style={styles.links}>
          {destinationsFor(role).map((d) => (
            <NavLink key={d.id} href={d.href} label={d.label} icon={d.icon} current={isCurrent(d, pathname)} layout="row" testID={`nav-${d.id}`} />
          ))}
        </View>
        <View style={styles.spacer} />
        <AccountPanel />
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  side: { width: SIDE_NAV_WIDTH, backgroundColor: colors.surface, borderRightWidth: 1, borderRightColor: colors.line },
  content: { flexGrow: 1, padding: space.lg, gap: space.lg },
  brand: { paddingHorizontal: space.sm, paddingVertical: space.sm },
  links: { gap: space.xs },
  spacer: { flexGrow: 1 },
});
