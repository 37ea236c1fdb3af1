/**
 * A phone's list of records: one card per record, the whole card a link to
 * the record's page (at least 44 px tall, nothing behind hover). The link's
 * accessible name is its visible text, so what is seen is what is spoken.
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { Badge } from '@/src/components/Badge';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import type { CardLines } from '../listRows';

export interface RecordCardsProps<Row> {
  rows: readonly Row[];
  lines: (row: Row) => CardLines;
  href: (row: Row) => Href;
  testID?: string;
}

export function RecordCards<Row>({ rows, lines, href, testID = 'record-cards' }: RecordCardsProps<Row>) {
  return (
    <View style={styles.list} testID={testID}>
      {rows.map((row) => {
        const l = lines(row);
        return (
          <Link key={l.code} href={href(row)} asChild>
            <Pressable accessibilityRole="link" style={styles.card} testID={`${testID}-${l.code}`}>
              <View style={styles.head}>
                <Text style={styles.code}>{l.code}</Text>
                {l.tag ? <Badge label={l.tag} /> : null}
              </View>
              <Text style={styles.title}>{l.title}</Text>
              {l.facts.length ? <Text style={styles.facts}>{l.facts.join(' · ')}</Text> : null}
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

// Link asChild merges plain style objects only (see src/components/nav/NavLink.tsx).
const styles = StyleSheet.create({
  list: { gap: space.sm },
  card: {
    minHeight: TOUCH_MIN,
    padding: space.md,
    gap: space.xxs,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  code: { fontFamily: fonts.monoBold, fontSize: 16, lineHeight: 22, color: colors.accent },
  title: { ...type.body },
  facts: { ...type.small, fontVariant: ['tabular-nums'] },
});
