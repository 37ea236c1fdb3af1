/**
 * What a delete would take off air, shown before the confirmation
 * (GET /api/<kind>/:code/impact, from the engine's fault reach): households
 * first, then carriages and sites, the carriages by code, and those that
 * would be left on a reserve feed. A screening answer from the network as
 * stored; it says so.
 */
import { StyleSheet, Text, View } from 'react-native';
import { countOf, formatCount, householdsText } from '@/shared/format';
import type { EntityKind } from '@/shared/schemas/network';
import { useDeleteImpact } from '@/src/api/queries/recordTools';
import { ErrorState, LoadingState } from '@/src/components/states';
import { colors, fonts, radius, space, type } from '@/src/theme';

export function DeleteImpactNote({ kind, code }: { kind: EntityKind; code: string }) {
  const impact = useDeleteImpact(kind, code);
  const d = impact.data;
  if (!d) {
    return impact.error ? (
      <ErrorState what="what this delete would take off air" error={impact.error} onRetry={() => void impact.mutate()} />
    ) : (
      <LoadingState what="what this delete would take off air" />
    );
  }
  const off = d.offAir;
  const more = off.carriages - off.shown.length;
  return (
    <View style={[styles.box, off.carriages > 0 ? styles.serious : styles.calm]} accessibilityRole="summary" accessibilityLabel="Off air after the delete" testID="delete-impact">
      {off.carriages > 0 ? (
        <>
          <Text style={styles.head}>{`⚠ Off air after the delete: ${householdsText(off.households)}`}</Text>
          <Text style={styles.body}>{`${countOf(off.carriages, 'carriage')} at ${countOf(off.sites, 'site')} would have no programme.`}</Text>
          <Text style={styles.codes} selectable testID="delete-impact-carriages">
            {`${off.shown.join(', ')}${more > 0 ? ` and ${formatCount(more)} more` : ''}`}
          </Text>
        </>
      ) : (
        <Text style={styles.head}>Nothing goes off air with this delete.</Text>
      )}
      {d.fallback.carriages > 0 ? (
        <Text style={styles.body}>{`${countOf(d.fallback.carriages, 'more carriage', 'more carriages')} would stay on air only through a reserve feed.`}</Text>
      ) : null}
      <Text style={styles.small}>{`${d.basis} A screening answer from the stored network.`}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderLeftWidth: 6 },
  serious: { borderColor: colors.bad, backgroundColor: colors.badSoft },
  calm: { borderColor: colors.line, backgroundColor: colors.sunken },
  head: { ...type.body, fontFamily: fonts.textBold },
  body: { ...type.body },
  codes: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 22, color: colors.ink },
  small: { ...type.small },
});
