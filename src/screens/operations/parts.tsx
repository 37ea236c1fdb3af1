/** Pieces shared by the planned-work and incident screens. */
import { StyleSheet, Text, View } from 'react-native';
import type { Clash, OperationsReach, WorkState } from '@/shared/schemas/operations';
import { Badge, type Tone } from '@/src/components/Badge';
import { Caution } from '@/src/components/Caution';
import { countOf, formatCount } from '@/shared/format';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';
import { localText } from './time';

const STATE_TONE: Record<WorkState, Tone> = { draft: 'neutral', requested: 'accent', approved: 'good', 'in-progress': 'accent', done: 'neutral', cancelled: 'neutral' };
export function StateBadge({ state, label }: { state: WorkState; label: string }) {
  return <Badge label={label} tone={STATE_TONE[state]} />;
}

/** The sentence shown before approving and on a clash: what goes off air only because both happen together. */
export function clashSentence(c: Clash, verb = 'This puts'): string {
  const other = c.with === 'incident' ? `incident ${c.work}` : c.work;
  return `${verb} ${countOf(c.jointLost.length, 'carriage')} off air together with ${other} (${formatCount(c.households)} households)`;
}

export function ClashList({ clashes, testID }: { clashes: readonly Clash[]; testID?: string }) {
  if (clashes.length === 0) return <Text style={styles.plain} testID={testID ? `${testID}-none` : undefined}>No clash: nothing more goes off air together with other work or an open incident.</Text>;
  return (
    <View style={styles.list} testID={testID}>
      {clashes.map((c) => (
        <View key={c.work} style={styles.clash} accessibilityRole="alert" testID={`clash-${c.work}`}>
          <View style={styles.row}>
            <StatusShape shape="triangle" color={colors.warn} size={18} />
            <Text style={styles.clashTitle}>{`Clash with ${c.with === 'incident' ? 'incident' : 'planned work'} ${c.work}`}</Text>
          </View>
          <Text style={styles.plain}>{`${countOf(c.jointLost.length, 'carriage')} off air only when both happen (${formatCount(c.households)} households).`}</Text>
          <Text style={styles.small}>{`Overlap: ${localText(c.overlap.start)} to ${localText(c.overlap.end)}`}</Text>
          <Text style={styles.small}>{`Off air only together: ${c.jointLost.join(', ')}`}</Text>
        </View>
      ))}
    </View>
  );
}

export function ReachFacts({ reach, networkVersion, testID }: { reach: OperationsReach; networkVersion: number; testID?: string }) {
  return (
    <View style={styles.list} testID={testID}>
      <View style={styles.row}>
        <StatusShape shape="cross" color={colors.bad} />
        <Text style={styles.plain}>{`Off air: ${countOf(reach.lost.length, 'carriage')}, ${formatCount(reach.households.lost)} households`}</Text>
      </View>
      <View style={styles.row}>
        <StatusShape shape="half" color={colors.warn} />
        <Text style={styles.plain}>{`On a reserve feed: ${countOf(reach.fallback.length, 'carriage')}, ${formatCount(reach.households.fallback)} households`}</Text>
      </View>
      {reach.lost.length ? <Text style={styles.small}>{`Off air: ${reach.lost.join(', ')}`}</Text> : null}
      <Text style={styles.small}>{`Computed at network version ${networkVersion}.`}</Text>
    </View>
  );
}

/** Site work cautions: always on planned-work screens. */
export function WorkCautions() {
  return (
    <Caution title="Before work on site" testID="work-cautions">
      {
        'Work at height and near live antennas needs a permit, a rescue plan and people trained for it. Keep within RF exposure limits: switch off or reduce power before anyone enters the exclusion zone, and confirm it is off. Follow the site safety rules, local codes and licensed practice; the reach shown here is a screening result, not a switching plan.'
      }
    </Caution>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  clash: { borderWidth: 1, borderLeftWidth: 6, borderColor: colors.warn, backgroundColor: colors.warnSoft, borderRadius: radius.md, padding: space.md, gap: space.xs },
  clashTitle: { ...type.label, fontSize: 16 },
  plain: { ...type.body },
  small: { ...type.small },
});
