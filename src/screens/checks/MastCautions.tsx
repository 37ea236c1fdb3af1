/**
 * Safety reminders shown wherever a check may send someone up a mast: a failed bearing or
 * clearance check ends in antenna work. Common practice, no source; the site's own rules and
 * the local regulations govern.
 */
import { StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { cautionParts } from '@/src/components/Caution';
import { colors, type } from '@/src/theme';

export const MAST_CAUTIONS: readonly { title: string; body: string }[] = [
  {
    title: 'RF exposure near live antennas',
    body: 'Antennas on a working mast radiate. Before anyone goes near them, agree a power reduction or switch-off with whoever runs each transmitter on the structure, and keep to the exposure limits and exclusion zones marked for the site.',
  },
  {
    title: 'Work at height',
    body: 'Only trained climbers with inspected equipment, someone on the ground and a rescue plan, under the site’s permit and the local work-at-height rules. Weather and ice stop the climb.',
  },
];

export function MastCautions({ testID }: { testID?: string }) {
  return (
    <View style={styles.box} accessibilityRole="summary" accessibilityLabel="Before work on a mast" testID={testID ?? 'mast-cautions'}>
      <View style={styles.head}>
        <StatusShape shape="triangle" color={colors.warn} size={18} />
        <Text style={styles.title}>Before work on a mast</Text>
      </View>
      {MAST_CAUTIONS.map((c) => (
        <Text key={c.title} style={styles.body}>
          <Text style={styles.lead}>{c.title}. </Text>
          {c.body}
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  ...cautionParts,
  box: { ...cautionParts.box, backgroundColor: colors.surface },
  lead: { fontFamily: type.label.fontFamily },
});
