/**
 * The screening-figure notice (docs/screens.md: engineering results are screening
 * figures; the screen says so and points to a full path study and the local
 * licensing rules before anyone acts). Put it next to any computed RF or
 * geometry figure. Extra lines may be passed as children.
 *
 *   <Caution />
 *   <Caution title="Screening figures">Path profile ignores clutter.</Caution>
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View, type TextStyle, type ViewStyle } from 'react-native';
import { colors, radius, space, type } from '@/src/theme';
import { StatusShape } from './StatusShape';

export const SCREENING_NOTICE =
  'These are screening figures, not a path study. Before acting on them, confirm with a full path study and the local licensing rules.';

export function Caution({ title = 'Screening figures', children, testID }: { title?: string; children?: ReactNode; testID?: string }) {
  return (
    <View style={styles.box} accessibilityRole="summary" testID={testID ?? 'caution'}>
      <View style={styles.head}>
        <StatusShape shape="triangle" color={colors.warn} size={18} />
        <Text style={styles.title}>{title}</Text>
      </View>
      <Text style={styles.body}>{SCREENING_NOTICE}</Text>
      {typeof children === 'string' ? <Text style={styles.body}>{children}</Text> : children}
    </View>
  );
}

/** The caution box's parts, shared with other safety notes so they all read alike. */
export const cautionParts = {
  box: {
    backgroundColor: colors.warnSoft,
    borderColor: colors.warn,
    borderWidth: 1,
    borderLeftWidth: 6,
    borderRadius: radius.md,
    padding: space.md,
    gap: space.xs,
  } satisfies ViewStyle,
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm } satisfies ViewStyle,
  title: { ...type.label, color: colors.warn } satisfies TextStyle,
  body: { ...type.body, fontSize: 16, lineHeight: 22 } satisfies TextStyle,
};

const styles = StyleSheet.create(cautionParts);
