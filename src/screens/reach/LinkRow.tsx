/**
 * One row that opens another page: a real link on the web (opens in a new
 * tab too), at least 44 px high, with an optional status shape and a muted
 * second line. Used by the reach, resilience and home lists.
 *
 *   <LinkRow href="/sites/M-CORR" title="Corrant Beacon" code="M-CORR" detail="11 services off air" status="off-air" />
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import type { AirStatus } from '@/src/components/Badge';
import { StatusShape, type ShapeName } from '@/src/components/StatusShape';
import { colors, fonts, space, TOUCH_MIN, type } from '@/src/theme';

const STATUS: Record<AirStatus, { shape: ShapeName; color: string }> = {
  'off-air': { shape: 'cross', color: colors.bad },
  'on-reserve': { shape: 'half', color: colors.warn },
  'on-air': { shape: 'solid', color: colors.good },
};

export interface LinkRowProps {
  href: Href;
  title: string;
  /** A code shown in the monospaced face after the title (on its own line when the title fills the row). */
  code?: string;
  detail?: string;
  status?: AirStatus;
  /** A figure at the right (tabular digits). */
  figure?: string;
  testID?: string;
  /** Called as the link is followed (before the address changes). */
  onPress?: () => void;
}

export function LinkRow({ href, title, code, detail, status, figure, testID, onPress }: LinkRowProps) {
  // The visible words are the accessible name (no separate label that could drift from them).
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" testID={testID} style={styles.row} onPress={onPress}>
        {status ? <StatusShape shape={STATUS[status].shape} color={STATUS[status].color} size={16} /> : null}
        <View style={styles.texts}>
          {/* the code beside the name where there is room, else whole on the next line: never cut short */}
          <View style={styles.heading}>
            <Text style={styles.title} numberOfLines={2}>
              {title}
            </Text>
            {code && code !== title ? <Text style={styles.code}>{code}</Text> : null}
          </View>
          {detail ? <Text style={styles.detail}>{detail}</Text> : null}
        </View>
        {figure ? <Text style={styles.figure}>{figure}</Text> : null}
        <Svg width={10} height={16} viewBox="0 0 10 16" aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
          <Path d="M2 2l6 6-6 6" stroke={colors.inkMuted} strokeWidth={2} fill="none" strokeLinecap="round" strokeLinejoin="round" />
        </Svg>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    minHeight: TOUCH_MIN + 4,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
    backgroundColor: colors.surface,
  },
  texts: { flex: 1, gap: space.xxs },
  heading: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm },
  title: { ...type.body, fontSize: 16, lineHeight: 22, color: colors.accent, fontFamily: fonts.textBold },
  code: { fontFamily: fonts.mono, fontSize: 14, color: colors.inkMuted },
  detail: { ...type.small },
  figure: { ...type.figure, fontFamily: fonts.monoBold },
});
