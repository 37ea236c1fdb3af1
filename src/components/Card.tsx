/**
 * A framed block of related content. Optional title (a heading) and footer.
 *
 *   <Card title="Sites" testID="tile-sites">...</Card>
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View, type StyleProp, type ViewStyle } from 'react-native';
import { colors, radius, space, type } from '@/src/theme';
import { heading } from './webAria';

export interface CardProps {
  title?: string;
  children?: ReactNode;
  footer?: ReactNode;
  /** `attention` draws a heavier left edge for items that need acting on. */
  emphasis?: 'none' | 'attention';
  testID?: string;
  style?: StyleProp<ViewStyle>;
}

export function Card({ title, children, footer, emphasis = 'none', testID, style }: CardProps) {
  return (
    <View style={[styles.card, emphasis === 'attention' && styles.attention, style]} testID={testID}>
      {title ? (
        <Text style={styles.title} {...heading(3)}>
          {title}
        </Text>
      ) : null}
      {children}
      {footer ? <View style={styles.footer}>{footer}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
    gap: space.sm,
    // Fills its cell so cards in one Columns row share a height.
    flexGrow: 1,
  },
  attention: { borderLeftWidth: 6, borderLeftColor: colors.warn },
  title: { ...type.label, fontSize: 17, lineHeight: 22 },
  footer: { marginTop: space.sm, flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
