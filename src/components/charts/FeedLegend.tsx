/**
 * What the lines and shapes on the chain tree and the network diagram mean,
 * in words beside a sample of each (docs/screens.md: the legend is always one tap
 * away). Screens pass the extra marks they draw (site roles, status marks).
 */
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '@/src/theme';
import { FeedSwatch } from './FeedSwatch';
import { MEDIUM_LABEL, MEDIUM_ORDER, ROLE_ORDER } from './feedStyle';

export interface LegendMark {
  key: string;
  sample: ReactNode;
  label: string;
}

const MEDIUM_NOTE: Record<string, string> = {
  line: 'solid',
  microwave: 'dash and dot',
  satellite: 'long dashes',
  'off-air': 'dots',
};

export function FeedLegend({ marks = [], testID }: { marks?: LegendMark[]; testID?: string }) {
  return (
    <View style={styles.box} testID={testID ?? 'feed-legend'} accessibilityLabel="Legend">
      <Text style={styles.head}>Feeds: medium by pattern</Text>
      {MEDIUM_ORDER.map((m) => (
        <View key={m} style={styles.row}>
          <FeedSwatch medium={m} role="main" />
          <Text style={styles.text}>{`${MEDIUM_LABEL[m]} (${MEDIUM_NOTE[m]})`}</Text>
        </View>
      ))}
      <Text style={styles.head}>Feeds: main or reserve by line</Text>
      {ROLE_ORDER.map((r) => (
        <View key={r} style={styles.row}>
          <FeedSwatch medium="line" role={r} />
          <Text style={styles.text}>{r === 'main' ? 'main feed (single line, dark)' : 'reserve feed (double line, blue)'}</Text>
        </View>
      ))}
      {marks.length > 0 ? <Text style={styles.head}>Marks</Text> : null}
      {marks.map((m) => (
        <View key={m.key} style={styles.row}>
          <View style={styles.sample}>{m.sample}</View>
          <Text style={styles.text}>{m.label}</Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, padding: space.md, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.surface },
  head: { ...type.label, marginTop: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: 24 },
  sample: { width: 48, alignItems: 'center' },
  text: { ...type.body, fontSize: 15, lineHeight: 20, flexShrink: 1 },
});
