/**
 * One navigation entry as a real link (an <a href> on the web, so it can be
 * opened in a new tab), marked as the current page when it is. `layout`
 * picks the bottom-tab look (icon over label) or the side-nav row look.
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text } from 'react-native';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/src/theme';
import { Icon, type IconName } from '../icons/Icon';
import { webAria } from '../webAria';

export interface NavLinkProps {
  href: Href;
  label: string;
  icon: IconName;
  current: boolean;
  layout: 'tab' | 'row';
  testID?: string;
}

export function NavLink({ href, label, icon, current, layout, testID }: NavLinkProps) {
  const ink = current ? colors.accent : colors.inkMuted;
  const tab = layout === 'tab';
  return (
    <Link href={href} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={label}
        accessibilityState={{ selected: current }}
        {...webAria({ 'aria-current': current ? 'page' : undefined })}
        testID={testID}
        // Link asChild merges plain style objects only (no arrays, no style functions).
        style={StyleSheet.flatten([tab ? styles.tab : styles.row, current && (tab ? styles.tabCurrent : styles.rowCurrent)])}
      >
        <Icon name={icon} size={tab ? 24 : 22} color={ink} weight={current ? 2.4 : 2} />
        <Text style={[tab ? styles.tabLabel : styles.rowLabel, { color: current ? colors.accent : colors.ink }, current && styles.labelCurrent]} numberOfLines={tab ? 2 : 1}>
          {label}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  tab: {
    flex: 1,
    minHeight: TOUCH_MIN + 12,
    minWidth: TOUCH_MIN,
    alignItems: 'center',
    justifyContent: 'center',
    paddingVertical: space.xs + 2,
    paddingHorizontal: space.xxs,
    gap: space.xxs,
    borderTopWidth: 3,
    borderTopColor: 'transparent',
  },
  // The current tab gets a bar above it as well as colour and weight.
  tabCurrent: { borderTopColor: colors.accent, backgroundColor: colors.accentSoft },
  tabLabel: { fontFamily: fonts.text, fontSize: 13, lineHeight: 16, textAlign: 'center' },
  row: {
    minHeight: TOUCH_MIN + 4,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderLeftWidth: 4,
    borderLeftColor: 'transparent',
  },
  rowCurrent: { backgroundColor: colors.accentSoft, borderLeftColor: colors.accent },
  rowLabel: { fontFamily: fonts.text, fontSize: 17, lineHeight: 22 },
  labelCurrent: { fontFamily: fonts.textBold },
});
