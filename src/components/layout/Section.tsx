/**
 * A titled part of a screen. Spacing between sections comes from Screen.
 *
 *   <Section title="Network" note="Version 14">...</Section>
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { space, type } from '@/src/theme';
import { heading } from '../webAria';

export interface SectionProps {
  title?: string;
  /** One muted line under the title. */
  note?: string;
  /** Controls at the right of the title (a filter, a link). */
  aside?: ReactNode;
  children?: ReactNode;
  testID?: string;
}

export function Section({ title, note, aside, children, testID }: SectionProps) {
  return (
    <View style={styles.section} testID={testID} accessibilityRole="summary" accessibilityLabel={title}>
      {title || aside ? (
        <View style={styles.head}>
          <View style={styles.titles}>
            {title ? (
              <Text style={styles.title} {...heading(2)}>
                {title}
              </Text>
            ) : null}
            {note ? <Text style={styles.note}>{note}</Text> : null}
          </View>
          {aside}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  head: { flexDirection: 'row', alignItems: 'flex-end', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  titles: { gap: space.xxs, flexShrink: 1 },
  title: { ...type.heading },
  note: { ...type.small },
});
