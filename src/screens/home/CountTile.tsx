import { StyleSheet, Text, View } from 'react-native';
import { Card } from '@/src/components/Card';
import { colors, fonts, space, type } from '@/src/theme';

export interface CountPart {
  label: string;
  count: number;
  testID: string;
}

/** One record count on Home: the figure large, in tabular digits, with optional parts under it. */
export function CountTile({ label, count, testID, parts }: { label: string; count: number; testID: string; parts?: CountPart[] }) {
  return (
    <Card testID={`tile-${testID.replace(/^count-/, '')}`}>
      <Text style={styles.label}>{label}</Text>
      <Text style={styles.figure} testID={testID} accessibilityLabel={`${label}: ${count}`}>
        {String(count)}
      </Text>
      {parts && parts.length > 0 ? (
        <View style={styles.parts}>
          {parts.map((p) => (
            <View key={p.testID} style={styles.part}>
              <Text style={styles.partLabel}>{p.label}</Text>
              <Text style={styles.partFigure} testID={p.testID} accessibilityLabel={`${p.label}: ${p.count}`}>
                {String(p.count)}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  label: { ...type.label, fontSize: 17, color: colors.inkMuted },
  figure: { fontFamily: fonts.monoBold, fontSize: 40, lineHeight: 48, color: colors.ink, fontVariant: ['tabular-nums'] },
  parts: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm, gap: space.xxs },
  part: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', minHeight: 28 },
  partLabel: { ...type.body, fontSize: 16 },
  partFigure: { ...type.figure, fontFamily: fonts.monoBold },
});
